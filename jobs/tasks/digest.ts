/**
 * The curators' daily digest, as a process (bree's job jobs/digest.ts starts it, or run it by hand
 * with `npx tsx jobs/tasks/digest.ts`): queue the digest mails and send them.
 */
import { queueDailyDigest } from "@/lib/mail/notifications";
import { drainOutgoingMail } from "@/lib/mail/queue";

async function main(): Promise<void> {
  const result = await queueDailyDigest();
  console.log(`[digest] since ${result.since}: ${result.candidates} new candidate(s), ${result.changes} changed verdict(s), ${result.mails} mail(s) queued`);
  // Send now; whatever cannot be sent stays queued and the worker loop retries it.
  await drainOutgoingMail();
}

main().then(
  () => process.exit(0),
  (err) => {
    console.error("[digest] failed:", err);
    process.exit(1);
  },
);
