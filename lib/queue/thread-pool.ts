/**
 * A pool of long-lived engine threads (node:worker_threads). Each thread screens one variant at a
 * time under a hard wall-clock limit and a heap limit (resourceLimits). When a run is over its
 * time, cancelled or lost, the thread is terminated (a stuck computation cannot be interrupted
 * any other way; ENGINE-NOTES §2) and a fresh one is started in the background for the next run.
 *
 * Threads run the TypeScript sources through tsx's require hook (TOOLCHAIN pitfall 6:
 * execArgv ["--require", "tsx/cjs"]; `--import tsx` does not work for workers on Node 20).
 */
import { Worker } from "node:worker_threads";
import { createRequire } from "node:module";
import { fileURLToPath } from "node:url";
import path from "node:path";
import type { RunOutcome } from "./outcome";
import type { FromThread, ToThread } from "./thread-protocol";

export interface EngineJob {
  runId: string;
  variantJson: string;
}

export interface JobHooks {
  onStage(stage: string): void;
  /** Aborting stops the run at once (thread terminated); the outcome is then "cancelled". */
  signal?: AbortSignal;
}

/** What the worker loop needs from a runner; tests inject their own. */
export interface EngineRunner {
  readonly size: number;
  execute(job: EngineJob, hooks: JobHooks): Promise<RunOutcome>;
  close(): Promise<void>;
}

export interface ThreadPoolOptions {
  size: number;
  timeLimitMs: number;
  memoryMb: number;
  /** Thread entry file (default lib/queue/engine-thread.ts). */
  entry?: string;
  /** Starting a thread (loading the engine) may take this long before it counts as a crash. */
  startupTimeoutMs?: number;
  /** Replace a thread after this many runs, to bound slow leaks. */
  recycleAfter?: number;
}

const HERE = path.dirname(fileURLToPath(import.meta.url));
const FROM_SOURCE = import.meta.url.endsWith(".ts");

function threadExecArgv(): string[] {
  if (!FROM_SOURCE) return [];
  return ["--require", createRequire(import.meta.url).resolve("tsx/cjs")];
}

interface Slot {
  worker: Worker | null;
  ready: Promise<Worker> | null;
  busy: boolean;
  runs: number;
}

let nextMessageId = 0;

export function createThreadPool(options: ThreadPoolOptions): EngineRunner {
  const entry = options.entry ?? path.join(HERE, FROM_SOURCE ? "engine-thread.ts" : "engine-thread.js");
  const startupTimeoutMs = options.startupTimeoutMs ?? 120_000;
  const recycleAfter = options.recycleAfter ?? 500;
  const slots: Slot[] = Array.from({ length: Math.max(1, options.size) }, () => ({ worker: null, ready: null, busy: false, runs: 0 }));
  const waiting: ((slot: Slot) => void)[] = [];
  let closed = false;

  function spawn(slot: Slot): Promise<Worker> {
    const worker = new Worker(entry, {
      execArgv: threadExecArgv(),
      resourceLimits: { maxOldGenerationSizeMb: options.memoryMb, maxYoungGenerationSizeMb: Math.max(8, Math.min(64, Math.floor(options.memoryMb / 8))) },
    });
    slot.worker = worker;
    slot.runs = 0;
    slot.ready = new Promise<Worker>((resolve, reject) => {
      const timer = setTimeout(() => fail(new Error(`the engine thread did not start within ${startupTimeoutMs} ms`)), startupTimeoutMs);
      const onMessage = (m: FromThread) => {
        if (m.type !== "ready") return;
        cleanup();
        resolve(worker);
      };
      const fail = (err: Error) => {
        cleanup();
        discard(slot, worker);
        reject(err);
      };
      const onError = (err: Error) => fail(err);
      const onExit = (code: number) => fail(new Error(`the engine thread exited with code ${code} while starting`));
      const cleanup = () => {
        clearTimeout(timer);
        worker.off("message", onMessage);
        worker.off("error", onError);
        worker.off("exit", onExit);
      };
      worker.on("message", onMessage);
      worker.on("error", onError);
      worker.on("exit", onExit);
    });
    slot.ready.catch(() => undefined); // observed by execute(); avoid an unhandled rejection when spawned ahead
    return slot.ready;
  }

  function discard(slot: Slot, worker: Worker): void {
    if (slot.worker === worker) {
      slot.worker = null;
      slot.ready = null;
    }
    void worker.terminate().catch(() => undefined);
  }

  /** Terminate a thread and, unless the pool is closing, start its replacement in the background. */
  function replace(slot: Slot, worker: Worker): void {
    discard(slot, worker);
    if (!closed) void spawn(slot).catch(() => undefined);
  }

  function acquire(): Promise<Slot> {
    const free = slots.find((s) => !s.busy);
    if (free) {
      free.busy = true;
      return Promise.resolve(free);
    }
    return new Promise((resolve) => waiting.push(resolve));
  }

  function release(slot: Slot): void {
    const next = waiting.shift();
    if (next) next(slot);
    else slot.busy = false;
  }

  async function runOn(slot: Slot, job: EngineJob, hooks: JobHooks): Promise<RunOutcome> {
    let worker: Worker;
    try {
      worker = await (slot.ready ?? spawn(slot));
    } catch (err) {
      return { kind: "crash", message: err instanceof Error ? err.message : String(err) };
    }
    if (hooks.signal?.aborted) return { kind: "cancelled" };
    const id = ++nextMessageId;
    let stage: string | undefined;
    return new Promise<RunOutcome>((resolve) => {
      let settled = false;
      const finish = (outcome: RunOutcome, kill: boolean) => {
        if (settled) return;
        settled = true;
        clearTimeout(timer);
        worker.off("message", onMessage);
        worker.off("error", onError);
        worker.off("exit", onExit);
        hooks.signal?.removeEventListener("abort", onAbort);
        slot.runs++;
        if (kill || slot.runs >= recycleAfter) replace(slot, worker);
        resolve(outcome);
      };
      const onMessage = (m: FromThread) => {
        if (m.type === "ready" || m.id !== id) return;
        if (m.type === "stage") {
          stage = m.stage;
          hooks.onStage(m.stage);
        } else if (m.type === "done") finish({ kind: "done", reportJson: m.reportJson, engine: m.engine, stage: m.stage }, false);
        else if (m.type === "input-error") finish({ kind: "input-error", message: m.message, stage: m.stage }, false);
        else finish({ kind: "engine-error", message: m.message, stage: m.stage }, false);
      };
      const onError = (err: Error & { code?: string }) => {
        if (err.code === "ERR_WORKER_OUT_OF_MEMORY") finish({ kind: "out-of-memory", limitMb: options.memoryMb, stage }, true);
        else finish({ kind: "crash", message: `the engine thread crashed: ${err.message}`, stage }, true);
      };
      const onExit = (code: number) => finish({ kind: "crash", message: `the engine thread exited with code ${code}`, stage }, true);
      const onAbort = () => finish({ kind: "cancelled", stage }, true);
      const timer = setTimeout(() => finish({ kind: "timed-out", limitMs: options.timeLimitMs, stage }, true), options.timeLimitMs);
      worker.on("message", onMessage);
      worker.on("error", onError);
      worker.on("exit", onExit);
      hooks.signal?.addEventListener("abort", onAbort, { once: true });
      worker.postMessage({ type: "screen", id, variantJson: job.variantJson } satisfies ToThread);
    });
  }

  return {
    size: slots.length,
    async execute(job, hooks) {
      if (closed) return { kind: "crash", message: "the thread pool is closed" };
      const slot = await acquire();
      try {
        return await runOn(slot, job, hooks);
      } finally {
        release(slot);
      }
    },
    async close() {
      closed = true;
      await Promise.all(slots.map(async (s) => {
        const w = s.worker;
        s.worker = null;
        s.ready = null;
        if (w) await w.terminate().catch(() => undefined);
      }));
    },
  };
}
