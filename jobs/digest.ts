/** Bree job "digest" (cron DIGEST_CRON, default 07:00): queue the curators' daily digest and send it. */
import { parentPort } from "node:worker_threads";
import { queueDailyDigest } from "@/lib/mail/notifications";
import { drainOutgoingMail } from "@/lib/mail/queue";

async function main(): Promise<void> {
  const result = await queueDailyDigest();
  console.log(`[digest] since ${result.since}: ${result.candidates} new candidate(s), ${result.changes} changed verdict(s), ${result.mails} mail(s) queued`);
  // Send now; whatever cannot be sent stays queued and the worker loop retries it.
  await drainOutgoingMail();
}

main().then(
  () => parentPort?.postMessage("done"),
  (err) => {
    console.error("[digest] failed:", err);
    process.exit(1);
  },
);
