/**
 * The class checks of ../shared/math/painleve.md §6 Step 7 (built-in classes only): the closed-form
 * oracle for the computed conditions, and the invariant statistic rho_inv in double.
 */
import type { Expr } from "../expr/types";
import { DoubleField } from "../expr";
import type { EquationClass } from "../spec/types";
import { PAINLEVE_ORACLE_AGREEMENT, RHO_INV_FAIL, RHO_INV_PASS } from "../tolerances";
import { rhoOf, sumAndScale } from "../zero";
import { complexText, type InvariantCall } from "./decision";
import { invariantFromSum, invariantTerms, INVARIANT_NAME } from "./invariants";
import { predictedCondition } from "./oracle";
import type { InvariantEvidence, JetRunEvidence } from "./types";

/** The oracle check of §6 Step 7: |C_rep - C_pred| > 1e-9 scale_0 is an engine error. */
export function applyOracle(cls: EquationClass, coefficients: Record<string, Expr>, jet: JetRunEvidence, u: string): string | null {
  for (const p of jet.points) {
    for (const b of p.branches) {
      for (const c of b.conditions) {
        const pred = predictedCondition(cls, coefficients, p.t, b.leading[u], c.resonance);
        if (!pred) continue;
        c.predicted = { re: pred.re + 0, im: pred.im + 0 };
        const diff = Math.hypot(c.value.re - pred.re, c.value.im - pred.im);
        if (!(diff <= PAINLEVE_ORACLE_AGREEMENT * c.scaleNormalised)) {
          return `engine error: C${c.resonance} = ${complexText(c.value)} but the closed form gives ${complexText(pred)} at t = ${p.t}`;
        }
      }
    }
  }
  return null;
}

/**
 * The invariant statistic rho_inv in double at the jet test's points, Taylor orders 0–2
 * (nls.md §3 "Numerical decision"): ≤ 1e-12 zero, ≥ 1e-9 nonzero, otherwise borderline.
 */
export function doubleInvariant(cls: EquationClass, coefficients: Record<string, Expr>, points: number[]): { call: InvariantCall; evidence: InvariantEvidence } {
  let rhoMax = 0;
  const values: { t: number; value: number }[] = [];
  for (const t of points) {
    const stats = sumAndScale(invariantTerms(cls, coefficients, String(t), DoubleField), DoubleField);
    for (const s of stats) rhoMax = Math.max(rhoMax, rhoOf(s, DoubleField));
    values.push({ t, value: invariantFromSum(cls, coefficients, String(t), stats[0].value) });
  }
  const call: InvariantCall = rhoMax <= RHO_INV_PASS ? "zero" : rhoMax >= RHO_INV_FAIL ? "nonzero" : "borderline";
  return {
    call,
    evidence: {
      name: INVARIANT_NAME[cls],
      values,
      rhoInv: rhoMax,
      outcome: call,
      precision: "double",
    },
  };
}
