/** Roles in increasing order of power; each role can do everything the ones before it can. */
export const ROLES = ["viewer", "researcher", "curator", "admin"] as const;
export type Role = (typeof ROLES)[number];

export function isRole(value: unknown): value is Role {
  return typeof value === "string" && (ROLES as readonly string[]).includes(value);
}

/** True when `role` is at least `needed`. */
export function hasRole(role: Role, needed: Role): boolean {
  return ROLES.indexOf(role) >= ROLES.indexOf(needed);
}

export const ROLE_LABELS: Record<Role, string> = {
  viewer: "Viewer",
  researcher: "Researcher",
  curator: "Curator",
  admin: "Admin",
};
