/**
 * The outgoing mail queue. Mail is written to outgoing_mail (inside the transaction of whatever
 * caused it, so a finished batch and its mail commit together) and sent later by the worker loop.
 * When the SMTP server is down the attempt is recorded and retried with exponential back-off; a
 * sending failure never fails a screening run. Delivery is at-least-once: a worker that dies
 * between handing a mail to SMTP and marking it sent will send it again after the claim expires.
 */
import { randomUUID } from "node:crypto";
import { Op, QueryTypes, type Transaction } from "sequelize";
import { sequelize, OutgoingMail } from "@/models";
import { sendMail } from "./index";

export interface QueuedMail {
  kind: string;
  to: string;
  subject: string;
  text: string;
  /** One mail per key, ever (e.g. "batch-done:<id>"); a second enqueue with the key is ignored. */
  dedupeKey?: string;
}

export async function enqueueMail(mail: QueuedMail, t?: Transaction, now = new Date()): Promise<OutgoingMail | null> {
  if (mail.dedupeKey && (await OutgoingMail.findOne({ where: { dedupeKey: mail.dedupeKey }, attributes: ["id"], transaction: t }))) return null;
  return OutgoingMail.create(
    { kind: mail.kind, dedupeKey: mail.dedupeKey ?? null, toAddress: mail.to, subject: mail.subject.slice(0, 300), textBody: mail.text, state: "queued", nextAttemptAt: now },
    { transaction: t },
  );
}

/** Delay before the next attempt after `attempts` failures: 30 s, 1 min, 2 min, … capped at 1 h. */
export function mailRetryDelayMs(attempts: number, baseMs = Number(process.env.MAIL_RETRY_BASE_MS || 30_000)): number {
  return Math.min(baseMs * 2 ** Math.max(0, attempts - 1), 3_600_000);
}

export interface DrainResult {
  sent: number;
  failed: number;
  retrying: number;
}

const CLAIM_MS = 120_000;

/** Send the mails that are due. Safe to call from several workers: each mail is claimed first. */
export async function drainOutgoingMail(options: { limit?: number; now?: Date } = {}): Promise<DrainResult> {
  const now = options.now ?? new Date();
  const token = randomUUID();
  const lock = sequelize.getDialect() === "postgres" ? " FOR UPDATE SKIP LOCKED" : "";
  await sequelize.query(
    `UPDATE outgoing_mail SET claim_token = :token, claimed_until = :until, updated_at = :now
      WHERE id IN (SELECT id FROM outgoing_mail
                    WHERE state = :queued AND next_attempt_at <= :now AND (claimed_until IS NULL OR claimed_until < :now)
                    ORDER BY next_attempt_at LIMIT :limit${lock})`,
    { replacements: { token, until: new Date(now.getTime() + CLAIM_MS), now, queued: "queued", limit: options.limit ?? 20 }, type: QueryTypes.UPDATE },
  );
  const mails = await OutgoingMail.findAll({ where: { claimToken: token, state: "queued" } });
  const result: DrainResult = { sent: 0, failed: 0, retrying: 0 };
  for (const mail of mails) {
    try {
      await sendMail({ to: mail.toAddress, subject: mail.subject, text: mail.textBody });
      await OutgoingMail.update({ state: "sent", sentAt: new Date(), attempts: mail.attempts + 1, claimToken: null, claimedUntil: null, lastError: null }, { where: { id: mail.id, claimToken: token } });
      result.sent++;
    } catch (err) {
      const attempts = mail.attempts + 1;
      const message = err instanceof Error ? err.message : String(err);
      const gaveUp = attempts >= mail.maxAttempts;
      await OutgoingMail.update(
        { state: gaveUp ? "failed" : "queued", attempts, lastError: message.slice(0, 1000), claimToken: null, claimedUntil: null, nextAttemptAt: new Date(now.getTime() + mailRetryDelayMs(attempts)) },
        { where: { id: mail.id, claimToken: token } },
      );
      if (gaveUp) result.failed++;
      else result.retrying++;
    }
  }
  return result;
}

export async function pendingMailCount(): Promise<number> {
  return OutgoingMail.count({ where: { state: "queued" } });
}

export async function listOutgoingMail(limit = 50) {
  const rows = await OutgoingMail.findAll({ where: { state: { [Op.in]: ["queued", "sent", "failed"] } }, order: [["createdAt", "DESC"]], limit });
  return rows.map((m) => ({ id: m.id, kind: m.kind, to: m.toAddress, subject: m.subject, state: m.state, attempts: m.attempts, lastError: m.lastError, nextAttemptAt: m.nextAttemptAt }));
}
