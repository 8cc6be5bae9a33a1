/**
 * The class invariants for the Painlevé stage's oracle (painleve.md §7): the polynomial forms of
 * ../shared/math/nls.md §3 (R-poly), kdv.md §2 (p²qK) and mkdv.md §2 (pqQ), evaluated over jets in
 * any field. The monomial tables are the reducibility stage's (../reducibility/invariants.ts), so
 * both judges read the one source.
 */
import type { Expr, Field } from "../expr/types";
import { DoubleField } from "../expr";
import type { EquationClass } from "../spec/types";
import type { TermJets, TermSource } from "../zero";
import { INVARIANTS } from "../reducibility/invariants";
import { coefficientDerivativeJets, monomialJet, monomialJets } from "../reducibility/terms";

export const INVARIANT_NAME: Readonly<Record<EquationClass, string>> = {
  nls: INVARIANTS.nls.symbol,
  kdv: INVARIANTS.kdv.symbol,
  mkdv: INVARIANTS.mkdv.symbol,
};

/**
 * The monomials of the class invariant at t (decimal text), per Taylor order 0..orders-1:
 * result[order][monomial] (the TermSource of the shared zero test). No precondition check: the
 * Painlevé stage redraws points where a pivot vanishes.
 */
export function invariantTerms<T>(cls: EquationClass, coefficients: Record<string, Expr>, t: string, field: Field<T>, orders = 3): TermJets<T> {
  const def = INVARIANTS[cls];
  const jets = coefficientDerivativeJets(def, coefficients, field.fromText(t), {}, orders, field);
  const monomials = monomialJets(def.monomials, jets, orders, field);
  return Array.from({ length: orders }, (_, m) => monomials.map((mono) => mono[m]));
}

export function invariantSource(cls: EquationClass, coefficients: Record<string, Expr>): TermSource {
  return { terms: <T>(t: string, field: Field<T>) => invariantTerms(cls, coefficients, t, field) };
}

/**
 * The invariant itself at t (double): R = Σ/(−a²h²), K = Σ/(p²q), Q = Σ/(pq), where Σ is the
 * polynomial form's value at Taylor order 0 and the divisor is the table's normalizer.
 */
export function invariantFromSum(cls: EquationClass, coefficients: Record<string, Expr>, t: string, sum: number): number {
  const def = INVARIANTS[cls];
  const jets = coefficientDerivativeJets(def, coefficients, Number(t), {}, 1, DoubleField);
  return sum / monomialJet(def.normalizer, jets, 1, DoubleField)[0];
}

/** The invariant R, K or Q at t (double). */
export function invariantValue(cls: EquationClass, coefficients: Record<string, Expr>, t: string): number {
  const terms = invariantTerms(cls, coefficients, t, DoubleField, 1)[0];
  return invariantFromSum(cls, coefficients, t, terms.reduce((s, m) => s + m, 0));
}
