/**
 * Complex jets: truncated Taylor series in τ = t - t_s with complex coefficients and a count of
 * trustworthy orders (../shared/math/painleve.md §5, "Jet"). The engine is written once against
 * this interface; `doubleJets` (Float64Array re/im, the fast pass) and `fieldJets` (any Field, e.g.
 * decimal.js for the extended-precision recheck of §7) implement it.
 *
 * Validity rules (§5): add/mul → min(valid); div → min(valid), throws on a zero leading
 * coefficient; d/dτ → valid - 1. Coefficients at or beyond `valid` are kept at zero.
 */
import type { Field } from "../expr/types";

/** A complex number in double precision, for reports and decisions. */
export interface Complex {
  re: number;
  im: number;
}

/** Thrown when a jet division meets a zero (or non-finite) leading coefficient: redraw the point. */
export class ZeroPivotError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "ZeroPivotError";
  }
}

export interface JetAlgebra<J, T> {
  /** "double" or the field name, e.g. "decimal40". */
  readonly precision: string;
  /** Jet length (Taylor orders 0..N-1). */
  readonly N: number;
  /** The number system of the real coefficient jets (for evalJet). */
  readonly field: Field<T>;
  /** Unit roundoff of the arithmetic (painleve.md §7: thresholds scale with it). */
  readonly unitRoundoff: number;
  /** Taylor orders 0..scaleOrders-1 of the term scale are tracked (all N in double). */
  readonly scaleOrders: number;

  zero(): J;
  /** A constant jet c + 0τ + …, from a double (exact for the small integers and ±i the engine uses). */
  constant(re: number, im: number): J;
  /** Taylor coefficients given as doubles (random jets, test-vector inputs); missing orders are 0. */
  fromDoubles(re: ArrayLike<number>, im: ArrayLike<number>): J;
  /** A real jet from evalJet over `field` (length ≥ N). */
  fromReal(c: readonly T[]): J;
  /** e^{2πik/n} as a constant jet, as exact as the arithmetic allows. */
  rootOfUnity(k: number, n: number): J;

  valid(a: J): number;
  /** The same coefficients with validity lowered to v (v ≤ valid). */
  truncate(a: J, v: number): J;

  add(a: J, b: J): J;
  sub(a: J, b: J): J;
  neg(a: J): J;
  conj(a: J): J;
  mul(a: J, b: J): J;
  /** a/b by the recurrence c_n = (a_n - Σ_{k=1..n} b_k c_{n-k})/b_0 (§5); throws ZeroPivotError. */
  div(a: J, b: J): J;
  /** Multiplication by a complex double constant (exact for integers and ±i). */
  scale(a: J, re: number, im: number): J;
  /** acc += a·b in place (acc must be a jet this caller owns). */
  mulAcc(acc: J, a: J, b: J): void;
  /** acc += a in place. */
  addTo(acc: J, a: J): void;
  /** d/dτ: c'_m = (m+1) c_{m+1}, valid - 1 (§5). */
  dtau(a: J): J;

  /** |c_m| as doubles, m = 0..N-1 (0 beyond valid). */
  modulus(a: J): Float64Array;
  /** acc[m] += |c_m| for m < min(valid, scaleOrders) (the term scale without an allocation). */
  addModulus(acc: Float64Array, a: J): void;
  /** c_m as a double complex number. */
  coefficient(a: J, m: number): Complex;
  isFinite(a: J): boolean;
}

export const complex = (re: number, im = 0): Complex => ({ re, im });
