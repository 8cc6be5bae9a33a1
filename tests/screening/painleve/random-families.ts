/**
 * Random family members, half reducible by construction, half perturbed.
 * Constructions (derived in ../shared/math):
 *  NLS  (nls.md §3): choose a, h, k, c and solve R = 0 for b = [W' - (a'/a)W + W² + 2cW]/(4a),
 *       W = a'/a - h'/h + 2(k - c); perturbed: b + δ(1 + 0.5 cos t) → R = -4aδ(1 + 0.5 cos t) ≠ 0.
 *  KdV  (kdv.md §2): choose p, q, r, s, g, l and solve K = 0 for m = [Z' + Z(Z + r + s - p'/p)]/p,
 *       Z = q'/q - p'/p + r - 2s; perturbed: m + δ → K = -pδ ≠ 0.
 *  mKdV (mkdv.md §2): choose p, q, s, g and solve Q = 0 for r = s - (q'/q - p'/p)/2;
 *       perturbed: r + δ → Q = 2δ ≠ 0.
 * Symbolic derivatives come from differentiate (../expr), so b, m, r are exact expressions.
 */
import { add, call, differentiate, div, mul, num, pow, sub, sym } from "../../../lib/screening/expr";
import type { Expr } from "../../../lib/screening/expr";
import { createRng, type Rng } from "../../../lib/screening/random";
import type { EquationClass, Variant } from "../../../lib/screening/spec/types";

const t = sym("t");
const d = (e: Expr): Expr => differentiate(e, "t");
const n = (v: number): Expr => num(Number(v.toPrecision(6)));

function uniform(rng: Rng, lo: number, hi: number): number {
  return rng.uniform(lo, hi);
}
function signed(rng: Rng, lo: number, hi: number): number {
  return (rng.next() < 0.5 ? -1 : 1) * uniform(rng, lo, hi);
}

/** A positive-definite (or negative-definite) smooth function: one of a few shapes. */
function nonvanishing(rng: Rng): Expr {
  const A = signed(rng, 0.5, 2.5);
  const w = uniform(rng, 0.5, 2);
  const shape = Math.floor(rng.next() * 4);
  if (shape === 0) return n(A);
  if (shape === 1) return mul(n(A), add(num(1), mul(n(uniform(rng, -0.4, 0.4)), call("sin", add(mul(n(w), t), n(uniform(rng, 0, 6)))))));
  if (shape === 2) return mul(n(A), call("exp", mul(n(uniform(rng, -0.5, 0.5)), t)));
  return div(n(A), add(num(1), mul(n(uniform(rng, 0.05, 0.5)), pow(t, num(2)))));
}

/** A smooth function, possibly zero. */
function smooth(rng: Rng, size: number): Expr {
  const shape = Math.floor(rng.next() * 4);
  if (shape === 0) return num(0);
  if (shape === 1) return n(signed(rng, 0.01, size));
  if (shape === 2) return mul(n(signed(rng, 0.01, size)), call("cos", mul(n(uniform(rng, 0.5, 2)), t)));
  return add(n(signed(rng, 0.01, size)), mul(n(signed(rng, 0.01, size / 2)), t));
}

export interface RandomFamily {
  variant: Variant;
  reducible: boolean;
}

const WINDOW: [number, number] = [0.5, 2];

function nlsFamily(rng: Rng, reducible: boolean): Record<string, Expr> {
  const a = nonvanishing(rng), h = nonvanishing(rng), k = smooth(rng, 0.3), c = smooth(rng, 0.3);
  const W = add(sub(div(d(a), a), div(d(h), h)), mul(num(2), sub(k, c)));
  let b = div(add(add(sub(d(W), mul(div(d(a), a), W)), pow(W, num(2))), mul(mul(num(2), c), W)), mul(num(4), a));
  if (!reducible) b = add(b, mul(n(signed(rng, 0.02, 0.3)), add(num(1), mul(num(0.5), call("cos", t)))));
  return { a, b, c, e: smooth(rng, 1), f: smooth(rng, 0.5), g: smooth(rng, 0.5), h, k };
}

function kdvFamily(rng: Rng, reducible: boolean): Record<string, Expr> {
  const p = nonvanishing(rng), q = nonvanishing(rng), r = smooth(rng, 0.3), s = smooth(rng, 0.3);
  const Z = sub(add(sub(div(d(q), q), div(d(p), p)), r), mul(num(2), s));
  let m = div(add(d(Z), mul(Z, sub(add(add(Z, r), s), div(d(p), p)))), p);
  if (!reducible) m = add(m, n(signed(rng, 0.02, 0.3)));
  return { p, q, r, s, g: smooth(rng, 0.5), l: smooth(rng, 0.5), m };
}

function mkdvFamily(rng: Rng, reducible: boolean): Record<string, Expr> {
  const p = nonvanishing(rng), q = nonvanishing(rng), s = smooth(rng, 0.3);
  let r = sub(s, div(sub(div(d(q), q), div(d(p), p)), num(2)));
  if (!reducible) r = add(r, n(signed(rng, 0.02, 0.3)));
  return { p, q, r, s, g: smooth(rng, 0.5) };
}

/** `count` members of class `cls`, alternating reducible / perturbed. */
export function randomFamilies(cls: EquationClass, count: number, seed: number): RandomFamily[] {
  const rng = createRng(seed);
  const make = cls === "nls" ? nlsFamily : cls === "kdv" ? kdvFamily : mkdvFamily;
  return Array.from({ length: count }, (_, index) => {
    const reducible = index % 2 === 0;
    return {
      reducible,
      variant: { familyId: `random-${cls}`, index, class: cls, parameters: {}, free: [], coefficients: make(rng, reducible), window: WINDOW },
    };
  });
}
