/**
 * Elementary antiderivatives ∫_{t0}^{t} f(s) ds for the integrals of the closed-form designs
 * (nls.md §5, §7, §10; kdv.md §2; mkdv.md §2), from a small table of rules on the normal form:
 * powers of linear functions, exponentials times polynomials or sines, trigonometric and
 * hyperbolic functions of linear arguments, and the substitution rule ∫ κ u' g(u) = κ G(u).
 * Rules: standard integral tables (I. S. Gradshteyn, I. M. Ryzhik, "Table of Integrals, Series,
 * and Products", 7th ed. 2007, §2.01–2.02, 2.31, 2.42, 2.66) [from memory]. Every result is
 * differentiated and compared with f on the window before it is used; anything else is null
 * (and the design falls back to a tabulated solution).
 */
import { differentiate, num, substitute, sym } from "../expr";
import type { Expr } from "../expr";
import * as Q from "./rational";
import type { Rational } from "./rational";
import {
  atomPoly,
  constPoly,
  isZeroPoly,
  polyAdd,
  polyDependsOnT,
  polyDiv,
  polyMul,
  polyNeg,
  polyPow,
  polyScale,
  polySub,
  polyToExpr,
  rationalValue,
  termDependsOnT,
  toPoly,
  zeroPoly,
} from "./normal";
import type { Atom, Factor, NormalContext, Poly, Term } from "./normal";
import { normalContext, sameFunction, valueAt } from "./sampling";
import type { WindowContext } from "./sampling";

const T_ATOM: Atom = { key: "$t", kind: "sym", expr: sym("t"), t: true };
const tPoly = (): Poly => atomPoly(T_ATOM);

interface Linear {
  alpha: Poly;
  beta: Poly;
}

/** p = alpha t + beta with alpha, beta free of t; null otherwise. */
function linearParts(p: Poly): Linear | null {
  let alpha = zeroPoly();
  let beta = zeroPoly();
  for (const term of p.terms) {
    if (!termDependsOnT(term)) {
      beta = polyAdd(beta, { terms: [term] });
      continue;
    }
    if (term.expArg && polyDependsOnT(term.expArg)) return null;
    const tFactors = term.factors.filter((f) => f.atom.t);
    if (tFactors.length !== 1 || tFactors[0].atom.key !== "$t" || !Q.isOne(tFactors[0].exp)) return null;
    alpha = polyAdd(alpha, { terms: [{ ...term, factors: term.factors.filter((f) => !f.atom.t) }] });
  }
  return isZeroPoly(alpha) ? null : { alpha, beta };
}

function atomLinear(a: Atom): Linear | null {
  if (a.key === "$t") return { alpha: constPoly(Q.ONE), beta: zeroPoly() };
  if (a.kind === "group" && a.poly) return linearParts(a.poly);
  return null;
}

const call1 = (fn: "sin" | "cos" | "sinh" | "cosh" | "tan" | "tanh" | "log", arg: Poly, ctx: NormalContext): Poly =>
  toPoly({ kind: "call", fn, arg: polyToExpr(arg) }, ctx);

interface Rules {
  ctx: NormalContext;
  window: WindowContext;
}

/** log|u| written without abs: log(u) or log(−u) when u keeps one sign on the window. */
function logAbs(u: Poly, r: Rules): Poly | null {
  const e = polyToExpr(u);
  if (r.ctx.positive(e)) return call1("log", u, r.ctx);
  const m = polyNeg(u);
  if (r.ctx.positive(polyToExpr(m))) return call1("log", m, r.ctx);
  return null;
}

const over = (p: Poly, d: Poly, r: Rules): Poly => polyDiv(p, d, r.ctx);

/** ∫ e^(αt) t^n dt = e^(αt) Σ_k (−1)^k n!/(n−k)! t^(n−k) / α^(k+1)   (G&R 2.321.2). */
function expTimesPower(alpha: Poly, n: number, r: Rules): Poly {
  const e = { terms: [{ coef: Q.ONE, factors: [], expArg: polyMul(alpha, tPoly()) }] } as Poly;
  let sum = zeroPoly();
  let falling = 1n;
  for (let k = 0; k <= n; k++) {
    if (k > 0) falling *= BigInt(n - k + 1);
    const c = Q.rational((k % 2 === 0 ? 1n : -1n) * falling);
    const piece = over(polyScale(polyPow(tPoly(), Q.fromInt(n - k), r.ctx), c), polyPow(alpha, Q.fromInt(k + 1), r.ctx), r);
    sum = polyAdd(sum, piece);
  }
  return polyMul(e, sum);
}

/** ∫ e^(αt) sin u, ∫ e^(αt) cos u with u = ωt + φ   (G&R 2.663.1, 2.663.3). */
function expTimesTrig(alpha: Poly, fn: "sin" | "cos", u: Poly, omega: Poly, r: Rules): Poly {
  const e = { terms: [{ coef: Q.ONE, factors: [], expArg: polyMul(alpha, tPoly()) }] } as Poly;
  const s = call1("sin", u, r.ctx);
  const c = call1("cos", u, r.ctx);
  const top = fn === "sin" ? polySub(polyMul(alpha, s), polyMul(omega, c)) : polyAdd(polyMul(alpha, c), polyMul(omega, s));
  const den = polyAdd(polyMul(alpha, alpha), polyMul(omega, omega));
  return polyMul(e, over(top, den, r));
}

/** ∫ of a single t-dependent factor f(u)^n with u linear (G&R 2.01, 2.42, 2.51, 2.41) [from memory]. */
function singleFactor(f: Factor, r: Rules): Poly | null {
  const a = f.atom;
  const n = f.exp;
  const lin = atomLinear(a);
  if (lin) {
    // ∫ L^n = L^(n+1)/(α(n+1)), ∫ L^-1 = log|L|/α.
    const L = a.key === "$t" ? tPoly() : (a.poly as Poly);
    if (Q.equals(n, Q.fromInt(-1))) {
      const l = logAbs(L, r);
      return l ? over(l, lin.alpha, r) : null;
    }
    const n1 = Q.add(n, Q.ONE);
    return over(polyPow(L, n1, r.ctx), polyScale(lin.alpha, n1), r);
  }
  if (a.kind !== "call" || !a.arg) return null;
  const u = linearParts(a.arg);
  if (!u) return null;
  const w = u.alpha;
  const arg = a.arg;
  const k = Q.isInteger(n) ? Number(n.n) : NaN;
  const half = (p: Poly) => polyScale(p, Q.rational(1n, 2n));
  const twice = polyScale(arg, Q.fromInt(2));
  switch (`${a.fn}^${k}`) {
    case "sin^1":
      return polyNeg(over(call1("cos", arg, r.ctx), w, r));
    case "cos^1":
      return over(call1("sin", arg, r.ctx), w, r);
    case "sinh^1":
      return over(call1("cosh", arg, r.ctx), w, r);
    case "cosh^1":
      return over(call1("sinh", arg, r.ctx), w, r);
    case "tan^1": {
      const l = logAbs(call1("cos", arg, r.ctx), r);
      return l ? polyNeg(over(l, w, r)) : null;
    }
    case "tanh^1":
      return over(call1("log", call1("cosh", arg, r.ctx), r.ctx), w, r);
    case "coth^1": {
      const l = logAbs(call1("sinh", arg, r.ctx), r);
      return l ? over(l, w, r) : null;
    }
    case "cos^-2":
      return over(call1("tan", arg, r.ctx), w, r);
    case "cosh^-2":
      return over(call1("tanh", arg, r.ctx), w, r);
    case "sin^2":
      return polySub(half(tPoly()), over(call1("sin", twice, r.ctx), polyScale(w, Q.fromInt(4)), r));
    case "cos^2":
      return polyAdd(half(tPoly()), over(call1("sin", twice, r.ctx), polyScale(w, Q.fromInt(4)), r));
    case "sinh^2":
      return polySub(over(call1("sinh", twice, r.ctx), polyScale(w, Q.fromInt(4)), r), half(tPoly()));
    case "cosh^2":
      return polyAdd(over(call1("sinh", twice, r.ctx), polyScale(w, Q.fromInt(4)), r), half(tPoly()));
    case "tan^2":
      return polySub(over(call1("tan", arg, r.ctx), w, r), tPoly());
    case "tanh^2":
      return polySub(tPoly(), over(call1("tanh", arg, r.ctx), w, r));
    default:
      return null;
  }
}

/** ∫ κ u' g(u): for each factor A^e of the integrand, if the rest is a constant multiple of A'. */
function substitution(factors: Factor[], expT: Poly | null, r: Rules): Poly | null {
  const whole: Term = { coef: Q.ONE, factors, expArg: expT };
  const candidates: { base: Poly; e: Rational | "exp"; rest: Term }[] = [];
  for (const f of factors) {
    candidates.push({ base: atomPoly(f.atom), e: f.exp, rest: { ...whole, factors: factors.filter((g) => g !== f) } });
  }
  if (expT) candidates.push({ base: expT, e: "exp", rest: { ...whole, expArg: null } });
  for (const c of candidates) {
    const derivative = toPoly(differentiate(polyToExpr(c.base), "t"), r.ctx);
    if (isZeroPoly(derivative)) continue;
    const kappa = polyDiv({ terms: [c.rest] }, derivative, r.ctx);
    if (polyDependsOnT(kappa)) continue;
    if (c.e === "exp") return polyMul(kappa, { terms: [{ coef: Q.ONE, factors: [], expArg: c.base }] });
    if (Q.equals(c.e, Q.fromInt(-1))) {
      const l = logAbs(c.base, r);
      if (l) return polyMul(kappa, l);
      continue;
    }
    const e1 = Q.add(c.e, Q.ONE);
    return polyMul(kappa, polyScale(polyPow(c.base, e1, r.ctx), Q.divide(Q.ONE, e1)));
  }
  return null;
}

/** ∫ of the t-dependent part of one term. */
function integrateDependent(factors: Factor[], expT: Poly | null, r: Rules): Poly | null {
  const expLin = expT ? linearParts(expT) : null;
  if (factors.length === 0 && !expT) return tPoly();
  if (factors.length === 0 && expLin) return over({ terms: [{ coef: Q.ONE, factors: [], expArg: expT }] }, expLin.alpha, r);
  if (factors.length === 1 && !expT) {
    const s = singleFactor(factors[0], r);
    if (s) return s;
  }
  if (factors.length === 1 && expLin) {
    const f = factors[0];
    if (f.atom.key === "$t" && Q.isInteger(f.exp) && f.exp.n > 0n && f.exp.n <= 6n) return expTimesPower(expLin.alpha, Number(f.exp.n), r);
    if (f.atom.kind === "call" && (f.atom.fn === "sin" || f.atom.fn === "cos") && Q.isOne(f.exp) && f.atom.arg) {
      const u = linearParts(f.atom.arg);
      if (u) return expTimesTrig(expLin.alpha, f.atom.fn, f.atom.arg, u.alpha, r);
    }
  }
  return substitution(factors, expT, r);
}

/** ∫ of one term: its t-free part times the integral of the rest. */
function integrateTerm(term: Term, r: Rules): Poly | null {
  const fixed = term.factors.filter((f) => !f.atom.t);
  const moving = term.factors.filter((f) => f.atom.t);
  let expFixed: Poly | null = null;
  let expMoving: Poly | null = null;
  if (term.expArg) {
    const fixedTerms = term.expArg.terms.filter((x) => !termDependsOnT(x));
    const movingTerms = term.expArg.terms.filter((x) => termDependsOnT(x));
    expFixed = fixedTerms.length ? { terms: fixedTerms } : null;
    expMoving = movingTerms.length ? { terms: movingTerms } : null;
  }
  const inner = integrateDependent(moving, expMoving, r);
  if (!inner) return null;
  return polyMul({ terms: [{ coef: term.coef, factors: fixed, expArg: expFixed }] }, inner);
}

export interface Antiderivative {
  /** ∫_{t0}^{t} f, normal form, as a tree. */
  expr: Expr;
}

/**
 * ∫_{t0}^{t} f(s) ds in closed form, or null when no rule applies or the result does not
 * differentiate back to f on the window.
 */
export function antiderivative(f: Expr, window: WindowContext): Expr | null {
  const ctx = normalContext(window);
  const r: Rules = { ctx, window };
  let poly: Poly;
  try {
    poly = toPoly(f, ctx);
  } catch {
    return null;
  }
  const v = rationalValue(poly);
  if (v && Q.isZero(v)) return num(0);
  let F = zeroPoly();
  for (const term of poly.terms) {
    const piece = integrateTerm(term, r);
    if (!piece) return null;
    F = polyAdd(F, piece);
  }
  const t0 = window.window[0];
  const Fexpr = polyToExpr(F);
  const atStart = toPoly(substitute(Fexpr, { t: num(t0) }), ctx);
  if (!Number.isFinite(valueAt(polyToExpr(atStart), window, t0))) return null;
  const result = polyToExpr(polySub(F, atStart));
  // The rules are checked, not trusted: F' = f on the window, and F(t0) = 0.
  if (!sameFunction(f, differentiate(result, "t"), window)) return null;
  if (Math.abs(valueAt(result, window, t0)) > 1e-12 * (1 + Math.abs(valueAt(Fexpr, window, t0)))) return null;
  return result;
}
