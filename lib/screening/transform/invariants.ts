/**
 * Guard: the invariant statistic rho_inv at a few points, so the transformation refuses a member
 * whose invariant is clearly nonzero (the reducibility stage owns the verdict; this only guards).
 * Polynomial forms: nls.md §3 (R-poly, 13 monomials), kdv.md §2 (p²qK, 14 monomials),
 * mkdv.md §2 (pqQ, 4 monomials); rho_inv = max over Taylor orders 0–2 of |Σ m_i| / Σ|m_i|.
 * (Both polynomial forms re-derived from the explicit R and K with sympy while writing this.)
 */
import { DoubleField, JetEvaluationError, jetDerivative, jetMul } from "../expr";
import type { EquationClass } from "../spec/types";
import type { CoefficientSet } from "./coefficients";

const F = DoubleField;
type J = number[];
const TAYLOR_ORDERS = 2;

/** Product of jets times a constant, truncated to `len` coefficients. */
function mono(c: number, len: number, ...factors: J[]): J {
  let r: J = factors[0].slice(0, len);
  for (let i = 1; i < factors.length; i++) r = jetMul(r, factors[i].slice(0, len), F);
  return r.map((v) => c * v);
}

/** The monomials of −a²h²R (nls.md §3 R-poly). */
function nlsMonomials(j: Record<string, J>, L: number): J[] {
  const { a, b, c, h, k } = j;
  const a1 = jetDerivative(a, F);
  const a2 = jetDerivative(a1, F);
  const h1 = jetDerivative(h, F);
  const h2 = jetDerivative(h1, F);
  const k1 = jetDerivative(k, F);
  const c1 = jetDerivative(c, F);
  return [
    mono(4, L, a, a, a, b, h, h),
    mono(-4, L, a, a, k, k, h, h),
    mono(4, L, a, a, c, k, h, h),
    mono(-2, L, a, a, k1, h, h),
    mono(2, L, a, a, c1, h, h),
    mono(-2, L, a, k, a1, h, h),
    mono(-1, L, a, a2, h, h),
    mono(1, L, a1, a1, h, h),
    mono(4, L, a, a, k, h, h1),
    mono(-2, L, a, a, c, h, h1),
    mono(1, L, a, a1, h, h1),
    mono(1, L, a, a, h, h2),
    mono(-2, L, a, a, h1, h1),
  ];
}

/** The monomials of p²qK (kdv.md §2 polynomial form). */
function kdvMonomials(j: Record<string, J>, L: number): J[] {
  const { p, q, r, s, m } = j;
  const p1 = jetDerivative(p, F);
  const p2 = jetDerivative(p1, F);
  const q1 = jetDerivative(q, F);
  const q2 = jetDerivative(q1, F);
  const r1 = jetDerivative(r, F);
  const s1 = jetDerivative(s, F);
  return [
    mono(-1, L, m, p, p, p, q),
    mono(2, L, p, p, q, r, r),
    mono(-5, L, p, p, q, r, s),
    mono(2, L, p, p, q, s, s),
    mono(1, L, p, p, q, r1),
    mono(-2, L, p, p, q, s1),
    mono(3, L, p, p, r, q1),
    mono(-3, L, p, p, s, q1),
    mono(1, L, p, p, q2),
    mono(-4, L, p, q, r, p1),
    mono(5, L, p, q, s, p1),
    mono(-1, L, p, q, p2),
    mono(-3, L, p, p1, q1),
    mono(3, L, q, p1, p1),
  ];
}

/** The monomials of pqQ (mkdv.md §2). */
function mkdvMonomials(j: Record<string, J>, L: number): J[] {
  const { p, q, r, s } = j;
  return [
    mono(1, L, p, jetDerivative(q, F)),
    mono(-1, L, q, jetDerivative(p, F)),
    mono(2, L, p, q, r),
    mono(-2, L, p, q, s),
  ];
}

const MONOMIALS: Record<EquationClass, (j: Record<string, J>, L: number) => J[]> = {
  nls: nlsMonomials,
  kdv: kdvMonomials,
  mkdv: mkdvMonomials,
};

export interface InvariantSample {
  /** Max rho over the points that could be evaluated; NaN if none. */
  rho: number;
  points: number[];
  /** Invariant polynomial value (order 0) at each point, for display. */
  values: number[];
}

/** rho_inv at the given points (points where a jet cannot be formed are skipped). */
export function sampleInvariant(coefs: CoefficientSet, points: readonly number[]): InvariantSample {
  const L = TAYLOR_ORDERS + 1;
  let rho = NaN;
  const used: number[] = [];
  const values: number[] = [];
  for (const t of points) {
    let monos: J[];
    try {
      monos = MONOMIALS[coefs.class](coefs.jets(t, TAYLOR_ORDERS + 2), L);
    } catch (err) {
      if (err instanceof JetEvaluationError) continue;
      throw err;
    }
    let pointRho = 0;
    for (let o = 0; o < L; o++) {
      let sum = 0;
      let scale = 0;
      for (const m of monos) {
        sum += m[o];
        scale += Math.abs(m[o]);
      }
      const r = scale === 0 ? 0 : Math.abs(sum) / scale;
      if (!Number.isFinite(r)) continue;
      pointRho = Math.max(pointRho, r);
    }
    used.push(t);
    values.push(monos.reduce((s, m) => s + m[0], 0));
    rho = Number.isNaN(rho) ? pointRho : Math.max(rho, pointRho);
  }
  return { rho, points: used, values };
}
