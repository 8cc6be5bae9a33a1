/**
 * High-precision refinement of a free-parameter solution before it is confirmed at 40/80 digits:
 * Gauss–Newton on the pivot parameters in decimalField(FREE_REFINE_DIGITS), exact gradients from
 * dual numbers; for a rank-deficient isolated root in one unknown, Newton's step times the
 * multiplicity m (E. Schröder 1870; e.g. Dahlquist & Björck, "Numerical Methods", 1974, §6.5).
 * Then the shortest decimal that agrees with the refined value to ~90 digits.
 */
import type Decimal from "decimal.js";
import { decimalField } from "../expr";
import { FREE_REFINE_DIGITS } from "../tolerances";
import { dualField } from "./dual";
import type { Dual } from "./dual";
import { normalStep } from "./linalg";
import type { SolveProblem } from "./free-solve";
import { polynomialParts } from "./terms";

/** The shortest decimal within a relative 10^-(digits-12) of `x`; "0" for |x| < 10^-(digits-15). */
export function shortestDecimal(x: Decimal, digits: number): string {
  const F = decimalField(digits);
  if (x.abs().lte(F.fromText(`1e-${digits - 15}`))) return "0";
  const tol = x.abs().mul(F.fromText(`1e-${digits - 12}`));
  for (let s = 1; s <= digits - 10; s++) {
    const c = x.toSignificantDigits(s);
    if (c.sub(x).abs().lte(tol)) return c.toString();
  }
  return x.toSignificantDigits(digits - 10).toString();
}


/**
 * Refine `pivots` of θ (the others fixed at their exact texts in `fixed`) to FREE_REFINE_DIGITS
 * digits on the first few solve points; null if the iteration breaks down. Returns every
 * parameter's exact text.
 */
export function refineSolution(
  problem: SolveProblem,
  theta: number[],
  weights: number[],
  pivots: number[],
  fixed: Record<number, string>,
  multiplicity: number,
): { texts: string[]; residual: number } | null {
  const digits = FREE_REFINE_DIGITS;
  const F = decimalField(digits);
  const D = dualField(F, pivots.length);
  const count = Math.min(problem.points.length, Math.max(6, 2 * pivots.length + 2));
  const points = problem.points.slice(0, count).map((t) => F.fromNumber(t));
  const w = weights.slice(0, count).map((x) => F.fromNumber(x));
  let values: Decimal[] = theta.map((x, i) => (i in fixed ? F.fromText(fixed[i]) : F.fromNumber(x)));
  let residual = Infinity;
  // Keep the best iterate: at a multiple root the scaled step lands on the root and the next
  // step (a ratio of two vanishing quantities) can throw it away again.
  let best = { values, residual: Infinity };
  const tiny = F.fromText(`1e-${digits - 8}`);
  for (let iteration = 0; iteration < 12; iteration++) {
    const params: Record<string, Dual<Decimal>> = {};
    problem.free.forEach((name, i) => {
      const k = pivots.indexOf(i);
      params[name] = k >= 0 ? D.variable(values[i], k) : D.constant(values[i]);
    });
    const r: Decimal[] = [];
    const j: Decimal[][] = [];
    try {
      points.forEach((t, idx) => {
        const parts = polynomialParts(problem.def, problem.coefficients, D.constant(t), params, D);
        const x = D.div(parts.p, parts.normalizer);
        r.push(F.mul(x.v, w[idx]));
        j.push(x.d.map((g) => F.mul(g, w[idx])));
      });
    } catch {
      return null;
    }
    if (r.some((x) => !x.isFinite())) return null;
    residual = Math.max(...r.map((x) => Math.abs(x.toNumber())));
    if (residual < best.residual) best = { values, residual };
    if (residual === 0) break;
    const step = normalStep(j, r, F.zero, F);
    if (!step) break; // exactly singular normal equations: the point is as good as it gets
    let done = true;
    const next = values.slice();
    pivots.forEach((p, k) => {
      const s = multiplicity > 1 && pivots.length === 1 ? F.mul(step[k], F.fromNumber(multiplicity)) : step[k];
      next[p] = F.add(values[p], s);
      if (s.abs().gt(F.mul(tiny, F.add(F.one, values[p].abs())))) done = false;
    });
    values = next;
    if (done) break;
  }
  return { texts: best.values.map((v, i) => (i in fixed ? fixed[i] : shortestDecimal(v, digits))), residual: best.residual };
}
