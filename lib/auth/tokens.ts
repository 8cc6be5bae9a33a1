import { createHash, randomBytes } from "node:crypto";

/** A random secret and the sha256 we store instead of it. */
export function newSecret(prefix: string): { secret: string; hash: string } {
  const secret = prefix + randomBytes(32).toString("base64url");
  return { secret, hash: sha256Hex(secret) };
}

export function sha256Hex(text: string): string {
  return createHash("sha256").update(text).digest("hex");
}
