/**
 * Verdicts that changed when a newer engine screened a variant again (the nightly re-screen, or a
 * re-upload after an engine update): the new done report is compared with the variant's previous
 * done report from a different engine version; any difference in the reducibility verdict, the
 * Painlevé verdict or their agreement is recorded once in verdict_changes.
 */
import { Op, type Transaction } from "sequelize";
import { ScreeningRun, VerdictChange, RegistryEntry, FamilyVariant } from "@/models";
import { reportVerdicts, verdictsOfColumns, type ReportVerdicts } from "@/lib/registry/verdicts";

const COMPARED = ["reducibility", "painleve", "agreement"] as const;

function verdictRecord(v: ReportVerdicts) {
  return { reducibility: v.reducibility, painleve: v.painleve, agreement: v.agreement };
}

export async function recordVerdictChange(t: Transaction, run: ScreeningRun, entryId: string, now: Date): Promise<VerdictChange | null> {
  // Runs after every finished run: the previous run's verdict columns, not its whole report.
  const previous = await ScreeningRun.findOne({
    where: { variantId: run.variantId, state: "done", id: { [Op.ne]: run.id }, reportJson: { [Op.ne]: null } },
    attributes: ["id", "engineVersion", "reducibilityVerdict", "painleveVerdict", "agreementVerdict"],
    order: [["finishedAt", "DESC"]],
    transaction: t,
  });
  if (!previous || previous.engineVersion === run.engineVersion) return null;
  const before = verdictsOfColumns(previous);
  const after = reportVerdicts(run.reportJson);
  if (!before || !after) return null;
  if (COMPARED.every((k) => before[k] === after[k])) return null;
  return VerdictChange.create(
    {
      entryId, variantId: run.variantId, oldEngine: previous.engineVersion, newEngine: run.engineVersion ?? after.engine ?? "unknown",
      oldVerdicts: JSON.stringify(verdictRecord(before)), newVerdicts: JSON.stringify(verdictRecord(after)), createdAt: now,
    },
    { transaction: t },
  );
}

export interface VerdictChangeView {
  id: string;
  entryId: string;
  slug: string;
  title: string;
  variantIndex: number | null;
  parameters: Record<string, number>;
  oldEngine: string | null;
  newEngine: string;
  before: Record<string, string>;
  after: Record<string, string>;
  changed: string[];
  createdAt: string;
}

/** The newest changes first (the curators' "changed since last engine" list). */
export async function listVerdictChanges(options: { limit?: number; since?: Date } = {}): Promise<VerdictChangeView[]> {
  const rows = await VerdictChange.findAll({
    where: options.since ? { createdAt: { [Op.gte]: options.since } } : {},
    order: [["createdAt", "DESC"]],
    limit: Math.min(Math.max(options.limit ?? 100, 1), 500),
  });
  if (rows.length === 0) return [];
  const [entries, variants] = await Promise.all([
    RegistryEntry.findAll({ where: { id: { [Op.in]: [...new Set(rows.map((r) => r.entryId))] } }, attributes: ["id", "slug", "title"] }),
    FamilyVariant.findAll({ where: { id: { [Op.in]: [...new Set(rows.map((r) => r.variantId))] } }, attributes: ["id", "variantIndex", "parametersJson"] }),
  ]);
  const entryById = new Map(entries.map((e) => [e.id, e]));
  const variantById = new Map(variants.map((v) => [v.id, v]));
  return rows.map((r) => {
    const before = JSON.parse(r.oldVerdicts) as Record<string, string>;
    const after = JSON.parse(r.newVerdicts) as Record<string, string>;
    const entry = entryById.get(r.entryId);
    const variant = variantById.get(r.variantId);
    return {
      id: r.id, entryId: r.entryId, slug: entry?.slug ?? "", title: entry?.title ?? "",
      variantIndex: variant?.variantIndex ?? null, parameters: variant ? (JSON.parse(variant.parametersJson) as Record<string, number>) : {},
      oldEngine: r.oldEngine, newEngine: r.newEngine, before, after,
      changed: COMPARED.filter((k) => before[k] !== after[k]),
      createdAt: r.createdAt.toISOString(),
    };
  });
}
