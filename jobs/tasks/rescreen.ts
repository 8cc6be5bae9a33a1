/**
 * The nightly re-screen, as a process (bree's job jobs/rescreen.ts starts it, or run it by hand
 * with `npx tsx jobs/tasks/rescreen.ts`): queue re-screens of reports made by older engines.
 */
import { enqueueRescreens } from "@/lib/queue/rescreen";
import { ENGINE_VERSION } from "@/lib/screening/version";

enqueueRescreens().then(
  (result) => {
    console.log(`[rescreen] engine ${ENGINE_VERSION}: ${result.queued} variant(s) of ${result.entries} entr${result.entries === 1 ? "y" : "ies"} queued`);
    process.exit(0);
  },
  (err) => {
    console.error("[rescreen] failed:", err);
    process.exit(1);
  },
);
