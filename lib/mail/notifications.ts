/**
 * Mails the background jobs send: "batch finished" to the submitter, and the curators' daily
 * digest. Both go through the outgoing mail queue and honour the user's notify_* preferences.
 */
import { Op, QueryTypes, type Transaction } from "sequelize";
import { sequelize, User, Batch, RegistryEntry, JobMark } from "@/models";
import { listVerdictChanges } from "@/lib/queue/changes";
import { appBaseUrl } from "./index";
import { enqueueMail } from "./queue";
import { writeTransaction } from "@/lib/queue/db";

export interface VerdictTally {
  reducible: number;
  notReducible: number;
  undecided: number;
}

/** Reducibility verdicts of a batch's done runs. */
export async function batchVerdictTally(batchId: string, t?: Transaction): Promise<VerdictTally> {
  const rows = await sequelize.query<{ verdict: string | null }>(
    `SELECT r.reducibility_verdict AS verdict FROM batch_runs br JOIN screening_runs r ON r.id = br.run_id WHERE br.batch_id = :batchId AND r.state = :done`,
    { replacements: { batchId, done: "done" }, type: QueryTypes.SELECT, transaction: t },
  );
  const tally: VerdictTally = { reducible: 0, notReducible: 0, undecided: 0 };
  for (const row of rows) {
    const v = row.verdict;
    if (v === "reducible") tally.reducible++;
    else if (v === "not-reducible") tally.notReducible++;
    else tally.undecided++;
  }
  return tally;
}

export function batchFinishedText(name: string, batch: { id: string; title: string }, tally: VerdictTally, other: { failed: number; timedOut: number; cancelled: number }): string {
  const lines = [
    `Hello ${name},`,
    "",
    `Your batch "${batch.title}" has been screened.`,
    "",
    `  reducible:      ${tally.reducible}`,
    `  not reducible:  ${tally.notReducible}`,
    `  undecided:      ${tally.undecided}`,
  ];
  if (other.failed) lines.push(`  failed:         ${other.failed}`);
  if (other.timedOut) lines.push(`  timed out:      ${other.timedOut}`);
  if (other.cancelled) lines.push(`  cancelled:      ${other.cancelled}`);
  lines.push("", `Open the batch: ${appBaseUrl()}/batches/${batch.id}`, "", "You can turn these mails off under My account.");
  return lines.join("\n") + "\n";
}

/** Queue the "batch finished" mail (once per batch) unless the owner turned it off. */
export async function queueBatchFinishedMail(t: Transaction, batch: Batch, counts: { failed: number; "timed-out": number; cancelled: number }): Promise<void> {
  const owner = await User.findByPk(batch.ownerId, { attributes: ["email", "name", "notifyBatchDone", "disabled"], transaction: t });
  if (!owner || owner.disabled || !owner.notifyBatchDone) return;
  const tally = await batchVerdictTally(batch.id, t);
  await enqueueMail(
    {
      kind: "batch-done",
      dedupeKey: `batch-done:${batch.id}`,
      to: owner.email,
      subject: `Batch screened: ${batch.title}`.slice(0, 300),
      text: batchFinishedText(owner.name, batch, tally, { failed: counts.failed, timedOut: counts["timed-out"], cancelled: counts.cancelled }),
    },
    t,
  );
}

export const DIGEST_MARK = "curator-digest";

export interface DigestResult {
  since: string;
  candidates: number;
  changes: number;
  mails: number;
}

/**
 * The curators' daily digest: registry entries added as candidates, and verdicts changed by a
 * newer engine, since the previous digest (or the last 24 hours the first time). Curators and
 * admins with notify_digest on get one mail each; nothing is sent when there is nothing new.
 */
export async function queueDailyDigest(now = new Date()): Promise<DigestResult> {
  const mark = await JobMark.findByPk(DIGEST_MARK);
  const since = mark?.at ?? new Date(now.getTime() - 24 * 3600_000);
  const [candidates, changes] = await Promise.all([
    RegistryEntry.findAll({ where: { curationState: "candidate", createdAt: { [Op.gt]: since, [Op.lte]: now } }, order: [["createdAt", "ASC"]], limit: 200 }),
    listVerdictChanges({ since, limit: 200 }),
  ]);
  const recentChanges = changes.filter((c) => new Date(c.createdAt) <= now);
  let mails = 0;
  await writeTransaction(async (t) => {
    if (candidates.length || recentChanges.length) {
      const curators = await User.findAll({ where: { role: { [Op.in]: ["curator", "admin"] }, disabled: false, notifyDigest: true }, transaction: t });
      const day = now.toISOString().slice(0, 10);
      const text = digestText(candidates, recentChanges, since);
      for (const c of curators) {
        const queued = await enqueueMail(
          { kind: "digest", dedupeKey: `digest:${c.id}:${since.toISOString()}`, to: c.email, subject: `Wavesieve digest ${day}: ${candidates.length} new candidates, ${recentChanges.length} changed verdicts`, text: `Hello ${c.name},\n\n${text}` },
          t,
          now,
        );
        if (queued) mails++;
      }
    }
    await JobMark.upsert({ name: DIGEST_MARK, at: now }, { transaction: t });
  });
  return { since: since.toISOString(), candidates: candidates.length, changes: recentChanges.length, mails };
}

function digestText(candidates: RegistryEntry[], changes: Awaited<ReturnType<typeof listVerdictChanges>>, since: Date): string {
  const base = appBaseUrl();
  const lines = [`Since ${since.toISOString().replace("T", " ").slice(0, 16)} UTC:`, ""];
  lines.push(`New candidates (${candidates.length}):`);
  if (candidates.length === 0) lines.push("  none");
  for (const e of candidates) lines.push(`  ${e.slug} — ${e.title} (${e.equationClass.toUpperCase()}; reducibility ${e.reducibility}, Painlevé ${e.painleve}; ${e.variantsScreened}/${e.variantsTotal} variants screened)`);
  lines.push("", `Verdicts changed by a newer engine (${changes.length}):`);
  if (changes.length === 0) lines.push("  none");
  for (const c of changes) {
    const what = c.changed.map((k) => `${k} ${c.before[k]} → ${c.after[k]}`).join(", ");
    lines.push(`  ${c.slug} #${c.variantIndex ?? "?"} (engine ${c.oldEngine ?? "?"} → ${c.newEngine}): ${what}`);
  }
  lines.push("", `Review them: ${base}/review`, "", "You can turn the digest off under My account.");
  return lines.join("\n") + "\n";
}
