/** For a reducible member: the point map (formulas, constants, a sample of the table) and plots of the coefficients and of μ, β, γ. */
import type { TransformationOk } from "@/lib/screening/transform";
import { Tex } from "./tex";
import { CurveChart } from "./curve-chart";
import { KeyValues } from "./section";
import { sci } from "./format";

const th = "px-2 py-1 text-left font-semibold";
const td = "px-2 py-1 font-mono text-xs";

function sampleRows(n: number, k = 9): number[] {
  if (n <= k) return Array.from({ length: n }, (_, i) => i);
  return Array.from({ length: k }, (_, i) => Math.round((i * (n - 1)) / (k - 1)));
}

export function TransformationSection({ tr }: { tr: TransformationOk }) {
  const names = Object.keys(tr.table.values);
  const rows = sampleRows(tr.table.t.length);
  const curves = (list: typeof tr.plot.coefficients) => list.map((c) => ({ name: c.name, t: c.t, values: c.values }));
  return (
    <div className="space-y-3" data-testid="transformation">
      <div className="rounded-lg border border-rule bg-panel p-3">
        <p className="text-xs text-abyss-500">Map to the canonical equation{tr.sigma !== null ? ` (canonical sign σ = ${tr.sigma > 0 ? "+1" : "−1"})` : ""}, on t ∈ [{sci(tr.mapWindow[0], 6)}, {sci(tr.mapWindow[1], 6)}]:</p>
        <div className="space-y-0.5" data-testid="transformation-formulas">
          {tr.formulas.map((f) => (
            <div key={f.name} className="flex flex-wrap items-center gap-x-3">
              <Tex latex={f.latex} display className="[&_.katex-display]:my-0.5" />
              <span className="text-xs text-abyss-500">{f.closedForm ? `closed form${f.maxRelDiffToTable !== undefined ? `; agrees with the table to ${sci(f.maxRelDiffToTable)}` : ""}` : "by quadrature (tabulated)"}{f.note ? `; ${f.note}` : ""}</span>
            </div>
          ))}
        </div>
        {tr.truncation ? <p className="mt-1 text-sm text-ember-700">The map stops at t = {sci(tr.truncation.at, 6)}: {tr.truncation.reason}</p> : null}
        <p className="mt-1 text-xs text-abyss-500">Identity at t0: {tr.identityAtStart.holds ? "yes" : "no"} — {tr.identityAtStart.condition}</p>
      </div>
      <div className="grid gap-3 lg:grid-cols-2">
        <CurveChart title="Normal-form coefficients" curves={curves(tr.plot.coefficients)} testId="coefficient-chart" hideZero />
        <CurveChart title={tr.class === "nls" ? "μ, β and γ of the map" : "β, γ and A of the map"} curves={curves(tr.plot.mapCurves)} testId="map-chart" />
      </div>
      <details className="rounded-lg border border-rule bg-panel p-3">
        <summary className="cursor-pointer text-sm font-semibold text-tide-700">Constants of the map ({tr.constants.length})</summary>
        <div className="relative overflow-x-auto">
          <table className="mt-2 text-sm">
            <thead className="bg-paper text-abyss-500"><tr><th className={th}>constant</th><th className={th}>value</th><th className={th}>status</th><th className={th}>meaning</th></tr></thead>
            <tbody>
              {tr.constants.map((c) => (
                <tr key={c.name} className="border-t border-rule"><td className="px-2 py-1"><Tex latex={c.latex} /></td><td className={td}>{sci(c.value, 6)}</td><td className={td}>{c.status}</td><td className="px-2 py-1 text-xs">{c.meaning}</td></tr>
              ))}
            </tbody>
          </table>
        </div>
      </details>
      <details className="rounded-lg border border-rule bg-panel p-3">
        <summary className="cursor-pointer text-sm font-semibold text-tide-700">Map table ({tr.table.t.length} nodes; {rows.length} shown)</summary>
        <div className="relative overflow-x-auto">
          <table className="mt-2 text-sm" data-testid="map-table">
            <thead className="bg-paper text-abyss-500"><tr><th className={th}>t</th>{names.map((n) => <th key={n} className={th}>{n}</th>)}</tr></thead>
            <tbody>
              {rows.map((i) => (
                <tr key={i} className="border-t border-rule"><td className={td}>{sci(tr.table.t[i], 5)}</td>{names.map((n) => <td key={n} className={td}>{sci(tr.table.values[n][i], 6)}</td>)}</tr>
              ))}
            </tbody>
          </table>
        </div>
        <p className="mt-1 text-xs text-abyss-500">The whole table is in the JSON export.</p>
      </details>
      <KeyValues items={[
        ["integrator", `${tr.integrator.method}; rel. tol. ${sci(tr.integrator.relTol)}, abs. tol. ${sci(tr.integrator.absTol)}; ${tr.integrator.acceptedSteps} steps (${tr.integrator.rejectedSteps} rejected)`],
        ["invariant check", `rho = ${sci(tr.checks.invariantRho)} at ${tr.checks.invariantPoints.length} points`],
        ...(tr.checks.betaFromMuMaxRelDiff !== undefined ? [["β from μ vs quadrature", sci(tr.checks.betaFromMuMaxRelDiff)] as [string, string]] : []),
        ...(tr.singularTimes.length ? [["singular times", tr.singularTimes.map((s) => `t = ${sci(s.t, 6)} (${s.kind}: ${s.detail})`).join("; ")] as [string, string]] : []),
      ]} />
      {tr.notes.length ? <ul className="list-disc pl-5 text-xs text-abyss-500">{tr.notes.map((n) => <li key={n}>{n}</li>)}</ul> : null}
    </div>
  );
}
