/**
 * Keeps a family's registry entry in step with the latest finished report of each of its variants.
 * Called when a family is stored and whenever one of its runs finishes.
 */
import { Op, type Transaction } from "sequelize";
import { Family, FamilyVariant, RegistryEntry, ScreeningRun, User } from "@/models";
import { coefficientsKey, readStoredSpec } from "./coefficients";
import { syncEntryTags } from "./tags";
import { normaliseTag } from "./filters";

export { reportVerdicts, type ReportVerdicts } from "./verdicts";
import { verdictsOfColumns, type ReportVerdicts } from "./verdicts";

/** One word for many variants: the common verdict, "mixed" when they differ, "pending" when none. */
export function summarise(values: string[]): string {
  if (values.length === 0) return "pending";
  return values.every((v) => v === values[0]) ? values[0] : "mixed";
}

export function summariseAgreement(values: string[]): string {
  if (values.length === 0) return "pending";
  if (values.includes("conflict")) return "conflict";
  return values.every((v) => v === "agree") ? "agree" : "inconclusive";
}

/**
 * The latest finished run of each variant of a family — its verdict columns, never the report
 * itself (reports are ~100 KB; this runs after every finished run of a family).
 */
export async function latestReports(familyId: string, transaction?: Transaction) {
  const runs = await ScreeningRun.findAll({
    where: { familyId, state: "done", reportJson: { [Op.ne]: null } },
    attributes: ["id", "variantId", "engineVersion", "finishedAt", "reducibilityVerdict", "painleveVerdict", "agreementVerdict"],
    order: [["finishedAt", "DESC"]],
    transaction,
    raw: true, // plain rows: building thousands of model instances cost more than the query
  });
  const latest = new Map<string, LatestRun>();
  for (const run of runs) {
    if (latest.has(run.variantId)) continue;
    latest.set(run.variantId, { ...run, finishedAt: run.finishedAt ? new Date(run.finishedAt) : null });
  }
  return latest;
}

/** What the summary needs of a variant's latest finished run. */
export interface LatestRun {
  id: string;
  variantId: string;
  engineVersion: string | null;
  finishedAt: Date | null;
  reducibilityVerdict: string | null;
  painleveVerdict: string | null;
  agreementVerdict: string | null;
}

export async function refreshRegistryEntry(familyId: string, transaction?: Transaction): Promise<RegistryEntry | null> {
  const family = await Family.findByPk(familyId, { transaction });
  if (!family) return null;
  const [variantCount, latest, submitter] = await Promise.all([
    FamilyVariant.count({ where: { familyId }, transaction }),
    latestReports(familyId, transaction),
    User.findByPk(family.ownerId, { attributes: ["email"], transaction }),
  ]);
  const verdicts = [...latest.values()].map(verdictsOfColumns).filter((v): v is ReportVerdicts => v !== null);
  const engines = [...latest.values()].map((r) => r.engineVersion).filter((v): v is string => Boolean(v)).sort();
  const tags = [...new Set((JSON.parse(family.tagsJson) as string[]).map(normaliseTag).filter((t): t is string => t !== null))];
  const values = {
    familyId,
    slug: family.slug,
    title: family.title,
    equationClass: family.equationClass,
    reducibility: summarise(verdicts.map((v) => v.reducibility)),
    painleve: summarise(verdicts.map((v) => v.painleve)),
    agreement: summariseAgreement(verdicts.map((v) => v.agreement)),
    variantsTotal: variantCount,
    variantsScreened: verdicts.length,
    variantsReducible: verdicts.filter((v) => v.reducibility === "reducible").length,
    tagsText: tags.length ? `,${tags.join(",")},` : "",
    submitterId: family.ownerId,
    submitterEmail: submitter?.email ?? "",
    batchId: family.firstBatchId,
    engineVersion: engines.length ? engines[0] : null, // the oldest engine that judged a variant
    normalisedKey: family.contentHash,
    coefficientsKey: coefficientsKey(family.equationClass, readStoredSpec(family.specJson)),
    searchText: `${family.title}\n${family.notes}\n${family.slug}`.toLowerCase(),
    screenedAt: latest.size ? new Date(Math.max(...[...latest.values()].map((r) => r.finishedAt?.getTime() ?? 0))) : null,
  };
  const existing = await RegistryEntry.findOne({ where: { familyId }, transaction });
  if (existing) {
    const tagsChanged = existing.tagsText !== values.tagsText;
    await existing.update(values, { transaction });
    if (tagsChanged) await syncEntryTags(existing.id, tags, transaction);
    return existing;
  }
  const created = await RegistryEntry.create(values, { transaction });
  await syncEntryTags(created.id, tags, transaction);
  return created;
}
