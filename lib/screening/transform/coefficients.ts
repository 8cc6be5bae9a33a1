/**
 * Coefficient access for the numeric stages: Taylor jets in t (exact derivatives, painleve.md §5)
 * and fast double values, for the normal-form coefficients of one Variant.
 */
import {
  DoubleField,
  compileExpression,
  evalJet,
  freeSymbols,
  num,
  variableJet,
  type Expr,
} from "../expr";
import { CLASS_COEFFICIENTS, type EquationClass, type Variant } from "../spec/types";

export interface CoefficientSet {
  class: EquationClass;
  names: readonly string[];
  exprs: Record<string, Expr>;
  /** Jets c_k = f^(k)(t)/k!, k = 0..order, of every coefficient. Throws JetEvaluationError at singular points. */
  jets(t: number, order: number): Record<string, number[]>;
  /** Double values of every coefficient (may be non-finite at poles). */
  values(t: number): Record<string, number>;
}

/** Symbols other than t left in the coefficients (unresolved free parameters, or x). */
export function unresolvedSymbols(variant: Variant): string[] {
  const out = new Set<string>();
  for (const e of Object.values(variant.coefficients)) for (const s of freeSymbols(e)) if (s !== "t") out.add(s);
  return [...out].sort();
}

export function coefficientSet(variant: Variant): CoefficientSet {
  const names = CLASS_COEFFICIENTS[variant.class];
  const exprs: Record<string, Expr> = {};
  for (const n of names) exprs[n] = variant.coefficients[n] ?? num(0);
  const compiled: Record<string, (t: number) => number> = {};
  for (const n of names) {
    const f = compileExpression(exprs[n], ["t"]);
    compiled[n] = (t: number) => f(t);
  }
  return {
    class: variant.class,
    names,
    exprs,
    jets(t, order) {
      const env = { t: variableJet(t, order, DoubleField) };
      const r: Record<string, number[]> = {};
      for (const n of names) r[n] = evalJet(exprs[n], env, order, DoubleField);
      return r;
    },
    values(t) {
      const r: Record<string, number> = {};
      for (const n of names) r[n] = compiled[n](t);
      return r;
    },
  };
}
