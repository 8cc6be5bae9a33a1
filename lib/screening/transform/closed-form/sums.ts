/**
 * Exponential–power sums: the small symbolic class in which the map quadratures are done in
 * closed form for display. A term is
 *     c · t^n · e^{z t} · Π_j (s_j t + r_j)^{p_j}        (c, z complex; n ≥ 0 integer;
 *                                                         s_j = ±1, r_j ≠ 0, p_j not a non-negative integer)
 * so sin, cos, sinh, cosh of linear arguments are exponentials (Euler), and powers of linear
 * factors such as (1 + t)^{-1/2} are kept as factors. Sums are closed under +, −, ×, d/dt;
 * reciprocals and real powers exist for single terms and for linear polynomials.
 * Anything else converts to null, and the caller falls back to ∫ notation.
 */
import type { Expr } from "../../expr";
import { type C, cadd, cmul, cneg, cpowReal, cscale, czero, isReal, re, cinv } from "./complex";

export interface LinearFactor {
  s: 1 | -1;
  r: number;
  p: number;
}
export interface Term {
  c: C;
  n: number;
  z: C;
  L: LinearFactor[];
}
export type Sum = Term[];

/** Largest exponent expanded by repeated multiplication. */
const MAX_INT_POWER = 12;
/** Relative size below which a coefficient counts as cancelled rounding noise. */
const NOISE = 1e-14;

const isNonNegInt = (p: number) => Number.isInteger(p) && p >= 0;
const baseKey = (f: LinearFactor) => `${f.s}:${f.r.toPrecision(13)}`;
const termKey = (t: Term) =>
  `${t.n}|${t.z.re.toPrecision(13)},${t.z.im.toPrecision(13)}|${t.L.map((f) => `${baseKey(f)}^${f.p.toPrecision(13)}`).join(";")}`;

export function constant(v: number): Sum {
  return v === 0 ? [] : [{ c: { re: v, im: 0 }, n: 0, z: czero, L: [] }];
}
export const tSum: Sum = [{ c: { re: 1, im: 0 }, n: 1, z: czero, L: [] }];

/** Combine equal terms; a combined coefficient that cancels to rounding level is dropped. */
export function normalize(terms: Term[]): Sum {
  const map = new Map<string, { term: Term; mag: number }>();
  for (const t of terms) {
    const k = termKey(t);
    const old = map.get(k);
    const m = Math.hypot(t.c.re, t.c.im);
    map.set(k, old ? { term: { ...old.term, c: cadd(old.term.c, t.c) }, mag: old.mag + m } : { term: t, mag: m });
  }
  const out: Term[] = [];
  for (const { term, mag } of map.values()) {
    const m = Math.hypot(term.c.re, term.c.im);
    if (m > NOISE * mag) out.push(Math.abs(term.c.im) <= NOISE * mag ? { ...term, c: { re: term.c.re, im: 0 } } : term);
  }
  return out;
}

export function addSums(a: Sum, b: Sum): Sum {
  return normalize([...a, ...b]);
}
export function scaleSum(a: Sum, k: C | number): Sum {
  const kc = typeof k === "number" ? { re: k, im: 0 } : k;
  return normalize(a.map((t) => ({ ...t, c: cmul(t.c, kc) })));
}
export function negSum(a: Sum): Sum {
  return a.map((t) => ({ ...t, c: cneg(t.c) }));
}

/** (s t + r)^k for a non-negative integer k, expanded by the binomial theorem. */
function expandLinearPower(f: LinearFactor, k: number): Sum {
  const out: Term[] = [];
  let binom = 1;
  for (let j = 0; j <= k; j++) {
    // C(k, j) (s t)^j r^{k−j}
    out.push({ c: { re: binom * Math.pow(f.s, j) * Math.pow(f.r, k - j), im: 0 }, n: j, z: czero, L: [] });
    binom = (binom * (k - j)) / (j + 1);
  }
  return normalize(out);
}

function mulTerms(a: Term, b: Term): Sum {
  const factors = new Map<string, LinearFactor>();
  for (const f of [...a.L, ...b.L]) {
    const k = baseKey(f);
    const old = factors.get(k);
    factors.set(k, old ? { ...old, p: old.p + f.p } : { ...f });
  }
  const kept: LinearFactor[] = [];
  let result: Sum = [{ c: cmul(a.c, b.c), n: a.n + b.n, z: cadd(a.z, b.z), L: [] }];
  for (const f of [...factors.values()].sort((x, y) => baseKey(x).localeCompare(baseKey(y)))) {
    const p = Math.abs(f.p - Math.round(f.p)) < 1e-13 ? Math.round(f.p) : f.p;
    if (p === 0) continue;
    if (isNonNegInt(p)) result = mulSumsRaw(result, expandLinearPower(f, p));
    else kept.push({ ...f, p });
  }
  return result.map((t) => ({ ...t, L: kept.map((f) => ({ ...f })) }));
}

function mulSumsRaw(a: Sum, b: Sum): Sum {
  const out: Term[] = [];
  for (const x of a) for (const y of b) out.push(...mulTerms(x, y));
  return out;
}
export function mulSums(a: Sum, b: Sum): Sum {
  return normalize(mulSumsRaw(a, b));
}

/** A real polynomial α t + β with α ≠ 0 and β ≠ 0, or null. */
function asLinear(a: Sum): { alpha: number; beta: number } | null {
  let alpha = 0;
  let beta = 0;
  for (const t of a) {
    if (t.L.length || t.z.re !== 0 || t.z.im !== 0 || !isReal(t.c) || t.n > 1) return null;
    if (t.n === 1) alpha += t.c.re;
    else beta += t.c.re;
  }
  return alpha !== 0 && beta !== 0 ? { alpha, beta } : null;
}

/** a^q for real q, or null when outside the class (e.g. a power of a sum of exponentials). */
export function powSum(a: Sum, q: number): Sum | null {
  if (isNonNegInt(q) && q <= MAX_INT_POWER) {
    let r = constant(1);
    for (let i = 0; i < q; i++) r = mulSums(r, a);
    return r;
  }
  if (a.length === 1) {
    const t = a[0];
    if (t.n !== 0 && !Number.isInteger(q)) return null;
    const c = cpowReal(t.c, q);
    if (!c) return null;
    const base: Term = { c, n: 0, z: cscale(t.z, q), L: t.L.map((f) => ({ ...f, p: f.p * q })) };
    let r: Sum = [base];
    if (t.n !== 0) {
      // t^{n q} with n q a negative integer is outside the class (no r = 0 factors)
      if (t.n * q < 0) return null;
      r = mulSums(r, powSum(tSum, t.n * q) ?? []);
    }
    return mulSums(r, constant(1));
  }
  const lin = asLinear(a);
  if (lin) {
    const s: 1 | -1 = lin.alpha > 0 ? 1 : -1;
    const f: LinearFactor = { s, r: lin.beta / Math.abs(lin.alpha), p: q };
    return mulSums(constant(Math.pow(Math.abs(lin.alpha), q)), [{ c: { re: 1, im: 0 }, n: 0, z: czero, L: [f] }]);
  }
  return null;
}

export function reciprocal(a: Sum): Sum | null {
  if (a.length === 1 && a[0].n === 0) {
    const t = a[0];
    return [{ c: cinv(t.c), n: 0, z: cneg(t.z), L: t.L.map((f) => ({ ...f, p: -f.p })) }];
  }
  return powSum(a, -1);
}

/** d/dt, termwise: (c tⁿ e^{zt} Π Lᵖ)' = c[n t^{n−1} + z tⁿ + tⁿ Σ p s L^{−1}] e^{zt} Π Lᵖ. */
export function derivative(a: Sum): Sum {
  const out: Term[] = [];
  for (const t of a) {
    if (t.n > 0) out.push({ ...t, c: cscale(t.c, t.n), n: t.n - 1 });
    if (t.z.re !== 0 || t.z.im !== 0) out.push({ ...t, c: cmul(t.c, t.z) });
    for (let i = 0; i < t.L.length; i++) {
      const f = t.L[i];
      out.push(...mulTerms({ ...t, c: cscale(t.c, f.p * f.s) }, { c: { re: 1, im: 0 }, n: 0, z: czero, L: [{ ...f, p: -1 }] }));
    }
  }
  return normalize(out);
}

/** exp of a real linear sum c0 + c1 t, or null. */
export function expSum(a: Sum): Sum | null {
  let c0 = 0;
  let c1 = 0;
  for (const t of a) {
    if (t.L.length || t.z.re !== 0 || t.z.im !== 0 || !isReal(t.c) || t.n > 1) return null;
    if (t.n === 1) c1 += t.c.re;
    else c0 += t.c.re;
  }
  return [{ c: { re: Math.exp(c0), im: 0 }, n: 0, z: { re: c1, im: 0 }, L: [] }];
}

/** A real constant, if the sum is one. */
export function constantValue(a: Sum): number | null {
  if (a.length === 0) return 0;
  if (a.length === 1 && a[0].n === 0 && a[0].z.re === 0 && a[0].z.im === 0 && a[0].L.length === 0 && isReal(a[0].c)) return a[0].c.re;
  return null;
}

/** Double value at t (real part; the sums built from real expressions are real). */
export function evalSum(a: Sum, t: number): number {
  let v = 0;
  for (const term of a) {
    // c e^{zt} = |c| e^{Re z t} (cos, sin)(arg c + Im z t)
    const mag = Math.hypot(term.c.re, term.c.im) * Math.exp(term.z.re * t);
    const ph = Math.atan2(term.c.im, term.c.re) + term.z.im * t;
    let x = mag * Math.cos(ph) * Math.pow(t, term.n);
    for (const f of term.L) x *= Math.pow(f.s * t + f.r, f.p);
    v += x;
  }
  return v;
}

/** Conversion of a validated tree (symbols: only t) into a sum, or null outside the class. */
export function fromExpr(e: Expr): Sum | null {
  switch (e.kind) {
    case "num":
      return constant(e.value);
    case "sym":
      return e.name === "t" ? tSum : null;
    case "neg": {
      const a = fromExpr(e.arg);
      return a && negSum(a);
    }
    case "add":
    case "sub":
    case "mul":
    case "div": {
      const l = fromExpr(e.left);
      const r = fromExpr(e.right);
      if (!l || !r) return null;
      if (e.kind === "add") return addSums(l, r);
      if (e.kind === "sub") return addSums(l, negSum(r));
      if (e.kind === "mul") return mulSums(l, r);
      const inv = reciprocal(r);
      return inv && mulSums(l, inv);
    }
    case "pow": {
      const base = fromExpr(e.left);
      const ex = fromExpr(e.right);
      const q = ex && constantValue(ex);
      if (!base || q === null || q === undefined) return null;
      return powSum(base, q);
    }
    case "call": {
      const a = fromExpr(e.arg);
      if (!a) return null;
      switch (e.fn) {
        case "exp":
          return expSum(a);
        case "sqrt":
          return powSum(a, 0.5);
        case "sin":
        case "cos":
        case "sinh":
        case "cosh":
          return trigOfLinear(e.fn, a);
        case "log":
          return logOfTerm(a);
        default: {
          const v = constantValue(a);
          return v === null ? null : constant(CONSTANT_FUNCTIONS[e.fn](v));
        }
      }
    }
  }
}

const CONSTANT_FUNCTIONS: Record<string, (v: number) => number> = {
  tan: Math.tan, tanh: Math.tanh, abs: Math.abs,
  sech: (v) => 1 / Math.cosh(v), csch: (v) => 1 / Math.sinh(v), coth: (v) => 1 / Math.tanh(v),
};

/** log(c e^{λt}) = ln c + λ t for real c > 0, real λ; else null. */
function logOfTerm(a: Sum): Sum | null {
  if (a.length !== 1) return null;
  const t = a[0];
  if (t.n !== 0 || t.L.length || t.z.im !== 0 || !isReal(t.c) || t.c.re <= 0) return null;
  return addSums(constant(Math.log(t.c.re)), scaleSum(tSum, t.z.re));
}

/** sin, cos, sinh, cosh of a real linear argument φ0 + ω t as exponentials (Euler's formula). */
function trigOfLinear(fn: "sin" | "cos" | "sinh" | "cosh", a: Sum): Sum | null {
  let c0 = 0;
  let c1 = 0;
  for (const t of a) {
    if (t.L.length || t.z.re !== 0 || t.z.im !== 0 || !isReal(t.c) || t.n > 1) return null;
    if (t.n === 1) c1 += t.c.re;
    else c0 += t.c.re;
  }
  const hyperbolic = fn === "sinh" || fn === "cosh";
  // e^{±i φ} (trig) or e^{±φ} (hyperbolic), φ = c0 + c1 t
  const plus: Term = hyperbolic
    ? { c: { re: Math.exp(c0), im: 0 }, n: 0, z: { re: c1, im: 0 }, L: [] }
    : { c: { re: Math.cos(c0), im: Math.sin(c0) }, n: 0, z: { re: 0, im: c1 }, L: [] };
  const minus: Term = hyperbolic
    ? { c: { re: Math.exp(-c0), im: 0 }, n: 0, z: { re: -c1, im: 0 }, L: [] }
    : { c: { re: Math.cos(c0), im: -Math.sin(c0) }, n: 0, z: { re: 0, im: -c1 }, L: [] };
  if (c1 === 0) {
    const v = { sin: Math.sin, cos: Math.cos, sinh: Math.sinh, cosh: Math.cosh }[fn](c0);
    return constant(v);
  }
  switch (fn) {
    case "cos":
    case "cosh":
      return normalize([plus, minus].map((t) => ({ ...t, c: cscale(t.c, 0.5) })));
    case "sinh":
      return normalize([{ ...plus, c: cscale(plus.c, 0.5) }, { ...minus, c: cscale(minus.c, -0.5) }]);
    case "sin":
      // (e^{iφ} − e^{−iφ})/(2i) = −i/2 e^{iφ} + i/2 e^{−iφ}
      return normalize([
        { ...plus, c: cmul(plus.c, { re: 0, im: -0.5 }) },
        { ...minus, c: cmul(minus.c, { re: 0, im: 0.5 }) },
      ]);
  }
}

export { re };
