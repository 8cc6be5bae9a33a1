/**
 * The solution formulas are written once over an abstract real algebra, so the same code
 * evaluates them in double precision (for plots and the browser) and over bivariate Taylor
 * series (for the residual check in ../verify). Complex values are pairs of reals.
 */
import { jacobiElliptic } from "../special";

export interface RealOps<T> {
  constant(v: number): T;
  add(a: T, b: T): T;
  sub(a: T, b: T): T;
  mul(a: T, b: T): T;
  div(a: T, b: T): T;
  neg(a: T): T;
  scale(a: T, s: number): T;
  exp(a: T): T;
  cos(a: T): T;
  sin(a: T): T;
  sech(a: T): T;
  tanh(a: T): T;
  /** sn, cn, dn(z | m), parameter convention mJ (../shared/math/README.md). */
  jacobi(z: T, m: number): { sn: T; cn: T; dn: T };
}

export interface Complex<T> {
  re: T;
  im: T;
}

export const numberOps: RealOps<number> = {
  constant: (v) => v,
  add: (a, b) => a + b,
  sub: (a, b) => a - b,
  mul: (a, b) => a * b,
  div: (a, b) => a / b,
  neg: (a) => -a,
  scale: (a, s) => a * s,
  exp: Math.exp,
  cos: Math.cos,
  sin: Math.sin,
  sech: (a) => 1 / Math.cosh(a),
  tanh: Math.tanh,
  jacobi: (z, m) => jacobiElliptic(z, m),
};

export function cx<T>(re: T, im: T): Complex<T> {
  return { re, im };
}
export function cxMul<T>(o: RealOps<T>, a: Complex<T>, b: Complex<T>): Complex<T> {
  return { re: o.sub(o.mul(a.re, b.re), o.mul(a.im, b.im)), im: o.add(o.mul(a.re, b.im), o.mul(a.im, b.re)) };
}
export function cxAdd<T>(o: RealOps<T>, a: Complex<T>, b: Complex<T>): Complex<T> {
  return { re: o.add(a.re, b.re), im: o.add(a.im, b.im) };
}
export function cxScale<T>(o: RealOps<T>, a: Complex<T>, r: T): Complex<T> {
  return { re: o.mul(a.re, r), im: o.mul(a.im, r) };
}
/** e^{iθ} = cos θ + i sin θ. */
export function expi<T>(o: RealOps<T>, theta: T): Complex<T> {
  return { re: o.cos(theta), im: o.sin(theta) };
}
/** A real value as a complex one. */
export function real<T>(o: RealOps<T>, a: T): Complex<T> {
  return { re: a, im: o.constant(0) };
}
