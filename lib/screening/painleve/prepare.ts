/**
 * Preparing a member for the jet test: free-parameter values substituted, terms whose
 * coefficient is the literal 0 dropped (so the dominant balance sees the equation actually given),
 * and the class preconditions a h ≠ 0 / p q ≠ 0 checked (../shared/math/README.md).
 */
import type { Expr } from "../expr/types";
import { freeSymbols, num, simplifyConstants, substitute } from "../expr";
import type { EquationTemplate, Term } from "./types";

function isZeroLiteral(e: Expr): boolean {
  const s = simplifyConstants(e);
  return s.kind === "num" && s.value === 0;
}

export interface Prepared {
  template: EquationTemplate;
  coefficients: Record<string, Expr>;
}

/** Substitute the free-parameter values; drop terms whose coefficient is the literal 0. */
export function prepare(
  template: EquationTemplate,
  coefficients: Record<string, Expr>,
  values: Record<string, number>,
): { ok: true; value: Prepared; parameters: Record<string, number> } | { ok: false; reason: string; parameters: Record<string, number> } {
  const map: Record<string, Expr> = {};
  const parameters: Record<string, number> = {};
  for (const [k, v] of Object.entries(values)) map[k] = num(v);
  const fix = (e: Expr): Expr => {
    for (const s of freeSymbols(e)) if (s in map) parameters[s] = values[s];
    return Object.keys(map).length ? substitute(e, map) : e;
  };
  const fixed: Record<string, Expr> = {};
  for (const [k, e] of Object.entries(coefficients)) fixed[k] = fix(e);
  const unresolved = new Set<string>();
  const check = (e: Expr) => {
    for (const s of freeSymbols(e)) if (s !== "t") unresolved.add(s);
  };
  const equations: Term[][] = [];
  for (const eq of template.equations) {
    const kept: Term[] = [];
    for (const tm of eq) {
      if (tm.constant.re === 0 && tm.constant.im === 0) continue;
      let coefficient = tm.coefficient;
      if (typeof coefficient !== "string") coefficient = fix(coefficient);
      const expr = typeof coefficient === "string" ? (coefficient === "1" ? null : fixed[coefficient]) : coefficient;
      if (typeof coefficient === "string" && coefficient !== "1" && !expr) {
        return { ok: false, reason: `undecided: evaluation failed (no coefficient '${coefficient}')`, parameters };
      }
      if (expr) {
        check(expr);
        if (isZeroLiteral(expr)) continue;
      }
      kept.push({ ...tm, coefficient });
    }
    equations.push(kept);
  }
  if (unresolved.size) {
    return { ok: false, reason: `undecided: evaluation failed (free parameters not fixed: ${[...unresolved].sort().join(", ")})`, parameters };
  }
  for (const name of template.nonvanishing) {
    const e = fixed[name];
    if (e && isZeroLiteral(e)) {
      return { ok: false, reason: `undecided: evaluation failed (precondition: ${template.nonvanishing.join(" ")} must not vanish; ${name} = 0)`, parameters };
    }
  }
  return { ok: true, value: { template: { ...template, equations }, coefficients: fixed }, parameters };
}
