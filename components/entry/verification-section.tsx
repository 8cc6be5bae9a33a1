/** Independent checks of the exact solutions: residuals of both equations, and (NLS) a split-step simulation. */
import type { VerificationResult } from "@/lib/screening/verify";
import type { SolutionSpec } from "@/lib/screening/solutions";
import { VerdictBadge } from "@/components/registry/verdict-badge";
import { CurveChart } from "./curve-chart";
import { sci } from "./format";

const th = "px-2 py-1 text-left font-semibold";
const td = "px-2 py-1 font-mono text-xs";

export function VerificationSection({ v, solutions }: { v: VerificationResult; solutions: SolutionSpec[] }) {
  const label = (id: string) => solutions.find((s) => s.id === id)?.label ?? id;
  const runs = v.splitStep.filter((s): s is Extract<typeof s, { status: "passed" | "failed" }> => s.status !== "not-applicable");
  return (
    <div className="space-y-3" data-testid="verification">
      <p className="flex items-center gap-2 text-sm"><VerdictBadge value={v.passed ? "passes" : "fails"} /> {v.passed ? "Every applicable check passed." : "At least one check failed; the failing evidence is kept below."}</p>
      <div className="relative overflow-x-auto rounded-lg border border-rule bg-panel">
        <table className="w-full text-sm" aria-label="Residual checks">
          <thead className="bg-paper text-abyss-500"><tr><th className={th}>solution</th><th className={th}>equation</th><th className={th}>points</th><th className={th}>max relative residual</th><th className={th}>tolerance</th><th className={th}>result</th></tr></thead>
          <tbody>
            {v.residuals.map((r, i) => (
              <tr key={i} className="border-t border-rule" title={r.method}>
                <td className="px-2 py-1">{label(r.solutionId)}</td><td className={td}>{r.equation}</td><td className={td}>{r.points}</td><td className={td}>{sci(r.maxRelResidual)}</td><td className={td}>{sci(r.tolerance)}</td><td className="px-2 py-1"><VerdictBadge value={r.passed ? "passes" : "fails"} /></td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {v.splitStep.length ? (
        <div className="relative overflow-x-auto rounded-lg border border-rule bg-panel">
          <table className="w-full text-sm" aria-label="Split-step simulations">
            <thead className="bg-paper text-abyss-500"><tr><th className={th}>solution</th><th className={th}>result</th><th className={th}>grid</th><th className={th}>steps</th><th className={th}>max relative error</th><th className={th}>tolerance</th></tr></thead>
            <tbody>
              {v.splitStep.map((s, i) => (
                <tr key={i} className="border-t border-rule">
                  <td className="px-2 py-1">{label(s.solutionId)}</td>
                  {s.status === "not-applicable" ? (
                    <td colSpan={5} className="px-2 py-1 text-xs text-abyss-500">not applicable: {s.reason}</td>
                  ) : (
                    <>
                      <td className="px-2 py-1"><VerdictBadge value={s.status === "passed" ? "passes" : "fails"} /></td>
                      <td className={td}>N = {s.grid.N}, x ∈ [{sci(s.grid.xMin)}, {sci(s.grid.xMax)}]</td>
                      <td className={td}>{s.steps}</td>
                      <td className={td}>{sci(s.maxRelError)}</td>
                      <td className={td}>{sci(s.tolerance)}</td>
                    </>
                  )}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ) : null}
      {runs.length ? (
        <CurveChart
          title="Split-step simulation against the exact solution: relative error over t (log scale)"
          curves={runs.map((s) => ({ name: label(s.solutionId), t: s.checks.map((c) => c.t), values: s.checks.map((c) => (c.relError > 0 ? c.relError : null)) }))}
          logY
          testId="verification-chart"
        />
      ) : null}
      {v.notes.length ? <ul className="list-disc pl-5 text-xs text-abyss-500">{v.notes.map((n) => <li key={n}>{n}</li>)}</ul> : null}
    </div>
  );
}
