import type { Role } from "@/lib/auth/roles";

export interface NavItem {
  href: string;
  label: string;
  needs: Role;
}

/** The shell's sections; each shows only to roles that may use it. */
export const NAV_ITEMS: NavItem[] = [
  { href: "/overview", label: "Overview", needs: "viewer" },
  { href: "/submit", label: "Submit", needs: "researcher" },
  { href: "/design", label: "Design", needs: "researcher" },
  { href: "/batches", label: "Batches", needs: "researcher" },
  { href: "/registry", label: "Registry", needs: "viewer" },
  { href: "/review", label: "Review", needs: "curator" },
  { href: "/admin/users", label: "Admin", needs: "admin" },
];
