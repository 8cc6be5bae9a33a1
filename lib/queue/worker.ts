/**
 * The worker loop: claim as many runs as there are idle engine threads, run each under its
 * limits while renewing its lease, record the outcome, drain the outgoing mail, repeat. Used by
 * `npm run worker` (jobs/worker.ts) and by the bree job jobs/screen.ts.
 *
 * Crash safety comes from the database, not from this process: a claim is a lease. If this
 * process dies, its runs are claimed again once their leases expire, and a late write from a
 * stalled worker is refused because its claim token no longer matches.
 */
import os from "node:os";
import { randomUUID } from "node:crypto";
import { ScreeningRun } from "@/models";
import { Op } from "sequelize";
import { drainOutgoingMail } from "@/lib/mail/queue";
import { claimRuns, type ClaimedRun } from "./claim";
import { finishRun, reportProgress, releaseRun, type FinishResult } from "./settle";
import { queueSettings, type QueueSettings } from "./config";
import { backoffMs } from "./backoff";
import { createThreadPool, type EngineRunner } from "./thread-pool";
import type { RunOutcome } from "./outcome";

export interface WorkerOptions extends Partial<QueueSettings> {
  workerId?: string;
  /** Injectable runner (tests, benchmarks); default: a pool of engine threads. */
  runner?: EngineRunner;
  /** Send queued mail between claims (default true). */
  drainMail?: boolean;
  mailEveryMs?: number;
  /** Stop once nothing is queued or running anywhere (tests, benchmarks). */
  stopWhenIdle?: boolean;
  log?: (line: string) => void;
  /** Called after each run is recorded. */
  onFinished?: (run: ClaimedRun, result: FinishResult, outcome: RunOutcome) => void;
}

export interface WorkerStats {
  claimed: number;
  finished: Record<FinishResult, number>;
  released: number;
}

export interface WorkerHandle {
  readonly workerId: string;
  /** Resolves when the loop has ended (stop() or stopWhenIdle). */
  readonly done: Promise<WorkerStats>;
  /** Graceful stop: running runs are handed back to the queue (not counted as attempts). */
  stop(): Promise<WorkerStats>;
}

const sleep = (ms: number) => new Promise<void>((r) => setTimeout(r, ms));
const STAGE_WRITE_MS = 250;

export function startWorker(options: WorkerOptions = {}): WorkerHandle {
  const settings = { ...queueSettings(), ...Object.fromEntries(Object.entries(options).filter(([, v]) => v !== undefined)) } as QueueSettings & WorkerOptions;
  const workerId = options.workerId ?? `${os.hostname()}:${process.pid}:${randomUUID().slice(0, 8)}`;
  const log = options.log ?? ((line: string) => console.log(`[worker ${workerId}] ${line}`));
  const runner = options.runner ?? createThreadPool({ size: settings.threads, timeLimitMs: settings.timeLimitMs, memoryMb: settings.memoryMb });
  const renewEveryMs = Math.max(50, Math.min(Math.floor(settings.leaseMs / 3), 5_000));
  const mailEveryMs = options.mailEveryMs ?? 2_000;
  const stats: WorkerStats = { claimed: 0, finished: { done: 0, failed: 0, "timed-out": 0, cancelled: 0, retry: 0, lost: 0 }, released: 0 };
  const active = new Map<string, { controller: AbortController; promise: Promise<void> }>();
  let stopping = false;
  let wake: (() => void) | null = null;
  const nap = (ms: number) => new Promise<void>((resolve) => {
    const timer = setTimeout(() => { wake = null; resolve(); }, ms);
    wake = () => { clearTimeout(timer); wake = null; resolve(); };
  });

  async function record(run: ClaimedRun, outcome: RunOutcome): Promise<FinishResult | null> {
    for (let attempt = 1; ; attempt++) {
      try {
        return await finishRun(run, outcome, { retryBaseMs: settings.retryBaseMs });
      } catch (err) {
        // Database busy or down: try a few times; after that the lease expires and the run is
        // claimed again (counted as an attempt), so nothing is lost.
        if (attempt >= 5) {
          log(`could not record run ${run.id}: ${err instanceof Error ? err.message : String(err)}; it returns to the queue when its lease expires`);
          return null;
        }
        await sleep(backoffMs(attempt, 200, 5_000));
      }
    }
  }

  async function handle(run: ClaimedRun, controller: AbortController): Promise<void> {
    let reason: "cancel" | "lost" | "shutdown" | null = null;
    let stage: string | undefined;
    const stopFor = (why: "cancel" | "lost" | "shutdown") => {
      if (reason) return;
      reason = why;
      controller.abort(why);
    };
    controller.signal.addEventListener("abort", () => { if (!reason) reason = "shutdown"; }, { once: true });
    // Stage changes are written at most every STAGE_WRITE_MS (a fast run's stages would otherwise
    // cost more database writes than its screening); a pending stage goes out with the next renewal.
    let lastWrite = 0;
    let pendingStage = false;
    const report = (s?: string) => {
      lastWrite = Date.now();
      pendingStage = false;
      return reportProgress(run, settings.leaseMs, s).then(
        (answer) => { if (answer !== "ok") stopFor(answer); },
        (err) => log(`lease renewal of ${run.id} failed: ${err instanceof Error ? err.message : String(err)}`),
      );
    };
    const onStage = (s: string) => {
      stage = s;
      if (s === "done") return; // the result follows at once
      if (Date.now() - lastWrite >= STAGE_WRITE_MS) void report(s);
      else pendingStage = true;
    };
    const renew = setInterval(() => void report(pendingStage ? stage : undefined), renewEveryMs);
    let outcome: RunOutcome;
    try {
      outcome = await runner.execute({ runId: run.id, variantJson: run.variantJson }, { onStage, signal: controller.signal });
    } finally {
      clearInterval(renew);
    }
    if (reason === "lost") {
      stats.finished.lost++;
      log(`run ${run.id} was claimed by another worker; result discarded`);
      return;
    }
    if (reason === "shutdown") {
      if (await releaseRun(run).catch(() => false)) stats.released++;
      return;
    }
    if (reason === "cancel") outcome = { kind: "cancelled", stage };
    const result = await record(run, outcome);
    if (!result) return;
    stats.finished[result]++;
    log(`run ${run.id} ${result}${outcome.kind === "done" ? "" : ` (${outcome.kind}${outcome.stage ? ` in ${outcome.stage}` : ""})`}`);
    options.onFinished?.(run, result, outcome);
  }

  async function idleEverywhere(): Promise<boolean> {
    return (await ScreeningRun.count({ where: { state: { [Op.in]: ["queued", "running"] } } })) === 0;
  }

  async function loop(): Promise<WorkerStats> {
    let dbFailures = 0;
    let lastMail = 0;
    while (!stopping) {
      const free = runner.size - active.size;
      let claimed: ClaimedRun[] = [];
      if (free > 0) {
        try {
          claimed = await claimRuns({ workerId, limit: free, leaseMs: settings.leaseMs });
          dbFailures = 0;
        } catch (err) {
          dbFailures++;
          log(`claim failed (${err instanceof Error ? err.message : String(err)}); retrying`);
          await nap(backoffMs(dbFailures, 250, 10_000));
          continue;
        }
      }
      for (const run of claimed) {
        stats.claimed++;
        const controller = new AbortController();
        const promise = handle(run, controller)
          .catch((err) => log(`run ${run.id}: ${err instanceof Error ? err.stack ?? err.message : String(err)}`))
          .finally(() => {
            active.delete(run.id);
            wake?.();
          });
        active.set(run.id, { controller, promise });
      }
      if (options.drainMail !== false && Date.now() - lastMail >= mailEveryMs) {
        lastMail = Date.now();
        try {
          const mail = await drainOutgoingMail();
          if (mail.sent || mail.retrying || mail.failed) log(`mail: ${mail.sent} sent, ${mail.retrying} to retry, ${mail.failed} given up`);
        } catch (err) {
          log(`mail drain failed: ${err instanceof Error ? err.message : String(err)}`);
        }
      }
      if (claimed.length === 0) {
        if (options.stopWhenIdle && active.size === 0 && (await idleEverywhere().catch(() => false))) break;
        await nap(settings.pollMs);
      }
    }
    for (const { controller } of active.values()) controller.abort("shutdown");
    await Promise.all([...active.values()].map((a) => a.promise));
    await runner.close();
    if (options.drainMail !== false && !stopping) await drainOutgoingMail().catch(() => undefined); // idle exit: send what the last runs queued
    return stats;
  }

  const done = loop();
  return {
    workerId,
    done,
    async stop() {
      stopping = true;
      wake?.();
      return done;
    },
  };
}
