/**
 * Closed-form predictions of the compatibility conditions at τ^0 (../shared/math/painleve.md
 * §2–§4, §6 Step 7), from the explicit invariant forms (independent of the monomial forms used
 * for rho_inv):
 *   NLS  C3 ≡ 0, C4 = -2aR/(h u0), R = W' - (a'/a)W + W² + 2cW - 4ab, W = a'/a - h'/h + 2(k - c)
 *   KdV  C4 ≡ 0, C6 = K/p, K = Z' + Z(Z + r + s - p'/p) - pm, Z = q'/q - p'/p + r - 2s
 *   mKdV C3 = u0 Q/2, C4 ≡ 0, Q = q'/q - p'/p + 2(r - s)
 */
import type { Expr } from "../expr/types";
import { DoubleField, evalJet, variableJet } from "../expr";
import type { EquationClass } from "../spec/types";
import type { Complex } from "./jet-algebra";
import { cdiv, cmul } from "./polynomial";

/** f, f', f'' at t (double). */
function derivatives(expr: Expr, t: number): [number, number, number] {
  const j = evalJet(expr, { t: variableJet(t, 2, DoubleField) }, 2, DoubleField);
  return [j[0], j[1], 2 * j[2]];
}

/** The nontrivial resonance of each class and the identically vanishing ones. */
export const CLASS_CONDITIONS: Readonly<Record<EquationClass, { nontrivial: number; identicallyZero: number[] }>> = {
  nls: { nontrivial: 4, identicallyZero: [3] },
  kdv: { nontrivial: 6, identicallyZero: [4] },
  mkdv: { nontrivial: 3, identicallyZero: [4] },
};

/** Predicted C at τ^0 for resonance j, given the branch's leading coefficient u0 at τ^0. */
export function predictedCondition(
  cls: EquationClass,
  coefficients: Record<string, Expr>,
  t: number,
  u0: Complex,
  j: number,
): Complex | null {
  const spec = CLASS_CONDITIONS[cls];
  if (spec.identicallyZero.includes(j)) return { re: 0, im: 0 };
  if (j !== spec.nontrivial) return null;
  const d = (name: string) => derivatives(coefficients[name], t);
  if (cls === "nls") {
    const [a, a1, a2] = d("a");
    const [h, h1, h2] = d("h");
    const [k, k1] = d("k");
    const [c, c1] = d("c");
    const [b] = d("b");
    const W = a1 / a - h1 / h + 2 * (k - c);
    const W1 = a2 / a - (a1 * a1) / (a * a) - h2 / h + (h1 * h1) / (h * h) + 2 * (k1 - c1);
    const R = W1 - (a1 / a) * W + W * W + 2 * c * W - 4 * a * b;
    return cdiv({ re: -2 * a * R, im: 0 }, { re: h * u0.re, im: h * u0.im });
  }
  if (cls === "kdv") {
    const [p, p1, p2] = d("p");
    const [q, q1, q2] = d("q");
    const [r, r1] = d("r");
    const [s, s1] = d("s");
    const [m] = d("m");
    const Z = q1 / q - p1 / p + r - 2 * s;
    const Z1 = q2 / q - (q1 * q1) / (q * q) - p2 / p + (p1 * p1) / (p * p) + r1 - 2 * s1;
    const K = Z1 + Z * (Z + r + s - p1 / p) - p * m;
    return { re: K / p, im: 0 };
  }
  const [p, p1] = d("p");
  const [q, q1] = d("q");
  const [r] = d("r");
  const [s] = d("s");
  const Q = q1 / q - p1 / p + 2 * (r - s);
  return cmul(u0, { re: Q / 2, im: 0 });
}
