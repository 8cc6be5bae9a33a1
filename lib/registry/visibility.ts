/**
 * Who may see which registry entries — the one place this is decided (every query goes through it):
 * everyone signed in sees published entries; researchers also their own unpublished ones;
 * curators and admins see everything.
 */
import { Op, literal, type WhereOptions } from "sequelize";
import { hasRole } from "@/lib/auth/roles";
import type { CurrentUser } from "@/lib/auth/current-user";
import { sequelize, type RegistryEntry } from "@/models";

/**
 * `unindexed` (SQLite): a researcher's "published OR own" with SQLite's unary plus on both columns,
 * so the planner walks a sort index instead of uniting two index scans (lib/registry/queries.ts).
 */
export function visibleEntriesWhere(user: CurrentUser, options: { unindexed?: boolean } = {}): WhereOptions<RegistryEntry> {
  if (hasRole(user.role, "curator")) return {};
  if (hasRole(user.role, "researcher")) {
    if (options.unindexed) return literal(`(+published = 1 OR +submitter_id = ${sequelize.escape(user.id)})`) as unknown as WhereOptions<RegistryEntry>;
    return { [Op.or]: [{ published: true }, { submitterId: user.id }] };
  }
  return { published: true };
}

export function canSeeEntry(user: CurrentUser, entry: Pick<RegistryEntry, "published" | "submitterId">): boolean {
  if (hasRole(user.role, "curator")) return true;
  if (entry.published) return true;
  return hasRole(user.role, "researcher") && entry.submitterId === user.id;
}

export const canCurate = (user: CurrentUser) => hasRole(user.role, "curator");
