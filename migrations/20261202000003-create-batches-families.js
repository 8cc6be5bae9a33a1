"use strict";

/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.createTable("batches", {
      id: { type: Sequelize.UUID, primaryKey: true, allowNull: false },
      owner_id: { type: Sequelize.UUID, allowNull: false, references: { model: "users", key: "id" } },
      title: { type: Sequelize.STRING(200), allowNull: false },
      state: { type: Sequelize.STRING(20), allowNull: false, defaultValue: "queued" },
      files_json: { type: Sequelize.TEXT, allowNull: false, defaultValue: "[]" },
      family_count: { type: Sequelize.INTEGER, allowNull: false, defaultValue: 0 },
      variant_count: { type: Sequelize.INTEGER, allowNull: false, defaultValue: 0 },
      error_count: { type: Sequelize.INTEGER, allowNull: false, defaultValue: 0 },
      created_at: { type: Sequelize.DATE, allowNull: false },
      updated_at: { type: Sequelize.DATE, allowNull: false },
    });
    await queryInterface.addIndex("batches", ["owner_id", "created_at"]);

    await queryInterface.createTable("families", {
      id: { type: Sequelize.UUID, primaryKey: true, allowNull: false },
      owner_id: { type: Sequelize.UUID, allowNull: false, references: { model: "users", key: "id" } },
      first_batch_id: { type: Sequelize.UUID, allowNull: false, references: { model: "batches", key: "id" } },
      slug: { type: Sequelize.STRING(64), allowNull: false },
      title: { type: Sequelize.STRING(300), allowNull: false },
      equation_class: { type: Sequelize.STRING(8), allowNull: false },
      content_hash: { type: Sequelize.STRING(64), allowNull: false },
      spec_json: { type: Sequelize.TEXT, allowNull: false },
      source_yaml: { type: Sequelize.TEXT, allowNull: false },
      file_name: { type: Sequelize.STRING(255), allowNull: true },
      document_index: { type: Sequelize.INTEGER, allowNull: true },
      tags_json: { type: Sequelize.TEXT, allowNull: false, defaultValue: "[]" },
      notes: { type: Sequelize.TEXT, allowNull: false, defaultValue: "" },
      variant_count: { type: Sequelize.INTEGER, allowNull: false, defaultValue: 1 },
      created_at: { type: Sequelize.DATE, allowNull: false },
      updated_at: { type: Sequelize.DATE, allowNull: false },
    });
    await queryInterface.addIndex("families", ["owner_id", "content_hash"], { unique: true });
    await queryInterface.addIndex("families", ["equation_class"]);
    await queryInterface.addIndex("families", ["first_batch_id"]);

    await queryInterface.createTable("batch_families", {
      batch_id: { type: Sequelize.UUID, allowNull: false, primaryKey: true, references: { model: "batches", key: "id" }, onDelete: "CASCADE" },
      family_id: { type: Sequelize.UUID, allowNull: false, primaryKey: true, references: { model: "families", key: "id" }, onDelete: "CASCADE" },
      reused: { type: Sequelize.BOOLEAN, allowNull: false, defaultValue: false },
      created_at: { type: Sequelize.DATE, allowNull: false },
    });
    await queryInterface.addIndex("batch_families", ["family_id"]);

    await queryInterface.createTable("variants", {
      id: { type: Sequelize.UUID, primaryKey: true, allowNull: false },
      family_id: { type: Sequelize.UUID, allowNull: false, references: { model: "families", key: "id" }, onDelete: "CASCADE" },
      variant_index: { type: Sequelize.INTEGER, allowNull: false },
      parameters_json: { type: Sequelize.TEXT, allowNull: false, defaultValue: "{}" },
      variant_json: { type: Sequelize.TEXT, allowNull: false },
      created_at: { type: Sequelize.DATE, allowNull: false },
    });
    await queryInterface.addIndex("variants", ["family_id", "variant_index"], { unique: true });
  },

  async down(queryInterface) {
    await queryInterface.dropTable("variants");
    await queryInterface.dropTable("batch_families");
    await queryInterface.dropTable("families");
    await queryInterface.dropTable("batches");
  },
};
