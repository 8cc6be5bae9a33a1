/**
 * The decision of the Painlevé stage from its statistics (../shared/math/painleve.md §6 Steps 6–7):
 * the jet call (pass < 1e-10 < undecided < 1e-7 < fail), the combination table with the class
 * invariant, and which calls are settled in double precision.
 */
import { PAINLEVE_RECHECK_DIGITS } from "../tolerances";
import type { Complex } from "./jet-algebra";
import type { JetTestOutcome } from "./jet-test";
import type { JetRunEvidence, PainleveVerdict, ResonanceSummary } from "./types";

export const PASS_REASON = "passes to relative accuracy 1e-10 (jet) / 1e-12 (invariant)";
export const PASS_REASON_NO_INVARIANT = `passes to relative accuracy 1e-10 (jet, confirmed at ${PAINLEVE_RECHECK_DIGITS} digits)`;

export const fmt = (x: number): string => x.toExponential(2);
export const complexText = (z: Complex): string =>
  Math.abs(z.im) < 1e-9 * Math.max(1, Math.abs(z.re)) ? String(Number(z.re.toPrecision(6))) : `${Number(z.re.toPrecision(6))}${z.im < 0 ? "-" : "+"}${Number(Math.abs(z.im).toPrecision(6))}i`;

export type JetCall = "pass" | "fail" | "undecided";
export type InvariantCall = "zero" | "nonzero" | "borderline" | "none";

function jetCall(rho: number, pass: number, fail: number): JetCall {
  return rho < pass ? "pass" : rho > fail ? "fail" : "undecided";
}

/** Build the jet-run evidence (rho_P,max and where it occurred) from a successful run. */
export function jetEvidence(outcome: Extract<JetTestOutcome, { kind: "ok" }>, alg: { precision: string; N: number }, thresholds: { pass: number; fail: number }): JetRunEvidence {
  let rhoMax = 0;
  let at: JetRunEvidence["rhoMaxAt"] = null;
  outcome.points.forEach((p, pi) =>
    p.branches.forEach((b, bi) =>
      b.conditions.forEach((c) =>
        c.rhoByOrder.forEach((r, m) => {
          if (r > rhoMax || at === null) {
            if (r > rhoMax) rhoMax = r;
            at = { point: pi, branch: bi, resonance: c.resonance, order: m };
          }
        }),
      ),
    ),
  );
  return {
    precision: alg.precision,
    jetLength: alg.N,
    points: outcome.points,
    rhoMax,
    rhoMaxAt: at,
    outcome: jetCall(rhoMax, thresholds.pass, thresholds.fail),
    thresholds,
  };
}

export function resonanceSummary(jet: JetRunEvidence): ResonanceSummary[] {
  const byJ = new Map<number, number>();
  for (const p of jet.points) for (const b of p.branches) for (const c of b.conditions) byJ.set(c.resonance, Math.max(byJ.get(c.resonance) ?? 0, c.rho));
  return [...byJ.entries()]
    .sort((x, y) => x[0] - y[0])
    .map(([resonance, worstRho]) => ({ resonance, worstRho, holdsIdentically: worstRho < jet.thresholds.pass }));
}

/** The resonance where rho_P,max occurred. */
const worstResonance = (jet: JetRunEvidence): number => jet.rhoMaxAt?.resonance ?? 0;

/** The combination table of painleve.md §6 Step 7 (and its use after the recheck). */
export function combine(jet: JetRunEvidence, invariant: InvariantCall, rhoInv: number | null): { verdict: PainleveVerdict; reason: string } {
  const call = jet.outcome;
  if (call === "undecided") return { verdict: "undecided", reason: "undecided: rho between thresholds" };
  if (invariant === "none") {
    if (call === "pass") return { verdict: "passes", reason: PASS_REASON_NO_INVARIANT };
    return { verdict: "fails", reason: `condition at resonance ${worstResonance(jet)} fails (rho_P = ${fmt(jet.rhoMax)})` };
  }
  if (call === "pass") {
    if (invariant === "zero") return { verdict: "passes", reason: PASS_REASON };
    return { verdict: "undecided", reason: "undecided: near-integrable (jet test and class invariant disagree)" };
  }
  if (invariant === "zero") {
    return {
      verdict: "undecided",
      reason: `undecided: evaluation failed (jet rho_P = ${fmt(jet.rhoMax)} but invariant rho_inv = ${fmt(rhoInv ?? 0)})`,
    };
  }
  return { verdict: "fails", reason: `condition at resonance ${worstResonance(jet)} fails (rho_P = ${fmt(jet.rhoMax)})` };
}

/** Does the double-precision call settle the verdict, or is the §7 recheck needed? */
export function settledInDouble(call: JetCall, invariant: InvariantCall): boolean {
  if (call === "undecided") return false;
  if (invariant === "none") return call === "fail";
  return (call === "pass" && invariant === "zero") || (call === "fail" && invariant !== "zero");
}
