/**
 * Closed forms of the linear second-order equations behind the designs (nls.md §2 (L),
 * kdv.md §2 (Ym Y')' = p m Ym Y and the linearised Riccati equation of r):
 *
 *   m'' + P m' + Q m = 0,  m(t0) = 1,  m'(t0) = s0,
 *
 * for constant P, Q (characteristic roots −P/2 ± √D, D = P²/4 − Q; W. E. Boyce,
 * R. C. DiPrima, "Elementary Differential Equations", 9th ed. 2009, §3.1–3.4) [from memory]:
 *   D > 0:  m = e^{−Pτ/2} [cosh ωτ + (s0 + P/2)/ω · sinh ωτ],  ω = √D
 *   D < 0:  m = e^{−Pτ/2} [cos ωτ + (s0 + P/2)/ω · sin ωτ],    ω = √(−D)
 *   D = 0:  m = e^{−Pτ/2} [1 + (s0 + P/2) τ]
 * and, for Q = 0 with a variable P = −(ln G)' (G > 0, G(t0) = 1): m = 1 + s0 ∫ G.
 */
import { call, div, mul, neg, num, sub } from "../expr";
import type { Expr } from "../expr";
import { DESIGN_DOUBLE_ROOT } from "../tolerances";
import type { Ops } from "./context";
import { rationalValue, toPoly } from "./normal";
import * as Q from "./rational";

/** m'' + P m' + Q m = 0 with constant P, Q: m(t) in closed form (exact in P, Q, s0). */
export function constantCoefficientSolution(ops: Ops, P: Expr, Qc: Expr, s0: Expr): Expr | null {
  if (!ops.tFree(P) || !ops.tFree(Qc)) return null;
  const D = ops.norm(sub(div(mul(P, P), num(4)), Qc));
  const exact = rationalValue(toPoly(D, ops.dc.normal));
  let sign: number;
  if (exact) sign = Q.sign(exact);
  else {
    const d = ops.value0(D);
    const size = Math.abs(ops.value0(div(mul(P, P), num(4)))) + Math.abs(ops.value0(Qc));
    if (!Number.isFinite(d)) return null;
    sign = Math.abs(d) <= DESIGN_DOUBLE_ROOT * size ? 0 : Math.sign(d);
  }
  const tau = ops.tau();
  const decay = call("exp", neg(mul(div(P, num(2)), tau)));
  const shift = ops.norm(ops.add(s0, div(P, num(2))));
  let bracket: Expr;
  if (sign === 0) bracket = ops.add(num(1), mul(shift, tau));
  else {
    const omega = ops.norm(call("sqrt", sign > 0 ? D : neg(D)));
    const wt = mul(omega, tau);
    const [even, odd] = sign > 0 ? (["cosh", "sinh"] as const) : (["cos", "sin"] as const);
    bracket = ops.add(call(even, wt), mul(div(shift, omega), call(odd, wt)));
  }
  return ops.norm(mul(decay, bracket));
}
