/**
 * `npm run worker`: a screening worker process and nothing else — claims runs from the shared
 * queue and screens them in WORKER_THREADS engine threads; drains the outgoing mail too.
 * Start as many as you like, on as many machines as share the database. SIGINT/SIGTERM stop it
 * gracefully (running runs go back to the queue); SIGKILL is safe too (their leases expire).
 */
import { startWorker } from "@/lib/queue/worker";
import { queueSettings } from "@/lib/queue/config";
import { stopWhenParentGoes } from "./child-process";

function main(): void {
  const settings = queueSettings();
  const worker = startWorker({ stopWhenIdle: process.env.WORKER_EXIT_WHEN_IDLE === "1" });
  console.log(
    `[worker ${worker.workerId}] started: ${settings.threads} thread(s), time limit ${settings.timeLimitMs} ms, memory ${settings.memoryMb} MB, lease ${settings.leaseMs} ms`,
  );
  let stopping = false;
  const stop = (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`[worker ${worker.workerId}] ${signal}: stopping`);
    void worker.stop();
  };
  process.on("SIGINT", () => stop("SIGINT"));
  process.on("SIGTERM", () => stop("SIGTERM"));
  stopWhenParentGoes(() => stop("scheduler gone"));
  worker.done.then(
    (stats) => {
      console.log(`[worker ${worker.workerId}] stopped: ${JSON.stringify(stats)}`);
      process.exit(0);
    },
    (err) => {
      console.error(`[worker ${worker.workerId}] failed:`, err);
      process.exit(1);
    },
  );
}

main();
