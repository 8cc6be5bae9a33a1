/**
 * The symbolic form of the class's nontrivial compatibility condition with the family's
 * coefficients substituted (../shared/math/README.md: C4 = -2aR/(h u0), C6 = K/p, C3 = u0 Q/2;
 * R, K, Q from nls.md §3, kdv.md §2, mkdv.md §2), for the evidence shown to users.
 */
import type { Expr } from "../expr/types";
import { add, differentiate, div, exprToString, mul, num, pow, simplifyConstants, sub, sym, toLatex } from "../expr";
import type { EquationClass } from "../spec/types";
import type { SymbolicCondition } from "./types";

const d = (e: Expr): Expr => differentiate(e, "t");

/** W = a'/a - h'/h + 2(k - c); R = W' - (a'/a)W + W² + 2cW - 4ab (nls.md §3). */
function nlsCondition(c: Record<string, Expr>): Expr {
  const { a, h, k, b } = c;
  const cc = c.c;
  const W = simplifyConstants(add(sub(div(d(a), a), div(d(h), h)), mul(num(2), sub(k, cc))));
  const R = sub(add(add(sub(d(W), mul(div(d(a), a), W)), pow(W, num(2))), mul(mul(num(2), cc), W)), mul(mul(num(4), a), b));
  return div(mul(num(-2), mul(a, R)), mul(h, sym("u0")));
}

/** Z = q'/q - p'/p + r - 2s; K = Z' + Z(Z + r + s - p'/p) - pm (kdv.md §2); C6 = K/p. */
function kdvCondition(c: Record<string, Expr>): Expr {
  const { p, q, r, s, m } = c;
  const Z = simplifyConstants(sub(add(sub(div(d(q), q), div(d(p), p)), r), mul(num(2), s)));
  const K = sub(add(d(Z), mul(Z, sub(add(add(Z, r), s), div(d(p), p)))), mul(p, m));
  return div(K, p);
}

/** Q = q'/q - p'/p + 2(r - s) (mkdv.md §2); C3 = u0 Q/2. */
function mkdvCondition(c: Record<string, Expr>): Expr {
  const { p, q, r, s } = c;
  const Q = add(sub(div(d(q), q), div(d(p), p)), mul(num(2), sub(r, s)));
  return div(mul(sym("u0"), Q), num(2));
}

const GENERIC: Record<EquationClass, { resonance: number; latex: string }> = {
  nls: {
    resonance: 4,
    latex:
      "C_{4} = -\\frac{2 a R}{h u_{0}},\\quad R = W' - \\frac{a'}{a} W + W^{2} + 2 c W - 4 a b,\\quad W = \\frac{a'}{a} - \\frac{h'}{h} + 2 (k - c)",
  },
  kdv: {
    resonance: 6,
    latex:
      "C_{6} = \\frac{K}{p},\\quad K = Z' + Z \\left(Z + r + s - \\frac{p'}{p}\\right) - p m,\\quad Z = \\frac{q'}{q} - \\frac{p'}{p} + r - 2 s",
  },
  mkdv: {
    resonance: 3,
    latex: "C_{3} = \\frac{u_{0} Q}{2},\\quad Q = \\frac{q'}{q} - \\frac{p'}{p} + 2 (r - s)",
  },
};

/** The class condition with `coefficients` substituted (simplified only by constant folding). */
export function symbolicCondition(cls: EquationClass, coefficients: Record<string, Expr>): SymbolicCondition {
  const expr = simplifyConstants(
    cls === "nls" ? nlsCondition(coefficients) : cls === "kdv" ? kdvCondition(coefficients) : mkdvCondition(coefficients),
  );
  const g = GENERIC[cls];
  return { resonance: g.resonance, generic: g.latex, latex: `C_{${g.resonance}} = ${toLatex(expr)}`, text: exprToString(expr) };
}
