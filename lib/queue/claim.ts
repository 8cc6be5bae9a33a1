/**
 * Claiming runs atomically, so several worker processes (on one machine or many) can share the
 * queue without doing the same work twice.
 *
 * One UPDATE marks up to `limit` claimable runs with a fresh claim token and a lease; the worker
 * then reads back exactly the rows carrying its token. Claimable: queued and due, or running with
 * an expired lease (its worker died). On SQLite the write transaction is BEGIN IMMEDIATE, so claims
 * are serialised; on PostgreSQL the inner SELECT takes row locks with FOR UPDATE SKIP LOCKED, so
 * concurrent claimers skip each other's rows instead of waiting or double-claiming.
 */
import { randomUUID } from "node:crypto";
import { Op, QueryTypes, col, type Transaction } from "sequelize";
import { sequelize, ScreeningRun, FamilyVariant, Batch, BatchRun } from "@/models";
import { writeTransaction, isPostgres, addMs, rowLock } from "./db";
import { settleRun } from "./settle";

export interface ClaimedRun {
  id: string;
  token: string;
  variantId: string;
  familyId: string;
  batchId: string | null;
  purpose: string;
  attempts: number;
  maxAttempts: number;
  variantJson: string;
}

export interface ClaimOptions {
  workerId: string;
  limit: number;
  leaseMs: number;
  now?: Date;
}

/**
 * Runs whose lease expired and that must not be tried again: the owner cancelled them, or they
 * used up their attempts (their worker kept dying, e.g. killed by the OS). They end here.
 */
async function reapExpired(t: Transaction, now: Date): Promise<number> {
  const stale = await ScreeningRun.findAll({
    where: {
      state: "running",
      leaseExpiresAt: { [Op.lt]: now },
      [Op.or]: [{ cancelRequested: true }, { attempts: { [Op.gte]: col("max_attempts") } }],
    },
    transaction: t,
    ...rowLock(t),
    ...(isPostgres() ? { skipLocked: true } : {}),
  });
  for (const run of stale) {
    const patch = run.cancelRequested
      ? { state: "cancelled" as const, error: "cancelled by the batch owner" }
      : { state: "failed" as const, error: `gave up after ${run.attempts} attempts: the worker running it stopped before finishing (lease expired)` };
    await settleRun(t, run, patch, now);
  }
  return stale.length;
}

export async function claimRuns(options: ClaimOptions): Promise<ClaimedRun[]> {
  const now = options.now ?? new Date();
  if (options.limit <= 0) return [];
  return writeTransaction(async (t) => {
    await reapExpired(t, now);
    const token = randomUUID();
    const lock = isPostgres() ? " FOR UPDATE SKIP LOCKED" : "";
    await sequelize.query(
      `UPDATE screening_runs
          SET state = :running, claim_token = :token, claimed_by = :worker, lease_expires_at = :lease,
              attempts = attempts + 1, started_at = :now, updated_at = :now
        WHERE id IN (
          SELECT id FROM screening_runs
           WHERE cancel_requested = :no
             AND ((state = :queued AND available_at <= :now) OR (state = :running AND lease_expires_at < :now))
           ORDER BY available_at, created_at
           LIMIT :limit${lock})`,
      {
        replacements: { running: "running", queued: "queued", token, worker: options.workerId.slice(0, 80), lease: addMs(now, options.leaseMs), now, no: false, limit: options.limit },
        type: QueryTypes.UPDATE,
        transaction: t,
      },
    );
    const runs = await ScreeningRun.findAll({ where: { claimToken: token }, transaction: t });
    if (runs.length === 0) return [];
    const variants = await FamilyVariant.findAll({ where: { id: { [Op.in]: runs.map((r) => r.variantId) } }, attributes: ["id", "variantJson"], transaction: t });
    const json = new Map(variants.map((v) => [v.id, v.variantJson]));
    await markBatchesRunning(t, runs.map((r) => r.id), now);
    return runs.map((r) => ({
      id: r.id, token, variantId: r.variantId, familyId: r.familyId, batchId: r.batchId, purpose: r.purpose,
      attempts: r.attempts, maxAttempts: r.maxAttempts, variantJson: json.get(r.variantId) ?? "",
    }));
  });
}

/** A batch becomes running when the first of its runs is claimed. */
async function markBatchesRunning(t: Transaction, runIds: string[], now: Date): Promise<void> {
  const links = await BatchRun.findAll({ where: { runId: { [Op.in]: runIds } }, attributes: ["batchId"], transaction: t });
  const ids = [...new Set(links.map((l) => l.batchId))];
  if (ids.length === 0) return;
  await Batch.update({ state: "running", startedAt: now }, { where: { id: { [Op.in]: ids }, state: "queued" }, transaction: t });
}
