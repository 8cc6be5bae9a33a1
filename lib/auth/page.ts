/** Guards for server components: who is signed in, and may they see this page. */
import { getServerSession } from "next-auth";
import { redirect } from "next/navigation";
import { authOptions } from "./options";
import { loadActiveUser, type CurrentUser } from "./current-user";
import { hasRole, type Role } from "./roles";

export async function getPageUser(): Promise<CurrentUser | null> {
  const session = await getServerSession(authOptions);
  return loadActiveUser(session?.user?.id);
}

/** Signed-in user or a redirect to the sign-in page. */
export async function requirePageUser(): Promise<CurrentUser> {
  const user = await getPageUser();
  if (!user) redirect("/signin");
  return user;
}

export type PageAccess = { allowed: true; user: CurrentUser } | { allowed: false; user: CurrentUser; needed: Role };

export async function pageAccess(needed: Role): Promise<PageAccess> {
  const user = await requirePageUser();
  return hasRole(user.role, needed) ? { allowed: true, user } : { allowed: false, user, needed };
}
