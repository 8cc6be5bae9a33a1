/**
 * The symbolic hook of the screening engine, implemented with algebrite in a worker thread with a
 * per-task timeout (ENGINE-NOTES §2 and Appendix A: terminate the worker on timeout, respawn).
 * Lives outside lib/screening so the engine stays pure; the CLI and jobs pass `hook` as
 * ScreeningOptions.symbolic.
 */
import { createRequire } from "node:module";
import { Worker } from "node:worker_threads";
import { fileURLToPath } from "node:url";
import type { SymbolicHook, SymbolicTask } from "./screening";

interface Reply {
  id: number;
  result: string | null;
  error?: string;
}

export interface SymbolicWorker {
  hook: SymbolicHook;
  /** Stop the worker (pending tasks resolve to null). */
  close(): Promise<void>;
}

const FROM_SOURCE = import.meta.url.endsWith(".ts");
const ENTRY = fileURLToPath(new URL(FROM_SOURCE ? "./symbolic-worker-entry.ts" : "./symbolic-worker-entry.js", import.meta.url));

function spawn(): Worker {
  let worker: Worker;
  if (FROM_SOURCE) {
    // Running from TypeScript sources (tsx, vitest): register tsx's require hook in the worker,
    // then load the entry. Only fixed paths are interpolated, never task data.
    const tsxApi = createRequire(import.meta.url).resolve("tsx/cjs/api");
    const bootstrap = `require(${JSON.stringify(tsxApi)}).register(); require(${JSON.stringify(ENTRY)});`;
    worker = new Worker(bootstrap, { eval: true });
  } else {
    worker = new Worker(ENTRY);
  }
  worker.unref();
  return worker;
}

/** A worker-backed hook; tasks run one at a time, each with its own timeout. */
export function createSymbolicWorker(): SymbolicWorker {
  let worker: Worker | null = null;
  let nextId = 0;
  let queue: Promise<unknown> = Promise.resolve();
  let closed = false;

  const current = (): Worker => {
    if (!worker) worker = spawn();
    return worker;
  };

  const runOne = (task: SymbolicTask): Promise<string | null> =>
    new Promise((resolve) => {
      if (closed) return resolve(null);
      const w = current();
      const id = ++nextId;
      const cleanup = (): void => {
        clearTimeout(timer);
        w.off("message", onMessage);
        w.off("error", onError);
      };
      const onMessage = (reply: Reply): void => {
        if (reply.id !== id) return;
        cleanup();
        if (reply.error && process.env.WAVESIEVE_DEBUG_SYMBOLIC) console.error(reply.error);
        resolve(reply.error ? null : reply.result);
      };
      const onError = (err: unknown): void => {
        if (process.env.WAVESIEVE_DEBUG_SYMBOLIC) console.error(err);
        cleanup();
        worker = null;
        resolve(null);
      };
      const timer = setTimeout(() => {
        cleanup();
        worker = null;
        void w.terminate();
        resolve(null);
      }, task.timeoutMs);
      w.on("message", onMessage);
      w.on("error", onError);
      w.postMessage(
        task.kind === "solve"
          ? { id, kind: task.kind, expression: task.expression, unknown: task.unknown }
          : { id, kind: task.kind, expression: task.expression },
      );
    });

  const hook: SymbolicHook = (task) => {
    const result = queue.then(() => runOne(task));
    queue = result.catch(() => null);
    return result;
  };

  return {
    hook,
    close: async () => {
      closed = true;
      const w = worker;
      worker = null;
      if (w) await w.terminate();
    },
  };
}
