"use strict";

/**
 * Background screening: cancel flags and worker ids on runs, batch timing, the batch ↔ run links
 * (a reused family's results are linked into a new batch instead of being screened again), the
 * outgoing mail queue (retried while SMTP is down) and small marks for periodic jobs.
 * @type {import('sequelize-cli').Migration}
 */
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.addColumn("screening_runs", "cancel_requested", { type: Sequelize.BOOLEAN, allowNull: false, defaultValue: false });
    await queryInterface.addColumn("screening_runs", "claimed_by", { type: Sequelize.STRING(80), allowNull: true });
    await queryInterface.addIndex("screening_runs", ["claim_token"]);
    await queryInterface.addIndex("screening_runs", ["state", "lease_expires_at"]);

    await queryInterface.addColumn("batches", "started_at", { type: Sequelize.DATE, allowNull: true });
    await queryInterface.addColumn("batches", "finished_at", { type: Sequelize.DATE, allowNull: true });
    await queryInterface.addColumn("batches", "cancel_requested_at", { type: Sequelize.DATE, allowNull: true });

    await queryInterface.createTable("batch_runs", {
      batch_id: { type: Sequelize.UUID, allowNull: false, primaryKey: true, references: { model: "batches", key: "id" }, onDelete: "CASCADE" },
      run_id: { type: Sequelize.UUID, allowNull: false, primaryKey: true, references: { model: "screening_runs", key: "id" }, onDelete: "CASCADE" },
      // true when the run existed before the batch (its result is reused, not recomputed)
      linked: { type: Sequelize.BOOLEAN, allowNull: false, defaultValue: false },
      created_at: { type: Sequelize.DATE, allowNull: false },
    });
    await queryInterface.addIndex("batch_runs", ["run_id"]);

    await queryInterface.createTable("outgoing_mail", {
      id: { type: Sequelize.UUID, primaryKey: true, allowNull: false },
      kind: { type: Sequelize.STRING(20), allowNull: false },
      dedupe_key: { type: Sequelize.STRING(200), allowNull: true, unique: true },
      to_address: { type: Sequelize.STRING(254), allowNull: false },
      subject: { type: Sequelize.STRING(300), allowNull: false },
      text_body: { type: Sequelize.TEXT, allowNull: false },
      state: { type: Sequelize.STRING(10), allowNull: false, defaultValue: "queued" },
      attempts: { type: Sequelize.INTEGER, allowNull: false, defaultValue: 0 },
      max_attempts: { type: Sequelize.INTEGER, allowNull: false, defaultValue: 10 },
      next_attempt_at: { type: Sequelize.DATE, allowNull: false },
      claim_token: { type: Sequelize.STRING(64), allowNull: true },
      claimed_until: { type: Sequelize.DATE, allowNull: true },
      last_error: { type: Sequelize.TEXT, allowNull: true },
      sent_at: { type: Sequelize.DATE, allowNull: true },
      created_at: { type: Sequelize.DATE, allowNull: false },
      updated_at: { type: Sequelize.DATE, allowNull: false },
    });
    await queryInterface.addIndex("outgoing_mail", ["state", "next_attempt_at"]);

    await queryInterface.createTable("job_marks", {
      name: { type: Sequelize.STRING(60), primaryKey: true, allowNull: false },
      at: { type: Sequelize.DATE, allowNull: false },
      updated_at: { type: Sequelize.DATE, allowNull: false },
    });
  },

  async down(queryInterface) {
    await queryInterface.dropTable("job_marks");
    await queryInterface.dropTable("outgoing_mail");
    await queryInterface.dropTable("batch_runs");
    await queryInterface.removeColumn("batches", "cancel_requested_at");
    await queryInterface.removeColumn("batches", "finished_at");
    await queryInterface.removeColumn("batches", "started_at");
    await queryInterface.removeIndex("screening_runs", ["state", "lease_expires_at"]);
    await queryInterface.removeIndex("screening_runs", ["claim_token"]);
    await queryInterface.removeColumn("screening_runs", "claimed_by");
    await queryInterface.removeColumn("screening_runs", "cancel_requested");
  },
};
