/** Bree job "digest" (cron DIGEST_CRON, default 07:00): runs jobs/tasks/digest.ts in a child process. */
import { relayToChildProcess } from "./child-process";

relayToChildProcess("tasks/digest.ts");
