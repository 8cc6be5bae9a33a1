/** The reducibility verdict with its evidence: invariant, rho_inv per sample point and order, precisions, singularities, constraints. */
import type { ReducibilityReport } from "@/lib/screening/report";
import { VerdictBadge } from "@/components/registry/verdict-badge";
import { Tex } from "./tex";
import { KeyValues } from "./section";
import { sci } from "./format";

const th = "px-2 py-1 text-left font-semibold";
const td = "px-2 py-1 font-mono text-xs";

export function ReducibilityEvidence({ report }: { report: ReducibilityReport }) {
  const ev = report.evidence;
  const windows = ev?.windows ?? [];
  const sing = ev?.singularities;
  return (
    <div className="space-y-3" data-testid="reducibility-evidence">
      <p className="flex flex-wrap items-center gap-2 text-sm"><VerdictBadge value={report.verdict} /> {report.summary}{report.verdict === "undecided" ? ` (${report.reason}: ${report.message})` : ""}</p>
      {ev ? (
        <>
          <div className="rounded-lg border border-rule bg-panel p-3">
            <p className="text-xs text-abyss-500">Invariant {ev.invariant}; reducible iff it vanishes identically on the window:</p>
            {ev.formula?.definition ? <Tex latex={ev.formula.definition} display /> : null}
            {ev.formula?.polynomialForm ? (<><p className="text-xs text-abyss-500">Polynomial form evaluated (Taylor coefficients at each sample point):</p><Tex latex={ev.formula.polynomialForm} display /></>) : null}
            {ev.display?.latex ? (
              <details className="mt-1">
                <summary className="cursor-pointer text-xs font-semibold text-tide-700">The residual with this member&apos;s coefficients ({ev.display.simplified ? "simplified" : "not simplified"}; for reading only, the verdict never uses it)</summary>
                <div className="relative max-h-64 overflow-auto"><Tex latex={ev.display.latex} display /></div>
              </details>
            ) : null}
          </div>
          <KeyValues items={[
            ["thresholds", <span key="t" className="font-mono text-xs">rho_inv ≤ {sci(ev.thresholds?.pass)} → zero; ≥ {sci(ev.thresholds?.fail)} → nonzero</span>],
            ["precision", ev.precision],
            ["seed", String(ev.seed)],
            ["engine", ev.engine],
          ]} />
          {sing && (sing.points.length || sing.endpoints.length || sing.undefinedRegions.length || sing.vanishing.length) ? (
            <div className="rounded-md bg-ember-100 p-2 text-sm text-ember-700">
              <p className="font-semibold">Singularities</p>
              <ul className="list-disc pl-5 text-xs">
                {sing.points.map((p, i) => <li key={`p${i}`}>split at t = {sci(p.t, 6)}: {p.coefficient} has a {p.kind}</li>)}
                {sing.endpoints.map((p, i) => <li key={`e${i}`}>window end t = {sci(p.t, 6)}: {p.coefficient} has a {p.kind}</li>)}
                {sing.undefinedRegions.map((r, i) => <li key={`u${i}`}>{r.coefficient} is not a finite real number on [{sci(r.from)}, {sci(r.to)}]</li>)}
                {sing.vanishing.map((c) => <li key={c}>{c} vanishes identically</li>)}
              </ul>
            </div>
          ) : null}
          {windows.map((w, wi) => (
            <div key={wi} className="space-y-2 rounded-lg border border-rule bg-panel p-3">
              <p className="flex flex-wrap items-center gap-2 text-sm">
                <span className="font-semibold">Window [{sci(w.window[0], 6)}, {sci(w.window[1], 6)}]</span>
                <VerdictBadge value={w.verdict} />
                <span className="font-mono text-xs">max rho_inv = {sci(w.rhoMax)}</span>
                <span className="text-xs text-abyss-500">double: {w.doubleOutcome}; {w.precision}{w.sigma ? `; σ = ${w.sigma > 0 ? "+1" : "−1"}` : ""}</span>
              </p>
              {w.message ? <p className="text-xs text-ember-700">{w.message}</p> : null}
              <div className="relative overflow-x-auto">
                <table className="text-sm" aria-label={`Sample points of window ${wi + 1}`}>
                  <thead className="bg-paper text-abyss-500"><tr><th className={th}>sample t</th><th className={th}>order</th><th className={th}>rho_inv</th><th className={th}>residual</th><th className={th}>scale</th><th className={th}>within rounding</th></tr></thead>
                  <tbody>
                    {w.samples.flatMap((s) => s.orders.map((o) => (
                      <tr key={`${s.t}-${o.order}`} className="border-t border-rule">
                        <td className={td}>{sci(s.t, 6)}</td><td className={td}>{o.order}</td><td className={td}>{sci(o.rho)}</td><td className={td}>{sci(o.residual)}</td><td className={td}>{sci(o.scale)}</td><td className={td}>{o.noise ? "yes" : "no"}</td>
                      </tr>
                    )))}
                  </tbody>
                </table>
              </div>
              {w.confirmation?.length ? (
                <details>
                  <summary className="cursor-pointer text-xs font-semibold text-tide-700">High-precision confirmation ({w.confirmation.length} values)</summary>
                  <div className="relative overflow-x-auto">
                    <table className="text-sm">
                      <thead className="bg-paper text-abyss-500"><tr><th className={th}>t</th><th className={th}>order</th><th className={th}>rho (lower)</th><th className={th}>rho (higher)</th><th className={th}>value (higher precision)</th><th className={th}>outcome</th></tr></thead>
                      <tbody>
                        {w.confirmation.map((c, i) => (
                          <tr key={i} className="border-t border-rule"><td className={td}>{sci(c.t, 6)}</td><td className={td}>{c.order}</td><td className={td}>{sci(c.rhoLow)}</td><td className={td}>{sci(c.rhoHigh)}</td><td className={td}>{c.valueHigh}</td><td className={td}>{String(c.outcome)}</td></tr>
                        ))}
                      </tbody>
                    </table>
                  </div>
                </details>
              ) : null}
            </div>
          ))}
          {ev.freeParameters ? (
            <div className="rounded-lg border border-rule bg-panel p-3 text-sm">
              <p className="font-semibold">Free parameters {ev.freeParameters.parameters.join(", ")}</p>
              <p className="text-xs text-abyss-500">{ev.freeParameters.starts} starts; best residual {sci(ev.freeParameters.bestResidual)}</p>
              <ul className="mt-1 space-y-1">
                {ev.freeParameters.solutions.map((s) => (
                  <li key={s.index} className="flex flex-wrap items-center gap-2">
                    <VerdictBadge value={s.verdict} /> solution {s.index + 1} ({s.kind}{s.dimension ? `, dimension ${s.dimension}` : ""}):
                    <span className="font-mono text-xs">{s.constraints.map((c) => `${c.parameter} = ${c.exact} (${c.role})`).join(", ")}</span>
                    {s.closedForm ? <Tex latex={s.closedForm} /> : null}
                  </li>
                ))}
              </ul>
            </div>
          ) : null}
          {report.constraints.length ? (
            <p className="text-sm">Conditions for reducibility: <span className="font-mono text-xs">{report.constraints.map((c) => `${c.parameter} = ${c.exact}`).join(", ")}</span></p>
          ) : null}
        </>
      ) : null}
    </div>
  );
}
