/**
 * Putting work on the queue, always inside the caller's transaction.
 *
 * The rule for a batch (documented in README "Background jobs"): for every variant of every family
 * in the batch —
 *   1. it has a done run made by the current ENGINE_VERSION → that run is linked into the batch
 *      (its result is reused, nothing is screened again);
 *   2. otherwise it has a run still queued or running → that run is linked (no duplicate work);
 *   3. otherwise a new queued run (purpose "upload") is created for the batch.
 * A new family always takes rule 3; a family uploaded again takes 1 or 2 where it can.
 */
import { Op, type Transaction } from "sequelize";
import { ScreeningRun, FamilyVariant, BatchRun } from "@/models";
import type { RunPurpose } from "@/models/screening-run";
import { ENGINE_VERSION } from "@/lib/screening/version";

export interface EnqueueResult {
  queued: number;
  linked: number;
}

export async function enqueueBatchRuns(t: Transaction, batchId: string, familyIds: string[], now = new Date()): Promise<EnqueueResult> {
  if (familyIds.length === 0) return { queued: 0, linked: 0 };
  const variants = await FamilyVariant.findAll({ where: { familyId: { [Op.in]: familyIds } }, attributes: ["id", "familyId", "variantIndex"], order: [["familyId", "ASC"], ["variantIndex", "ASC"]], transaction: t });
  const existing = await ScreeningRun.findAll({
    where: {
      variantId: { [Op.in]: variants.map((v) => v.id) },
      [Op.or]: [{ state: "done", engineVersion: ENGINE_VERSION }, { state: { [Op.in]: ["queued", "running"] }, cancelRequested: false }],
    },
    attributes: ["id", "variantId", "state", "finishedAt", "createdAt"],
    order: [["createdAt", "DESC"]],
    transaction: t,
  });
  const done = new Map<string, string>();
  const active = new Map<string, string>();
  for (const run of existing) {
    const into = run.state === "done" ? done : active;
    if (!into.has(run.variantId)) into.set(run.variantId, run.id);
  }
  const links: { batchId: string; runId: string; linked: boolean; createdAt: Date }[] = [];
  const fresh: { variantId: string; familyId: string; batchId: string; purpose: RunPurpose; state: "queued"; availableAt: Date }[] = [];
  for (const v of variants) {
    const reuse = done.get(v.id) ?? active.get(v.id);
    if (reuse) links.push({ batchId, runId: reuse, linked: true, createdAt: now });
    else fresh.push({ variantId: v.id, familyId: v.familyId, batchId, purpose: "upload", state: "queued", availableAt: now });
  }
  const created = fresh.length ? await ScreeningRun.bulkCreate(fresh, { transaction: t }) : [];
  for (const run of created) links.push({ batchId, runId: run.id, linked: false, createdAt: now });
  if (links.length) await BatchRun.bulkCreate(links, { transaction: t });
  return { queued: created.length, linked: links.length - created.length };
}

/** Queue one run outside any batch (the nightly re-screen). */
export async function enqueueRun(t: Transaction, variant: { id: string; familyId: string }, purpose: RunPurpose, now = new Date()): Promise<ScreeningRun> {
  return ScreeningRun.create({ variantId: variant.id, familyId: variant.familyId, batchId: null, purpose, state: "queued", availableAt: now }, { transaction: t });
}
