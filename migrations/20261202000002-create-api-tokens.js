"use strict";

/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.createTable("api_tokens", {
      id: { type: Sequelize.UUID, primaryKey: true, allowNull: false },
      user_id: { type: Sequelize.UUID, allowNull: false, references: { model: "users", key: "id" }, onDelete: "CASCADE" },
      name: { type: Sequelize.STRING(80), allowNull: false },
      prefix: { type: Sequelize.STRING(12), allowNull: false },
      token_hash: { type: Sequelize.STRING(64), allowNull: false, unique: true },
      last_used_at: { type: Sequelize.DATE, allowNull: true },
      revoked_at: { type: Sequelize.DATE, allowNull: true },
      created_at: { type: Sequelize.DATE, allowNull: false },
    });
    await queryInterface.addIndex("api_tokens", ["user_id"]);
  },
  async down(queryInterface) {
    await queryInterface.dropTable("api_tokens");
  },
};
