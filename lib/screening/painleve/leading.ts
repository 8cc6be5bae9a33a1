/**
 * Step 3 of ../shared/math/painleve.md §6: the leading order and its branches, from the
 * residual at P^lowest alone (no class formula).
 *  - Scalar: sample at the n = leadDegree+1 roots of unity, inverse DFT → polynomial (jets),
 *    roots of its τ^0 part, drop ~0, lift each root by Newton steps in jet arithmetic.
 *  - Two components: u0 is a free (random) jet, v0 solves the first equation's leading
 *    polynomial; the second equation is then checked (consistency ratio).
 */
import { LEADING_COEFFICIENT_ZERO, LEADING_ROOT_ZERO, LEADING_CONSISTENCY } from "../tolerances";
import type { BiSeries } from "./biseries";
import type { Complex, JetAlgebra } from "./jet-algebra";
import { cabs, polynomialRoots } from "./polynomial";
import { residualAt, type PointContext } from "./residual";

export interface ExpansionSetup {
  variables: string[];
  alpha: number;
  lowest: number;
  leadDegree: number;
  /** Degree D of det M(j). */
  determinantDegree: number;
  /** Highest t-derivative of any factor (each one costs a valid Taylor order). */
  maxTimeDerivative: number;
}

/** The leading coefficients w_0 of one branch, per variable. */
export type Branch<J> = Record<string, J>;

export type LeadingResult<J> =
  | { kind: "branches"; branches: Branch<J>[]; consistency?: number }
  | { kind: "inconsistent"; ratio: number; detail: string }
  | { kind: "not-covered"; detail: string };

/** Thrown when a leading root is multiple (f'(z0) ≈ 0), which the engine does not cover. */
export class MultipleRootError extends Error {
  constructor() {
    super("multiple root of the leading-order polynomial (not covered, painleve.md §6 Step 3.7)");
    this.name = "MultipleRootError";
  }
}

export const seriesOf = <J>(alpha: number, rows: J[]): BiSeries<J> => ({ lo: alpha, rows, exact: false });

/** Polynomial coefficients (jets, ascending) in z of the P^lowest residual of equation `eq`. */
function leadingPolynomial<J, T>(
  ctx: PointContext<J, T>,
  setup: ExpansionSetup,
  rowsFor: (z: J) => Record<string, J[]>,
  eq: number,
): { coefficients: J[]; scale: number } {
  const { alg } = ctx;
  const n = setup.leadDegree + 1;
  const values: J[] = [];
  let scale = 0;
  for (let k = 0; k < n; k++) {
    const rows = rowsFor(alg.rootOfUnity(k, n));
    const series: Record<string, BiSeries<J>> = {};
    for (const v of setup.variables) series[v] = seriesOf(setup.alpha, rows[v]);
    const r = residualAt(ctx, series, setup.lowest)[eq];
    values.push(r.value);
    scale += r.scale[0] / n;
  }
  // Inverse DFT: coef_m = (1/n) Σ_k val_k z_k^{-m} (§6 Step 3.2).
  const coefficients: J[] = [];
  for (let m = 0; m < n; m++) {
    const acc = alg.zero();
    for (let k = 0; k < n; k++) alg.mulAcc(acc, values[k], alg.rootOfUnity(-k * m, n));
    coefficients.push(alg.div(acc, alg.constant(n, 0)));
  }
  return { coefficients, scale };
}

/** Nonzero roots of the polynomial, lifted to full jets by Newton's method (§6 Step 3.4–3.6). */
function liftedRoots<J, T>(alg: JetAlgebra<J, T>, poly: J[], scale: number): J[] {
  const c0: Complex[] = poly.map((p) => {
    const c = alg.coefficient(p, 0);
    return cabs(c) < LEADING_COEFFICIENT_ZERO * scale ? { re: 0, im: 0 } : c;
  });
  const roots = polynomialRoots(c0);
  const biggest = Math.max(1, ...roots.map(cabs));
  const kept = roots.filter((r) => cabs(r) > LEADING_ROOT_ZERO * biggest);
  // Deterministic branch order: by argument, then modulus.
  kept.sort((a, b) => Math.atan2(a.im, a.re) - Math.atan2(b.im, b.re) || cabs(a) - cabs(b));
  const steps = Math.ceil(Math.log2(alg.N)) + 2;
  return kept.map((r0) => {
    let z = alg.constant(r0.re, r0.im);
    let derivative0 = 0;
    for (let s = 0; s < steps; s++) {
      let f = alg.zero();
      let df = alg.zero();
      let zp = alg.constant(1, 0);
      for (let m = 0; m < poly.length; m++) {
        f = alg.add(f, alg.mul(poly[m], zp));
        if (m + 1 < poly.length) df = alg.add(df, alg.mul(alg.scale(poly[m + 1], m + 1, 0), zp));
        zp = alg.mul(zp, z);
      }
      derivative0 = cabs(alg.coefficient(df, 0));
      if (derivative0 <= LEADING_ROOT_ZERO * scale) throw new MultipleRootError();
      z = alg.sub(z, alg.div(f, df));
    }
    return z;
  });
}

/** max over valid Taylor orders of |res_m| / scale_m (0/0 counts as 0). */
export function ratioOf<J, T>(alg: JetAlgebra<J, T>, value: J, scale: Float64Array, orders = alg.N): number {
  const mod = alg.modulus(value);
  let worst = 0;
  for (let m = 0; m < Math.min(orders, alg.scaleOrders, alg.valid(value)); m++) {
    const r = mod[m] === 0 ? 0 : scale[m] === 0 ? 1 : mod[m] / scale[m];
    worst = Math.max(worst, r);
  }
  return worst;
}

/** Leading-order branches at this point (§6 Step 3). `u0` is the free leading jet of systems. */
export function leadingBranches<J, T>(ctx: PointContext<J, T>, setup: ExpansionSetup, u0: J | null): LeadingResult<J> {
  const { alg } = ctx;
  const vars = setup.variables;
  if (vars.length === 1) {
    const [u] = vars;
    const { coefficients, scale } = leadingPolynomial(ctx, setup, (z) => ({ [u]: [z] }), 0);
    const roots = liftedRoots(alg, coefficients, scale);
    if (roots.length === 0) return { kind: "inconsistent", ratio: 1, detail: "no nonzero leading coefficient" };
    return { kind: "branches", branches: roots.map((z) => ({ [u]: z })) };
  }
  if (vars.length !== 2 || !u0) return { kind: "not-covered", detail: `systems of ${vars.length} components` };
  if (setup.leadDegree < 1) {
    return { kind: "not-covered", detail: "a fully determined 2×2 leading system (painleve.md §9)" };
  }
  const [u, v] = vars;
  const { coefficients, scale } = leadingPolynomial(ctx, setup, (z) => ({ [u]: [u0], [v]: [z] }), 0);
  const roots = liftedRoots(alg, coefficients, scale);
  if (roots.length === 0) return { kind: "inconsistent", ratio: 1, detail: "no nonzero leading coefficient" };
  const branches: Branch<J>[] = [];
  let consistency = 0;
  for (const v0 of roots) {
    const check = residualAt(ctx, { [u]: seriesOf(setup.alpha, [u0]), [v]: seriesOf(setup.alpha, [v0]) }, setup.lowest)[1];
    const ratio = ratioOf(alg, check.value, check.scale);
    consistency = Math.max(consistency, ratio);
    if (ratio > LEADING_CONSISTENCY) {
      return { kind: "inconsistent", ratio, detail: `second equation at leading order: ratio ${ratio.toExponential(2)}` };
    }
    branches.push({ [u]: u0, [v]: v0 });
  }
  return { kind: "branches", branches, consistency };
}
