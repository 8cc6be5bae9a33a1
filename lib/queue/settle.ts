/**
 * How a claimed run ends: every write checks the claim token, so a worker that lost its lease
 * (it stalled, another worker re-claimed the run) can never overwrite the new owner's result.
 * Ending a run, refreshing its family's registry entry, recording verdict changes and updating its
 * batches happen in one transaction: a run is done exactly once, with its effects, or not at all.
 */
import type { Transaction } from "sequelize";
import { ScreeningRun } from "@/models";
import type { RunState } from "@/models/screening-run";
import { refreshRegistryEntry } from "@/lib/registry/refresh";
import { ENGINE_VERSION } from "@/lib/screening/version";
import { writeTransaction, rowLock, addMs } from "./db";
import { updateBatchStatesForRun } from "./batch-state";
import { recordVerdictChange } from "./changes";
import { backoffMs } from "./backoff";
import type { RunOutcome } from "./outcome";

type TerminalState = Extract<RunState, "done" | "failed" | "cancelled" | "timed-out">;

export interface TerminalPatch {
  state: TerminalState;
  error?: string | null;
  stage?: string | null;
  reportJson?: string;
  engineVersion?: string;
}

/** End a run (already locked in `t`): terminal state, registry entry, its batches. */
export async function settleRun(t: Transaction, run: ScreeningRun, patch: TerminalPatch, now: Date): Promise<void> {
  await run.update(
    {
      state: patch.state,
      error: patch.error ?? null,
      ...(patch.stage !== undefined ? { stage: patch.stage } : {}),
      ...(patch.reportJson !== undefined ? { reportJson: patch.reportJson, engineVersion: patch.engineVersion ?? ENGINE_VERSION } : {}),
      claimToken: null,
      leaseExpiresAt: null,
      finishedAt: now,
    },
    { transaction: t },
  );
  const entry = await refreshRegistryEntry(run.familyId, t);
  if (patch.state === "done" && entry) await recordVerdictChange(t, run, entry.id, now);
  await updateBatchStatesForRun(t, run.id, now);
}

export interface FinishOptions {
  retryBaseMs: number;
  now?: Date;
}

export type FinishResult = "done" | "failed" | "timed-out" | "cancelled" | "retry" | "lost";

/** Record what happened to a claimed run. Returns "lost" when the claim was no longer ours. */
export async function finishRun(claim: { id: string; token: string }, outcome: RunOutcome, options: FinishOptions): Promise<FinishResult> {
  const now = options.now ?? new Date();
  return writeTransaction(async (t) => {
    const run = await ScreeningRun.findOne({ where: { id: claim.id, claimToken: claim.token, state: "running" }, transaction: t, ...rowLock(t) });
    if (!run) return "lost";
    switch (outcome.kind) {
      case "done":
        await settleRun(t, run, { state: "done", reportJson: outcome.reportJson, engineVersion: outcome.engine, stage: outcome.stage ?? "done" }, now);
        return "done";
      case "input-error":
        await settleRun(t, run, { state: "failed", error: `input error: ${outcome.message}`, stage: outcome.stage }, now);
        return "failed";
      case "engine-error":
        // Deterministic: the same input fails the same way, so it is not retried.
        await settleRun(t, run, { state: "failed", error: `engine error in stage ${outcome.stage ?? "start"}: ${outcome.message}`, stage: outcome.stage }, now);
        return "failed";
      case "out-of-memory":
        await settleRun(t, run, { state: "failed", error: `exceeded the memory limit of ${outcome.limitMb} MB in stage ${outcome.stage ?? "start"}`, stage: outcome.stage }, now);
        return "failed";
      case "timed-out":
        await settleRun(t, run, { state: "timed-out", error: `exceeded the time limit of ${(outcome.limitMs / 1000).toFixed(1)} s in stage ${outcome.stage ?? "start"}`, stage: outcome.stage }, now);
        return "timed-out";
      case "cancelled":
        await settleRun(t, run, { state: "cancelled", error: "cancelled by the batch owner", stage: outcome.stage }, now);
        return "cancelled";
      case "crash": {
        if (run.attempts >= run.maxAttempts) {
          await settleRun(t, run, { state: "failed", error: `gave up after ${run.attempts} attempts: ${outcome.message}`, stage: outcome.stage }, now);
          return "failed";
        }
        // Not the input's fault (thread crash, database busy): try again later.
        await run.update(
          { state: "queued", error: `attempt ${run.attempts} failed: ${outcome.message}`, stage: outcome.stage ?? null, claimToken: null, leaseExpiresAt: null, availableAt: addMs(now, backoffMs(run.attempts, options.retryBaseMs)) },
          { transaction: t },
        );
        return "retry";
      }
    }
  });
}

export type ReportResult = "ok" | "lost" | "cancel";

/**
 * A running run reports in: renews its lease and records its stage. Answers "cancel" when the
 * owner asked to cancel it and "lost" when the claim is no longer ours; either way the caller stops.
 */
export async function reportProgress(claim: { id: string; token: string }, leaseMs: number, stage?: string, now = new Date()): Promise<ReportResult> {
  // One statement in the common case; only a refused renewal needs a second look (cancel or lost).
  const [changed] = await ScreeningRun.update(
    { leaseExpiresAt: addMs(now, leaseMs), ...(stage ? { stage: stage.slice(0, 40) } : {}) },
    { where: { id: claim.id, claimToken: claim.token, state: "running", cancelRequested: false } },
  );
  if (changed > 0) return "ok";
  const row = await ScreeningRun.findOne({ where: { id: claim.id, claimToken: claim.token, state: "running" }, attributes: ["cancelRequested"] });
  return row?.cancelRequested ? "cancel" : "lost";
}

/** Give a claimed run back untouched (graceful shutdown): it does not count as an attempt. */
export async function releaseRun(claim: { id: string; token: string }, now = new Date()): Promise<boolean> {
  const run = await ScreeningRun.findOne({ where: { id: claim.id, claimToken: claim.token, state: "running" } });
  if (!run) return false;
  const [changed] = await ScreeningRun.update(
    { state: "queued", attempts: Math.max(0, run.attempts - 1), claimToken: null, leaseExpiresAt: null, availableAt: now, claimedBy: null },
    { where: { id: claim.id, claimToken: claim.token, state: "running" } },
  );
  return changed > 0;
}
