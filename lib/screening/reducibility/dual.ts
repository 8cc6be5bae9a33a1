/**
 * Forward-mode derivatives in any field: numbers v + Σ d_i ε_i with ε_i ε_j = 0 (multivariate
 * dual numbers; Griewank & Walther, "Evaluating Derivatives", 2nd ed. 2008, ch. 3). Jets over
 * this field give the invariant and its exact gradient in the free parameters at once, for the
 * Gauss–Newton / Levenberg–Marquardt solve.
 */
import type { Field } from "../expr";

export interface Dual<T> {
  v: T;
  d: T[];
}

/** The dual-number field over `base` with `n` independent directions. */
export function dualField<T>(base: Field<T>, n: number): Field<Dual<T>> & { variable(value: T, index: number): Dual<T>; constant(value: T): Dual<T> } {
  const zeros = (): T[] => new Array<T>(n).fill(base.zero);
  const constant = (v: T): Dual<T> => ({ v, d: zeros() });
  const chain = (a: Dual<T>, v: T, slope: T): Dual<T> => ({ v, d: a.d.map((x) => base.mul(slope, x)) });
  const dZero = (a: Dual<T>): boolean => a.d.every((x) => base.isZero(x));
  const F: Field<Dual<T>> & { variable(value: T, index: number): Dual<T>; constant(value: T): Dual<T> } = {
    name: `dual${n}(${base.name})`,
    zero: constant(base.zero),
    one: constant(base.one),
    constant,
    variable: (value, index) => {
      const d = zeros();
      d[index] = base.one;
      return { v: value, d };
    },
    fromNumber: (x) => constant(base.fromNumber(x)),
    fromText: (s) => constant(base.fromText(s)),
    toNumber: (a) => base.toNumber(a.v),
    add: (a, b) => ({ v: base.add(a.v, b.v), d: a.d.map((x, i) => base.add(x, b.d[i])) }),
    sub: (a, b) => ({ v: base.sub(a.v, b.v), d: a.d.map((x, i) => base.sub(x, b.d[i])) }),
    mul: (a, b) => ({
      v: base.mul(a.v, b.v),
      d: a.d.map((x, i) => base.add(base.mul(x, b.v), base.mul(a.v, b.d[i]))),
    }),
    div: (a, b) => {
      const q = base.div(a.v, b.v);
      return { v: q, d: a.d.map((x, i) => base.div(base.sub(x, base.mul(q, b.d[i])), b.v)) };
    },
    neg: (a) => ({ v: base.neg(a.v), d: a.d.map((x) => base.neg(x)) }),
    abs: (a) => (base.lt(a.v, base.zero) ? F.neg(a) : a),
    exp: (a) => {
      const e = base.exp(a.v);
      return chain(a, e, e);
    },
    log: (a) => chain(a, base.log(a.v), base.div(base.one, a.v)),
    sin: (a) => chain(a, base.sin(a.v), base.cos(a.v)),
    cos: (a) => chain(a, base.cos(a.v), base.neg(base.sin(a.v))),
    sinh: (a) => chain(a, base.sinh(a.v), base.cosh(a.v)),
    cosh: (a) => chain(a, base.cosh(a.v), base.sinh(a.v)),
    sqrt: (a) => {
      const s = base.sqrt(a.v);
      return dZero(a) ? constant(s) : chain(a, s, base.div(base.one, base.add(s, s)));
    },
    pow: (a, b) => {
      const r = base.pow(a.v, b.v);
      // d(a^b) = b a^(b-1) da + a^b log(a) db; each part only where its direction is present.
      let d = zeros();
      if (!dZero(a)) {
        const slope = base.mul(b.v, base.pow(a.v, base.sub(b.v, base.one)));
        d = a.d.map((x) => base.mul(slope, x));
      }
      if (!dZero(b)) {
        const slope = base.mul(r, base.log(a.v));
        d = d.map((x, i) => base.add(x, base.mul(slope, b.d[i])));
      }
      return { v: r, d };
    },
    isFinite: (a) => base.isFinite(a.v) && a.d.every((x) => base.isFinite(x)),
    isZero: (a) => base.isZero(a.v),
    lt: (a, b) => base.lt(a.v, b.v),
  };
  return F;
}
