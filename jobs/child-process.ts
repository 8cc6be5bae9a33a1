/**
 * A bree job's worker thread only relays to a child process that does the work. Why: sqlite3's
 * native module aborts the whole process when a worker thread that has it loaded is terminated
 * with a statement in flight (node-sqlite3 issue #1666; reproduced here with sqlite3 6.0.1), and
 * bree terminates its threads on "done" and on stop. A child process can be stopped safely.
 *
 * The relay forwards bree's "cancel" as SIGTERM, answers "cancelled" once the child has exited,
 * says "done" when the child ends with code 0 and ends the thread with the child's code otherwise.
 * The child reads the relay's end of a pipe on stdin: if the scheduler dies, it stops too.
 */
import { spawn } from "node:child_process";
import path from "node:path";
import { parentPort } from "node:worker_threads";

/** Set in the child's environment; `stopWhenParentGoes` only acts when it is set. */
const PARENT_PIPE_ENV = "WAVESIEVE_PARENT_PIPE";

/** `taskFile`: absolute, or relative to this folder (jobs/). */
export function relayToChildProcess(taskFile: string): void {
  const child = spawn(process.execPath, ["--conditions=react-server", "--import", "tsx", path.resolve(__dirname, taskFile)], {
    cwd: process.cwd(),
    env: { ...process.env, [PARENT_PIPE_ENV]: "1" },
    stdio: ["pipe", "inherit", "inherit"],
  });
  let cancelled = false;
  parentPort?.on("message", (message: unknown) => {
    if (message !== "cancel" || cancelled) return;
    cancelled = true;
    child.kill("SIGTERM");
  });
  child.on("error", (err) => {
    console.error(`[jobs] could not start ${taskFile}:`, err);
    process.exit(1);
  });
  child.on("exit", (code, signal) => {
    if (cancelled) {
      parentPort?.postMessage("cancelled");
      // End the thread ourselves (code 0) rather than be terminated by bree, which logs code 1.
      setImmediate(() => process.exit(0));
    } else if (code === 0) parentPort?.postMessage("done");
    else {
      console.error(`[jobs] ${taskFile} ended with ${signal ?? `code ${code}`}`);
      process.exit(code ?? 1);
    }
  });
}

/**
 * In a task started by `relayToChildProcess`: call `stop` when the relay's pipe closes (the
 * scheduler ended without stopping us). Does nothing in a process started any other way, where
 * stdin may be a terminal or /dev/null.
 */
export function stopWhenParentGoes(stop: () => void): void {
  if (process.env[PARENT_PIPE_ENV] !== "1") return;
  process.stdin.on("end", stop);
  process.stdin.on("error", stop);
  process.stdin.resume();
}
