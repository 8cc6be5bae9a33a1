/** Test helper: a Variant from coefficient texts (missing coefficients are 0), as the spec layer would build it. */
import { parseExpression } from "../../../lib/screening/expr";
import type { Expr } from "../../../lib/screening/expr";
import { CLASS_COEFFICIENTS } from "../../../lib/screening/spec/types";
import type { EquationClass, Variant } from "../../../lib/screening/spec/types";

export function parse(text: string, symbols: string[] = []): Expr {
  const r = parseExpression(text, { symbols: new Set(["t", ...symbols]) });
  if (!r.ok) throw new Error(`${text}: ${r.error.message}`);
  return r.expr;
}

export function buildVariant(
  equationClass: EquationClass,
  coefficients: Record<string, string | Expr>,
  window: [number, number],
  free: string[] = [],
  index = 0,
): Variant {
  const out: Record<string, Expr> = {};
  for (const name of CLASS_COEFFICIENTS[equationClass]) {
    const c = coefficients[name] ?? "0";
    out[name] = typeof c === "string" ? parse(c, free) : c;
  }
  return { familyId: `test-${equationClass}`, index, class: equationClass, parameters: {}, free, coefficients: out, window };
}
