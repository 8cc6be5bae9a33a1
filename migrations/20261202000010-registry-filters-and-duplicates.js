"use strict";

/**
 * The registry table's filters at scale, and duplicate suggestions.
 *  - coefficients_key: sha256 of the family's canonical coefficient texts (class + sorted name=text),
 *    so families that share their coefficients but differ in parameters, window or owner are found
 *    with one indexed lookup;
 *  - registry_entry_tags: one row per (tag, entry), so a tag filter is an index lookup instead of a
 *    LIKE scan over tags_text (tags_text stays as the display copy);
 *  - composite indexes for the common queries: visibility + class + verdict in date order, the
 *    review queue (curation state + agreement), submitter e-mail, duplicates;
 *  - on SQLite, registry_entries_search: an FTS5 word index (unicode61, with prefix indexes) of
 *    search_text kept in step by triggers, so the search over title and notes (every word of the
 *    query as a word prefix) does not scan the table. It is an external-content table keyed by
 *    registry_entries' rowid: after a VACUUM run
 *    INSERT INTO registry_entries_search(registry_entries_search) VALUES('rebuild').
 *    Other databases (PostgreSQL) match each word with LIKE instead.
 */
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.addColumn("registry_entries", "coefficients_key", { type: Sequelize.STRING(64), allowNull: true });
    const indexes = [
      ["coefficients_key"],
      ["published", "created_at"],
      ["published", "screened_at"],
      ["equation_class", "reducibility", "created_at"],
      ["published", "equation_class", "reducibility", "created_at"],
      ["submitter_id", "published", "created_at"],
      ["curation_state", "agreement"],
      ["submitter_email"],
      ["duplicate_of_id"],
    ];
    for (const fields of indexes) {
      await queryInterface.addIndex("registry_entries", fields, { name: `registry_entries_${fields.join("_")}_x` });
    }

    await queryInterface.createTable("registry_entry_tags", {
      tag: { type: Sequelize.STRING(40), allowNull: false, primaryKey: true },
      entry_id: { type: Sequelize.UUID, allowNull: false, primaryKey: true, references: { model: "registry_entries", key: "id" }, onDelete: "CASCADE" },
    });
    await queryInterface.addIndex("registry_entry_tags", ["entry_id"]);
    const [rows] = await queryInterface.sequelize.query("SELECT id, tags_text FROM registry_entries WHERE tags_text <> ''");
    const tagRows = rows.flatMap((r) => [...new Set(String(r.tags_text).split(",").filter(Boolean))].map((tag) => ({ tag, entry_id: r.id })));
    for (let i = 0; i < tagRows.length; i += 500) await queryInterface.bulkInsert("registry_entry_tags", tagRows.slice(i, i + 500));

    if (queryInterface.sequelize.getDialect() === "sqlite") {
      const run = (sql) => queryInterface.sequelize.query(sql);
      try {
        await run("CREATE VIRTUAL TABLE registry_entries_search USING fts5(search_text, content='registry_entries', content_rowid='rowid', tokenize='unicode61', prefix='2 3')");
      } catch (err) {
        // An SQLite without FTS5: the query service falls back to LIKE.
        console.warn(`[migration] registry search index not created (${err.message}); text search will scan`);
        return;
      }
      await run("CREATE TRIGGER registry_entries_search_ai AFTER INSERT ON registry_entries BEGIN INSERT INTO registry_entries_search(rowid, search_text) VALUES (new.rowid, new.search_text); END");
      await run("CREATE TRIGGER registry_entries_search_ad AFTER DELETE ON registry_entries BEGIN INSERT INTO registry_entries_search(registry_entries_search, rowid, search_text) VALUES ('delete', old.rowid, old.search_text); END");
      await run("CREATE TRIGGER registry_entries_search_au AFTER UPDATE OF search_text ON registry_entries WHEN old.search_text IS NOT new.search_text BEGIN INSERT INTO registry_entries_search(registry_entries_search, rowid, search_text) VALUES ('delete', old.rowid, old.search_text); INSERT INTO registry_entries_search(rowid, search_text) VALUES (new.rowid, new.search_text); END");
      await run("INSERT INTO registry_entries_search(registry_entries_search) VALUES ('rebuild')");
    }
  },

  async down(queryInterface) {
    if (queryInterface.sequelize.getDialect() === "sqlite") {
      for (const t of ["ai", "ad", "au"]) await queryInterface.sequelize.query(`DROP TRIGGER IF EXISTS registry_entries_search_${t}`);
      await queryInterface.sequelize.query("DROP TABLE IF EXISTS registry_entries_search");
    }
    await queryInterface.dropTable("registry_entry_tags");
    for (const name of ["coefficients_key", "published_created_at", "published_screened_at", "equation_class_reducibility_created_at", "published_equation_class_reducibility_created_at", "submitter_id_published_created_at", "curation_state_agreement", "submitter_email", "duplicate_of_id"]) {
      await queryInterface.removeIndex("registry_entries", `registry_entries_${name}_x`);
    }
    await queryInterface.removeColumn("registry_entries", "coefficients_key");
  },
};
