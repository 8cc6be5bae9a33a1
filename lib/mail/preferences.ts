/** A user's mail preferences, for the My account page. */
import { User } from "@/models";

export interface MailPreferences {
  notifyBatchDone: boolean;
  notifyDigest: boolean;
}

export async function mailPreferences(userId: string): Promise<MailPreferences | null> {
  const user = await User.findByPk(userId, { attributes: ["notifyBatchDone", "notifyDigest"] });
  return user ? { notifyBatchDone: user.notifyBatchDone, notifyDigest: user.notifyDigest } : null;
}
