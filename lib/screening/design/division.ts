/**
 * Factoring and exact division in the normal form: the rational content and common monomial of
 * a sum, and division of one polynomial in the atoms by another when it is exact (lexicographic
 * division by a single divisor leaves remainder 0 exactly when the divisor divides; D. Cox,
 * J. Little, D. O'Shea, "Ideals, Varieties, and Algorithms", 4th ed. 2015, §2.3) [from memory].
 */
import * as Q from "./rational";
import type { Rational } from "./rational";
import { groupAtom, isZeroPoly, mergeFactors, normaliseTerms, polyKey, polyNeg, polySub, termMul } from "./poly";
import type { Factor, NormalContext, Poly, Term } from "./poly";

/** The term with the fewest factors (then canonical order): its coefficient is the content. */
function simplestTerm(p: Poly): Term {
  let best = p.terms[0];
  const size = (t: Term) => t.factors.length + (t.expArg ? 1 : 0);
  for (const t of p.terms) if (size(t) < size(best)) best = t;
  return best;
}

/** a / b for terms (exponents and exp arguments subtract). */
function divideTerm(a: Term, b: Term): Term {
  return termMul(a, {
    coef: Q.divide(Q.ONE, b.coef),
    factors: b.factors.map((f) => ({ atom: f.atom, exp: Q.negate(f.exp) })),
    expArg: b.expArg ? polyNeg(b.expArg) : null,
  });
}

/** The monomial common to every term: shared atoms at their smallest exponent, and a shared exp part. */
function commonMonomial(p: Poly, ctx: NormalContext | null): Term {
  const first = p.terms[0];
  const factors: Factor[] = [];
  for (const f of first.factors) {
    let exp = f.exp;
    let everywhere = true;
    for (const t of p.terms) {
      const g = t.factors.find((x) => x.atom.key === f.atom.key);
      if (!g || Q.sign(g.exp) !== Q.sign(f.exp)) {
        everywhere = false;
        break;
      }
      exp = Q.sign(exp) > 0 ? (Q.toNumber(g.exp) < Q.toNumber(exp) ? g.exp : exp) : Q.toNumber(g.exp) > Q.toNumber(exp) ? g.exp : exp;
    }
    if (everywhere && (!ctx || ctx.positive(f.atom.expr))) factors.push({ atom: f.atom, exp });
  }
  const k = first.expArg ? polyKey(first.expArg) : null;
  const sharedExp = k !== null && p.terms.every((t) => t.expArg && polyKey(t.expArg) === k) ? first.expArg : null;
  return { coef: Q.ONE, factors, expArg: sharedExp };
}

/**
 * p = c · g · unit for a sum: c the rational content (from the simplest term; positive when
 * `power` asks for it), g the common monomial (for non-integer powers only positive atoms),
 * unit the rest (still a sum).
 */
export function factorOut(p: Poly, power: { ctx: NormalContext } | null = null): { c: Rational; g: Term; unit: Poly } {
  let c = simplestTerm(p).coef;
  if (power && Q.sign(c) < 0) c = Q.negate(c);
  const g = commonMonomial(p, power ? power.ctx : null);
  const divisor: Term = { ...g, coef: c };
  return { c, g, unit: normaliseTerms(p.terms.map((t) => divideTerm(t, divisor))) };
}

/** A sum as one term c · g · (unit)^1, so it can cancel against a denominator (unit)^-1. */
export function asGroupedTerm(p: Poly): Term {
  const { c, g, unit } = factorOut(p);
  return termMul({ ...g, coef: c }, { coef: Q.ONE, factors: [{ atom: groupAtom(unit), exp: Q.ONE }], expArg: null });
}

/** Integer exponents ≥ 0 and no exp part: a polynomial in the atoms. */
const polynomialTerms = (p: Poly): boolean => p.terms.every((t) => !t.expArg && t.factors.every((f) => Q.isInteger(f.exp) && Q.sign(f.exp) >= 0));

function compareMonomials(x: Term, y: Term): number {
  const keys = [...new Set([...x.factors, ...y.factors].map((f) => f.atom.key))].sort().reverse();
  for (const k of keys) {
    const ex = Q.toNumber(x.factors.find((f) => f.atom.key === k)?.exp ?? Q.ZERO);
    const ey = Q.toNumber(y.factors.find((f) => f.atom.key === k)?.exp ?? Q.ZERO);
    if (ex !== ey) return ex - ey;
  }
  return 0;
}

const leading = (p: Poly): Term => p.terms.reduce((a, b) => (compareMonomials(b, a) > 0 ? b : a));

/**
 * N / D when D divides N exactly as polynomials in the atoms (lexicographic division by one
 * polynomial: the remainder is 0 exactly when D | N), else null.
 */
export function exactDivide(N: Poly, D: Poly): Poly | null {
  if (!polynomialTerms(N) || !polynomialTerms(D) || D.terms.length === 0) return null;
  const lead = leading(D);
  let rest = N;
  const quotient: Term[] = [];
  for (let step = 0; step < 200; step++) {
    if (isZeroPoly(rest)) return normaliseTerms(quotient);
    const m = divideTerm(leading(rest), lead);
    if (m.factors.some((f) => Q.sign(f.exp) < 0)) return null;
    quotient.push(m);
    rest = polySub(rest, normaliseTerms(D.terms.map((t) => termMul(t, m))));
  }
  return null;
}

/** Cancel group denominators of the single-term side against exact factors of the sum side. */
export function cancelAgainst(sum: Poly, single: Poly): [Poly, Poly] {
  if (sum.terms.length < 2 || single.terms.length !== 1) return [sum, single];
  let term = single.terms[0];
  for (let round = 0; round < 4; round++) {
    const f = term.factors.find((x) => x.atom.kind === "group" && Q.sign(x.exp) < 0 && x.atom.poly);
    if (!f || sum.terms.length < 2) break;
    const { c, g, unit } = factorOut(sum);
    const q = exactDivide(unit, f.atom.poly as Poly);
    if (!q) break;
    sum = normaliseTerms(q.terms.map((t) => termMul(t, { ...g, coef: c })));
    term = { ...term, factors: mergeFactors(term.factors, [{ atom: f.atom, exp: Q.ONE }]) };
  }
  return [sum, { terms: [term] }];
}
