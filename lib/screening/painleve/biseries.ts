/**
 * BiSeries: a Laurent polynomial in P = x + ψ(t) whose coefficients are complex jets in τ
 * (../shared/math/painleve.md §5, "BiSeries"). rows[k] is the coefficient of P^(lo+k).
 * exact = true: rows beyond the last are exactly zero; false: the series is known only up to
 * hi = lo + rows.length - 1. Row validity is carried by each jet.
 */
import type { JetAlgebra } from "./jet-algebra";

export interface BiSeries<J> {
  lo: number;
  rows: J[];
  exact: boolean;
}

export function hiOf<J>(b: BiSeries<J>): number {
  return b.exact ? Number.POSITIVE_INFINITY : b.lo + b.rows.length - 1;
}

/** A coefficient function c(t) as an exact one-row series at P^0. */
export function fromJet<J>(j: J): BiSeries<J> {
  return { lo: 0, rows: [j], exact: true };
}

/** The coefficient of P^e (zero outside an exact series; an error beyond hi of an inexact one). */
export function rowAt<J, T>(alg: JetAlgebra<J, T>, b: BiSeries<J>, e: number): J {
  const k = e - b.lo;
  if (k < 0 || (b.exact && k >= b.rows.length)) return alg.zero();
  if (k >= b.rows.length) throw new Error(`BiSeries: P^${e} is beyond the known order P^${hiOf(b)}`);
  return b.rows[k];
}

/** ∂_P: row k times (lo + k), lo - 1 (§5). */
export function dP<J, T>(alg: JetAlgebra<J, T>, b: BiSeries<J>): BiSeries<J> {
  return { lo: b.lo - 1, rows: b.rows.map((r, k) => alg.scale(r, b.lo + k, 0)), exact: b.exact };
}

/** ∂_τ of every row (§5). */
export function dTau<J, T>(alg: JetAlgebra<J, T>, b: BiSeries<J>): BiSeries<J> {
  return { lo: b.lo, rows: b.rows.map((r) => alg.dtau(r)), exact: b.exact };
}

/** Sum (§5): lo = min; exact if both are; otherwise hi = min(hi_a, hi_b). */
export function biAdd<J, T>(alg: JetAlgebra<J, T>, a: BiSeries<J>, b: BiSeries<J>): BiSeries<J> {
  const lo = Math.min(a.lo, b.lo);
  const exact = a.exact && b.exact;
  const top = exact ? Math.max(a.lo + a.rows.length, b.lo + b.rows.length) - 1 : Math.min(hiOf(a), hiOf(b));
  const rows: J[] = [];
  for (let e = lo; e <= top; e++) {
    const r = alg.zero();
    for (const s of [a, b]) {
      const k = e - s.lo;
      if (k >= 0 && k < s.rows.length) alg.addTo(r, s.rows[k]);
    }
    rows.push(r);
  }
  return { lo, rows, exact };
}

/**
 * Product (§5): lo = lo_a + lo_b; exact if both are, otherwise hi = min(hi_a + lo_b, hi_b + lo_a).
 * `maxPower` truncates the result at P^maxPower (only lower rows are needed by the caller).
 */
export function biMul<J, T>(
  alg: JetAlgebra<J, T>,
  a: BiSeries<J>,
  b: BiSeries<J>,
  maxPower = Number.POSITIVE_INFINITY,
): BiSeries<J> {
  const lo = a.lo + b.lo;
  const exact = a.exact && b.exact;
  const naturalHi = exact ? a.lo + a.rows.length - 1 + b.lo + b.rows.length - 1 : Math.min(hiOf(a) + b.lo, hiOf(b) + a.lo);
  const hi = Math.min(naturalHi, maxPower);
  const rows: J[] = [];
  for (let k = 0; k <= hi - lo; k++) {
    const r = alg.zero();
    const iStart = Math.max(0, k - (b.rows.length - 1));
    const iEnd = Math.min(k, a.rows.length - 1);
    for (let i = iStart; i <= iEnd; i++) alg.mulAcc(r, a.rows[i], b.rows[k - i]);
    rows.push(r);
  }
  return { lo, rows, exact: exact && hi === naturalHi };
}

/** Multiplication by a complex double constant. */
export function biScale<J, T>(alg: JetAlgebra<J, T>, b: BiSeries<J>, re: number, im: number): BiSeries<J> {
  return { lo: b.lo, rows: b.rows.map((r) => alg.scale(r, re, im)), exact: b.exact };
}

/** D_t B = ∂_τ B + ψ'(τ) ∂_P B, with ψ' an exact one-row series (§1, §5). */
export function dT<J, T>(alg: JetAlgebra<J, T>, b: BiSeries<J>, psiPrime: BiSeries<J>): BiSeries<J> {
  return biAdd(alg, dTau(alg, b), biMul(alg, psiPrime, dP(alg, b)));
}
