"use strict";

/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface, Sequelize) {
    const ts = {
      created_at: { type: Sequelize.DATE, allowNull: false },
      updated_at: { type: Sequelize.DATE, allowNull: false },
    };
    // One screening of one variant. Claimed atomically by workers (claim_token + lease_expires_at).
    await queryInterface.createTable("screening_runs", {
      id: { type: Sequelize.UUID, primaryKey: true, allowNull: false },
      variant_id: { type: Sequelize.UUID, allowNull: false, references: { model: "variants", key: "id" }, onDelete: "CASCADE" },
      family_id: { type: Sequelize.UUID, allowNull: false, references: { model: "families", key: "id" }, onDelete: "CASCADE" },
      batch_id: { type: Sequelize.UUID, allowNull: true, references: { model: "batches", key: "id" }, onDelete: "SET NULL" },
      purpose: { type: Sequelize.STRING(12), allowNull: false, defaultValue: "upload" },
      state: { type: Sequelize.STRING(12), allowNull: false, defaultValue: "queued" },
      stage: { type: Sequelize.STRING(40), allowNull: true },
      attempts: { type: Sequelize.INTEGER, allowNull: false, defaultValue: 0 },
      max_attempts: { type: Sequelize.INTEGER, allowNull: false, defaultValue: 3 },
      available_at: { type: Sequelize.DATE, allowNull: false },
      claim_token: { type: Sequelize.STRING(64), allowNull: true },
      lease_expires_at: { type: Sequelize.DATE, allowNull: true },
      engine_version: { type: Sequelize.STRING(20), allowNull: true },
      report_json: { type: Sequelize.TEXT, allowNull: true },
      error: { type: Sequelize.TEXT, allowNull: true },
      started_at: { type: Sequelize.DATE, allowNull: true },
      finished_at: { type: Sequelize.DATE, allowNull: true },
      ...ts,
    });
    await queryInterface.addIndex("screening_runs", ["state", "available_at"]);
    await queryInterface.addIndex("screening_runs", ["batch_id", "state"]);
    await queryInterface.addIndex("screening_runs", ["variant_id", "finished_at"]);
    await queryInterface.addIndex("screening_runs", ["family_id"]);

    // One registry entry per family: the summary of its variants' latest reports, plus curation.
    await queryInterface.createTable("registry_entries", {
      id: { type: Sequelize.UUID, primaryKey: true, allowNull: false },
      family_id: { type: Sequelize.UUID, allowNull: false, unique: true, references: { model: "families", key: "id" }, onDelete: "CASCADE" },
      slug: { type: Sequelize.STRING(64), allowNull: false },
      title: { type: Sequelize.STRING(300), allowNull: false },
      equation_class: { type: Sequelize.STRING(8), allowNull: false },
      reducibility: { type: Sequelize.STRING(16), allowNull: false, defaultValue: "pending" },
      painleve: { type: Sequelize.STRING(16), allowNull: false, defaultValue: "pending" },
      agreement: { type: Sequelize.STRING(16), allowNull: false, defaultValue: "pending" },
      variants_total: { type: Sequelize.INTEGER, allowNull: false, defaultValue: 0 },
      variants_screened: { type: Sequelize.INTEGER, allowNull: false, defaultValue: 0 },
      variants_reducible: { type: Sequelize.INTEGER, allowNull: false, defaultValue: 0 },
      curation_state: { type: Sequelize.STRING(16), allowNull: false, defaultValue: "candidate" },
      published: { type: Sequelize.BOOLEAN, allowNull: false, defaultValue: false },
      published_at: { type: Sequelize.DATE, allowNull: true },
      duplicate_of_id: { type: Sequelize.UUID, allowNull: true },
      tags_text: { type: Sequelize.TEXT, allowNull: false, defaultValue: "" },
      submitter_id: { type: Sequelize.UUID, allowNull: false },
      submitter_email: { type: Sequelize.STRING(254), allowNull: false },
      batch_id: { type: Sequelize.UUID, allowNull: false },
      engine_version: { type: Sequelize.STRING(20), allowNull: true },
      normalised_key: { type: Sequelize.STRING(64), allowNull: true },
      search_text: { type: Sequelize.TEXT, allowNull: false, defaultValue: "" },
      screened_at: { type: Sequelize.DATE, allowNull: true },
      ...ts,
    });
    for (const cols of [["equation_class"], ["reducibility"], ["painleve"], ["agreement"], ["curation_state"], ["published", "updated_at"], ["submitter_id"], ["batch_id"], ["engine_version"], ["created_at"], ["screened_at"], ["normalised_key"], ["title"]]) {
      await queryInterface.addIndex("registry_entries", cols);
    }

    // Verdicts that changed when a newer engine re-screened an entry (nightly job).
    await queryInterface.createTable("verdict_changes", {
      id: { type: Sequelize.UUID, primaryKey: true, allowNull: false },
      entry_id: { type: Sequelize.UUID, allowNull: false, references: { model: "registry_entries", key: "id" }, onDelete: "CASCADE" },
      variant_id: { type: Sequelize.UUID, allowNull: false },
      old_engine: { type: Sequelize.STRING(20), allowNull: true },
      new_engine: { type: Sequelize.STRING(20), allowNull: false },
      old_verdicts: { type: Sequelize.TEXT, allowNull: false },
      new_verdicts: { type: Sequelize.TEXT, allowNull: false },
      created_at: { type: Sequelize.DATE, allowNull: false },
    });
    await queryInterface.addIndex("verdict_changes", ["created_at"]);
  },

  async down(queryInterface) {
    await queryInterface.dropTable("verdict_changes");
    await queryInterface.dropTable("registry_entries");
    await queryInterface.dropTable("screening_runs");
  },
};
