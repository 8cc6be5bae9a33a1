/**
 * The invariant statistic rho_inv (nls.md §3 "Numerical decision"; kdv.md §2; mkdv.md §2) from
 * coefficient jets given directly, for designs whose solved coefficient exists only as a table:
 * the monomials of the polynomial form (the reducibility stage's tables, INVARIANTS) are
 * multiplied out over the jets, and rho_inv = |Σ m_i| / Σ |m_i| per Taylor order.
 */
import { constantJet, jetDerivative, jetMul, jetPowInt } from "../expr";
import { INVARIANTS } from "../reducibility";
import type { EquationClass } from "../spec/types";
import { F } from "./jets";
import type { J } from "./jets";

export interface OrderStatistic {
  order: number;
  residual: number;
  scale: number;
  rho: number;
}

/**
 * rho_inv at one point for Taylor orders 0 … orders−1; `jets[name]` is the jet of coefficient
 * `name` of length ≥ orders + maxDerivative (missing coefficients are 0).
 */
export function invariantStatistic(cls: EquationClass, jets: Record<string, J>, orders: number): OrderStatistic[] {
  const def = INVARIANTS[cls];
  const derivatives: Record<string, J[]> = {};
  for (const name of def.inputs) {
    let j = jets[name] ?? constantJet(0, orders - 1 + def.maxDerivative, F);
    const list = [j.slice(0, orders)];
    for (let d = 1; d <= def.maxDerivative; d++) list.push((j = jetDerivative(j, F)).slice(0, orders));
    derivatives[name] = list;
  }
  const monomials = def.monomials.map((m) => {
    let r = constantJet(m.coefficient, orders - 1, F);
    for (const [name, derivative, power] of m.factors) {
      const base = derivatives[name][derivative];
      r = jetMul(r, power === 1 ? base : jetPowInt(base, power, F), F);
    }
    return r;
  });
  const out: OrderStatistic[] = [];
  for (let k = 0; k < orders; k++) {
    let residual = 0;
    let scale = 0;
    for (const m of monomials) {
      residual += m[k];
      scale += Math.abs(m[k]);
    }
    // nls.md §3: an order where Σ|m_i| = 0 counts as rho_inv = 0.
    out.push({ order: k, residual, scale, rho: scale === 0 ? 0 : Math.abs(residual) / scale });
  }
  return out;
}
