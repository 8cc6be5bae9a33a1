/**
 * The registry table's query: filters, sort and page, read from and written to URL search
 * parameters. Pure (no server imports), so the client table and the API share one reading.
 */

export const EQUATION_CLASSES = ["nls", "kdv", "mkdv"] as const;
export const REDUCIBILITY_VALUES = ["reducible", "not-reducible", "undecided", "mixed", "pending"] as const;
export const PAINLEVE_VALUES = ["passes", "fails", "undecided", "mixed", "not-run", "pending"] as const;
export const AGREEMENT_VALUES = ["agree", "conflict", "inconclusive", "pending"] as const;
export const CURATION_VALUES = ["candidate", "accepted", "rejected", "returned"] as const;

/** Columns the server can sort by (each backed by an index or a small result). */
export const SORT_KEYS = ["title", "slug", "class", "reducibility", "painleve", "agreement", "state", "submitter", "engine", "variants", "created", "screened", "published"] as const;
export type SortKey = (typeof SORT_KEYS)[number];

export const PAGE_SIZES = [10, 25, 50, 100] as const;
export const DEFAULT_PAGE_SIZE = 25;
export const MAX_PAGE_SIZE = 100;
export const MAX_QUERY_LENGTH = 200;
export const MAX_TAGS_IN_FILTER = 5;
/** Most rows one export holds (lib/registry/export.ts); the table warns when a set is larger. */
export const EXPORT_CAP = 10_000;

export interface RegistryFilters {
  /** Text search over title, notes and slug (case-insensitive substring). */
  q?: string;
  class?: string[];
  reducibility?: string[];
  painleve?: string[];
  agreement?: string[];
  state?: string[];
  /** Every listed tag must be present. */
  tags?: string[];
  /** Submitter e-mail (exact, case-insensitive). */
  submitter?: string;
  batch?: string;
  engine?: string;
  published?: boolean;
  /** Dates as YYYY-MM-DD (UTC), inclusive. */
  createdFrom?: string;
  createdTo?: string;
  screenedFrom?: string;
  screenedTo?: string;
}

export interface RegistryQuery {
  filters: RegistryFilters;
  sort: SortKey;
  dir: "asc" | "desc";
  page: number;
  size: number;
}

export const DEFAULT_QUERY: RegistryQuery = { filters: {}, sort: "created", dir: "desc", page: 1, size: DEFAULT_PAGE_SIZE };

type Params = { get(name: string): string | null };

const DATE = /^\d{4}-\d{2}-\d{2}$/;
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
/** Tags: 1–40 characters, no commas (they delimit tags_text), no control characters, no blanks (written as '-'). */
const TAG = /^[^,\s\p{Cc}][^,\s\p{Cc}]{0,39}$/u;

function list(params: Params, name: string, allowed: readonly string[]): string[] | undefined {
  const raw = params.get(name);
  if (!raw) return undefined;
  const values = [...new Set(raw.split(",").map((v) => v.trim()).filter((v) => allowed.includes(v)))];
  return values.length ? values : undefined;
}

function text(params: Params, name: string, max = MAX_QUERY_LENGTH): string | undefined {
  const raw = params.get(name)?.trim();
  return raw ? raw.slice(0, max) : undefined;
}

function date(params: Params, name: string): string | undefined {
  const raw = params.get(name);
  return raw && DATE.test(raw) && !Number.isNaN(Date.parse(`${raw}T00:00:00Z`)) ? raw : undefined;
}

export const isUuid = (value: unknown): value is string => typeof value === "string" && UUID.test(value);

/** A tag as stored: lower-case, blanks written as '-', no commas (commas delimit tags in tags_text). */
export function normaliseTag(tag: string): string | null {
  const t = tag.trim().toLowerCase().replace(/\s+/g, "-");
  return TAG.test(t) ? t : null;
}

/** Read a query from URL search parameters; unknown or malformed values are dropped, never guessed. */
export function parseRegistryQuery(params: Params): RegistryQuery {
  const tags = params.get("tags")?.split(",").map(normaliseTag).filter((t): t is string => t !== null);
  const batch = params.get("batch");
  const pub = params.get("published");
  const filters: RegistryFilters = {
    q: text(params, "q"),
    class: list(params, "class", EQUATION_CLASSES),
    reducibility: list(params, "reducibility", REDUCIBILITY_VALUES),
    painleve: list(params, "painleve", PAINLEVE_VALUES),
    agreement: list(params, "agreement", AGREEMENT_VALUES),
    state: list(params, "state", CURATION_VALUES),
    tags: tags?.length ? [...new Set(tags)].slice(0, MAX_TAGS_IN_FILTER) : undefined,
    submitter: text(params, "submitter", 254)?.toLowerCase(),
    batch: batch && UUID.test(batch) ? batch.toLowerCase() : undefined,
    engine: text(params, "engine", 20),
    published: pub === "yes" ? true : pub === "no" ? false : undefined,
    createdFrom: date(params, "createdFrom"),
    createdTo: date(params, "createdTo"),
    screenedFrom: date(params, "screenedFrom"),
    screenedTo: date(params, "screenedTo"),
  };
  for (const key of Object.keys(filters) as (keyof RegistryFilters)[]) if (filters[key] === undefined) delete filters[key];
  const sortRaw = params.get("sort");
  const sort = (SORT_KEYS as readonly string[]).includes(sortRaw ?? "") ? (sortRaw as SortKey) : DEFAULT_QUERY.sort;
  const dirRaw = params.get("dir");
  const dir = dirRaw === "asc" || dirRaw === "desc" ? dirRaw : sortRaw ? "asc" : DEFAULT_QUERY.dir;
  const page = Math.max(1, Math.min(100_000, Number.parseInt(params.get("page") ?? "1", 10) || 1));
  const sizeRaw = Number.parseInt(params.get("size") ?? "", 10);
  const size = Number.isFinite(sizeRaw) && sizeRaw > 0 ? Math.min(MAX_PAGE_SIZE, sizeRaw) : DEFAULT_PAGE_SIZE;
  return { filters, sort, dir, page, size };
}

/** The inverse of parseRegistryQuery: only non-default values are written, so links stay short. */
export function registryQueryToParams(query: RegistryQuery, options: { paging?: boolean } = {}): URLSearchParams {
  const out = new URLSearchParams();
  const f = query.filters;
  if (f.q) out.set("q", f.q);
  for (const key of ["class", "reducibility", "painleve", "agreement", "state", "tags"] as const) {
    const v = f[key];
    if (v?.length) out.set(key, v.join(","));
  }
  if (f.submitter) out.set("submitter", f.submitter);
  if (f.batch) out.set("batch", f.batch);
  if (f.engine) out.set("engine", f.engine);
  if (f.published !== undefined) out.set("published", f.published ? "yes" : "no");
  for (const key of ["createdFrom", "createdTo", "screenedFrom", "screenedTo"] as const) {
    const v = f[key];
    if (v) out.set(key, v);
  }
  if (query.sort !== DEFAULT_QUERY.sort || query.dir !== DEFAULT_QUERY.dir) {
    out.set("sort", query.sort);
    out.set("dir", query.dir);
  }
  if (options.paging !== false) {
    if (query.page !== 1) out.set("page", String(query.page));
    if (query.size !== DEFAULT_PAGE_SIZE) out.set("size", String(query.size));
  }
  return out;
}

/** Tags from the stored ",a,b," form. */
export function tagsFromText(tagsText: string): string[] {
  return tagsText.split(",").filter(Boolean);
}

export function tagsToText(tags: readonly string[]): string {
  return tags.length ? `,${tags.join(",")},` : "";
}
