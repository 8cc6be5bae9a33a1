/**
 * The residual with the coefficients substituted, for display only (never for the verdict):
 * built as an expression tree from the coefficient trees with symbolic d/dt (nls.md §3 explicit
 * form; kdv.md §2; mkdv.md §2), optionally simplified by the time-limited symbolic hook.
 */
import {
  add,
  call,
  differentiate,
  div,
  exprToString,
  mul,
  neg,
  num,
  parseExpression,
  pow,
  simplifyConstants,
  sub,
  sym,
  toLatex,
  PI_TEXT,
  E_TEXT,
} from "../expr";
import type { Expr } from "../expr";
import type { EquationClass } from "../spec/types";
import type { ResidualDisplay } from "../report";
import type { SymbolicHook } from "./types";

const d = (e: Expr): Expr => differentiate(e, "t");
const n = (v: number): Expr => num(v);

/** The invariant R, K or Q as a tree in the coefficient trees (explicit forms of the class files). */
export function invariantExpr(equationClass: EquationClass, c: Record<string, Expr>): Expr {
  const get = (name: string): Expr => c[name] ?? n(0);
  const logDerivative = (e: Expr): Expr => div(d(e), e);
  switch (equationClass) {
    case "nls": {
      // nls.md §3: W = a'/a − h'/h + 2(k − c), R = W' − (a'/a)W + W² + 2cW − 4ab.
      const [a, b, cc, h, k] = ["a", "b", "c", "h", "k"].map(get);
      const W = simplifyConstants(add(sub(logDerivative(a), logDerivative(h)), mul(n(2), sub(k, cc))));
      const R = sub(
        add(add(sub(d(W), mul(logDerivative(a), W)), pow(W, n(2))), mul(mul(n(2), cc), W)),
        mul(mul(n(4), a), b),
      );
      return simplifyConstants(R);
    }
    case "kdv": {
      // kdv.md §2: Z = q'/q − p'/p + r − 2s, K = Z' + Z(Z + r + s − p'/p) − pm.
      const [p, q, r, s, m] = ["p", "q", "r", "s", "m"].map(get);
      const Z = simplifyConstants(sub(add(sub(logDerivative(q), logDerivative(p)), r), mul(n(2), s)));
      const K = sub(add(d(Z), mul(Z, sub(add(add(Z, r), s), logDerivative(p)))), mul(p, m));
      return simplifyConstants(K);
    }
    case "mkdv": {
      // mkdv.md §2: Q = q'/q − p'/p + 2(r − s).
      const [p, q, r, s] = ["p", "q", "r", "s"].map(get);
      return simplifyConstants(add(sub(logDerivative(q), logDerivative(p)), mul(n(2), sub(r, s))));
    }
  }
}

/** A decimal literal as an exact rational tree m/10^k (algebrite misreads 1e-3 and prints floats, ENGINE-NOTES §2). */
function rationalLiteral(text: string): Expr {
  const match = /^(-?)(\d*)(?:\.(\d*))?(?:[eE]([-+]?\d+))?$/.exec(text.trim());
  if (!match) return num(Number(text));
  const [, sign, intPart, fracPart = "", expPart = "0"] = match;
  let digits = (intPart + fracPart).replace(/^0+(?=\d)/, "") || "0";
  let exponent = Number(expPart) - fracPart.length;
  if (exponent > 0) {
    digits += "0".repeat(exponent);
    exponent = 0;
  }
  const numerator = num(Number(digits), digits);
  const value = exponent === 0 ? numerator : div(numerator, num(Number(`1e${-exponent}`), `1${"0".repeat(-exponent)}`));
  return sign ? neg(value) : value;
}

/** Rewrite a tree into what algebrite reads exactly: rational literals, no sech/csch/coth (ENGINE-NOTES §1). */
export function forAlgebrite(e: Expr): Expr {
  switch (e.kind) {
    case "num":
      if (e.text === PI_TEXT) return sym("pi");
      if (e.text === E_TEXT) return call("exp", num(1));
      return rationalLiteral(e.text);
    case "sym":
      return e;
    case "neg":
      return neg(forAlgebrite(e.arg));
    case "call": {
      const arg = forAlgebrite(e.arg);
      if (e.fn === "sech") return div(num(1), call("cosh", arg));
      if (e.fn === "csch") return div(num(1), call("sinh", arg));
      if (e.fn === "coth") return div(call("cosh", arg), call("sinh", arg));
      return call(e.fn, arg);
    }
    default:
      return { kind: e.kind, left: forAlgebrite(e.left), right: forAlgebrite(e.right) };
  }
}

/** Engine-generated algebrite text of a tree. */
export function algebriteText(e: Expr): string {
  return exprToString(forAlgebrite(e));
}

/** Parse the hook's answer back into a tree; null when it is not a plain real expression in `symbols`. */
export function parseSymbolicAnswer(text: string, symbols: string[]): Expr | null {
  const trimmed = text.trim();
  if (trimmed === "" || /stop|nil|undefined/i.test(trimmed)) return null;
  const parsed = parseExpression(trimmed, { symbols: new Set(symbols) });
  return parsed.ok ? parsed.expr : null;
}

/** The display of the residual: simplified through the hook when it answers in time, else the tree. */
export async function residualDisplay(
  equationClass: EquationClass,
  coefficients: Record<string, Expr>,
  free: string[],
  hook: SymbolicHook | undefined,
  timeoutMs: number,
): Promise<ResidualDisplay> {
  const expr = invariantExpr(equationClass, coefficients);
  if (hook) {
    try {
      const answer = await hook({ kind: "simplify", expression: algebriteText(expr), timeoutMs });
      const parsed = answer === null ? null : parseSymbolicAnswer(answer, ["t", ...free]);
      if (parsed) return { latex: toLatex(parsed), simplified: true, source: "symbolic-hook" };
    } catch {
      // A failing hook only costs the simplification.
    }
  }
  return { latex: toLatex(expr), simplified: false, source: "expression-tree" };
}
