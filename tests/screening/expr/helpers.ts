/** Shared test helpers for the expression layer. */
import { parseExpression } from "../../../lib/screening/expr";
import type { Expr } from "../../../lib/screening/expr";

export const SYMBOLS: ReadonlySet<string> = new Set(["t", "a0", "g0", "L", "eps", "w", "k", "b0"]);
/** Parameter values used wherever the symbols above appear (invented, moderate sizes). */
export const PARAMS: Record<string, number> = { a0: 1.3, g0: -0.4, L: 2.5, eps: 0.3, w: 1.7, k: 0.6, b0: 0.25 };

export function parseOk(text: string, symbols: ReadonlySet<string> = SYMBOLS): Expr {
  const r = parseExpression(text, { symbols });
  if (!r.ok) throw new Error(`parse failed for ${text}: ${r.error.message}`);
  return r.expr;
}

/**
 * Coefficient shapes of the screening battery (../shared/ENGINE-NOTES.md §1 and §5) and
 * combinations of them; all analytic near t in [0.2, 1.5].
 */
export const CORPUS: readonly string[] = [
  "exp(g0*t)",
  "a0*exp(g0*t)",
  "1/(1 + t/L)",
  "tanh(t)",
  "sech(t)^2",
  "(1 + t)^t",
  "log(2 + sin(t))",
  "t^2.5",
  "sqrt(1 + t^2)",
  "cosh(3*t)^2",
  "a0*(1 + eps*cos(w*t))",
  "1/(1 + eps*cos(w*t))",
  "eps*w^2*cos(w*t)/(4*(1 + eps*cos(w*t)))",
  "1/cosh(t)",
  "1/(1 + t^2)",
  "-k^2/4",
  "exp(-2*k*t)",
  "b0*exp(2*k*t)",
  "tan(t)",
  "csch(t)",
  "coth(t)",
  "sinh(t)*cosh(2*t)",
  "exp(g0*t)*tanh(t)",
  "sech(t)^2/(1 + t/L)",
  "(1 + t)^t*log(2 + sin(t))",
  "t^2.5*sqrt(1 + t^2)",
  "sinh(3*t)^2/cosh(t)",
  "exp(sin(t))/(2 + cos(t))",
  "abs(t - 3)",
  "abs(sin(t))",
  "t^-3",
  "(t - 2)^3",
  "(t - 2)^-2",
  "2^t",
  "t^t",
  "sqrt(t)*log(t)",
  "exp(-t^2/2)",
  "1/(1 + exp(-t))",
  "-(a0*t)^2 + 3*t - 1/t",
  "pi*t + e",
];
