/**
 * One registry entry with what its page shows: the family (spec, source YAML, provenance), a page
 * of its variants with their latest verdicts, the chosen variant's full report, the curation
 * history and duplicate marks. Visibility is checked here (lib/registry/visibility).
 */
import { Op } from "sequelize";
import { AuditEvent, Batch, Family, FamilyVariant, RegistryEntry, ScreeningRun } from "@/models";
import type { CurrentUser } from "@/lib/auth/current-user";
import type { Variant } from "@/lib/screening/spec";
import { canSeeEntry } from "./visibility";
import { isUuid, tagsFromText } from "./filters";
import { registryRow, type RegistryRow } from "./queries";
import { readStoredSpec, type StoredSpec } from "./coefficients";
import { verdictsOfColumns } from "./verdicts";
import { readReport, type ReportView } from "./report-view";

export const VARIANTS_PER_PAGE = 50;

export interface VariantSummary {
  id: string;
  index: number;
  parameters: Record<string, number>;
  reducibility: string;
  painleve: string;
  agreement: string;
  engine: string | null;
  finishedAt: string | null;
}

export interface HistoryItem {
  id: string;
  action: string;
  actor: string | null;
  detail: string | null;
  at: string;
}

export interface EntryDetail {
  entry: RegistryRow & { normalisedKey: string | null; coefficientsKey: string | null };
  family: {
    id: string;
    slug: string;
    title: string;
    class: string;
    notes: string;
    tags: string[];
    spec: StoredSpec;
    sourceYaml: string;
    fileName: string | null;
    documentIndex: number | null;
    createdAt: string;
  };
  batch: { id: string; title: string; createdAt: string } | null;
  variantsPage: { rows: VariantSummary[]; page: number; pages: number; total: number };
  selected: { summary: VariantSummary; variant: Variant | null; report: ReportView | null; runId: string | null; startedAt: string | null } | null;
  history: HistoryItem[];
  duplicateOf: { id: string; slug: string; title: string } | null;
  duplicates: { id: string; slug: string; title: string }[];
}

const iso = (d: Date | string | null | undefined) => (d ? new Date(d).toISOString() : null);

function parseJson<T>(text: string | null | undefined, fallback: T): T {
  if (!text) return fallback;
  try {
    return JSON.parse(text) as T;
  } catch {
    return fallback;
  }
}

/** The latest done run of each of the given variants. */
/**
 * The latest done run of each variant; its report only when asked (the page lists verdicts from the
 * run's columns and reads one report, the selected variant's; the JSON export needs them all).
 */
async function latestRuns(variantIds: string[], options: { reports: boolean }) {
  if (!variantIds.length) return new Map<string, ScreeningRun>();
  const runs = await ScreeningRun.findAll({
    where: { variantId: { [Op.in]: variantIds }, state: "done", reportJson: { [Op.ne]: null } },
    ...(options.reports ? {} : { attributes: { exclude: ["reportJson"] } }),
    order: [["finishedAt", "DESC"]],
  });
  const latest = new Map<string, ScreeningRun>();
  for (const run of runs) if (!latest.has(run.variantId)) latest.set(run.variantId, run);
  return latest;
}

export async function entryHistory(entryId: string): Promise<HistoryItem[]> {
  const rows = await AuditEvent.findAll({ where: { targetType: "entry", targetId: entryId }, order: [["createdAt", "ASC"]], limit: 500 });
  return rows.map((r) => ({ id: r.id, action: r.action, actor: r.actorEmail, detail: r.detail, at: iso(r.createdAt) ?? "" }));
}

/** The entry if the user may see it (null otherwise: callers answer 404, so existence is not revealed). */
export async function findVisibleEntry(user: CurrentUser, id: string): Promise<RegistryEntry | null> {
  if (!isUuid(id)) return null;
  const entry = await RegistryEntry.findByPk(id);
  return entry && canSeeEntry(user, entry) ? entry : null;
}

export async function getEntryDetail(user: CurrentUser, id: string, options: { variant?: number; variantPage?: number } = {}): Promise<EntryDetail | null> {
  const entry = await findVisibleEntry(user, id);
  if (!entry) return null;
  const family = await Family.findByPk(entry.familyId);
  if (!family) return null;
  const total = await FamilyVariant.count({ where: { familyId: family.id } });
  const pages = Math.max(1, Math.ceil(total / VARIANTS_PER_PAGE));
  const wanted = options.variant !== undefined && Number.isInteger(options.variant) && options.variant >= 0 ? options.variant : null;
  const page = wanted !== null ? Math.floor(wanted / VARIANTS_PER_PAGE) + 1 : Math.min(Math.max(1, options.variantPage ?? 1), pages);
  const variants = await FamilyVariant.findAll({
    where: { familyId: family.id },
    attributes: ["id", "variantIndex", "parametersJson"],
    order: [["variantIndex", "ASC"]],
    limit: VARIANTS_PER_PAGE,
    offset: (page - 1) * VARIANTS_PER_PAGE,
  });
  const runs = await latestRuns(variants.map((v) => v.id), { reports: false });
  const rows: VariantSummary[] = variants.map((v) => {
    const run = runs.get(v.id);
    const verdicts = run ? verdictsOfColumns(run) : null;
    return {
      id: v.id,
      index: v.variantIndex,
      parameters: parseJson<Record<string, number>>(v.parametersJson, {}),
      reducibility: verdicts?.reducibility ?? "pending",
      painleve: verdicts?.painleve ?? "pending",
      agreement: verdicts?.agreement ?? "pending",
      engine: run?.engineVersion ?? null,
      finishedAt: iso(run?.finishedAt),
    };
  });
  // Default selection: the first screened reducible variant on the page, else the first screened, else the first.
  const chosen =
    (wanted !== null ? rows.find((r) => r.index === wanted) : undefined) ??
    rows.find((r) => r.reducibility === "reducible") ??
    rows.find((r) => r.reducibility !== "pending") ??
    rows[0];
  let selected: EntryDetail["selected"] = null;
  if (chosen) {
    const full = await FamilyVariant.findByPk(chosen.id);
    const run = runs.get(chosen.id);
    const report = run ? await ScreeningRun.findByPk(run.id, { attributes: ["reportJson"] }) : null;
    selected = {
      summary: chosen,
      variant: parseJson<Variant | null>(full?.variantJson, null),
      report: readReport(report?.reportJson ?? null),
      runId: run?.id ?? null,
      startedAt: iso(run?.startedAt),
    };
  }
  const [batch, history, original, duplicates] = await Promise.all([
    Batch.findByPk(entry.batchId, { attributes: ["id", "title", "createdAt"] }),
    entryHistory(entry.id),
    entry.duplicateOfId ? RegistryEntry.findByPk(entry.duplicateOfId, { attributes: ["id", "slug", "title", "published", "submitterId"] }) : Promise.resolve(null),
    RegistryEntry.findAll({ where: { duplicateOfId: entry.id }, attributes: ["id", "slug", "title", "published", "submitterId"], limit: 50 }),
  ]);
  const spec = readStoredSpec(family.specJson);
  return {
    entry: { ...registryRow(entry), normalisedKey: entry.normalisedKey, coefficientsKey: entry.coefficientsKey },
    family: {
      id: family.id,
      slug: family.slug,
      title: family.title,
      class: family.equationClass,
      notes: family.notes,
      tags: tagsFromText(entry.tagsText),
      spec,
      sourceYaml: family.sourceYaml,
      fileName: family.fileName,
      documentIndex: family.documentIndex,
      createdAt: iso(family.createdAt) ?? "",
    },
    batch: batch ? { id: batch.id, title: batch.title, createdAt: iso(batch.createdAt) ?? "" } : null,
    variantsPage: { rows, page, pages, total },
    selected,
    history,
    // Links only to entries the user may open.
    duplicateOf: original && canSeeEntry(user, original) ? { id: original.id, slug: original.slug, title: original.title } : null,
    duplicates: duplicates.filter((d) => canSeeEntry(user, d)).map((d) => ({ id: d.id, slug: d.slug, title: d.title })),
  };
}

/** Every variant's latest report, in chunks (for the JSON export). */
export async function* entryReports(familyId: string, chunk = 50): AsyncGenerator<{ index: number; parameters: Record<string, number>; engine: string | null; finishedAt: string | null; report: unknown }[]> {
  for (let offset = 0; ; offset += chunk) {
    const variants = await FamilyVariant.findAll({ where: { familyId }, attributes: ["id", "variantIndex", "parametersJson"], order: [["variantIndex", "ASC"]], limit: chunk, offset });
    if (!variants.length) return;
    const runs = await latestRuns(variants.map((v) => v.id), { reports: true });
    yield variants.map((v) => {
      const run = runs.get(v.id);
      return {
        index: v.variantIndex,
        parameters: parseJson<Record<string, number>>(v.parametersJson, {}),
        engine: run?.engineVersion ?? null,
        finishedAt: iso(run?.finishedAt),
        report: parseJson<unknown>(run?.reportJson, null),
      };
    });
    if (variants.length < chunk) return;
  }
}
