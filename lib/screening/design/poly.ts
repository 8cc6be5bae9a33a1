/**
 * The normal form's data and its exact, rule-free operations: terms (an exact rational times
 * atoms to rational powers times at most one exp(·)), sums of terms with like terms collected,
 * canonical keys, and the way back to a tree.
 */
import { add, call, div, mul, neg, num, pow, sub } from "../expr";
import type { Expr, UnaryFunction } from "../expr";
import * as Q from "./rational";
import type { Rational } from "./rational";

export type AtomKind = "sym" | "const" | "call" | "group" | "pow" | "num";

export interface Atom {
  key: string;
  kind: AtomKind;
  /** The atom as a tree (canonical). */
  expr: Expr;
  /** Depends on t. */
  t: boolean;
  fn?: UnaryFunction;
  /** Canonical argument of a call atom. */
  arg?: Poly;
  /** The polynomial a group atom stands for. */
  poly?: Poly;
}

export interface Factor {
  atom: Atom;
  exp: Rational;
}

export interface Term {
  coef: Rational;
  /** Sorted by atom key; no zero exponents. */
  factors: Factor[];
  /** Argument of the term's exponential factor, or null. */
  expArg: Poly | null;
}

export interface Poly {
  /** Sorted by term key; like terms merged; no zero coefficients. */
  terms: Term[];
}

export interface NormalContext {
  /** True when `expr` is finite and > 0 on the whole window (sampled). */
  positive(expr: Expr): boolean;
}

/** A context that knows nothing: only rules valid for all real values are used. */
export const NO_SIGN_INFORMATION: NormalContext = { positive: () => false };


// ---- keys ---------------------------------------------------------------------------------

export function termKey(t: Term): string {
  const f = t.factors.map((x) => `${x.atom.key}^${Q.key(x.exp)}`).join("*");
  return t.expArg ? `${f}*exp[${polyKey(t.expArg)}]` : f;
}

export function polyKey(p: Poly): string {
  return p.terms.map((t) => `${Q.key(t.coef)}·${termKey(t)}`).join(" + ");
}

// ---- constructors -------------------------------------------------------------------------

export const zeroPoly = (): Poly => ({ terms: [] });
export const constPoly = (r: Rational): Poly => (Q.isZero(r) ? zeroPoly() : { terms: [{ coef: r, factors: [], expArg: null }] });
export const atomPoly = (atom: Atom, exp: Rational = Q.ONE): Poly => ({ terms: [{ coef: Q.ONE, factors: [{ atom, exp }], expArg: null }] });

export const isZeroPoly = (p: Poly): boolean => p.terms.length === 0;
export const termDependsOnT = (t: Term): boolean => t.factors.some((f) => f.atom.t) || (t.expArg !== null && polyDependsOnT(t.expArg));
export const polyDependsOnT = (p: Poly): boolean => p.terms.some(termDependsOnT);

/** The rational value of a constant polynomial (no atoms), or null. */
export function rationalValue(p: Poly): Rational | null {
  if (p.terms.length === 0) return Q.ZERO;
  if (p.terms.length === 1 && p.terms[0].factors.length === 0 && p.terms[0].expArg === null) return p.terms[0].coef;
  return null;
}

export function normaliseTerms(terms: Term[]): Poly {
  const byKey = new Map<string, Term>();
  for (const t of terms) {
    if (Q.isZero(t.coef)) continue;
    const k = termKey(t);
    const prev = byKey.get(k);
    byKey.set(k, prev ? { ...prev, coef: Q.add(prev.coef, t.coef) } : t);
  }
  const out = [...byKey.entries()].filter(([, t]) => !Q.isZero(t.coef)).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
  return { terms: out.map(([, t]) => t) };
}

// ---- arithmetic ---------------------------------------------------------------------------

export function polyAdd(a: Poly, b: Poly): Poly {
  return normaliseTerms([...a.terms, ...b.terms]);
}

export function polyScale(a: Poly, r: Rational): Poly {
  return normaliseTerms(a.terms.map((t) => ({ ...t, coef: Q.mul(t.coef, r) })));
}

export const polyNeg = (a: Poly): Poly => polyScale(a, Q.fromInt(-1));
export const polySub = (a: Poly, b: Poly): Poly => polyAdd(a, polyNeg(b));

export function mergeFactors(a: Factor[], b: Factor[]): Factor[] {
  const byKey = new Map<string, Factor>();
  for (const f of [...a, ...b]) {
    const prev = byKey.get(f.atom.key);
    byKey.set(f.atom.key, prev ? { atom: prev.atom, exp: Q.add(prev.exp, f.exp) } : f);
  }
  return [...byKey.values()].filter((f) => !Q.isZero(f.exp)).sort((x, y) => (x.atom.key < y.atom.key ? -1 : x.atom.key > y.atom.key ? 1 : 0));
}

function mergeExp(a: Poly | null, b: Poly | null): Poly | null {
  if (!a) return b;
  if (!b) return a;
  const s = polyAdd(a, b);
  return isZeroPoly(s) ? null : s;
}

export function termMul(a: Term, b: Term): Term {
  return { coef: Q.mul(a.coef, b.coef), factors: mergeFactors(a.factors, b.factors), expArg: mergeExp(a.expArg, b.expArg) };
}

export function groupAtom(p: Poly): Atom {
  const key = `(${polyKey(p)})`;
  return { key, kind: "group", expr: polyToExpr(p), t: polyDependsOnT(p), poly: p };
}


// ---- normal form → tree ---------------------------------------------------------------------

const isPowerOfTen = (d: bigint): boolean => {
  while (d % 10n === 0n) d /= 10n;
  return d === 1n;
};

function factorExpr(f: Factor): Expr {
  const m = Q.sign(f.exp) < 0 ? Q.negate(f.exp) : f.exp;
  const base = f.atom.expr;
  if (Q.isOne(m)) return base;
  if (Q.equals(m, Q.rational(1n, 2n))) return call("sqrt", base);
  return pow(base, Q.rationalExpr(m));
}

function product(parts: Expr[]): Expr | null {
  if (parts.length === 0) return null;
  return parts.reduce((acc, p) => mul(acc, p));
}

/** |term| as a tree (the sign is placed by the sum). */
function termMagnitudeExpr(t: Term): Expr {
  const c = Q.sign(t.coef) < 0 ? Q.negate(t.coef) : t.coef;
  const top: Expr[] = [];
  const bottom: Expr[] = [];
  const decimalCoefficient = c.d !== 1n && (isPowerOfTen(c.d) || c.d > 12n);
  if (decimalCoefficient) top.push(Q.decimalMagnitudeExpr(c));
  else if (c.n !== 1n || (t.factors.every((f) => Q.sign(f.exp) < 0) && !t.expArg)) top.push(Q.magnitudeExpr(Q.rational(c.n)));
  for (const f of t.factors) (Q.sign(f.exp) > 0 ? top : bottom).push(factorExpr(f));
  if (t.expArg) top.push(call("exp", polyToExpr(t.expArg)));
  if (!decimalCoefficient && c.d !== 1n) bottom.unshift(Q.magnitudeExpr(Q.rational(c.d)));
  const numerator = product(top) ?? num(1);
  const denominator = product(bottom);
  return denominator ? div(numerator, denominator) : numerator;
}

const isConstantTerm = (t: Term): boolean => t.factors.length === 0 && t.expArg === null;

/** Display order: terms with factors first (canonical order), the constant term last. */
export function polyToExpr(p: Poly): Expr {
  if (p.terms.length === 0) return num(0);
  let out: Expr | null = null;
  const ordered = [...p.terms.filter((t) => !isConstantTerm(t)), ...p.terms.filter(isConstantTerm)];
  for (const t of ordered) {
    const m = termMagnitudeExpr(t);
    const negative = Q.sign(t.coef) < 0;
    if (out === null) out = negative ? neg(m) : m;
    else out = negative ? sub(out, m) : add(out, m);
  }
  return out ?? num(0);
}
