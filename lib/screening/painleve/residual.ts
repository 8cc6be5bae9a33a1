/**
 * Everything fixed at one sample point t_s, and the residual of the template at one power of P
 * with its term scale (../shared/math/painleve.md §5 "Residual evaluation"):
 *   scale_m = Σ_terms |[term]_{P^order, τ^m}|.
 * Coordinates (§1): P = x + ψ(t), ∂_x → ∂_P, D_t = ∂_τ + ψ'∂_P, x = P - ψ.
 */
import type { Expr } from "../expr/types";
import { evalJet, variableJet } from "../expr";
import { biMul, dP, dT, fromJet, hiOf, rowAt, type BiSeries } from "./biseries";
import type { JetAlgebra } from "./jet-algebra";
import type { EquationTemplate, Factor } from "./types";

/** A term with its coefficient evaluated at the point. */
interface PointTerm<J> {
  re: number;
  im: number;
  /** null for the constant coefficient "1". */
  coefficient: J | null;
  xPower: number;
  factors: Factor[];
}

export interface PointContext<J, T> {
  alg: JetAlgebra<J, T>;
  t: number;
  variables: string[];
  equations: PointTerm<J>[][];
  psi: J;
  psiPrime: BiSeries<J>;
  /** x, x², … as exact series in P (cached). */
  xPowers: BiSeries<J>[];
  /** Real coefficient jets by name (for the class oracle and reports). */
  coefficientJets: Map<string, J>;
}

/**
 * Evaluate the template's coefficients at t (exact decimal text `tText`) and set up ψ and x.
 * Throws JetEvaluationError (from evalJet) when the point is singular for a coefficient.
 */
export function pointContext<J, T>(
  alg: JetAlgebra<J, T>,
  template: EquationTemplate,
  coefficients: Record<string, Expr>,
  tText: string,
  psiCoefficients: readonly number[],
): PointContext<J, T> {
  const F = alg.field;
  const order = alg.N - 1;
  const env = { t: variableJet(F.fromText(tText), order, F) };
  const byName = new Map<string, J>();
  const byExpr = new Map<Expr, J>();
  const jetOf = (c: string | Expr): J | null => {
    if (c === "1") return null;
    if (typeof c === "string") {
      const cached = byName.get(c);
      if (cached) return cached;
      const expr = coefficients[c];
      if (!expr) throw new Error(`no coefficient '${c}' for the template`);
      const j = alg.fromReal(evalJet(expr, env, order, F));
      byName.set(c, j);
      return j;
    }
    const cached = byExpr.get(c);
    if (cached) return cached;
    const j = alg.fromReal(evalJet(c, env, order, F));
    byExpr.set(c, j);
    return j;
  };
  const equations = template.equations.map((eq) =>
    eq.map((tm) => ({ re: tm.constant.re, im: tm.constant.im, coefficient: jetOf(tm.coefficient), xPower: tm.xPower, factors: tm.factors })),
  );
  const psi = alg.fromDoubles(psiCoefficients.slice(0, alg.N), []);
  const xSeries: BiSeries<J> = { lo: 0, rows: [alg.neg(psi), alg.constant(1, 0)], exact: true };
  return {
    alg,
    t: Number(tText),
    variables: template.variables,
    equations,
    psi,
    psiPrime: fromJet(alg.dtau(psi)),
    xPowers: [fromJet(alg.constant(1, 0)), xSeries],
    coefficientJets: byName,
  };
}

function xPower<J, T>(ctx: PointContext<J, T>, n: number): BiSeries<J> {
  while (ctx.xPowers.length <= n) ctx.xPowers.push(biMul(ctx.alg, ctx.xPowers[ctx.xPowers.length - 1], ctx.xPowers[1]));
  return ctx.xPowers[n];
}

/** The coefficient of P^power in the product of `factors`, computing only the rows it needs. */
function productRow<J, T>(alg: JetAlgebra<J, T>, factors: BiSeries<J>[], power: number): J {
  if (factors.length === 0) return power === 0 ? alg.constant(1, 0) : alg.zero();
  const lows = factors.map((s) => s.lo);
  let remaining = lows.reduce((s, l) => s + l, 0);
  if (power < remaining) return alg.zero();
  let acc = factors[0];
  remaining -= lows[0];
  for (let i = 1; i < factors.length - 1; i++) {
    remaining -= lows[i];
    acc = biMul(alg, acc, factors[i], power - remaining);
  }
  if (factors.length === 1) return rowAt(alg, acc, power);
  const last = factors[factors.length - 1];
  // Single row of acc × last at P^power.
  const k = power - acc.lo - last.lo;
  if (!acc.exact || !last.exact) {
    const hi = Math.min(hiOf(acc) + last.lo, hiOf(last) + acc.lo);
    if (power > hi) throw new Error(`residual: P^${power} is beyond the known order P^${hi}`);
  }
  const r = alg.zero();
  const iStart = Math.max(0, k - (last.rows.length - 1));
  const iEnd = Math.min(k, acc.rows.length - 1);
  for (let i = iStart; i <= iEnd; i++) alg.mulAcc(r, acc.rows[i], last.rows[k - i]);
  return r;
}

export interface EquationResidual<J> {
  value: J;
  /** Term scale per Taylor order (§5). */
  scale: Float64Array;
}

/** Derivative series ∂_x^nx D_t^nt of each variable, computed once per series (§5). */
export type DerivativeCache<J> = Map<string, Map<string, BiSeries<J>>>;

/**
 * The coefficient of P^power of every equation, for dependent-variable series `series`
 * (one BiSeries per variable), with its term scale (§5). `cache` may carry the derivative
 * series of variables whose series did not change since an earlier call.
 */
export function residualAt<J, T>(
  ctx: PointContext<J, T>,
  series: Record<string, BiSeries<J>>,
  power: number,
  cache: DerivativeCache<J> = new Map(),
): EquationResidual<J>[] {
  const { alg } = ctx;
  const derivative = (v: string, nx: number, nt: number): BiSeries<J> => {
    let perVariable = cache.get(v);
    if (!perVariable) cache.set(v, (perVariable = new Map()));
    const key = `${nx}|${nt}`;
    const hit = perVariable.get(key);
    if (hit) return hit;
    let s: BiSeries<J>;
    if (nt > 0) s = dT(alg, derivative(v, nx, nt - 1), ctx.psiPrime);
    else if (nx > 0) s = dP(alg, derivative(v, nx - 1, 0));
    else {
      s = series[v];
      if (!s) throw new Error(`residual: no series for '${v}'`);
    }
    perVariable.set(key, s);
    return s;
  };
  return ctx.equations.map((eq) => {
    const value = alg.zero();
    const scale = new Float64Array(alg.N);
    for (const tm of eq) {
      const parts = tm.factors.map((fa) => derivative(fa.variable, fa.x, fa.t));
      if (tm.xPower > 0) parts.push(xPower(ctx, tm.xPower));
      let row = productRow(alg, parts, power);
      if (tm.coefficient) row = alg.mul(row, tm.coefficient);
      if (tm.re !== 1 || tm.im !== 0) row = alg.scale(row, tm.re, tm.im);
      alg.addTo(value, row);
      alg.addModulus(scale, row);
    }
    return { value, scale };
  });
}
