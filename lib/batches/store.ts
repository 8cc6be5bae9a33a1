/**
 * Storing a validated upload as one batch, in one transaction: either the batch with all its
 * valid families is stored, or nothing is (a failed write leaves the database as it was).
 */
import { Batch, Family, BatchFamily, FamilyVariant } from "@/models";
import { writeTransaction } from "@/lib/db";
import type { FamilySpec } from "@/lib/screening/spec/types";
import type { FileValidation } from "./validate";
import type { CurrentUser } from "@/lib/auth/current-user";
import { recordAudit } from "@/lib/audit";
import { refreshRegistryEntry } from "@/lib/registry/refresh";
import { enqueueBatchRuns } from "@/lib/queue/enqueue";
import { updateBatchStates } from "@/lib/queue/batch-state";

/** What of a FamilySpec is kept as its normalised description (trees live on the variants). */
function specRecord(f: FamilySpec) {
  return {
    id: f.id, title: f.title, class: f.class, variables: f.variables, parameters: f.parameters,
    coefficients: f.coefficientText, equation: f.equation, functions: f.functions, window: f.window,
    tags: f.tags, notes: f.notes, location: f.location,
  };
}

export interface StoredBatch {
  id: string;
  families: number;
  reusedFamilies: number;
  variants: number;
  errors: number;
  /** Runs queued for this batch, and earlier runs whose results were linked (see lib/queue/enqueue.ts). */
  queuedRuns: number;
  linkedRuns: number;
}

export async function storeBatch(owner: CurrentUser, validations: FileValidation[], title?: string): Promise<StoredBatch> {
  const families = validations.flatMap((v) => v.families.map((f) => ({ file: v.file, spec: f })));
  const errorCount = validations.reduce((n, v) => n + v.errors.length, 0);
  const files = validations.map((v) => ({ name: v.file, bytes: v.bytes, families: v.families.length, errors: v.errors }));
  const batchTitle = (title?.trim() || validations.map((v) => v.file).join(", ")).slice(0, 200);

  const stored = await writeTransaction(async (transaction) => {
    const batch = await Batch.create(
      { ownerId: owner.id, title: batchTitle, state: "queued", filesJson: JSON.stringify(files), errorCount },
      { transaction },
    );
    let reused = 0;
    let variants = 0;
    const seen = new Set<string>();
    const familyIds: string[] = [];
    for (const { file, spec } of families) {
      if (seen.has(spec.hash)) continue; // the same family twice in one upload counts once
      seen.add(spec.hash);
      const existing = await Family.findOne({ where: { ownerId: owner.id, contentHash: spec.hash }, transaction });
      let familyId: string;
      if (existing) {
        familyId = existing.id;
        reused++;
      } else {
        const family = await Family.create(
          {
            ownerId: owner.id, firstBatchId: batch.id, slug: spec.id, title: spec.title, equationClass: spec.class,
            contentHash: spec.hash, specJson: JSON.stringify(specRecord(spec)), sourceYaml: spec.source, fileName: file,
            documentIndex: spec.location.document ?? null, tagsJson: JSON.stringify(spec.tags), notes: spec.notes,
            variantCount: spec.variants.length,
          },
          { transaction },
        );
        familyId = family.id;
        await FamilyVariant.bulkCreate(
          spec.variants.map((v) => ({ familyId, variantIndex: v.index, parametersJson: JSON.stringify(v.parameters), variantJson: JSON.stringify(v) })),
          { transaction },
        );
        await refreshRegistryEntry(familyId, transaction);
      }
      variants += spec.variants.length;
      familyIds.push(familyId);
      await BatchFamily.create({ batchId: batch.id, familyId, reused: Boolean(existing) }, { transaction });
    }
    await batch.update({ familyCount: seen.size, variantCount: variants }, { transaction });
    // Screening work goes on the queue in the same transaction: a stored batch always has its runs.
    const runs = await enqueueBatchRuns(transaction, batch.id, familyIds);
    await updateBatchStates(transaction, [batch.id], new Date()); // done at once when every result was linked
    return { id: batch.id, families: seen.size, reusedFamilies: reused, variants, errors: errorCount, queuedRuns: runs.queued, linkedRuns: runs.linked };
  });
  await recordAudit(owner, "batch.created", "batch", stored.id, `${stored.families} families, ${stored.variants} variants, ${stored.errors} errors`);
  return stored;
}
