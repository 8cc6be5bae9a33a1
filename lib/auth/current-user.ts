import { User } from "@/models";
import { isRole, type Role } from "./roles";

export interface CurrentUser {
  id: string;
  email: string;
  name: string;
  role: Role;
}

/** Reload the user on every request, so a disabled account or a changed role takes effect at once. */
export async function loadActiveUser(id: string | undefined | null): Promise<CurrentUser | null> {
  if (!id) return null;
  const user = await User.findByPk(id);
  if (!user || user.disabled || !isRole(user.role)) return null;
  return { id: user.id, email: user.email, name: user.name, role: user.role };
}
