/**
 * The registry_entry_tags index (one row per tag and entry), kept in step with an entry's tags
 * so that a tag filter is an index lookup. tags_text on the entry stays the copy shown in lists.
 */
import type { Transaction } from "sequelize";
import { sequelize } from "@/models";

export async function syncEntryTags(entryId: string, tags: readonly string[], transaction?: Transaction): Promise<void> {
  const unique = [...new Set(tags)];
  await sequelize.query("DELETE FROM registry_entry_tags WHERE entry_id = ?", { replacements: [entryId], transaction });
  if (!unique.length) return;
  const values = unique.map(() => "(?, ?)").join(", ");
  await sequelize.query(`INSERT INTO registry_entry_tags (tag, entry_id) VALUES ${values}`, { replacements: unique.flatMap((t) => [t, entryId]), transaction });
}

let searchIndex: Promise<boolean> | null = null;

/** Whether the SQLite FTS5 trigram index of search_text exists (created by the registry migration). */
export function hasSearchIndex(): Promise<boolean> {
  if (sequelize.getDialect() !== "sqlite") return Promise.resolve(false);
  searchIndex ??= sequelize
    .query("SELECT name FROM sqlite_master WHERE type = 'table' AND name = 'registry_entries_search'", { plain: false, raw: true })
    .then(([rows]) => (rows as unknown[]).length > 0)
    .catch(() => false);
  return searchIndex;
}
