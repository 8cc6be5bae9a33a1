/**
 * Values that carry a running bound on their own rounding error (running error analysis:
 * N. J. Higham, "Accuracy and Stability of Numerical Algorithms", 2nd ed. 2002, §3.3).
 * `e` is the first-order absolute error bound in units of the arithmetic's unit roundoff u:
 * |computed − exact| ≲ e·u. Each operation adds the propagated input errors and one rounding of
 * its result. Used to tell a residual from rounding noise (ENGINE-NOTES §4: the "magnitude bound").
 */
import type { Field } from "../expr";

export interface Tracked<T> {
  v: T;
  /** Error bound in units of u (a double; e·u is the absolute bound). */
  e: number;
}

/** Significant digits of a decimal literal (sign, point, exponent and leading zeros ignored). */
export function significantDigits(text: string): number {
  const mantissa = text.trim().replace(/^[-+]/, "").split(/[eE]/)[0].replace(".", "");
  const stripped = mantissa.replace(/^0+/, "").replace(/0+$/, "");
  return Math.max(stripped.length, 1);
}

/**
 * The tracked field over `base`. `digits` is the precision of `base` (16 for double, where a
 * literal is exact only if it is an integer), used to decide which literals are read exactly.
 */
export function trackedField<T>(base: Field<T>, digits: number): Field<Tracked<T>> {
  const mag = (x: T): number => Math.abs(base.toNumber(x));
  const exactText = (s: string, v: T): boolean => {
    if (digits <= 17) return Number.isInteger(base.toNumber(v)) && Math.abs(base.toNumber(v)) <= 2 ** 53;
    return significantDigits(s) <= digits;
  };
  const make = (v: T, propagated: number): Tracked<T> => ({ v, e: propagated + mag(v) });
  const unary = (a: Tracked<T>, v: T, slope: number): Tracked<T> => make(v, Math.abs(slope) * a.e);
  const F: Field<Tracked<T>> = {
    name: `tracked(${base.name})`,
    zero: { v: base.zero, e: 0 },
    one: { v: base.one, e: 0 },
    fromNumber: (n) => ({ v: base.fromNumber(n), e: Number.isInteger(n) ? 0 : Math.abs(n) }),
    fromText: (s) => {
      const v = base.fromText(s);
      return { v, e: exactText(s, v) ? 0 : mag(v) };
    },
    toNumber: (a) => base.toNumber(a.v),
    add: (a, b) => make(base.add(a.v, b.v), a.e + b.e),
    sub: (a, b) => make(base.sub(a.v, b.v), a.e + b.e),
    mul: (a, b) => make(base.mul(a.v, b.v), mag(b.v) * a.e + mag(a.v) * b.e),
    div: (a, b) => {
      const q = base.div(a.v, b.v);
      return make(q, (a.e + mag(q) * b.e) / mag(b.v));
    },
    neg: (a) => ({ v: base.neg(a.v), e: a.e }),
    abs: (a) => ({ v: base.abs(a.v), e: a.e }),
    exp: (a) => {
      const v = base.exp(a.v);
      return unary(a, v, mag(v));
    },
    log: (a) => unary(a, base.log(a.v), 1 / mag(a.v)),
    sin: (a) => unary(a, base.sin(a.v), mag(base.cos(a.v))),
    cos: (a) => unary(a, base.cos(a.v), mag(base.sin(a.v))),
    sinh: (a) => unary(a, base.sinh(a.v), mag(base.cosh(a.v))),
    cosh: (a) => unary(a, base.cosh(a.v), mag(base.sinh(a.v))),
    sqrt: (a) => {
      const v = base.sqrt(a.v);
      return unary(a, v, base.isZero(v) ? 0 : 1 / (2 * mag(v)));
    },
    pow: (a, b) => {
      const v = base.pow(a.v, b.v);
      const bv = base.toNumber(b.v);
      const slopeA = a.e === 0 ? 0 : Math.abs(bv) * mag(v) / mag(a.v);
      const slopeB = b.e === 0 ? 0 : mag(v) * Math.abs(Math.log(mag(a.v)));
      return make(v, slopeA * a.e + slopeB * b.e);
    },
    isFinite: (a) => base.isFinite(a.v),
    isZero: (a) => base.isZero(a.v),
    lt: (a, b) => base.lt(a.v, b.v),
  };
  return F;
}
