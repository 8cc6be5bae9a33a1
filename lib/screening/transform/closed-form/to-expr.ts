/**
 * Sums and antiderivatives back to validated trees for display: conjugate exponentials are paired
 * into e^{λt}(A cos ωt + B sin ωt), and coefficients that are simple fractions (denominator ≤ 1000,
 * to 1e-12) are written as fractions.
 */
import { type Expr, add, call, div, mul, neg, num, pow, sub, sym } from "../../expr";
import type { C } from "./complex";
import type { Sum, Term } from "./sums";
import type { Antiderivative } from "./integrate";

const T = sym("t");

/** A simple fraction p/q close to v (continued fractions), or null. */
export function simpleFraction(v: number, maxDen = 1000): [number, number] | null {
  if (!Number.isFinite(v)) return null;
  if (Number.isInteger(v)) return [v, 1];
  let h0 = 0, h1 = 1, k0 = 1, k1 = 0;
  let x = v;
  for (let i = 0; i < 30; i++) {
    const a = Math.floor(x);
    const h2 = a * h1 + h0;
    const k2 = a * k1 + k0;
    if (k2 > maxDen) break;
    h0 = h1; h1 = h2; k0 = k1; k1 = k2;
    if (Math.abs(v - h1 / k1) <= 1e-12 * Math.max(1, Math.abs(v))) return [h1, k1];
    const frac = x - a;
    if (frac < 1e-15) break;
    x = 1 / frac;
  }
  return null;
}

/** A non-negative number as a tree: integer, fraction or 12-digit decimal. */
function magnitude(v: number): Expr {
  const f = simpleFraction(v);
  if (f && f[1] !== 1) return div(num(f[0]), num(f[1]));
  if (f) return num(f[0]);
  const text = Number(v.toPrecision(12)).toString();
  return num(Number(text), text);
}

interface Signed {
  negative: boolean;
  expr: Expr | null; // null means the factor is 1
}

/** The non-coefficient part tⁿ e^{λt} Π (s t + r)ᵖ (λ real) of a term, or null if it is 1. */
function shape(t: Term, lambda: number): Expr | null {
  const parts: Expr[] = [];
  if (t.n === 1) parts.push(T);
  else if (t.n > 1) parts.push(pow(T, num(t.n)));
  if (lambda !== 0) {
    const arg = Math.abs(lambda) === 1 ? T : mul(magnitude(Math.abs(lambda)), T);
    parts.push(call("exp", lambda < 0 ? neg(arg) : arg));
  }
  for (const f of t.L) {
    let b: Expr;
    if (f.s === 1) b = f.r >= 0 ? add(T, magnitude(f.r)) : sub(T, magnitude(-f.r));
    else b = f.r >= 0 ? sub(magnitude(f.r), T) : neg(add(T, magnitude(-f.r)));
    parts.push(pow(b, f.p < 0 ? neg(magnitude(-f.p)) : magnitude(f.p)));
  }
  if (!parts.length) return null;
  return parts.reduce((x, y) => mul(x, y));
}

function withCoefficient(c: number, rest: Expr | null): Signed {
  const negative = c < 0;
  const m = Math.abs(c);
  if (rest === null) return { negative, expr: magnitude(m) };
  if (Math.abs(m - 1) <= 1e-14) return { negative, expr: rest };
  return { negative, expr: mul(magnitude(m), rest) };
}

function angle(w: number): Expr {
  return w === 1 ? T : mul(magnitude(w), T);
}

function sameShape(a: Term, b: Term): boolean {
  if (a.n !== b.n || a.L.length !== b.L.length) return false;
  return a.L.every((f, i) => f.s === b.L[i].s && f.r === b.L[i].r && f.p === b.L[i].p);
}
function close(a: number, b: number): boolean {
  return Math.abs(a - b) <= 1e-12 * Math.max(1, Math.abs(a), Math.abs(b));
}
function conj(c: C): C {
  return { re: c.re, im: -c.im };
}

/** A real-valued sum as a tree, or null if its complex terms do not pair into real ones. */
export function sumToExpr(a: Sum): Expr | null {
  const pieces: Signed[] = [];
  const used = new Set<number>();
  for (let i = 0; i < a.length; i++) {
    if (used.has(i)) continue;
    const t = a[i];
    if (t.z.im === 0) {
      if (Math.abs(t.c.im) > 1e-12 * Math.abs(t.c.re)) return null;
      pieces.push(withCoefficient(t.c.re, shape(t, t.z.re)));
      continue;
    }
    const j = a.findIndex((u, k) => k !== i && !used.has(k) && sameShape(t, u) && close(u.z.re, t.z.re) && close(u.z.im, -t.z.im) &&
      close(u.c.re, conj(t.c).re) && close(u.c.im, conj(t.c).im));
    if (j < 0) return null;
    used.add(j);
    const w = Math.abs(t.z.im);
    const c = t.z.im > 0 ? t.c : conj(t.c);
    const rest = shape(t, t.z.re);
    // 2 Re(c e^{iωt}) = 2 c.re cos ωt − 2 c.im sin ωt
    if (c.re !== 0) pieces.push(withCoefficient(2 * c.re, rest ? mul(rest, call("cos", angle(w))) : call("cos", angle(w))));
    if (c.im !== 0) pieces.push(withCoefficient(-2 * c.im, rest ? mul(rest, call("sin", angle(w))) : call("sin", angle(w))));
  }
  return joinSigned(pieces);
}

function joinSigned(pieces: Signed[]): Expr {
  const real = pieces.filter((p): p is { negative: boolean; expr: Expr } => p.expr !== null);
  if (!real.length) return num(0);
  let acc: Expr = real[0].negative ? neg(real[0].expr) : real[0].expr;
  for (let i = 1; i < real.length; i++) acc = real[i].negative ? sub(acc, real[i].expr) : add(acc, real[i].expr);
  return acc;
}

/** F(t) with its logarithms, log written of the orientation of s t + r that is positive at t0. */
export function antiderivativeToExpr(F: Antiderivative, t0: number): Expr | null {
  const base = F.sum.length ? sumToExpr(F.sum) : null;
  if (F.sum.length && !base) return null;
  const pieces: Signed[] = base ? [{ negative: false, expr: base }] : [];
  for (const l of F.logs) {
    const positive = l.s * t0 + l.r > 0;
    const s = positive ? l.s : -l.s;
    const r = positive ? l.r : -l.r;
    const arg = s === 1 ? (r >= 0 ? add(T, magnitude(r)) : sub(T, magnitude(-r))) : r >= 0 ? sub(magnitude(r), T) : neg(add(T, magnitude(-r)));
    pieces.push(withCoefficient(l.coef, call("log", arg)));
  }
  return joinSigned(pieces);
}
