/**
 * Exact rationals (bigint numerator / positive denominator, always reduced) for the design
 * engine's algebra: decimal literals of the expression language are terminating decimals, so
 * every fold the normal form does with them is exact.
 */
import { div, neg, num } from "../expr";
import type { Expr } from "../expr";

export interface Rational {
  readonly n: bigint;
  readonly d: bigint;
}

const abs = (x: bigint): bigint => (x < 0n ? -x : x);
function gcd(a: bigint, b: bigint): bigint {
  a = abs(a);
  b = abs(b);
  while (b !== 0n) [a, b] = [b, a % b];
  return a;
}

export function rational(n: bigint, d: bigint = 1n): Rational {
  if (d === 0n) throw new RangeError("rational with zero denominator");
  if (d < 0n) {
    n = -n;
    d = -d;
  }
  const g = gcd(n, d) || 1n;
  return { n: n / g, d: d / g };
}

export const ZERO = rational(0n);
export const ONE = rational(1n);
export const fromInt = (k: number): Rational => rational(BigInt(k));

/** Exact value of a decimal literal ("0.25", "-1e-3", "6.02E23"); null for anything else. */
export function fromDecimalText(text: string): Rational | null {
  const m = /^([-+]?)(\d*)(?:\.(\d*))?(?:[eE]([-+]?\d+))?$/.exec(text.trim());
  if (!m || (m[2] === "" && (m[3] ?? "") === "")) return null;
  const [, sign, whole, frac = "", expText = "0"] = m;
  const exponent = Number(expText) - frac.length;
  if (!Number.isFinite(exponent) || Math.abs(exponent) > 400) return null;
  let n = BigInt((whole + frac).replace(/^0+(?=\d)/, "") || "0");
  let d = 1n;
  if (exponent >= 0) n *= 10n ** BigInt(exponent);
  else d = 10n ** BigInt(-exponent);
  return rational(sign === "-" ? -n : n, d);
}

export const add = (a: Rational, b: Rational): Rational => rational(a.n * b.d + b.n * a.d, a.d * b.d);
export const sub = (a: Rational, b: Rational): Rational => rational(a.n * b.d - b.n * a.d, a.d * b.d);
export const mul = (a: Rational, b: Rational): Rational => rational(a.n * b.n, a.d * b.d);
export const divide = (a: Rational, b: Rational): Rational => rational(a.n * b.d, a.d * b.n);
export const negate = (a: Rational): Rational => ({ n: -a.n, d: a.d });
export const isZero = (a: Rational): boolean => a.n === 0n;
export const isOne = (a: Rational): boolean => a.n === 1n && a.d === 1n;
export const isInteger = (a: Rational): boolean => a.d === 1n;
export const equals = (a: Rational, b: Rational): boolean => a.n === b.n && a.d === b.d;
export const sign = (a: Rational): -1 | 0 | 1 => (a.n < 0n ? -1 : a.n > 0n ? 1 : 0);
export const toNumber = (a: Rational): number => Number(a.n) / Number(a.d);
export const key = (a: Rational): string => (a.d === 1n ? a.n.toString() : `${a.n}/${a.d}`);

/** a^k for an integer k (k < 0 needs a ≠ 0). */
export function powInt(a: Rational, k: number): Rational {
  if (k < 0) return powInt(divide(ONE, a), -k);
  return rational(a.n ** BigInt(k), a.d ** BigInt(k));
}

/** Exact k-th root of a non-negative integer, or null. */
function integerRoot(x: bigint, k: number): bigint | null {
  if (x < 0n) return null;
  if (x < 2n) return x;
  const r = BigInt(Math.round(Number(x) ** (1 / k)));
  for (const c of [r - 1n, r, r + 1n]) if (c >= 0n && c ** BigInt(k) === x) return c;
  return null;
}

/** a^(p/q) when it is rational (a ≥ 0, both parts perfect q-th powers), else null. */
export function powRational(a: Rational, e: Rational): Rational | null {
  if (isInteger(e)) return isZero(a) && e.n < 0n ? null : powInt(a, Number(e.n));
  if (a.n < 0n || e.d > 12n) return null;
  const q = Number(e.d);
  const rn = integerRoot(a.n, q);
  const rd = integerRoot(a.d, q);
  if (rn === null || rd === null) return null;
  const root = rational(rn, rd);
  return isZero(root) && e.n < 0n ? null : powInt(root, Number(e.n));
}

/** Denominator 2^i 5^j: the value is a terminating decimal. */
function terminating(d: bigint): boolean {
  while (d % 2n === 0n) d /= 2n;
  while (d % 5n === 0n) d /= 5n;
  return d === 1n;
}

/** Exact decimal text of a rational with a terminating expansion. */
function decimalText(a: Rational): string {
  let scale = 0;
  let d = a.d;
  while (d !== 1n) {
    if (d % 10n === 0n) d /= 10n;
    else if (d % 2n === 0n) d /= 2n;
    else d /= 5n;
    scale++;
  }
  // a = n/d with d | 10^scale.
  const scaled = abs(a.n) * (10n ** BigInt(scale) / a.d);
  const digits = scaled.toString().padStart(scale + 1, "0");
  const whole = digits.slice(0, digits.length - scale);
  const frac = digits.slice(digits.length - scale).replace(/0+$/, "");
  return frac ? `${whole}.${frac}` : whole;
}

const literal = (x: bigint): Expr => num(Number(x), x.toString());

/**
 * A non-negative rational as a tree: integers as literals; small denominators as a fraction
 * (1/3, 5/4), which reads better; other terminating values as one exact decimal literal.
 */
export function magnitudeExpr(a: Rational): Expr {
  const m = a.n < 0n ? negate(a) : a;
  if (m.d === 1n) return literal(m.n);
  if (m.d <= 12n || !terminating(m.d)) return div(literal(m.n), literal(m.d));
  const text = decimalText(m);
  return num(Number(text), text);
}

/** A non-negative terminating rational as one decimal literal (1/10 → 0.1), else as magnitudeExpr. */
export function decimalMagnitudeExpr(a: Rational): Expr {
  const m = a.n < 0n ? negate(a) : a;
  if (m.d === 1n || !terminating(m.d)) return magnitudeExpr(m);
  const text = decimalText(m);
  return num(Number(text), text);
}

/** A rational as a tree (exact). */
export function rationalExpr(a: Rational): Expr {
  return a.n < 0n ? neg(magnitudeExpr(a)) : magnitudeExpr(a);
}
