/**
 * The screening queue (database side): enqueueing, atomic claims with leases, finishing runs,
 * batch progress and cancellation, the nightly re-screen and verdict changes. Safe to import from
 * route handlers and pages: no worker threads here (those live in lib/queue/worker.ts and
 * lib/queue/thread-pool.ts, imported only by jobs/).
 */
export { enqueueBatchRuns, enqueueRun, type EnqueueResult } from "./enqueue";
export { claimRuns, type ClaimedRun, type ClaimOptions } from "./claim";
export { finishRun, reportProgress, releaseRun, settleRun, type FinishResult, type ReportResult } from "./settle";
export { updateBatchStates, batchRunCounts, ACTIVE_STATES, FINISHED_STATES, type RunCounts } from "./batch-state";
export { batchProgress, canSeeBatch, type BatchProgress, type VariantProgress } from "./progress";
export { cancelBatch, type CancelResult } from "./cancel";
export { queueSnapshot, type QueueSnapshot, type RecentRun } from "./snapshot";
export { enqueueRescreens, compareVersions, isOlderEngine } from "./rescreen";
export { listVerdictChanges, type VerdictChangeView } from "./changes";
export { queueSettings, type QueueSettings } from "./config";
export { backoffMs } from "./backoff";
export type { RunOutcome } from "./outcome";
