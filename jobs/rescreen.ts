/** Bree job "rescreen" (cron RESCREEN_CRON, default 02:00): queue re-screens of reports from older engines. */
import { parentPort } from "node:worker_threads";
import { enqueueRescreens } from "@/lib/queue/rescreen";
import { ENGINE_VERSION } from "@/lib/screening/version";

enqueueRescreens().then(
  (result) => {
    console.log(`[rescreen] engine ${ENGINE_VERSION}: ${result.queued} variant(s) of ${result.entries} entr${result.entries === 1 ? "y" : "ies"} queued`);
    parentPort?.postMessage("done");
  },
  (err) => {
    console.error("[rescreen] failed:", err);
    process.exit(1);
  },
);
