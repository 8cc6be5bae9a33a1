/**
 * Bree job "screen": the screening worker loop inside the scheduler (jobs/scheduler.ts), which
 * starts it at boot and again whenever it ends. Answers bree's "cancel" by handing its running
 * runs back to the queue.
 */
import { parentPort } from "node:worker_threads";
import { startWorker } from "@/lib/queue/worker";

function main(): void {
  const worker = startWorker({});
  parentPort?.on("message", (message: unknown) => {
    if (message !== "cancel") return;
    void worker.stop().then(() => {
      parentPort?.postMessage("cancelled");
      process.exit(0);
    });
  });
  worker.done.then(
    () => parentPort?.postMessage("done"),
    (err) => {
      console.error("[screen] worker loop failed:", err);
      process.exit(1);
    },
  );
}

main();
