"use strict";

/**
 * The three verdicts of a finished run as columns of screening_runs, so a family's registry summary
 * (refreshed after every finished run) and batch progress read a few short strings per variant
 * instead of parsing each ~100 KB report: with a 5000-variant sweep that was 5000 reports re-read
 * per finished run. Filled here from the stored reports; kept by the ScreeningRun model's hooks.
 * @type {import('sequelize-cli').Migration}
 */
const CHUNK = 200;

function verdicts(reportJson) {
  if (!reportJson) return { reducibility_verdict: null, painleve_verdict: null, agreement_verdict: null };
  const r = JSON.parse(reportJson);
  return {
    reducibility_verdict: (r.reducibility && r.reducibility.verdict) || "undecided",
    painleve_verdict: (r.painleve && r.painleve.verdict) || "not-run",
    agreement_verdict: r.agreement || "inconclusive",
  };
}

module.exports = {
  async up(queryInterface, Sequelize) {
    for (const column of ["reducibility_verdict", "painleve_verdict", "agreement_verdict"]) {
      await queryInterface.addColumn("screening_runs", column, { type: Sequelize.STRING(20), allowNull: true });
    }
    // The refresh query: a family's done runs, newest first.
    await queryInterface.addIndex("screening_runs", ["family_id", "state", "finished_at"]);
    let after = null; // paging by id (a UUID column on PostgreSQL: no "" sentinel)
    for (;;) {
      const [rows] = await queryInterface.sequelize.query(
        `SELECT id, report_json FROM screening_runs WHERE report_json IS NOT NULL${after === null ? "" : " AND id > :after"} ORDER BY id LIMIT :limit`,
        { replacements: { after, limit: CHUNK } },
      );
      if (rows.length === 0) break;
      // One transaction per chunk: on SQLite each statement would otherwise be its own commit.
      await queryInterface.sequelize.transaction(async (transaction) => {
        for (const row of rows) {
          await queryInterface.bulkUpdate("screening_runs", verdicts(row.report_json), { id: row.id }, { transaction });
        }
      });
      after = rows[rows.length - 1].id;
    }
  },

  async down(queryInterface) {
    await queryInterface.removeIndex("screening_runs", ["family_id", "state", "finished_at"]);
    for (const column of ["reducibility_verdict", "painleve_verdict", "agreement_verdict"]) {
      await queryInterface.removeColumn("screening_runs", column);
    }
  },
};
