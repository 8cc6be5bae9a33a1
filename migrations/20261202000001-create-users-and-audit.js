"use strict";

/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface, Sequelize) {
    const ts = {
      created_at: { type: Sequelize.DATE, allowNull: false },
      updated_at: { type: Sequelize.DATE, allowNull: false },
    };
    await queryInterface.createTable("users", {
      id: { type: Sequelize.UUID, primaryKey: true, allowNull: false },
      email: { type: Sequelize.STRING(254), allowNull: false, unique: true },
      name: { type: Sequelize.STRING(120), allowNull: false },
      password_hash: { type: Sequelize.STRING(100), allowNull: true },
      role: { type: Sequelize.STRING(20), allowNull: false, defaultValue: "viewer" },
      disabled: { type: Sequelize.BOOLEAN, allowNull: false, defaultValue: false },
      failed_sign_ins: { type: Sequelize.INTEGER, allowNull: false, defaultValue: 0 },
      locked_until: { type: Sequelize.DATE, allowNull: true },
      notify_batch_done: { type: Sequelize.BOOLEAN, allowNull: false, defaultValue: true },
      notify_digest: { type: Sequelize.BOOLEAN, allowNull: false, defaultValue: true },
      ...ts,
    });
    await queryInterface.addIndex("users", ["role"]);

    await queryInterface.createTable("audit_events", {
      id: { type: Sequelize.UUID, primaryKey: true, allowNull: false },
      actor_id: { type: Sequelize.UUID, allowNull: true },
      actor_email: { type: Sequelize.STRING(254), allowNull: true },
      action: { type: Sequelize.STRING(60), allowNull: false },
      target_type: { type: Sequelize.STRING(40), allowNull: false },
      target_id: { type: Sequelize.STRING(64), allowNull: true },
      detail: { type: Sequelize.TEXT, allowNull: true },
      created_at: { type: Sequelize.DATE, allowNull: false },
    });
    await queryInterface.addIndex("audit_events", ["target_type", "target_id"]);
    await queryInterface.addIndex("audit_events", ["created_at"]);

    await queryInterface.createTable("invites", {
      id: { type: Sequelize.UUID, primaryKey: true, allowNull: false },
      user_id: { type: Sequelize.UUID, allowNull: false, references: { model: "users", key: "id" }, onDelete: "CASCADE" },
      token_hash: { type: Sequelize.STRING(64), allowNull: false, unique: true },
      purpose: { type: Sequelize.STRING(10), allowNull: false, defaultValue: "invite" },
      expires_at: { type: Sequelize.DATE, allowNull: false },
      used_at: { type: Sequelize.DATE, allowNull: true },
      created_by_id: { type: Sequelize.UUID, allowNull: true },
      created_at: { type: Sequelize.DATE, allowNull: false },
    });

    await queryInterface.createTable("mail_messages", {
      id: { type: Sequelize.UUID, primaryKey: true, allowNull: false },
      from_address: { type: Sequelize.STRING(254), allowNull: false },
      to_addresses: { type: Sequelize.TEXT, allowNull: false },
      subject: { type: Sequelize.STRING(300), allowNull: false },
      text_body: { type: Sequelize.TEXT, allowNull: false },
      html_body: { type: Sequelize.TEXT, allowNull: true },
      created_at: { type: Sequelize.DATE, allowNull: false },
    });
    await queryInterface.addIndex("mail_messages", ["created_at"]);
  },

  async down(queryInterface) {
    await queryInterface.dropTable("mail_messages");
    await queryInterface.dropTable("invites");
    await queryInterface.dropTable("audit_events");
    await queryInterface.dropTable("users");
  },
};
