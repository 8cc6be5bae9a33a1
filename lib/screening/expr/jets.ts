/**
 * Truncated Taylor series ("jets") over any Field<T>: c[k] = f^(k)(t_s)/k!, k = 0..order.
 * Recurrences: ../shared/math/painleve.md §5 and ../shared/ENGINE-NOTES.md Appendix C
 * (standard automatic-differentiation rules, e.g. Griewank & Walther, "Evaluating Derivatives",
 * 2nd ed. 2008, Table 13.2). Every operation is O(order²) and allocates its result.
 */
import type { Field, Jet } from "./types";
import { DoubleField } from "./fields";
import { JetEvaluationError } from "./jet-error";
import { addD, divD, expD, logD, mulD, powConstD, sinCosLikeD, sqrtD, subD } from "./jets-double";

export { JetEvaluationError, type JetFailure } from "./jet-error";

/** Double-precision calls go to the specialised copies in ./jets-double.ts (same formulas). */
function isDouble<T>(F: Field<T>): boolean {
  return (F as unknown) === DoubleField;
}
function asNumbers<T>(a: Jet<T>): number[] {
  return a as unknown as number[];
}
function asJet<T>(a: number[]): Jet<T> {
  return a as unknown as Jet<T>;
}

function zeros<T>(n: number, F: Field<T>): Jet<T> {
  return new Array<T>(n).fill(F.zero);
}
function len<T>(a: Jet<T>, b: Jet<T>): number {
  return Math.min(a.length, b.length);
}
function checkFinite<T>(x: T, F: Field<T>, what: string): T {
  if (!F.isFinite(x)) throw new JetEvaluationError("non-finite", `${what} is not finite`);
  return x;
}

/** The jet of the variable itself at `value`: [value, 1, 0, …]. */
export function variableJet<T>(value: T, order: number, F: Field<T>): Jet<T> {
  const r = zeros(order + 1, F);
  r[0] = value;
  if (order >= 1) r[1] = F.one;
  return r;
}
/** The jet of a constant: [value, 0, 0, …]. */
export function constantJet<T>(value: T, order: number, F: Field<T>): Jet<T> {
  const r = zeros(order + 1, F);
  r[0] = value;
  return r;
}
/** True when every coefficient above order 0 is exactly zero. */
export function isConstantJet<T>(a: Jet<T>, F: Field<T>): boolean {
  for (let k = 1; k < a.length; k++) if (!F.isZero(a[k])) return false;
  return true;
}

export function jetAdd<T>(a: Jet<T>, b: Jet<T>, F: Field<T>): Jet<T> {
  if (isDouble(F)) return asJet(addD(asNumbers(a), asNumbers(b)));
  const n = len(a, b);
  const r = new Array<T>(n);
  for (let k = 0; k < n; k++) r[k] = F.add(a[k], b[k]);
  return r;
}
export function jetSub<T>(a: Jet<T>, b: Jet<T>, F: Field<T>): Jet<T> {
  if (isDouble(F)) return asJet(subD(asNumbers(a), asNumbers(b)));
  const n = len(a, b);
  const r = new Array<T>(n);
  for (let k = 0; k < n; k++) r[k] = F.sub(a[k], b[k]);
  return r;
}
export function jetNeg<T>(a: Jet<T>, F: Field<T>): Jet<T> {
  return a.map((x) => F.neg(x));
}
/** s·a for a scalar s. */
export function jetScale<T>(a: Jet<T>, s: T, F: Field<T>): Jet<T> {
  return a.map((x) => F.mul(s, x));
}

/** Truncated Cauchy product: r_k = Σ_{j≤k} a_j b_{k-j} (painleve.md §5). */
export function jetMul<T>(a: Jet<T>, b: Jet<T>, F: Field<T>): Jet<T> {
  if (isDouble(F)) return asJet(mulD(asNumbers(a), asNumbers(b)));
  const n = len(a, b);
  const r = new Array<T>(n);
  for (let k = 0; k < n; k++) {
    let s = F.zero;
    for (let j = 0; j <= k; j++) s = F.add(s, F.mul(a[j], b[k - j]));
    r[k] = s;
  }
  return r;
}

/** r_k = (a_k - Σ_{j=1..k} b_j r_{k-j}) / b_0 (painleve.md §5); throws if b_0 = 0. */
export function jetDiv<T>(a: Jet<T>, b: Jet<T>, F: Field<T>): Jet<T> {
  if (isDouble(F)) return asJet(divD(asNumbers(a), asNumbers(b)));
  if (F.isZero(b[0])) throw new JetEvaluationError("zero-divisor", "division by a quantity that is zero here");
  const n = len(a, b);
  const r = new Array<T>(n);
  for (let k = 0; k < n; k++) {
    let s = a[k];
    for (let j = 1; j <= k; j++) s = F.sub(s, F.mul(b[j], r[k - j]));
    r[k] = F.div(s, b[0]);
  }
  return r;
}

/** 1/b. */
export function jetReciprocal<T>(b: Jet<T>, F: Field<T>): Jet<T> {
  return jetDiv(constantJet(F.one, b.length - 1, F), b, F);
}

/**
 * d/dt of a jet: c'_m = (m+1) c_{m+1} (painleve.md §5). The result is one order shorter
 * (length - 1), since the top coefficient of the derivative is not known.
 */
export function jetDerivative<T>(a: Jet<T>, F: Field<T>): Jet<T> {
  const r = new Array<T>(Math.max(a.length - 1, 0));
  for (let m = 0; m < r.length; m++) r[m] = F.mul(F.fromNumber(m + 1), a[m + 1]);
  return r;
}

/** The k-th derivative value f^(k)(t_s) = k! c_k. */
export function jetDerivativeValue<T>(a: Jet<T>, k: number, F: Field<T>): T {
  let f = F.one;
  for (let j = 2; j <= k; j++) f = F.mul(f, F.fromNumber(j));
  return F.mul(f, a[k]);
}

/** e_0 = exp(a_0), e_n = (1/n) Σ_{k=1..n} k a_k e_{n-k} (painleve.md §5). */
export function jetExp<T>(a: Jet<T>, F: Field<T>): Jet<T> {
  if (isDouble(F)) return asJet(expD(asNumbers(a)));
  const n = a.length;
  const r = new Array<T>(n);
  r[0] = checkFinite(F.exp(a[0]), F, "exp");
  for (let m = 1; m < n; m++) {
    let s = F.zero;
    for (let k = 1; k <= m; k++) s = F.add(s, F.mul(F.mul(F.fromNumber(k), a[k]), r[m - k]));
    r[m] = F.div(s, F.fromNumber(m));
  }
  return r;
}

/** l_0 = log a_0, l_n = (a_n - (1/n) Σ_{k=1..n-1} k l_k a_{n-k}) / a_0 (painleve.md §5). */
export function jetLog<T>(a: Jet<T>, F: Field<T>): Jet<T> {
  if (isDouble(F)) return asJet(logD(asNumbers(a)));
  if (!F.lt(F.zero, a[0])) throw new JetEvaluationError("log-domain", "log of a quantity that is not positive here");
  const n = a.length;
  const r = new Array<T>(n);
  r[0] = F.log(a[0]);
  for (let m = 1; m < n; m++) {
    let s = F.zero;
    for (let k = 1; k < m; k++) s = F.add(s, F.mul(F.mul(F.fromNumber(k), r[k]), a[m - k]));
    r[m] = F.div(F.sub(a[m], F.div(s, F.fromNumber(m))), a[0]);
  }
  return r;
}

/**
 * sin and cos together (sign = -1), or sinh and cosh (sign = +1):
 * s_n = (1/n) Σ k a_k c_{n-k}, c_n = ∓(1/n) Σ k a_k s_{n-k} (painleve.md §5).
 */
function sinCosLike<T>(a: Jet<T>, F: Field<T>, hyperbolic: boolean): [Jet<T>, Jet<T>] {
  if (isDouble(F)) {
    const [sd, cd] = sinCosLikeD(asNumbers(a), hyperbolic);
    return [asJet(sd), asJet(cd)];
  }
  const n = a.length;
  const s = new Array<T>(n);
  const c = new Array<T>(n);
  s[0] = hyperbolic ? F.sinh(a[0]) : F.sin(a[0]);
  c[0] = hyperbolic ? F.cosh(a[0]) : F.cos(a[0]);
  checkFinite(s[0], F, hyperbolic ? "sinh" : "sin");
  checkFinite(c[0], F, hyperbolic ? "cosh" : "cos");
  for (let m = 1; m < n; m++) {
    let ss = F.zero;
    let cc = F.zero;
    for (let k = 1; k <= m; k++) {
      const ka = F.mul(F.fromNumber(k), a[k]);
      ss = F.add(ss, F.mul(ka, c[m - k]));
      cc = F.add(cc, F.mul(ka, s[m - k]));
    }
    const inv = F.fromNumber(m);
    s[m] = F.div(ss, inv);
    c[m] = hyperbolic ? F.div(cc, inv) : F.neg(F.div(cc, inv));
  }
  return [s, c];
}

export function jetSinCos<T>(a: Jet<T>, F: Field<T>): [Jet<T>, Jet<T>] {
  return sinCosLike(a, F, false);
}
export function jetSinhCosh<T>(a: Jet<T>, F: Field<T>): [Jet<T>, Jet<T>] {
  return sinCosLike(a, F, true);
}
export function jetSin<T>(a: Jet<T>, F: Field<T>): Jet<T> {
  return sinCosLike(a, F, false)[0];
}
export function jetCos<T>(a: Jet<T>, F: Field<T>): Jet<T> {
  return sinCosLike(a, F, false)[1];
}
export function jetSinh<T>(a: Jet<T>, F: Field<T>): Jet<T> {
  return sinCosLike(a, F, true)[0];
}
export function jetCosh<T>(a: Jet<T>, F: Field<T>): Jet<T> {
  return sinCosLike(a, F, true)[1];
}
/** tan = sin/cos (painleve.md §5: "tan, tanh, sech by division"). */
export function jetTan<T>(a: Jet<T>, F: Field<T>): Jet<T> {
  const [s, c] = sinCosLike(a, F, false);
  return jetDiv(s, c, F);
}
export function jetTanh<T>(a: Jet<T>, F: Field<T>): Jet<T> {
  const [s, c] = sinCosLike(a, F, true);
  return jetDiv(s, c, F);
}
export function jetSech<T>(a: Jet<T>, F: Field<T>): Jet<T> {
  return jetReciprocal(sinCosLike(a, F, true)[1], F);
}
export function jetCsch<T>(a: Jet<T>, F: Field<T>): Jet<T> {
  return jetReciprocal(sinCosLike(a, F, true)[0], F);
}
export function jetCoth<T>(a: Jet<T>, F: Field<T>): Jet<T> {
  const [s, c] = sinCosLike(a, F, true);
  return jetDiv(c, s, F);
}

/** Integer power by repeated squaring: exact sign handling for negative bases. */
export function jetPowInt<T>(a: Jet<T>, n: number, F: Field<T>): Jet<T> {
  if (!Number.isSafeInteger(n)) throw new RangeError(`jetPowInt: exponent ${n} is not a safe integer`);
  if (n < 0) return jetReciprocal(jetPowInt(a, -n, F), F);
  let result = constantJet(F.one, a.length - 1, F);
  let base = a;
  let e = n;
  while (e > 0) {
    if (e & 1) result = jetMul(result, base, F);
    e = Math.floor(e / 2);
    if (e > 0) base = jetMul(base, base, F);
  }
  return result;
}

/**
 * a^p for a constant real p: p_0 = a_0^p, p_n = (1/(n a_0)) Σ_{k=1..n} (k(p+1) - n) a_k p_{n-k}
 * (painleve.md §5). Integer p goes through jetPowInt (valid for any sign of a_0).
 */
export function jetPowConst<T>(a: Jet<T>, p: T, F: Field<T>): Jet<T> {
  const pn = F.toNumber(p);
  if (Number.isSafeInteger(pn) && Math.abs(pn) <= 1024 && F.isZero(F.sub(p, F.fromNumber(pn)))) {
    return jetPowInt(a, pn, F);
  }
  if (isDouble(F)) return asJet(powConstD(asNumbers(a), pn));
  const n = a.length;
  if (n > 1 && !F.lt(F.zero, a[0])) {
    throw new JetEvaluationError("pow-domain", "non-integer power of a quantity that is not positive here");
  }
  const r = new Array<T>(n);
  r[0] = checkFinite(F.pow(a[0], p), F, "power");
  const p1 = F.add(p, F.one);
  for (let m = 1; m < n; m++) {
    let s = F.zero;
    for (let k = 1; k <= m; k++) {
      const w = F.sub(F.mul(F.fromNumber(k), p1), F.fromNumber(m));
      s = F.add(s, F.mul(F.mul(w, a[k]), r[m - k]));
    }
    r[m] = F.div(s, F.mul(F.fromNumber(m), a[0]));
  }
  return r;
}

/** a^b: constant exponent → jetPowConst; otherwise exp(b log a) (painleve.md §5). */
export function jetPow<T>(a: Jet<T>, b: Jet<T>, F: Field<T>): Jet<T> {
  if (isConstantJet(b, F)) return jetPowConst(a, b[0], F);
  const n = len(a, b);
  return jetExp(jetMul(b.slice(0, n), jetLog(a.slice(0, n), F), F), F);
}

/** sqrt: r_0 = √a_0, r_n = (a_n - Σ_{j=1..n-1} r_j r_{n-j}) / (2 r_0) (from r·r = a). */
export function jetSqrt<T>(a: Jet<T>, F: Field<T>): Jet<T> {
  if (isDouble(F)) return asJet(sqrtD(asNumbers(a)));
  const n = a.length;
  if (F.lt(a[0], F.zero)) throw new JetEvaluationError("sqrt-domain", "square root of a negative quantity here");
  if (n > 1 && F.isZero(a[0])) {
    throw new JetEvaluationError("sqrt-domain", "square root of zero is not differentiable here");
  }
  const r = new Array<T>(n);
  r[0] = F.sqrt(a[0]);
  const twoR0 = F.add(r[0], r[0]);
  for (let m = 1; m < n; m++) {
    let s = a[m];
    for (let j = 1; j < m; j++) s = F.sub(s, F.mul(r[j], r[m - j]));
    r[m] = F.div(s, twoR0);
  }
  return r;
}

/** |a| = sign(a_0)·a near a point where a_0 ≠ 0. */
export function jetAbs<T>(a: Jet<T>, F: Field<T>): Jet<T> {
  if (F.isZero(a[0])) {
    if (a.length > 1) throw new JetEvaluationError("abs-at-zero", "|…| of a quantity that is zero here");
    return [F.zero];
  }
  return F.lt(a[0], F.zero) ? jetNeg(a, F) : a.slice();
}
