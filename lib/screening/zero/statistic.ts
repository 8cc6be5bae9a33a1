/**
 * The invariant statistic rho = |Σ m_i| / Σ |m_i| per Taylor order (../shared/math/nls.md §3,
 * "Numerical decision"), in any field.
 */
import type { Field } from "../expr";
import type { TermJets } from "./types";

export interface FieldStatistic<T> {
  value: T;
  scale: T;
}

/** Σ m_i and Σ |m_i| at each order (nls.md §3). */
export function sumAndScale<T>(terms: TermJets<T>, field: Field<T>): FieldStatistic<T>[] {
  return terms.map((row) => {
    let value = field.zero;
    let scale = field.zero;
    for (const m of row) {
      value = field.add(value, m);
      scale = field.add(scale, field.abs(m));
    }
    return { value, scale };
  });
}

/** rho = |value|/scale; an order whose scale is 0 counts as rho = 0 (nls.md §3). */
export function rhoOf<T>(s: FieldStatistic<T>, field: Field<T>): T {
  if (field.isZero(s.scale)) return field.zero;
  return field.div(field.abs(s.value), s.scale);
}

/** Unit roundoff of a decimal arithmetic with `digits` significant digits (round-half-even). */
export function unitRoundoff(digits: number): number {
  return 0.5 * Math.pow(10, 1 - digits);
}
