/**
 * A batch's state follows its runs: queued → running (first claim) → done when none of its runs
 * is queued or running, or cancelled when the owner cancelled and the runs it stopped have ended.
 * The batch row is locked while its runs are counted, so two runs finishing together on
 * PostgreSQL cannot both miss the last one (SQLite serialises write transactions anyway).
 */
import { QueryTypes, type Transaction } from "sequelize";
import { sequelize, Batch, BatchRun } from "@/models";
import type { RunState } from "@/models/screening-run";
import { rowLock } from "./db";
import { queueBatchFinishedMail } from "@/lib/mail/notifications";

export const ACTIVE_STATES: readonly RunState[] = ["queued", "running"];
export const FINISHED_STATES: readonly RunState[] = ["done", "failed", "cancelled", "timed-out"];

export type RunCounts = Record<RunState, number>;

export function emptyCounts(): RunCounts {
  return { queued: 0, running: 0, done: 0, failed: 0, cancelled: 0, "timed-out": 0 };
}

/** Runs of a batch by state (linked runs included). */
export async function batchRunCounts(batchId: string, t?: Transaction): Promise<RunCounts> {
  const rows = await sequelize.query<{ state: RunState; n: number | string }>(
    `SELECT r.state AS state, COUNT(*) AS n FROM batch_runs br JOIN screening_runs r ON r.id = br.run_id WHERE br.batch_id = :batchId GROUP BY r.state`,
    { replacements: { batchId }, type: QueryTypes.SELECT, transaction: t },
  );
  const counts = emptyCounts();
  for (const row of rows) if (row.state in counts) counts[row.state] = Number(row.n);
  return counts;
}

/** Runs this batch asked to stop that are still going (the cancelled batch waits only for those). */
async function stoppingRuns(batchId: string, t: Transaction): Promise<number> {
  const rows = await sequelize.query<{ n: number | string }>(
    `SELECT COUNT(*) AS n FROM batch_runs br JOIN screening_runs r ON r.id = br.run_id
      WHERE br.batch_id = :batchId AND r.state = :running AND r.cancel_requested = :yes`,
    { replacements: { batchId, running: "running", yes: true }, type: QueryTypes.SELECT, transaction: t },
  );
  return Number(rows[0]?.n ?? 0);
}

export async function updateBatchStates(t: Transaction, batchIds: string[], now: Date): Promise<void> {
  for (const id of [...new Set(batchIds)].sort()) {
    const batch = await Batch.findByPk(id, { transaction: t, ...rowLock(t) });
    if (!batch || batch.state === "done" || batch.state === "cancelled") continue;
    const counts = await batchRunCounts(id, t);
    const active = counts.queued + counts.running;
    if (batch.cancelRequestedAt) {
      if ((await stoppingRuns(id, t)) === 0) await batch.update({ state: "cancelled", finishedAt: now }, { transaction: t });
      continue;
    }
    if (active === 0) {
      await batch.update({ state: "done", finishedAt: now, startedAt: batch.startedAt ?? now }, { transaction: t });
      await queueBatchFinishedMail(t, batch, counts);
    } else if (batch.state === "queued" && active < counts.queued + counts.running + counts.done + counts.failed + counts.cancelled + counts["timed-out"]) {
      await batch.update({ state: "running", startedAt: batch.startedAt ?? now }, { transaction: t });
    }
  }
}

export async function updateBatchStatesForRun(t: Transaction, runId: string, now: Date): Promise<void> {
  const links = await BatchRun.findAll({ where: { runId }, attributes: ["batchId"], transaction: t });
  await updateBatchStates(t, links.map((l) => l.batchId), now);
}
