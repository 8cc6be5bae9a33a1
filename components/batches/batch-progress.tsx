"use client";
/**
 * Live progress of a batch: a bar with counts by state, elapsed time, per-variant state, and the
 * owner's Cancel button. Polls GET /api/batches/{id}/progress about once a second until the
 * batch is done or cancelled; no page reload is needed.
 */
import { useEffect, useRef, useState } from "react";
import { StateBadge } from "./state-badge";
import type { BatchProgress } from "@/lib/queue/progress";
import { formatElapsed } from "./format";

const POLL_MS = 1000;

const SEGMENTS: { key: keyof BatchProgress["counts"]; label: string; colour: string }[] = [
  { key: "done", label: "done", colour: "bg-reed-700" },
  { key: "failed", label: "failed", colour: "bg-coral-700" },
  { key: "timed-out", label: "timed out", colour: "bg-ember-700" },
  { key: "cancelled", label: "cancelled", colour: "bg-abyss-500" },
  { key: "running", label: "running", colour: "bg-tide-600" },
  { key: "queued", label: "queued", colour: "bg-rule" },
];

function params(p: Record<string, number>): string {
  const entries = Object.entries(p);
  return entries.length ? entries.map(([k, v]) => `${k} = ${v}`).join(", ") : "—";
}

export function BatchProgressPanel({ initial }: { initial: BatchProgress }) {
  const [progress, setProgress] = useState(initial);
  const [problem, setProblem] = useState<string | null>(null);
  const [confirming, setConfirming] = useState(false);
  const [cancelling, setCancelling] = useState(false);
  const [now, setNow] = useState(() => Date.now());
  const fetchedAt = useRef(Date.now());

  useEffect(() => {
    if (progress.complete) return;
    let stopped = false;
    const timer = setInterval(async () => {
      try {
        const res = await fetch(`/api/batches/${progress.id}/progress`, { cache: "no-store" });
        const body = (await res.json()) as { progress?: BatchProgress; error?: string };
        if (stopped) return;
        if (res.ok && body.progress) {
          fetchedAt.current = Date.now();
          setProgress(body.progress);
          setProblem(null);
        } else setProblem(body.error ?? `progress unavailable (${res.status})`);
      } catch {
        if (!stopped) setProblem("progress unavailable (network); retrying");
      }
    }, POLL_MS);
    const tick = setInterval(() => setNow(Date.now()), 250);
    return () => {
      stopped = true;
      clearInterval(timer);
      clearInterval(tick);
    };
  }, [progress.id, progress.complete]);

  async function cancel() {
    setCancelling(true);
    const res = await fetch(`/api/batches/${progress.id}/cancel`, { method: "POST" });
    const body = (await res.json()) as { error?: string };
    setCancelling(false);
    setConfirming(false);
    if (!res.ok) setProblem(body.error ?? `cancel failed (${res.status})`);
    const fresh = await fetch(`/api/batches/${progress.id}/progress`, { cache: "no-store" });
    if (fresh.ok) setProgress(((await fresh.json()) as { progress: BatchProgress }).progress);
  }

  const { counts, total } = progress;
  const elapsed = progress.complete ? progress.elapsedMs : progress.elapsedMs + (now - fetchedAt.current);
  return (
    <section className="mb-6 rounded-lg border border-rule bg-panel p-4" data-testid="batch-progress" aria-label="Screening progress">
      <div className="mb-2 flex flex-wrap items-baseline justify-between gap-2">
        <h2 className="text-lg font-bold">
          Screening <span className="ml-1 align-middle"><StateBadge state={progress.state} /></span>
        </h2>
        <div className="text-sm text-abyss-500">
          <span data-testid="progress-percent" className="mr-3 font-mono text-base font-semibold text-abyss-900">{progress.percent} %</span>
          {progress.finished} of {total} variants finished · elapsed <span data-testid="progress-elapsed">{formatElapsed(elapsed)}</span>
        </div>
      </div>
      <div
        className="flex h-4 w-full overflow-hidden rounded bg-paper ring-1 ring-rule"
        role="progressbar"
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={progress.percent}
        aria-label="Variants finished"
        data-testid="progress-bar"
      >
        {total > 0
          ? SEGMENTS.filter((s) => s.key !== "queued" && counts[s.key] > 0).map((s) => (
              <div key={s.key} className={`${s.colour} transition-all duration-500`} style={{ width: `${(counts[s.key] / total) * 100}%` }} title={`${s.label}: ${counts[s.key]}`} />
            ))
          : null}
      </div>
      <ul className="mt-2 flex flex-wrap gap-x-4 gap-y-1 text-sm" data-testid="progress-counts">
        {SEGMENTS.map((s) => (
          <li key={s.key} className="flex items-center gap-1.5">
            <span className={`inline-block h-2.5 w-2.5 rounded-sm ${s.colour}`} aria-hidden />
            {s.label} <strong data-testid={`count-${s.key}`}>{counts[s.key]}</strong>
          </li>
        ))}
      </ul>
      {progress.cancelRequested && !progress.complete ? <p className="mt-2 text-sm text-ember-700">Cancelling: running variants stop when they next report.</p> : null}
      {problem ? <p role="alert" className="mt-2 rounded-md bg-coral-100 px-3 py-2 text-sm text-coral-700">{problem}</p> : null}
      {progress.isOwner && !progress.complete && !progress.cancelRequested ? (
        <div className="mt-3 flex items-center gap-2">
          {confirming ? (
            <>
              <span className="text-sm">Stop screening this batch? Finished results are kept.</span>
              <button type="button" disabled={cancelling} onClick={cancel} className="rounded-md bg-coral-700 px-3 py-1.5 text-sm font-semibold text-white disabled:opacity-60" data-testid="cancel-confirm">
                {cancelling ? "Cancelling…" : "Yes, cancel"}
              </button>
              <button type="button" onClick={() => setConfirming(false)} className="rounded-md border border-rule px-3 py-1.5 text-sm">Keep going</button>
            </>
          ) : (
            <button type="button" onClick={() => setConfirming(true)} className="rounded-md border border-coral-700/40 px-3 py-1.5 text-sm font-semibold text-coral-700 hover:bg-coral-100" data-testid="cancel-batch">
              Cancel batch
            </button>
          )}
        </div>
      ) : null}
      <div className="mt-4 overflow-x-auto rounded-md border border-rule">
        <table className="w-full text-left text-sm" data-testid="variant-runs">
          <thead className="border-b border-rule bg-paper text-abyss-500">
            <tr>
              <th className="px-3 py-2">Family</th>
              <th className="px-3 py-2">#</th>
              <th className="px-3 py-2">Parameters</th>
              <th className="px-3 py-2">State</th>
              <th className="px-3 py-2">Stage</th>
              <th className="px-3 py-2">Reducibility</th>
              <th className="px-3 py-2">Painlevé</th>
              <th className="px-3 py-2">Time</th>
            </tr>
          </thead>
          <tbody>
            {progress.variants.map((v) => (
              <tr key={v.runId} className="border-b border-rule last:border-0" data-state={v.state}>
                <td className="px-3 py-1.5 font-mono text-xs">{v.familySlug}{v.linked ? <span className="ml-2 rounded bg-paper px-1 text-abyss-500" title="result reused from an earlier run">reused</span> : null}</td>
                <td className="px-3 py-1.5">{v.variantIndex}</td>
                <td className="px-3 py-1.5 font-mono text-xs">{params(v.parameters)}</td>
                <td className="px-3 py-1.5">
                  <StateBadge state={v.state} />
                  {v.attempts > 1 ? <span className="ml-1 text-xs text-abyss-500">attempt {v.attempts}</span> : null}
                  {v.error && v.state !== "done" ? <span className="block max-w-xs text-xs text-abyss-500">{v.error}</span> : null}
                </td>
                <td className="px-3 py-1.5 text-xs">{v.state === "queued" ? "—" : v.stage ?? "—"}</td>
                <td className="px-3 py-1.5">{v.reducibility ?? "—"}</td>
                <td className="px-3 py-1.5">{v.painleve ?? "—"}</td>
                <td className="px-3 py-1.5 font-mono text-xs">{formatElapsed(v.state === "running" && v.elapsedMs !== null ? v.elapsedMs + (now - fetchedAt.current) : v.elapsedMs)}</td>
              </tr>
            ))}
          </tbody>
        </table>
        {progress.variantsShown < total ? <p className="px-3 py-2 text-xs text-abyss-500">Showing the first {progress.variantsShown} of {total} variants.</p> : null}
      </div>
    </section>
  );
}
