/**
 * Step 0 of ../shared/math/painleve.md §6: dominant balance from the terms alone.
 * The exponent of a term is n·α - d (n dependent-variable factors, d derivatives; a t-derivative
 * counts because D_t contains ψ'∂_P; a power of x does not). Candidates α < 0 come from pairs of
 * terms with different n; a candidate is kept if in every equation at least two terms attain the
 * minimum and the minima agree (symmetric ansatz α_u = α_v for systems).
 */
import type { Term } from "./types";

/** A rational number p/q in lowest terms, q > 0. */
export interface Rational {
  p: number;
  q: number;
}

function gcd(a: number, b: number): number {
  a = Math.abs(a);
  b = Math.abs(b);
  while (b) [a, b] = [b, a % b];
  return a || 1;
}
export function rational(p: number, q = 1): Rational {
  if (q === 0) throw new RangeError("rational: zero denominator");
  const s = q < 0 ? -1 : 1;
  const g = gcd(p, q);
  return { p: (s * p) / g, q: (s * q) / g };
}
export const rationalText = (r: Rational): string => (r.q === 1 ? String(r.p) : `${r.p}/${r.q}`);
const value = (r: Rational): number => r.p / r.q;

const countFactors = (t: Term): number => t.factors.length;
const countDerivatives = (t: Term): number => t.factors.reduce((s, fa) => s + fa.x + fa.t, 0);

/** n·α - d for α = p/q, as a rational. */
function termExponent(t: Term, alpha: Rational): Rational {
  return rational(countFactors(t) * alpha.p - countDerivatives(t) * alpha.q, alpha.q);
}

export interface Balance {
  alpha: Rational;
  /** Lowest exponent (the same in every equation). */
  lowest: Rational;
  /** Dominant terms per equation (indices into the equation's term list). */
  dominant: number[][];
}

/** All admissible balances, sorted by α (painleve.md §6 Step 0). */
export function dominantBalances(equations: Term[][]): Balance[] {
  const candidates = new Map<string, Rational>();
  for (const eq of equations) {
    for (let i = 0; i < eq.length; i++) {
      for (let k = i + 1; k < eq.length; k++) {
        const n1 = countFactors(eq[i]), n2 = countFactors(eq[k]);
        if (n1 === n2) continue;
        const alpha = rational(countDerivatives(eq[i]) - countDerivatives(eq[k]), n1 - n2);
        if (value(alpha) < 0) candidates.set(rationalText(alpha), alpha);
      }
    }
  }
  const out: Balance[] = [];
  for (const alpha of [...candidates.values()].sort((a, b) => value(a) - value(b))) {
    let ok = true;
    let lowest: Rational | null = null;
    const dominant: number[][] = [];
    for (const eq of equations) {
      const ex = eq.map((t) => termExponent(t, alpha));
      const min = Math.min(...ex.map(value));
      const dom = ex.flatMap((e, i) => (value(e) === min ? [i] : []));
      if (dom.length < 2) ok = false;
      const m = ex[dom[0]];
      if (lowest && (lowest.p !== m.p || lowest.q !== m.q)) ok = false;
      lowest = m;
      dominant.push(dom);
    }
    if (ok && lowest) out.push({ alpha, lowest, dominant });
  }
  return out;
}

/**
 * Degree of the leading-order polynomial in the sampled unknown (§6 Step 0): scalar, the largest
 * n among the dominant terms; system, the number of factors of the second variable in the
 * dominant terms of the first equation.
 */
export function leadDegree(equations: Term[][], variables: string[], balance: Balance): number {
  const dom = balance.dominant[0].map((i) => equations[0][i]);
  if (variables.length === 1) return Math.max(...dom.map(countFactors));
  const second = variables[1];
  return Math.max(...dom.map((t) => t.factors.filter((fa) => fa.variable === second).length));
}

/**
 * D, the degree of det M(j): the sum over equations of the highest derivative order among the
 * dominant terms (each M entry is a falling factorial of that order in j). For the product
 * classes this equals the rule "sum of the highest x-orders" of §6 Step 0 (NLS 4, KdV 3, mKdV 3).
 */
export function determinantDegree(equations: Term[][], balance: Balance): number {
  let D = 0;
  equations.forEach((eq, e) => {
    let m = 0;
    for (const i of balance.dominant[e]) for (const fa of eq[i].factors) m = Math.max(m, fa.x + fa.t);
    D += m;
  });
  return D;
}
