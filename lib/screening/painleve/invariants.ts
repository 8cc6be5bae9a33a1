/**
 * The class invariants as sums of monomials, for the invariant statistic rho_inv of
 * ../shared/math/nls.md §3 (R-poly, 13 monomials), kdv.md §2 (p²qK, 14) and mkdv.md §2 (pqQ, 4),
 * evaluated over jets in any field and handed to the shared zero test (../zero).
 */
import type { Expr, Field, Jet } from "../expr/types";
import { DoubleField, evalJet, jetDerivative, jetMul, jetScale, variableJet } from "../expr";
import type { EquationClass } from "../spec/types";
import type { TermJets, TermSource } from "../zero";

/** A factor c^(d): coefficient `name` differentiated d times in t. */
type Factor = [name: string, derivative: number];
/** A monomial: integer constant × Π factors. */
type Monomial = [constant: number, factors: Factor[]];

const x = (name: string, d = 0): Factor => [name, d];

// -a²h²R (nls.md §3, R-poly).
const NLS_MONOMIALS: Monomial[] = [
  [4, [x("a"), x("a"), x("a"), x("b"), x("h"), x("h")]],
  [-4, [x("a"), x("a"), x("k"), x("k"), x("h"), x("h")]],
  [4, [x("a"), x("a"), x("c"), x("k"), x("h"), x("h")]],
  [-2, [x("a"), x("a"), x("k", 1), x("h"), x("h")]],
  [2, [x("a"), x("a"), x("c", 1), x("h"), x("h")]],
  [-2, [x("a"), x("k"), x("a", 1), x("h"), x("h")]],
  [-1, [x("a"), x("a", 2), x("h"), x("h")]],
  [1, [x("a", 1), x("a", 1), x("h"), x("h")]],
  [4, [x("a"), x("a"), x("k"), x("h"), x("h", 1)]],
  [-2, [x("a"), x("a"), x("c"), x("h"), x("h", 1)]],
  [1, [x("a"), x("a", 1), x("h"), x("h", 1)]],
  [1, [x("a"), x("a"), x("h"), x("h", 2)]],
  [-2, [x("a"), x("a"), x("h", 1), x("h", 1)]],
];

// p²qK (kdv.md §2, polynomial form).
const KDV_MONOMIALS: Monomial[] = [
  [-1, [x("m"), x("p"), x("p"), x("p"), x("q")]],
  [2, [x("p"), x("p"), x("q"), x("r"), x("r")]],
  [-5, [x("p"), x("p"), x("q"), x("r"), x("s")]],
  [2, [x("p"), x("p"), x("q"), x("s"), x("s")]],
  [1, [x("p"), x("p"), x("q"), x("r", 1)]],
  [-2, [x("p"), x("p"), x("q"), x("s", 1)]],
  [3, [x("p"), x("p"), x("r"), x("q", 1)]],
  [-3, [x("p"), x("p"), x("s"), x("q", 1)]],
  [1, [x("p"), x("p"), x("q", 2)]],
  [-4, [x("p"), x("q"), x("r"), x("p", 1)]],
  [5, [x("p"), x("q"), x("s"), x("p", 1)]],
  [-1, [x("p"), x("q"), x("p", 2)]],
  [-3, [x("p"), x("p", 1), x("q", 1)]],
  [3, [x("q"), x("p", 1), x("p", 1)]],
];

// pqQ (mkdv.md §2, polynomial form).
const MKDV_MONOMIALS: Monomial[] = [
  [1, [x("p"), x("q", 1)]],
  [-1, [x("q"), x("p", 1)]],
  [2, [x("p"), x("q"), x("r")]],
  [-2, [x("p"), x("q"), x("s")]],
];

export const INVARIANT_MONOMIALS: Readonly<Record<EquationClass, Monomial[]>> = {
  nls: NLS_MONOMIALS,
  kdv: KDV_MONOMIALS,
  mkdv: MKDV_MONOMIALS,
};
export const INVARIANT_NAME: Readonly<Record<EquationClass, string>> = { nls: "R", kdv: "K", mkdv: "Q" };

/**
 * The monomials of the class invariant at t (decimal text), per Taylor order 0..orders-1:
 * result[order][monomial] (the TermSource of the shared zero test).
 */
export function invariantTerms<T>(
  cls: EquationClass,
  coefficients: Record<string, Expr>,
  t: string,
  field: Field<T>,
  orders = 3,
): TermJets<T> {
  const order = orders - 1 + 2; // second derivatives at Taylor order orders-1
  const env = { t: variableJet(field.fromText(t), order, field) };
  const cache = new Map<string, Jet<T>>();
  const jetOf = ([name, d]: Factor): Jet<T> => {
    const key = `${name}'${d}`;
    const hit = cache.get(key);
    if (hit) return hit;
    const j = d === 0 ? evalJet(coefficients[name], env, order, field) : jetDerivative(jetOf([name, d - 1]), field);
    cache.set(key, j);
    return j;
  };
  const monomials = INVARIANT_MONOMIALS[cls].map(([k, factors]) => {
    let prod = factors.map(jetOf).reduce((acc, j) => jetMul(acc, j, field));
    prod = jetScale(prod, field.fromNumber(k), field);
    return prod.slice(0, orders);
  });
  return Array.from({ length: orders }, (_, m) => monomials.map((mono) => mono[m]));
}

export function invariantSource(cls: EquationClass, coefficients: Record<string, Expr>): TermSource {
  return { terms: <T>(t: string, field: Field<T>) => invariantTerms(cls, coefficients, t, field) };
}

/**
 * The invariant itself at t (double): R = Σ/(−a²h²), K = Σ/(p²q), Q = Σ/(pq), where Σ is the
 * polynomial form's value at Taylor order 0.
 */
export function invariantFromSum(cls: EquationClass, coefficients: Record<string, Expr>, t: string, sum: number): number {
  const F = DoubleField;
  const at = (name: string): number => evalJet(coefficients[name], { t: variableJet(Number(t), 0, F) }, 0, F)[0];
  if (cls === "nls") return sum / (-at("a") * at("a") * at("h") * at("h"));
  if (cls === "kdv") return sum / (at("p") * at("p") * at("q"));
  return sum / (at("p") * at("q"));
}

/** The invariant R, K or Q at t (double). */
export function invariantValue(cls: EquationClass, coefficients: Record<string, Expr>, t: string): number {
  const terms = invariantTerms(cls, coefficients, t, DoubleField, 1)[0];
  return invariantFromSum(cls, coefficients, t, terms.reduce((s, m) => s + m, 0));
}
