/**
 * Guard: the invariant statistic rho_inv at a few points, so the transformation refuses a member
 * whose invariant is clearly nonzero (the reducibility stage owns the verdict; this only guards).
 * It evaluates the same polynomial forms as the reducibility stage (nls.md §3 R-poly, kdv.md §2,
 * mkdv.md §2; ../reducibility/invariants.ts), in double precision:
 * rho_inv = max over Taylor orders 0–2 of |Σ m_i| / Σ|m_i|.
 */
import { DoubleField, JetEvaluationError } from "../expr";
import { INVARIANTS } from "../reducibility/invariants";
import { invariantTerms } from "../reducibility/terms";
import { SingularPointError } from "../zero";
import type { CoefficientSet } from "./coefficients";

const TAYLOR_ORDERS = 2;

export interface InvariantSample {
  /** Max rho over the points that could be evaluated; NaN if none. */
  rho: number;
  points: number[];
  /** Invariant polynomial value (order 0) at each point, for display. */
  values: number[];
}

/** rho_inv at the given points (points where a jet cannot be formed are skipped). */
export function sampleInvariant(coefs: CoefficientSet, points: readonly number[]): InvariantSample {
  const def = INVARIANTS[coefs.class];
  let rho = NaN;
  const used: number[] = [];
  const values: number[] = [];
  for (const t of points) {
    let rows: number[][];
    try {
      rows = invariantTerms(def, coefs.exprs, t, {}, TAYLOR_ORDERS + 1, DoubleField);
    } catch (err) {
      if (err instanceof JetEvaluationError || err instanceof SingularPointError) continue;
      throw err;
    }
    let pointRho = 0;
    for (const monomials of rows) {
      let sum = 0;
      let scale = 0;
      for (const m of monomials) {
        sum += m;
        scale += Math.abs(m);
      }
      const r = scale === 0 ? 0 : Math.abs(sum) / scale;
      if (Number.isFinite(r)) pointRho = Math.max(pointRho, r);
    }
    used.push(t);
    values.push(rows[0].reduce((s, m) => s + m, 0));
    rho = Number.isNaN(rho) ? pointRho : Math.max(rho, pointRho);
  }
  return { rho, points: used, values };
}
