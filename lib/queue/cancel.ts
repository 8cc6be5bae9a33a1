/**
 * Cancelling a batch (its owner, or an admin): queued runs end as cancelled at once; running ones
 * are flagged and stopped by their worker when it next reports (a stage change or lease renewal).
 * A run shared with another batch that still wants it is left alone.
 */
import { Op, QueryTypes } from "sequelize";
import { sequelize, Batch, ScreeningRun } from "@/models";
import { hasRole } from "@/lib/auth/roles";
import type { CurrentUser } from "@/lib/auth/current-user";
import { recordAudit } from "@/lib/audit";
import { writeTransaction, rowLock } from "./db";
import { settleRun } from "./settle";
import { updateBatchStates } from "./batch-state";

export type CancelResult =
  | { ok: true; value: { cancelledQueued: number; stopping: number; state: string } }
  | { ok: false; status: number; error: string };

export async function cancelBatch(user: CurrentUser, batchId: string, now = new Date()): Promise<CancelResult> {
  const result = await writeTransaction(async (t): Promise<CancelResult> => {
    const batch = await Batch.findByPk(batchId, { transaction: t, ...rowLock(t) });
    if (!batch || (batch.ownerId !== user.id && !hasRole(user.role, "curator"))) return { ok: false, status: 404, error: "no such batch" };
    if (batch.ownerId !== user.id && !hasRole(user.role, "admin")) return { ok: false, status: 403, error: "only the batch owner can cancel it" };
    if (batch.state === "done" || batch.state === "cancelled") return { ok: false, status: 409, error: `the batch is ${batch.state} already` };
    await batch.update({ cancelRequestedAt: batch.cancelRequestedAt ?? now }, { transaction: t });
    // Active runs of this batch that no other live (not cancelling) batch also counts on.
    const ids = await sequelize.query<{ id: string }>(
      `SELECT r.id AS id FROM batch_runs br JOIN screening_runs r ON r.id = br.run_id
        WHERE br.batch_id = :batchId AND r.state IN (:active)
          AND NOT EXISTS (SELECT 1 FROM batch_runs o JOIN batches b ON b.id = o.batch_id
                           WHERE o.run_id = r.id AND o.batch_id <> :batchId AND b.cancel_requested_at IS NULL AND b.state IN (:live))`,
      { replacements: { batchId, active: ["queued", "running"], live: ["queued", "running"] }, type: QueryTypes.SELECT, transaction: t },
    );
    const runs = ids.length ? await ScreeningRun.findAll({ where: { id: { [Op.in]: ids.map((r) => r.id) } }, transaction: t, ...rowLock(t) }) : [];
    let cancelledQueued = 0;
    let stopping = 0;
    // Flag the running ones first: the batch must not count as cancelled while they still run.
    for (const run of runs.filter((r) => r.state === "running")) {
      await run.update({ cancelRequested: true }, { transaction: t });
      stopping++;
    }
    for (const run of runs.filter((r) => r.state === "queued")) {
      await settleRun(t, run, { state: "cancelled", error: "cancelled by the batch owner" }, now);
      cancelledQueued++;
    }
    await updateBatchStates(t, [batchId], now);
    await batch.reload({ transaction: t });
    return { ok: true, value: { cancelledQueued, stopping, state: batch.state } };
  });
  if (result.ok) await recordAudit(user, "batch.cancelled", "batch", batchId, `${result.value.cancelledQueued} queued runs cancelled, ${result.value.stopping} running runs stopping`);
  return result;
}
