/**
 * The two number systems jets are computed in: IEEE double (fast pass) and decimal.js at a chosen
 * precision (extended-precision recheck, ../shared/math/painleve.md §7).
 */
import Decimal from "decimal.js";
import type { Field } from "./types";

export const DoubleField: Field<number> = {
  name: "double",
  zero: 0,
  one: 1,
  fromNumber: (n) => n,
  fromText: (s) => Number(s),
  toNumber: (a) => a,
  add: (a, b) => a + b,
  sub: (a, b) => a - b,
  mul: (a, b) => a * b,
  div: (a, b) => a / b,
  neg: (a) => -a,
  abs: (a) => Math.abs(a),
  exp: (a) => Math.exp(a),
  log: (a) => Math.log(a),
  sin: (a) => Math.sin(a),
  cos: (a) => Math.cos(a),
  sinh: (a) => Math.sinh(a),
  cosh: (a) => Math.cosh(a),
  sqrt: (a) => Math.sqrt(a),
  pow: (a, b) => Math.pow(a, b),
  isFinite: (a) => Number.isFinite(a),
  isZero: (a) => a === 0,
  lt: (a, b) => a < b,
};

const decimalFields = new Map<number, Field<Decimal>>();

/**
 * decimal.js with `digits` significant digits. Each precision gets its own `Decimal.clone`, so
 * no global decimal.js configuration is read or changed; fields are cached per precision.
 */
export function decimalField(digits: number): Field<Decimal> {
  if (!Number.isInteger(digits) || digits < 1 || digits > 1e6) {
    throw new RangeError(`decimalField: digits must be an integer in 1..1e6, got ${digits}`);
  }
  const cached = decimalFields.get(digits);
  if (cached) return cached;
  const D = Decimal.clone({ precision: digits, rounding: Decimal.ROUND_HALF_EVEN });
  const field: Field<Decimal> = {
    name: `decimal${digits}`,
    zero: new D(0),
    one: new D(1),
    fromNumber: (n) => new D(n),
    fromText: (s) => new D(s),
    toNumber: (a) => a.toNumber(),
    add: (a, b) => D.add(a, b),
    sub: (a, b) => D.sub(a, b),
    mul: (a, b) => D.mul(a, b),
    div: (a, b) => D.div(a, b),
    neg: (a) => D.mul(a, -1),
    abs: (a) => D.abs(a),
    exp: (a) => D.exp(a),
    log: (a) => D.ln(a),
    sin: (a) => D.sin(a),
    cos: (a) => D.cos(a),
    sinh: (a) => D.sinh(a),
    cosh: (a) => D.cosh(a),
    sqrt: (a) => D.sqrt(a),
    pow: (a, b) => D.pow(a, b),
    isFinite: (a) => a.isFinite(),
    isZero: (a) => a.isZero(),
    lt: (a, b) => a.lt(b),
  };
  decimalFields.set(digits, field);
  return field;
}
