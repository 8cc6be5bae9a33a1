/** User administration and account services: invite, roles, disable, passwords. */
import { Op } from "sequelize";
import { User, Invite } from "@/models";
import { writeTransaction } from "./db";
import { recordAudit, type Actor } from "./audit";
import { hashPassword, checkPassword, passwordProblem } from "./auth/passwords";
import { isRole, type Role } from "./auth/roles";
import { newSecret, sha256Hex } from "./auth/tokens";
import { appBaseUrl, sendMail } from "./mail";

export const INVITE_HOURS = 72;
const EMAIL_RE = /^[^\s@]{1,64}@[^\s@]{1,190}\.[^\s@]{2,}$/;

export type ServiceResult<T> = { ok: true; value: T } | { ok: false; status: number; error: string };
const fail = (status: number, error: string) => ({ ok: false as const, status, error });

export function publicUser(u: User) {
  return {
    id: u.id, email: u.email, name: u.name, role: u.role, disabled: u.disabled,
    invited: !u.passwordHash, createdAt: u.createdAt,
    notifyBatchDone: u.notifyBatchDone, notifyDigest: u.notifyDigest,
  };
}

export async function listUsers() {
  const rows = await User.findAll({ order: [["createdAt", "ASC"]] });
  return rows.map(publicUser);
}

export async function inviteUser(actor: Actor, input: { email?: unknown; name?: unknown; role?: unknown }) {
  const email = typeof input.email === "string" ? input.email.trim().toLowerCase() : "";
  const name = typeof input.name === "string" ? input.name.trim() : "";
  if (!EMAIL_RE.test(email)) return fail(400, "a valid e-mail address is required");
  if (!name || name.length > 120) return fail(400, "a name of 1–120 characters is required");
  if (!isRole(input.role)) return fail(400, "role must be one of viewer, researcher, curator, admin");
  const role: Role = input.role;
  if (await User.findOne({ where: { email } })) return fail(409, `a user with e-mail ${email} exists already`);

  const { secret, hash } = newSecret("");
  const user = await writeTransaction(async (transaction) => {
    const u = await User.create({ email, name, role, passwordHash: null }, { transaction });
    await Invite.create(
      { userId: u.id, tokenHash: hash, purpose: "invite", expiresAt: new Date(Date.now() + INVITE_HOURS * 3600_000), createdById: actor.id },
      { transaction },
    );
    return u;
  });
  await recordAudit(actor, "user.invited", "user", user.id, `${email} as ${role}`);
  const link = `${appBaseUrl()}/welcome/${secret}`;
  let mailed = true;
  try {
    await sendMail({
      to: email,
      subject: "You are invited to Wavesieve",
      text: `Hello ${name},\n\n${actor.email} invited you to Wavesieve as ${role}.\nSet your password here (the link works once, for ${INVITE_HOURS} hours):\n\n${link}\n`,
    });
  } catch (err) {
    mailed = false;
    console.error("[mail] invite not sent:", err);
  }
  return { ok: true as const, value: { user: publicUser(user), mailed } };
}

export async function updateUser(actor: Actor, id: string, input: { role?: unknown; disabled?: unknown }) {
  const user = await User.findByPk(id);
  if (!user) return fail(404, "no such user");
  const changes: string[] = [];
  if (input.role !== undefined) {
    if (!isRole(input.role)) return fail(400, "role must be one of viewer, researcher, curator, admin");
    if (user.id === actor.id && input.role !== "admin") return fail(400, "you cannot remove your own admin role");
    if (input.role !== user.role) changes.push(`role ${user.role} → ${input.role}`);
    user.role = input.role;
  }
  if (input.disabled !== undefined) {
    if (typeof input.disabled !== "boolean") return fail(400, "disabled must be true or false");
    if (user.id === actor.id && input.disabled) return fail(400, "you cannot disable your own account");
    if (input.disabled !== user.disabled) changes.push(input.disabled ? "disabled" : "enabled");
    user.disabled = input.disabled;
  }
  await user.save();
  if (changes.length) await recordAudit(actor, "user.updated", "user", user.id, changes.join("; "));
  return { ok: true as const, value: publicUser(user) };
}

/** Use a one-time invite link: set the password and make the link unusable. */
export async function acceptInvite(secret: unknown, password: unknown) {
  if (typeof secret !== "string" || secret.length < 20) return fail(400, "invalid link");
  const problem = passwordProblem(password);
  if (problem) return fail(400, problem);
  const invite = await Invite.findOne({ where: { tokenHash: sha256Hex(secret), usedAt: null, expiresAt: { [Op.gt]: new Date() } } });
  if (!invite) return fail(410, "this link has expired or was used already");
  const user = await User.findByPk(invite.userId);
  if (!user || user.disabled) return fail(410, "this account is not available");
  const hash = await hashPassword(password as string);
  await writeTransaction(async (transaction) => {
    await user.update({ passwordHash: hash, failedSignIns: 0, lockedUntil: null }, { transaction });
    await invite.update({ usedAt: new Date() }, { transaction });
  });
  await recordAudit({ id: user.id, email: user.email }, "user.password-set", "user", user.id, "via invite link");
  return { ok: true as const, value: { email: user.email } };
}

export async function changePassword(userId: string, current: unknown, next: unknown) {
  const user = await User.findByPk(userId);
  if (!user || !user.passwordHash) return fail(404, "no such user");
  if (typeof current !== "string" || !(await checkPassword(current, user.passwordHash))) return fail(400, "the current password is wrong");
  const problem = passwordProblem(next);
  if (problem) return fail(400, problem);
  await user.update({ passwordHash: await hashPassword(next as string) });
  await recordAudit({ id: user.id, email: user.email }, "user.password-changed", "user", user.id);
  return { ok: true as const, value: null };
}

export async function updatePreferences(userId: string, input: { notifyBatchDone?: unknown; notifyDigest?: unknown }) {
  const user = await User.findByPk(userId);
  if (!user) return fail(404, "no such user");
  if (typeof input.notifyBatchDone === "boolean") user.notifyBatchDone = input.notifyBatchDone;
  if (typeof input.notifyDigest === "boolean") user.notifyDigest = input.notifyDigest;
  await user.save();
  return { ok: true as const, value: publicUser(user) };
}
