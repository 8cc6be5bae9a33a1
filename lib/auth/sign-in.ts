/**
 * Credential check with lock-out: after MAX_FAILURES wrong passwords in a row the account is locked
 * for LOCK_MINUTES (common practice; OWASP Authentication Cheat Sheet suggests lock-out or throttling).
 */
import { User } from "@/models";
import { checkPassword } from "./passwords";
import { recordAudit } from "@/lib/audit";
import type { Role } from "./roles";

export const MAX_FAILURES = 5;
export const LOCK_MINUTES = 15;

export type SignInResult =
  | { ok: true; user: { id: string; email: string; name: string; role: Role } }
  | { ok: false; reason: "invalid" | "locked" | "disabled" };

export async function verifyCredentials(emailRaw: unknown, password: unknown): Promise<SignInResult> {
  if (typeof emailRaw !== "string" || typeof password !== "string") return { ok: false, reason: "invalid" };
  const email = emailRaw.trim().toLowerCase();
  const user = await User.findOne({ where: { email } });
  if (!user || !user.passwordHash) return { ok: false, reason: "invalid" };
  if (user.disabled) return { ok: false, reason: "disabled" };
  if (user.lockedUntil && user.lockedUntil.getTime() > Date.now()) return { ok: false, reason: "locked" };

  if (!(await checkPassword(password, user.passwordHash))) {
    const failures = user.failedSignIns + 1;
    const lock = failures >= MAX_FAILURES;
    await user.update({
      failedSignIns: lock ? 0 : failures,
      lockedUntil: lock ? new Date(Date.now() + LOCK_MINUTES * 60_000) : user.lockedUntil,
    });
    if (lock) await recordAudit(null, "user.locked", "user", user.id, `after ${MAX_FAILURES} failed sign-ins`);
    return { ok: false, reason: lock ? "locked" : "invalid" };
  }
  if (user.failedSignIns > 0 || user.lockedUntil) await user.update({ failedSignIns: 0, lockedUntil: null });
  return { ok: true, user: { id: user.id, email: user.email, name: user.name, role: user.role } };
}
