/**
 * Test helpers for the Painlevé stage: coefficient maps from text, the fixed inputs of
 * ../shared/math/painleve.md §8 ("Common inputs"), and variants.
 */
import { parseExpression } from "../../../lib/screening/expr";
import type { Expr } from "../../../lib/screening/expr";
import { CLASS_COEFFICIENTS, type EquationClass, type Variant } from "../../../lib/screening/spec/types";
import type { Complex, FixedDraws, PainleveResult } from "../../../lib/screening/painleve";

export function expr(text: string, symbols: string[] = []): Expr {
  const r = parseExpression(text, { symbols: new Set(["t", ...symbols]) });
  if (!r.ok) throw new Error(`${text}: ${r.error.message}`);
  return r.expr;
}

/** All class coefficients, the given ones parsed, the rest 0 (as in a Variant). */
export function coefficients(cls: EquationClass, given: Record<string, string>, symbols: string[] = []): Record<string, Expr> {
  return Object.fromEntries(CLASS_COEFFICIENTS[cls].map((n) => [n, expr(given[n] ?? "0", symbols)]));
}

export function variant(cls: EquationClass, given: Record<string, string>, window: [number, number] = [0.5, 1.5], free: string[] = []): Variant {
  return { familyId: "test-family", index: 0, class: cls, parameters: {}, free, coefficients: coefficients(cls, given, free), window };
}

const c = (re: number, im = 0): Complex => ({ re, im });

/**
 * painleve.md §8 common inputs: t_s = 1, ψ(1 + τ) = 0.3 + 0.5τ + 0.5τ², free functions 0.2 then 0.1
 * (mKdV: again 0.2, 0.1 on the second branch), u0 as given.
 */
export function vectorInputs(u0?: Complex[], branches = 1): FixedDraws {
  const free: Complex[][] = [];
  for (let b = 0; b < branches; b++) free.push([c(0.2)], [c(0.1)]);
  return { points: [1], psi: [[0.3, 0.5, 0.5]], u0: u0 ? [u0] : undefined, free: [free] };
}
export const U0_ONE: Complex[] = [c(1)];
export const U0_CHIRPED: Complex[] = [c(1), c(0, 0.5)];

/** The single branch (or branch `b`) of the single point of a fixed-input run. */
export function branchOf(r: PainleveResult, b = 0) {
  const jet = r.evidence.doubleJet ?? r.evidence.jet;
  if (!jet) throw new Error(`no jet evidence: ${r.reason}`);
  return jet.points[0].branches[b];
}
export function conditionOf(r: PainleveResult, j: number, b = 0) {
  const cond = branchOf(r, b).conditions.find((x) => x.resonance === j);
  if (!cond) throw new Error(`no condition at resonance ${j}`);
  return cond;
}
