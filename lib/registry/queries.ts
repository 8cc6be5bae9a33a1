/**
 * The registry query service: filtered, sorted, paged lists of entries with visibility enforced
 * here (never in the UI). Used by GET /api/registry, the export and the review queue.
 */
import { Op, literal, type Order, type WhereOptions } from "sequelize";
import { RegistryEntry, sequelize } from "@/models";
import type { CurrentUser } from "@/lib/auth/current-user";
import { hasRole } from "@/lib/auth/roles";
import { visibleEntriesWhere } from "./visibility";
import { hasSearchIndex } from "./tags";
import { tagsFromText, type RegistryFilters, type RegistryQuery, type SortKey } from "./filters";

const SORT_COLUMNS: Record<SortKey, keyof RegistryEntry> = {
  title: "title",
  slug: "slug",
  class: "equationClass",
  reducibility: "reducibility",
  painleve: "painleve",
  agreement: "agreement",
  state: "curationState",
  submitter: "submitterEmail",
  engine: "engineVersion",
  variants: "variantsTotal",
  created: "createdAt",
  screened: "screenedAt",
  published: "publishedAt",
};

/** Columns the table needs (search_text and keys stay in the database). */
const LIST_ATTRIBUTES: (keyof RegistryEntry)[] = [
  "id", "slug", "title", "equationClass", "reducibility", "painleve", "agreement", "variantsTotal", "variantsScreened",
  "variantsReducible", "curationState", "published", "publishedAt", "duplicateOfId", "tagsText", "submitterId",
  "submitterEmail", "batchId", "engineVersion", "screenedAt", "createdAt", "updatedAt",
];

/** A LIKE pattern matching `text` literally (%, _ and \ escaped), with ESCAPE '\' (SQLite and PostgreSQL). */
function likeContains(column: string, text: string) {
  const escaped = text.replace(/[\\%_]/g, (c) => `\\${c}`);
  return literal(`${column} LIKE ${sequelize.escape(`%${escaped}%`)} ESCAPE '\\'`);
}

function dayStart(day: string) {
  return new Date(`${day}T00:00:00.000Z`);
}
function dayEnd(day: string) {
  return new Date(`${day}T23:59:59.999Z`);
}

function dateRange(from?: string, to?: string) {
  if (!from && !to) return undefined;
  return { ...(from ? { [Op.gte]: dayStart(from) } : {}), ...(to ? { [Op.lte]: dayEnd(to) } : {}) };
}

/**
 * The words of a search: runs of letters and digits, lower-cased, without diacritics — the same
 * split as the FTS5 unicode61 tokenizer (remove_diacritics), so both sides agree.
 */
export function searchWords(q: string): string[] {
  return q.normalize("NFKD").replace(/\p{M}+/gu, "").toLowerCase().split(/[^\p{L}\p{N}]+/u).filter(Boolean).slice(0, 12);
}

/**
 * Text search over title, notes and slug: every word of the query must begin a word of the text
 * ("ampl chain" finds "amplifier chain"). SQLite uses the FTS5 word index, PostgreSQL a regular
 * expression per word (no index), other databases a substring LIKE. A query without letters or
 * digits is matched literally.
 */
async function textSearch(q: string, member: (column: string) => string) {
  const words = searchWords(q);
  if (!words.length) return likeContains("search_text", q.toLowerCase());
  if (await hasSearchIndex()) {
    const match = words.map((w) => `"${w}"*`).join(" ");
    return literal(`${member("rowid")} IN (SELECT rowid FROM registry_entries_search WHERE registry_entries_search MATCH ${sequelize.escape(match)})`);
  }
  if (sequelize.getDialect() === "postgres") {
    // Same rule without the index: the word follows the start or a character that is not a letter
    // or digit (search_text is stored lower-cased; words hold only letters and digits).
    return { [Op.and]: words.map((w) => literal(`search_text ~ ${sequelize.escape(`(^|[^[:alnum:]])${w}`)}`)) };
  }
  return { [Op.and]: words.map((w) => likeContains("search_text", w)) };
}

/**
 * How a tag or word set enters a WHERE: as a plain `column IN (…)`, which lets the database drive
 * the query from the set, or (SQLite, `walkSortIndex`) as `+column IN (…)`: SQLite's unary plus
 * keeps a term from being used as an index, so the planner walks the sort column's index and tests
 * each row against the set instead — far cheaper when the set is large and only a page is wanted.
 */
function setMember(walkSortIndex: boolean) {
  const plus = walkSortIndex && sequelize.getDialect() === "sqlite" ? "+" : "";
  return (column: string) => `${plus}${column}`;
}

/**
 * The WHERE of a filter set with the given visibility (by default the user's).
 * Tags go through the registry_entry_tags index; text through the search index.
 */
export async function registryWhere(user: CurrentUser, f: RegistryFilters, visibility: WhereOptions<RegistryEntry> = visibleEntriesWhere(user), options: { walkSortIndex?: boolean } = {}): Promise<WhereOptions<RegistryEntry>> {
  const member = setMember(Boolean(options.walkSortIndex));
  const and: WhereOptions<RegistryEntry>[] = [visibility];
  const eq = (field: keyof RegistryEntry, values?: string[]) => {
    if (values?.length) and.push({ [field]: values.length === 1 ? values[0] : { [Op.in]: values } } as WhereOptions<RegistryEntry>);
  };
  eq("equationClass", f.class);
  eq("reducibility", f.reducibility);
  eq("painleve", f.painleve);
  eq("agreement", f.agreement);
  eq("curationState", f.state);
  if (f.submitter) and.push({ submitterEmail: f.submitter });
  if (f.batch) and.push({ batchId: f.batch });
  if (f.engine) and.push({ engineVersion: f.engine });
  if (f.published !== undefined) and.push({ published: f.published });
  const created = dateRange(f.createdFrom, f.createdTo);
  if (created) and.push({ createdAt: created });
  const screened = dateRange(f.screenedFrom, f.screenedTo);
  if (screened) and.push({ screenedAt: screened });
  for (const tag of f.tags ?? []) {
    and.push(literal(`${member("id")} IN (SELECT entry_id FROM registry_entry_tags WHERE tag = ${sequelize.escape(tag)})`) as unknown as WhereOptions<RegistryEntry>);
  }
  if (f.q) and.push((await textSearch(f.q, member)) as unknown as WhereOptions<RegistryEntry>);
  return { [Op.and]: and };
}

export function registryOrder(sort: SortKey, dir: "asc" | "desc"): Order {
  const d = dir === "asc" ? "ASC" : "DESC";
  return [[SORT_COLUMNS[sort], d], ["id", d]];
}

export interface RegistryRow {
  id: string;
  slug: string;
  title: string;
  class: string;
  reducibility: string;
  painleve: string;
  agreement: string;
  variants: { total: number; screened: number; reducible: number };
  curationState: string;
  published: boolean;
  publishedAt: string | null;
  duplicateOfId: string | null;
  tags: string[];
  submitter: string;
  batchId: string;
  engineVersion: string | null;
  createdAt: string;
  screenedAt: string | null;
  updatedAt: string;
}

const iso = (d: Date | string | null) => (d ? new Date(d).toISOString() : null);

export function registryRow(e: RegistryEntry): RegistryRow {
  return {
    id: e.id,
    slug: e.slug,
    title: e.title,
    class: e.equationClass,
    reducibility: e.reducibility,
    painleve: e.painleve,
    agreement: e.agreement,
    variants: { total: e.variantsTotal, screened: e.variantsScreened, reducible: e.variantsReducible },
    curationState: e.curationState,
    published: Boolean(e.published),
    publishedAt: iso(e.publishedAt),
    duplicateOfId: e.duplicateOfId,
    tags: tagsFromText(e.tagsText),
    submitter: e.submitterEmail,
    batchId: e.batchId,
    engineVersion: e.engineVersion,
    createdAt: iso(e.createdAt) ?? "",
    screenedAt: iso(e.screenedAt),
    updatedAt: iso(e.updatedAt) ?? "",
  };
}

export interface RegistryPage {
  rows: RegistryRow[];
  total: number;
  page: number;
  size: number;
  pages: number;
}

/** Sorts with an index of (nearly) distinct values, which a page can be read off in order. */
const WALKABLE_SORTS = new Set<SortKey>(["title", "created", "screened"]);

/**
 * Index entries we are willing to walk (and test against a tag or word set) for one page. Above it,
 * reading the set's rows and sorting them is cheaper. Common practice, tuned on the 100 000-entry
 * benchmark (bench/registry-latency.ts).
 */
const WALK_BUDGET = 20_000;

/** Roughly how many entries there are (SQLite: the largest rowid, one index probe). */
async function approximateEntryCount(): Promise<number> {
  const [rows] = await sequelize.query("SELECT max(rowid) AS n FROM registry_entries");
  return Number((rows as { n: number | null }[])[0]?.n ?? 0);
}

/**
 * One page of the registry with its exact total. Plans, each kept to the indexes:
 *  - plain filters: one COUNT and one LIMIT/OFFSET query (both walk an index);
 *  - researchers see "published OR their own", an OR that defeats the sorted indexes, so (without
 *    a tag or text filter) it is split into two disjoint parts, each counted and cut at
 *    offset+size, and the database orders the union of the candidate ids (its own collation, so
 *    the order equals one query's);
 *  - tag or text filters: the COUNT is driven by the tag or word set; the page either walks the
 *    sort index testing each entry against the set (a large set: few steps to fill a page) or reads
 *    the set and sorts it (a small set, or a sort without a suitable index).
 */
export async function listRegistry(user: CurrentUser, query: RegistryQuery): Promise<RegistryPage> {
  const order = registryOrder(query.sort, query.dir);
  const setDriven = Boolean(query.filters.q || query.filters.tags?.length);
  if (setDriven) return listSetDriven(user, query, order);

  const split = !hasRole(user.role, "curator") && hasRole(user.role, "researcher");
  const parts = split ? [{ published: true }, { published: false, submitterId: user.id }] : [visibleEntriesWhere(user)];
  const wheres = await Promise.all(parts.map((v) => registryWhere(user, query.filters, v as WhereOptions<RegistryEntry>)));
  const wanted = query.page * query.size;

  let total = 0;
  let candidates: string[] | null = null;
  if (split) {
    candidates = [];
    for (const where of wheres) {
      total += await RegistryEntry.count({ where });
      const rows = await RegistryEntry.findAll({ where, attributes: ["id"], order, limit: wanted, raw: true });
      candidates.push(...rows.map((r) => r.id));
    }
  } else {
    total = await RegistryEntry.count({ where: wheres[0] });
  }
  const { page, offset, pages } = pageOf(query, total);
  const where = candidates ? { id: { [Op.in]: candidates } } : wheres[0];
  const rows = await RegistryEntry.findAll({ where, attributes: LIST_ATTRIBUTES, order, limit: query.size, offset });
  return { rows: rows.map(registryRow), total, page, size: query.size, pages };
}

function pageOf(query: RegistryQuery, total: number) {
  const pages = Math.max(1, Math.ceil(total / query.size));
  const page = Math.min(query.page, pages);
  return { page, pages, offset: (page - 1) * query.size };
}

async function listSetDriven(user: CurrentUser, query: RegistryQuery, order: Order): Promise<RegistryPage> {
  const total = await RegistryEntry.count({ where: await registryWhere(user, query.filters) });
  const { page, offset, pages } = pageOf(query, total);
  let walk = false;
  if (sequelize.getDialect() === "sqlite" && WALKABLE_SORTS.has(query.sort) && total > 0) {
    // Entries walked to fill the page ≈ (offset + size) / (share of entries in the set).
    walk = ((offset + query.size) * (await approximateEntryCount())) / total <= WALK_BUDGET;
  }
  const where = await registryWhere(user, query.filters, visibleEntriesWhere(user, { unindexed: walk }), { walkSortIndex: walk });
  const rows = await RegistryEntry.findAll({ where, attributes: LIST_ATTRIBUTES, order, limit: query.size, offset });
  return { rows: rows.map(registryRow), total, page, size: query.size, pages };
}

/** Page through a filtered set in chunks (for exports), at most `cap` rows. */
export async function* iterateRegistry(user: CurrentUser, query: RegistryQuery, cap: number, chunk = 500): AsyncGenerator<RegistryRow[]> {
  const where = await registryWhere(user, query.filters);
  const order = registryOrder(query.sort, query.dir);
  for (let offset = 0; offset < cap; offset += chunk) {
    const rows = await RegistryEntry.findAll({ where, attributes: LIST_ATTRIBUTES, order, limit: Math.min(chunk, cap - offset), offset });
    if (rows.length) yield rows.map(registryRow);
    if (rows.length < chunk) return;
  }
}

export async function countRegistry(user: CurrentUser, filters: RegistryFilters): Promise<number> {
  return RegistryEntry.count({ where: await registryWhere(user, filters) });
}
