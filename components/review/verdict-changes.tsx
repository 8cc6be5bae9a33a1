/**
 * The Review page's "Changed since last engine" section (server component): verdicts that a
 * newer engine judged differently from the report it replaced (lib/queue/changes.ts).
 */
import { listVerdictChanges } from "@/lib/queue";

const LABELS: Record<string, string> = { reducibility: "Reducibility", painleve: "Painlevé", agreement: "Agreement" };

export async function VerdictChanges({ limit = 50 }: { limit?: number }) {
  const changes = await listVerdictChanges({ limit });
  return (
    <section className="mb-8" data-testid="verdict-changes" aria-labelledby="verdict-changes-title">
      <h2 id="verdict-changes-title" className="mb-1 text-lg font-bold">Changed since last engine</h2>
      <p className="mb-3 text-sm text-abyss-500">Variants the nightly re-screen (or a re-upload) judged differently from the older engine&apos;s report.</p>
      {changes.length === 0 ? (
        <p className="rounded-lg border border-dashed border-rule bg-panel p-4 text-sm text-abyss-500">No verdict has changed.</p>
      ) : (
        <div className="relative overflow-x-auto rounded-lg border border-rule bg-panel">
          <table className="w-full text-left text-sm">
            <thead className="border-b border-rule bg-paper text-abyss-500">
              <tr><th className="px-3 py-2">Entry</th><th className="px-3 py-2">Variant</th><th className="px-3 py-2">Engine</th><th className="px-3 py-2">What changed</th><th className="px-3 py-2">When (UTC)</th></tr>
            </thead>
            <tbody>
              {changes.map((c) => (
                <tr key={c.id} className="border-b border-rule last:border-0 align-top">
                  <td className="px-3 py-2"><span className="font-mono text-xs">{c.slug}</span><span className="block text-xs text-abyss-500">{c.title}</span></td>
                  <td className="px-3 py-2 font-mono text-xs">#{c.variantIndex ?? "?"} {Object.entries(c.parameters).map(([k, v]) => `${k} = ${v}`).join(", ")}</td>
                  <td className="px-3 py-2 font-mono text-xs">{c.oldEngine ?? "?"} → {c.newEngine}</td>
                  <td className="px-3 py-2">
                    <ul>
                      {c.changed.map((k) => (
                        <li key={k}>{LABELS[k] ?? k}: <span className="text-abyss-500 line-through">{c.before[k]}</span> → <strong>{c.after[k]}</strong></li>
                      ))}
                    </ul>
                  </td>
                  <td className="px-3 py-2 font-mono text-xs">{c.createdAt.replace("T", " ").slice(0, 16)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </section>
  );
}
