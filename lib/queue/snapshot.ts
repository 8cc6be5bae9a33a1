/** The queue at a glance (Overview page's Queue panel): runs by state and the ten latest runs. */
import { QueryTypes } from "sequelize";
import { sequelize } from "@/models";
import type { RunState } from "@/models/screening-run";
import { hasRole } from "@/lib/auth/roles";
import type { CurrentUser } from "@/lib/auth/current-user";
import { emptyCounts, type RunCounts } from "./batch-state";

export interface RecentRun {
  id: string;
  familySlug: string;
  variantIndex: number;
  purpose: string;
  state: RunState;
  stage: string | null;
  attempts: number;
  batchId: string | null;
  updatedAt: string;
  elapsedMs: number | null;
}

export interface QueueSnapshot {
  counts: RunCounts;
  depth: number;
  recent: RecentRun[];
  takenAt: string;
}

const asDate = (v: string | Date | null) => (v === null ? null : v instanceof Date ? v : new Date(v));

/**
 * Counts cover the whole queue (they reveal no family). The recent list shows everyone's runs to
 * curators and admins, and only the user's own families' runs to researchers and viewers.
 */
export async function queueSnapshot(user?: CurrentUser, now = new Date()): Promise<QueueSnapshot> {
  const rows = await sequelize.query<{ state: RunState; n: number | string }>(`SELECT state, COUNT(*) AS n FROM screening_runs GROUP BY state`, { type: QueryTypes.SELECT });
  const counts = emptyCounts();
  for (const r of rows) if (r.state in counts) counts[r.state] = Number(r.n);
  const everyone = !user || hasRole(user.role, "curator");
  const recent = await sequelize.query<{
    id: string; slug: string; variant_index: number | string; purpose: string; state: RunState; stage: string | null;
    attempts: number | string; batch_id: string | null; updated_at: string | Date; started_at: string | Date | null; finished_at: string | Date | null;
  }>(
    `SELECT r.id, f.slug, v.variant_index, r.purpose, r.state, r.stage, r.attempts, r.batch_id, r.updated_at, r.started_at, r.finished_at
       FROM screening_runs r JOIN families f ON f.id = r.family_id JOIN variants v ON v.id = r.variant_id
      ${everyone ? "" : "WHERE f.owner_id = :owner"}
      ORDER BY r.updated_at DESC LIMIT 10`,
    { replacements: { owner: user?.id ?? "" }, type: QueryTypes.SELECT },
  );
  return {
    counts,
    depth: counts.queued + counts.running,
    takenAt: now.toISOString(),
    recent: recent.map((r) => {
      const started = asDate(r.started_at);
      const ended = asDate(r.finished_at);
      return {
        id: r.id, familySlug: r.slug, variantIndex: Number(r.variant_index), purpose: r.purpose, state: r.state, stage: r.stage,
        attempts: Number(r.attempts), batchId: r.batch_id, updatedAt: (asDate(r.updated_at) ?? now).toISOString(),
        elapsedMs: started ? ((ended ?? (r.state === "running" ? now : started)).getTime() - started.getTime()) : null,
      };
    }),
  };
}
