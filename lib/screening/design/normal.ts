/**
 * An exact algebraic normal form for expression trees: a sum of terms, each an exact rational
 * times a product of atoms raised to rational powers, times at most one exp(·). Like terms are
 * collected, exponentials merge (e^u e^v = e^(u+v), e^(c log u) = u^c) and sums cancel against
 * denominators they are exact multiples of (division.ts).
 *
 * Rules that are only valid for positive bases ((f^e)^r = f^(er) for non-integer r,
 * log(f g) = log f + log g) are applied only where the context says the base is positive on the
 * window (sampled); every caller verifies the result numerically against the input tree.
 */
import { PI_TEXT, E_TEXT, call, exprEquals, pow } from "../expr";
import type { Expr, UnaryFunction } from "../expr";
import * as Q from "./rational";
import type { Rational } from "./rational";
import {
  atomPoly, constPoly, groupAtom, isZeroPoly, mergeFactors, normaliseTerms, polyAdd, polyDependsOnT, polyKey, polyNeg, polyScale,
  polySub, polyToExpr, rationalValue, termMul, zeroPoly,
} from "./poly";
import type { Atom, NormalContext, Poly, Term } from "./poly";
import { NO_SIGN_INFORMATION } from "./poly";
import { asGroupedTerm, cancelAgainst, exactDivide, factorOut } from "./division";

export * from "./poly";

/** Products of sums are expanded only while they stay below this many terms (keeps output readable). */
const MAX_EXPANDED_TERMS = 48;
/** Integer powers of sums up to this exponent are expanded. */
const MAX_EXPANDED_POWER = 3;

export function polyMul(a: Poly, b: Poly): Poly {
  if (isZeroPoly(a) || isZeroPoly(b)) return zeroPoly();
  [a, b] = cancelAgainst(a, b);
  [b, a] = cancelAgainst(b, a);
  if (a.terms.length * b.terms.length > MAX_EXPANDED_TERMS) {
    if (a.terms.length > 1) a = { terms: [asGroupedTerm(a)] };
    if (b.terms.length > 1) b = { terms: [asGroupedTerm(b)] };
  }
  const out: Term[] = [];
  for (const x of a.terms) for (const y of b.terms) out.push(termMul(x, y));
  return normaliseTerms(out);
}

function numAtom(c: Rational): Atom {
  return { key: `#${Q.key(c)}`, kind: "num", expr: Q.rationalExpr(c), t: false };
}

/** term^r; for non-integer r only where the parts are positive (else the term stays grouped). */
function termPow(t: Term, r: Rational, ctx: NormalContext): Poly {
  if (Q.isInteger(r)) {
    const k = Number(r.n);
    if (Q.isZero(t.coef) && k < 0) return atomPoly(groupAtom({ terms: [t] }), r);
    return normaliseTerms([{
      coef: Q.powInt(t.coef, k),
      factors: t.factors.map((f) => ({ atom: f.atom, exp: Q.mul(f.exp, r) })),
      expArg: t.expArg ? polyScale(t.expArg, r) : null,
    }]);
  }
  const allPositive = Q.sign(t.coef) > 0 && t.factors.every((f) => ctx.positive(f.atom.expr));
  if (!allPositive) return atomPoly(groupAtom({ terms: [t] }), r);
  const root = Q.powRational(t.coef, r);
  const factors = t.factors.map((f) => ({ atom: f.atom, exp: Q.mul(f.exp, r) }));
  if (!root) factors.push({ atom: numAtom(t.coef), exp: r });
  return normaliseTerms([{ coef: root ?? Q.ONE, factors: mergeFactors(factors, []), expArg: t.expArg ? polyScale(t.expArg, r) : null }]);
}

export function polyPow(p: Poly, r: Rational, ctx: NormalContext): Poly {
  if (Q.isZero(r)) return constPoly(Q.ONE);
  if (isZeroPoly(p)) return Q.sign(r) > 0 ? zeroPoly() : atomPoly(groupAtom(p), r);
  if (p.terms.length === 1) return termPow(p.terms[0], r, ctx);
  if (Q.isInteger(r) && r.n > 0n && r.n <= BigInt(MAX_EXPANDED_POWER) && p.terms.length ** Number(r.n) <= MAX_EXPANDED_TERMS) {
    let out = p;
    for (let i = 1; i < Number(r.n); i++) out = polyMul(out, p);
    return out;
  }
  const { c, g, unit } = factorOut(p, Q.isInteger(r) ? null : { ctx });
  return polyMul(termPow({ ...g, coef: c }, r, ctx), atomPoly(groupAtom(unit), r));
}

export function polyInverse(p: Poly, ctx: NormalContext): Poly {
  return polyPow(p, Q.fromInt(-1), ctx);
}

export function polyDiv(a: Poly, b: Poly, ctx: NormalContext): Poly {
  return polyMul(a, polyInverse(b, ctx));
}

// ---- functions ----------------------------------------------------------------------------

const ODD: ReadonlySet<UnaryFunction> = new Set(["sin", "tan", "sinh", "tanh", "csch", "coth"]);
const EVEN: ReadonlySet<UnaryFunction> = new Set(["cos", "cosh", "sech"]);

function callAtom(fn: UnaryFunction, arg: Poly): Atom {
  return { key: `${fn}(${polyKey(arg)})`, kind: "call", expr: call(fn, polyToExpr(arg)), t: polyDependsOnT(arg), fn, arg };
}

/** The log atom of a term c·log(u), as [c, u], or null. */
function logTerm(t: Term): [Rational, Poly] | null {
  if (t.expArg || t.factors.length !== 1) return null;
  const f = t.factors[0];
  if (f.atom.kind !== "call" || f.atom.fn !== "log" || !Q.isOne(f.exp) || !f.atom.arg) return null;
  return [t.coef, f.atom.arg];
}

function polyExp(arg: Poly, ctx: NormalContext): Poly {
  let out = constPoly(Q.ONE);
  const rest: Term[] = [];
  for (const t of arg.terms) {
    const lt = logTerm(t);
    // e^(c log u) = u^c, valid wherever log u is real (u > 0).
    if (lt) out = polyMul(out, polyPow(lt[1], lt[0], { positive: (e) => ctx.positive(e) || isLogArgumentFactor(lt[1], e) }));
    else rest.push(t);
  }
  if (rest.length === 0) return out;
  return polyMul(out, { terms: [{ coef: Q.ONE, factors: [], expArg: { terms: rest } }] });
}

/** A single-term log argument whose only factor is `e`: positive because its log is real. */
function isLogArgumentFactor(u: Poly, e: Expr): boolean {
  return u.terms.length === 1 && Q.sign(u.terms[0].coef) > 0 && u.terms[0].factors.length === 1 && !u.terms[0].expArg && exprEquals(u.terms[0].factors[0].atom.expr, e);
}

function polyLog(arg: Poly, ctx: NormalContext): Poly {
  const r = rationalValue(arg);
  if (r && Q.isOne(r)) return zeroPoly();
  if (arg.terms.length === 1) {
    const t = arg.terms[0];
    if (Q.isOne(t.coef) && t.factors.length === 0 && t.expArg) return t.expArg;
    // log(c Π f^e e^A) = log c + Σ e log f + A, for positive c and f.
    if (Q.sign(t.coef) > 0 && t.factors.length > 0 && t.factors.every((f) => ctx.positive(f.atom.expr))) {
      let out = t.expArg ?? zeroPoly();
      if (!Q.isOne(t.coef)) out = polyAdd(out, atomPoly(callAtom("log", constPoly(t.coef))));
      for (const f of t.factors) out = polyAdd(out, polyScale(atomPoly(callAtom("log", atomPoly(f.atom))), f.exp));
      return out;
    }
  }
  return atomPoly(callAtom("log", arg));
}

function polyCall(fn: UnaryFunction, arg: Poly, ctx: NormalContext): Poly {
  switch (fn) {
    case "exp":
      return polyExp(arg, ctx);
    case "log":
      return polyLog(arg, ctx);
    case "sqrt":
      return polyPow(arg, Q.rational(1n, 2n), ctx);
    case "abs": {
      const r = rationalValue(arg);
      if (r) return constPoly(Q.sign(r) < 0 ? Q.negate(r) : r);
      return atomPoly(callAtom("abs", arg));
    }
    default:
      break;
  }
  if (isZeroPoly(arg)) {
    if (fn === "cos" || fn === "cosh" || fn === "sech") return constPoly(Q.ONE);
    if (fn === "sin" || fn === "tan" || fn === "sinh" || fn === "tanh") return zeroPoly();
  }
  // Parity: the canonical argument has a positive first coefficient.
  let sign = 1;
  if (arg.terms.length > 0 && Q.sign(arg.terms[0].coef) < 0 && (ODD.has(fn) || EVEN.has(fn))) {
    arg = polyNeg(arg);
    if (ODD.has(fn)) sign = -1;
  }
  let out: Poly;
  if (fn === "sech") out = atomPoly(callAtom("cosh", arg), Q.fromInt(-1));
  else if (fn === "csch") out = atomPoly(callAtom("sinh", arg), Q.fromInt(-1));
  else out = atomPoly(callAtom(fn, arg));
  return sign < 0 ? polyNeg(out) : out;
}

// ---- tree → normal form ---------------------------------------------------------------------

export function toPoly(e: Expr, ctx: NormalContext = NO_SIGN_INFORMATION): Poly {
  switch (e.kind) {
    case "num": {
      if (e.text === PI_TEXT) return atomPoly({ key: "pi", kind: "const", expr: e, t: false });
      if (e.text === E_TEXT) return polyExp(constPoly(Q.ONE), ctx);
      const r = Q.fromDecimalText(e.text);
      return r ? constPoly(r) : atomPoly({ key: `#${e.text}`, kind: "num", expr: e, t: false });
    }
    case "sym":
      return atomPoly({ key: `$${e.name}`, kind: "sym", expr: e, t: e.name === "t" });
    case "neg":
      return polyNeg(toPoly(e.arg, ctx));
    case "add":
      return polyAdd(toPoly(e.left, ctx), toPoly(e.right, ctx));
    case "sub":
      return polySub(toPoly(e.left, ctx), toPoly(e.right, ctx));
    case "mul":
      return polyMul(toPoly(e.left, ctx), toPoly(e.right, ctx));
    case "div":
      return polyDiv(toPoly(e.left, ctx), toPoly(e.right, ctx), ctx);
    case "call":
      return polyCall(e.fn, toPoly(e.arg, ctx), ctx);
    case "pow": {
      const base = toPoly(e.left, ctx);
      const expo = toPoly(e.right, ctx);
      const r = rationalValue(expo);
      if (r) return polyPow(base, r, ctx);
      const b = rationalValue(base);
      if (base.terms.length === 1 && Q.isOne(base.terms[0].coef) && base.terms[0].factors.length === 0 && base.terms[0].expArg) {
        // (e^A)^B = e^(AB).
        return polyExp(polyMul(base.terms[0].expArg, expo), ctx);
      }
      if (b && Q.sign(b) > 0) return polyExp(polyMul(expo, atomPoly(callAtom("log", base))), ctx);
      const key = `pow[${polyKey(base)}][${polyKey(expo)}]`;
      return atomPoly({ key, kind: "pow", expr: pow(polyToExpr(base), polyToExpr(expo)), t: polyDependsOnT(base) || polyDependsOnT(expo) });
    }
  }
}

/** Normal form of a tree, back as a tree (not verified; see simplify.ts). */
export function normalise(e: Expr, ctx: NormalContext = NO_SIGN_INFORMATION): Expr {
  return polyToExpr(toPoly(e, ctx));
}


/**
 * All terms over one denominator Π G_i^{k_i} (G_i the sums that occur as denominators), with
 * every exact factor G_i of the numerator cancelled (exactDivide): the rational-function form.
 * Null when nothing is gained (no denominators, or exponents that are not integers).
 */
export function together(p: Poly): Poly | null {
  const denominators = new Map<string, { atom: Atom; k: number }>();
  for (const t of p.terms) {
    for (const f of t.factors) {
      if (f.atom.kind !== "group" || Q.sign(f.exp) >= 0) continue;
      if (!Q.isInteger(f.exp)) return null;
      const k = -Number(f.exp.n);
      const prev = denominators.get(f.atom.key);
      denominators.set(f.atom.key, { atom: f.atom, k: Math.max(k, prev?.k ?? 0) });
    }
  }
  if (denominators.size === 0 || p.terms.length < 2) return null;
  // Numerator: each term times the denominator powers it lacks (the group sums expanded).
  let numerator = zeroPoly();
  for (const t of p.terms) {
    let piece: Poly = { terms: [t] };
    for (const { atom, k } of denominators.values()) {
      const own = t.factors.find((f) => f.atom.key === atom.key);
      const have = own && Q.sign(own.exp) < 0 ? -Number(own.exp.n) : 0;
      // Multiply by G^k: the G^-have factor is replaced by the expanded sum G^(k - have).
      piece = polyMul(piece, atomPoly(atom, Q.fromInt(have)));
      for (let i = 0; i < k - have; i++) piece = expandProduct(piece, atom.poly as Poly);
    }
    numerator = polyAdd(numerator, piece);
  }
  let remaining = [...denominators.values()];
  for (const d of remaining) {
    while (d.k > 0) {
      const q = exactDivide(numerator, d.atom.poly as Poly);
      if (!q) break;
      numerator = q;
      d.k--;
    }
  }
  remaining = remaining.filter((d) => d.k > 0);
  let out: Poly = numerator;
  if (numerator.terms.length > 1 && remaining.length > 0) out = { terms: [asGroupedTerm(numerator)] };
  for (const d of remaining) out = polyMul(out, atomPoly(d.atom, Q.fromInt(-d.k)));
  return out;
}

/** a · b with every product of terms formed (no grouping limit). */
function expandProduct(a: Poly, b: Poly): Poly {
  const out: Term[] = [];
  for (const x of a.terms) for (const y of b.terms) out.push(termMul(x, y));
  return normaliseTerms(out);
}
