/** The Overview page's Queue panel (server component): runs by state and the ten latest runs. */
import Link from "next/link";
import { queueSnapshot } from "@/lib/queue";
import type { CurrentUser } from "@/lib/auth/current-user";
import { StateBadge } from "@/components/batches/state-badge";
import { formatElapsed } from "@/components/batches/format";

const ORDER = ["queued", "running", "done", "failed", "timed-out", "cancelled"] as const;

export async function QueuePanel({ user }: { user: CurrentUser }) {
  const snap = await queueSnapshot(user);
  return (
    <section className="mb-6 rounded-lg border border-rule bg-panel p-4" data-testid="queue-panel" aria-label="Queue">
      <h2 className="mb-1 text-lg font-bold">Queue</h2>
      <p className="mb-3 text-sm text-abyss-500">
        {snap.depth === 0 ? "Nothing waiting: every submitted variant has been screened." : `${snap.depth} variant${snap.depth === 1 ? "" : "s"} waiting or being screened.`}
      </p>
      <dl className="mb-4 grid grid-cols-3 gap-2 sm:grid-cols-6">
        {ORDER.map((state) => (
          <div key={state} className="rounded-md border border-rule bg-paper px-2 py-1.5">
            <dt className="text-xs text-abyss-500">{state}</dt>
            <dd className="text-xl font-bold" data-testid={`queue-${state}`}>{snap.counts[state]}</dd>
          </div>
        ))}
      </dl>
      {snap.recent.length ? (
        <div className="overflow-x-auto">
          <table className="w-full text-left text-sm">
            <caption className="mb-1 text-left text-xs text-abyss-500">Latest runs</caption>
            <thead className="border-b border-rule text-abyss-500">
              <tr><th className="px-2 py-1">Family</th><th className="px-2 py-1">#</th><th className="px-2 py-1">Why</th><th className="px-2 py-1">State</th><th className="px-2 py-1">Stage</th><th className="px-2 py-1">Time</th><th className="px-2 py-1">Updated (UTC)</th></tr>
            </thead>
            <tbody>
              {snap.recent.map((r) => (
                <tr key={r.id} className="border-b border-rule last:border-0">
                  <td className="px-2 py-1 font-mono text-xs">{r.batchId ? <Link className="text-tide-700 hover:underline" href={`/batches/${r.batchId}`}>{r.familySlug}</Link> : r.familySlug}</td>
                  <td className="px-2 py-1">{r.variantIndex}</td>
                  <td className="px-2 py-1 text-xs">{r.purpose === "rescreen" ? "re-screen" : r.purpose}</td>
                  <td className="px-2 py-1"><StateBadge state={r.state} /></td>
                  <td className="px-2 py-1 text-xs">{r.state === "queued" ? "—" : r.stage ?? "—"}</td>
                  <td className="px-2 py-1 font-mono text-xs">{formatElapsed(r.elapsedMs)}</td>
                  <td className="px-2 py-1 font-mono text-xs">{r.updatedAt.replace("T", " ").slice(0, 19)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ) : null}
    </section>
  );
}
