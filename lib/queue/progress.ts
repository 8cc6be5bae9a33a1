/** A batch's screening progress, as the batch page polls it (GET /api/batches/{id}/progress). */
import { QueryTypes } from "sequelize";
import { sequelize, Batch } from "@/models";
import type { RunState } from "@/models/screening-run";
import { hasRole } from "@/lib/auth/roles";
import type { CurrentUser } from "@/lib/auth/current-user";
import { batchRunCounts, type RunCounts } from "./batch-state";

/** Rows listed per batch; the counts always cover every run. */
export const PROGRESS_ROW_LIMIT = 500;

export interface VariantProgress {
  runId: string;
  familySlug: string;
  familyTitle: string;
  variantIndex: number;
  parameters: Record<string, number>;
  state: RunState;
  stage: string | null;
  attempts: number;
  linked: boolean;
  purpose: string;
  reducibility: string | null;
  painleve: string | null;
  error: string | null;
  startedAt: string | null;
  finishedAt: string | null;
  elapsedMs: number | null;
}

export interface BatchProgress {
  id: string;
  title: string;
  state: string;
  isOwner: boolean;
  total: number;
  finished: number;
  percent: number;
  counts: RunCounts;
  complete: boolean;
  cancelRequested: boolean;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
  elapsedMs: number;
  variants: VariantProgress[];
  variantsShown: number;
}

interface Row {
  run_id: string;
  state: RunState;
  stage: string | null;
  attempts: number | string;
  linked: number | boolean;
  purpose: string;
  error: string | null;
  started_at: string | Date | null;
  finished_at: string | Date | null;
  reducibility_verdict: string | null;
  painleve_verdict: string | null;
  variant_index: number | string;
  parameters_json: string;
  slug: string;
  title: string;
}

function toDate(value: string | Date | null): Date | null {
  if (value === null || value === undefined) return null;
  const d = value instanceof Date ? value : new Date(value);
  return Number.isNaN(d.getTime()) ? null : d;
}

export function canSeeBatch(user: CurrentUser, batch: Batch): boolean {
  return batch.ownerId === user.id || hasRole(user.role, "curator");
}

export async function batchProgress(user: CurrentUser, batchId: string, now = new Date()): Promise<BatchProgress | null> {
  const batch = await Batch.findByPk(batchId);
  if (!batch || !canSeeBatch(user, batch)) return null;
  const counts = await batchRunCounts(batchId);
  const rows = await sequelize.query<Row>(
    `SELECT r.id AS run_id, r.state, r.stage, r.attempts, br.linked, r.purpose, r.error, r.started_at, r.finished_at,
            CASE WHEN r.state = :done THEN r.reducibility_verdict END AS reducibility_verdict,
            CASE WHEN r.state = :done THEN r.painleve_verdict END AS painleve_verdict,
            v.variant_index, v.parameters_json, f.slug, f.title
       FROM batch_runs br
       JOIN screening_runs r ON r.id = br.run_id
       JOIN variants v ON v.id = r.variant_id
       JOIN families f ON f.id = r.family_id
      WHERE br.batch_id = :batchId
      ORDER BY f.slug, v.variant_index
      LIMIT :limit`,
    { replacements: { batchId, done: "done", limit: PROGRESS_ROW_LIMIT }, type: QueryTypes.SELECT },
  );
  const total = Object.values(counts).reduce((a, b) => a + b, 0);
  const finished = total - counts.queued - counts.running;
  const complete = batch.state === "done" || batch.state === "cancelled";
  const variants = rows.map((r): VariantProgress => {
    const started = toDate(r.started_at);
    const ended = toDate(r.finished_at);
    return {
      runId: r.run_id, familySlug: r.slug, familyTitle: r.title, variantIndex: Number(r.variant_index),
      parameters: JSON.parse(r.parameters_json) as Record<string, number>, state: r.state, stage: r.stage, attempts: Number(r.attempts),
      linked: Boolean(r.linked), purpose: r.purpose, reducibility: r.reducibility_verdict ?? null, painleve: r.painleve_verdict ?? null,
      error: r.error, startedAt: started?.toISOString() ?? null, finishedAt: ended?.toISOString() ?? null,
      elapsedMs: started ? (ended ?? (r.state === "running" ? now : started)).getTime() - started.getTime() : null,
    };
  });
  const end = batch.finishedAt ?? now;
  return {
    id: batch.id, title: batch.title, state: batch.state, isOwner: batch.ownerId === user.id,
    total, finished, percent: total === 0 ? 100 : Math.floor((finished / total) * 100), counts, complete,
    cancelRequested: Boolean(batch.cancelRequestedAt), createdAt: batch.createdAt.toISOString(),
    startedAt: batch.startedAt?.toISOString() ?? null, finishedAt: batch.finishedAt?.toISOString() ?? null,
    elapsedMs: Math.max(0, end.getTime() - batch.createdAt.getTime()), variants, variantsShown: variants.length,
  };
}
