import { ApiToken } from "@/models";
import { loadActiveUser, type CurrentUser } from "./current-user";
import { newSecret, sha256Hex } from "./tokens";

export const API_TOKEN_PREFIX = "ws_";

export async function createApiToken(userId: string, name: string) {
  const { secret, hash } = newSecret(API_TOKEN_PREFIX);
  const row = await ApiToken.create({ userId, name, prefix: secret.slice(0, 10), tokenHash: hash });
  return { id: row.id, name: row.name, prefix: row.prefix, createdAt: row.createdAt, secret };
}

export async function userFromApiToken(secret: string): Promise<CurrentUser | null> {
  const row = await ApiToken.findOne({ where: { tokenHash: sha256Hex(secret), revokedAt: null } });
  if (!row) return null;
  await row.update({ lastUsedAt: new Date() });
  return loadActiveUser(row.userId);
}

export async function listApiTokens(userId: string) {
  const rows = await ApiToken.findAll({ where: { userId }, order: [["createdAt", "DESC"]] });
  return rows.map((r) => ({ id: r.id, name: r.name, prefix: r.prefix, createdAt: r.createdAt, lastUsedAt: r.lastUsedAt, revokedAt: r.revokedAt }));
}

export async function revokeApiToken(userId: string, id: string): Promise<boolean> {
  const [n] = await ApiToken.update({ revokedAt: new Date() }, { where: { id, userId, revokedAt: null } });
  return n > 0;
}
