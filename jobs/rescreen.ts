/** Bree job "rescreen" (cron RESCREEN_CRON, default 02:00): runs jobs/tasks/rescreen.ts in a child process. */
import { relayToChildProcess } from "./child-process";

relayToChildProcess("tasks/rescreen.ts");
