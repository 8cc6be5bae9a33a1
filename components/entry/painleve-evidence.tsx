/** The Painlevé verdict with its evidence: leading orders, resonances, compatibility conditions, jet statistics. */
import type { PainleveEvidence } from "@/lib/screening/painleve";
import { VerdictBadge } from "@/components/registry/verdict-badge";
import { Tex } from "./tex";
import { KeyValues } from "./section";
import { sci } from "./format";

const th = "px-2 py-1 text-left font-semibold";
const td = "px-2 py-1 font-mono text-xs";
const cx = (z: { re: number; im: number } | undefined) => (z ? (Math.abs(z.im) < 1e-300 ? sci(z.re) : `${sci(z.re)} ${z.im < 0 ? "−" : "+"} ${sci(Math.abs(z.im))}i`) : "—");

export function PainleveEvidenceView({ verdict, reason, evidence }: { verdict: string; reason: string; evidence: Partial<PainleveEvidence> | null }) {
  const jet = evidence?.jet ?? null;
  return (
    <div className="space-y-3" data-testid="painleve-evidence">
      <p className="flex flex-wrap items-center gap-2 text-sm"><VerdictBadge value={verdict} /> {reason}</p>
      {evidence ? (
        <>
          <KeyValues items={[
            ["leading orders", evidence.exponents ? <span key="e" className="font-mono text-xs">{Object.entries(evidence.exponents).map(([v, p]) => `${v} ~ φ^(${p})`).join(", ")}</span> : "—"],
            ["dominant balances", <span key="b" className="font-mono text-xs">{(evidence.balances ?? []).join(", ") || "—"}</span>],
            ["resonances", <span key="r" className="font-mono text-xs">{evidence.resonances ? `j = ${evidence.resonances.join(", ")}` : "—"}{evidence.flaggedResonances?.length ? ` (flagged: ${evidence.flaggedResonances.join(", ")})` : ""}</span>],
            ["det M(j) degree", evidence.determinantDegree ?? "—"],
            ["seed", evidence.seed ?? "—"],
            ...(evidence.leadingConsistency !== undefined ? [["leading-order consistency", sci(evidence.leadingConsistency)] as [string, React.ReactNode]] : []),
          ]} />
          {evidence.conditions?.length ? (
            <div className="relative overflow-x-auto">
              <table className="text-sm" aria-label="Compatibility conditions per resonance">
                <thead className="bg-paper text-abyss-500"><tr><th className={th}>resonance</th><th className={th}>condition holds identically</th><th className={th}>worst rho_P</th></tr></thead>
                <tbody>
                  {evidence.conditions.map((c) => (
                    <tr key={c.resonance} className="border-t border-rule"><td className={td}>{c.resonance}</td><td className={td}>{c.holdsIdentically ? "yes" : "no"}</td><td className={td}>{sci(c.worstRho)}</td></tr>
                  ))}
                </tbody>
              </table>
            </div>
          ) : null}
          {evidence.nontrivialCondition ? (
            <div className="rounded-lg border border-rule bg-panel p-3">
              <p className="text-xs text-abyss-500">The nontrivial compatibility condition (resonance {evidence.nontrivialCondition.resonance}):</p>
              <Tex latex={evidence.nontrivialCondition.generic} display />
              <details>
                <summary className="cursor-pointer text-xs font-semibold text-tide-700">With this member&apos;s coefficients</summary>
                <div className="relative max-h-64 overflow-auto"><Tex latex={evidence.nontrivialCondition.latex} display /></div>
              </details>
            </div>
          ) : null}
          {jet ? (
            <div className="space-y-2 rounded-lg border border-rule bg-panel p-3">
              <p className="text-sm"><span className="font-semibold">Jet test</span>: {jet.precision}, {jet.jetLength} Taylor orders, max rho_P = <span className="font-mono text-xs">{sci(jet.rhoMax)}</span> → {jet.outcome} (pass &lt; {sci(jet.thresholds.pass)}, fail &gt; {sci(jet.thresholds.fail)})</p>
              <div className="relative overflow-x-auto">
                <table className="text-sm" aria-label="Jet test per sample point">
                  <thead className="bg-paper text-abyss-500"><tr><th className={th}>point t</th><th className={th}>branch</th><th className={th}>leading coefficients</th><th className={th}>resonance: rho_P</th></tr></thead>
                  <tbody>
                    {jet.points.flatMap((p, pi) => p.branches.map((b, bi) => (
                      <tr key={`${pi}-${bi}`} className="border-t border-rule">
                        <td className={td}>{sci(p.t, 6)}</td>
                        <td className={td}>{bi + 1}</td>
                        <td className={td}>{Object.entries(b.leading).map(([v, z]) => `${v}0 = ${cx(z)}`).join("; ")}</td>
                        <td className={td}>{b.conditions.map((c) => `${c.resonance}: ${sci(c.rho)}`).join("; ")}</td>
                      </tr>
                    )))}
                  </tbody>
                </table>
              </div>
            </div>
          ) : null}
          {evidence.invariant ? (
            <p className="text-sm">Invariant {evidence.invariant.name} at the points: rho_inv = <span className="font-mono text-xs">{sci(evidence.invariant.rhoInv)}</span> ({evidence.invariant.outcome}, {evidence.invariant.precision})</p>
          ) : null}
          {evidence.notes?.length ? <ul className="list-disc pl-5 text-xs text-abyss-500">{evidence.notes.map((n) => <li key={n}>{n}</li>)}</ul> : null}
        </>
      ) : null}
    </div>
  );
}
