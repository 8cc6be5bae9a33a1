/** The review queue (server component): conflicts between the two verdicts first, then candidates awaiting review. */
import Link from "next/link";
import { reviewQueue } from "@/lib/registry/review";
import type { RegistryRow } from "@/lib/registry/queries";
import { VerdictBadge } from "@/components/registry/verdict-badge";

const CLASS_NAME: Record<string, string> = { nls: "vc-NLS", kdv: "vc-KdV", mkdv: "vc-mKdV" };

function QueueTable({ rows, testId, label }: { rows: RegistryRow[]; testId: string; label: string }) {
  return (
    <div className="relative overflow-x-auto rounded-lg border border-rule bg-panel">
      <table className="w-full text-left text-sm" data-testid={testId} aria-label={label}>
        <thead className="border-b border-rule bg-paper text-abyss-500">
          <tr><th className="px-3 py-2">Family</th><th className="px-3 py-2">Class</th><th className="px-3 py-2">Reducibility</th><th className="px-3 py-2">Painlevé</th><th className="px-3 py-2">State</th><th className="px-3 py-2">Submitter</th><th className="px-3 py-2">Screened</th></tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.id} className="border-b border-rule last:border-0">
              <td className="px-3 py-2"><Link href={`/registry/${r.id}`} className="font-semibold text-tide-700 hover:underline">{r.title}</Link><div className="font-mono text-xs text-abyss-500">{r.slug}</div></td>
              <td className="px-3 py-2">{CLASS_NAME[r.class] ?? r.class}</td>
              <td className="px-3 py-2"><VerdictBadge value={r.reducibility} /></td>
              <td className="px-3 py-2"><VerdictBadge value={r.painleve} /></td>
              <td className="px-3 py-2"><VerdictBadge value={r.curationState} /></td>
              <td className="px-3 py-2 font-mono text-xs">{r.submitter}</td>
              <td className="px-3 py-2 font-mono text-xs">{r.screenedAt?.slice(0, 10) ?? "—"}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

export async function ReviewQueueSection() {
  const q = await reviewQueue();
  return (
    <div className="space-y-8">
      <section aria-labelledby="conflicts-h" className="space-y-2">
        <h2 id="conflicts-h" className="flex items-center gap-2 text-lg font-bold">
          Conflicting verdicts <span className={`rounded px-2 py-0.5 text-sm ${q.conflicts.total ? "bg-coral-100 text-coral-700" : "bg-paper text-abyss-500"}`} data-testid="conflict-count">{q.conflicts.total}</span>
        </h2>
        <p className="max-w-3xl text-sm text-abyss-500">For these classes the reducibility verdict and the Painlevé test must agree; a disagreement points to a numerical or modelling problem. Resolve each one (accept with a note, send back, or reject) before anything else.</p>
        {q.conflicts.total === 0 ? <p className="rounded-lg border border-dashed border-rule bg-panel p-4 text-sm text-abyss-500">No conflicts to resolve.</p> : <QueueTable rows={q.conflicts.rows} testId="review-conflicts" label="Entries with conflicting verdicts" />}
        {q.conflicts.total > q.conflicts.rows.length ? <p className="text-sm"><Link className="text-tide-700 underline" href="/registry?agreement=conflict&state=candidate,returned">All {q.conflicts.total} in the registry</Link></p> : null}
      </section>
      <section aria-labelledby="candidates-h" className="space-y-2">
        <h2 id="candidates-h" className="flex items-center gap-2 text-lg font-bold">
          Candidates awaiting review <span className="rounded bg-tide-100 px-2 py-0.5 text-sm text-tide-700" data-testid="candidate-count">{q.candidates.total}</span>
        </h2>
        <p className="text-sm text-abyss-500">Screened entries nobody has decided on yet, oldest first.{q.unscreened ? ` ${q.unscreened} more are still waiting to be screened.` : ""}</p>
        {q.candidates.total === 0 ? <p className="rounded-lg border border-dashed border-rule bg-panel p-4 text-sm text-abyss-500">No candidates are waiting.</p> : <QueueTable rows={q.candidates.rows} testId="review-candidates" label="Candidates awaiting review" />}
        {q.candidates.total > q.candidates.rows.length ? <p className="text-sm"><Link className="text-tide-700 underline" href="/registry?state=candidate&sort=screened&dir=asc">All {q.candidates.total} in the registry</Link></p> : null}
      </section>
    </div>
  );
}
