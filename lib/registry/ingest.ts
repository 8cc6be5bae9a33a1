/**
 * Storing a finished report: one done ScreeningRun for the variant, then the family's registry
 * entry is refreshed. Used by scripts/screen-and-record.ts (synchronous screening) and anywhere a
 * report is produced outside the queue. A queued, unclaimed run of the same variant is completed
 * instead of adding a second row, so the queue does not screen it again.
 */
import { FamilyVariant, Family, ScreeningRun, type RegistryEntry } from "@/models";
import { writeTransaction } from "./db";
import type { VariantReport } from "@/lib/screening/report";
import { refreshRegistryEntry } from "./refresh";

export interface RecordOptions {
  startedAt?: Date;
  finishedAt?: Date;
  purpose?: "upload" | "rescreen" | "design";
}

export type RecordResult = { ok: true; runId: string; entry: RegistryEntry | null } | { ok: false; error: string };

export async function recordReport(variantId: string, report: VariantReport, options: RecordOptions = {}): Promise<RecordResult> {
  const finishedAt = options.finishedAt ?? new Date();
  return writeTransaction(async (transaction) => {
    const variant = await FamilyVariant.findByPk(variantId, { transaction });
    if (!variant) return { ok: false, error: `no variant ${variantId}` };
    const family = await Family.findByPk(variant.familyId, { transaction });
    if (!family) return { ok: false, error: `variant ${variantId} has no family` };
    const values = {
      state: "done" as const,
      stage: null,
      engineVersion: report.engine,
      reportJson: JSON.stringify(report),
      error: null,
      startedAt: options.startedAt ?? finishedAt,
      finishedAt,
    };
    const queued = await ScreeningRun.findOne({ where: { variantId, state: "queued", claimToken: null }, order: [["createdAt", "ASC"]], transaction });
    let runId: string;
    if (queued) {
      await queued.update({ ...values, attempts: queued.attempts + 1 }, { transaction });
      runId = queued.id;
    } else {
      const run = await ScreeningRun.create(
        { ...values, variantId, familyId: family.id, batchId: family.firstBatchId, purpose: options.purpose ?? "upload", attempts: 1, availableAt: finishedAt },
        { transaction },
      );
      runId = run.id;
    }
    const entry = await refreshRegistryEntry(family.id, transaction);
    return { ok: true, runId, entry };
  });
}
