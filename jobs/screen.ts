/**
 * Bree job "screen": the screening worker loop (jobs/worker.ts) in a child process, started by the
 * scheduler at boot and again whenever it ends. Bree's "cancel" becomes SIGTERM, which hands the
 * running runs back to the queue.
 */
import { relayToChildProcess } from "./child-process";

relayToChildProcess("worker.ts");
