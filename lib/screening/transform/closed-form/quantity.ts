/**
 * Quantities for the formula display: each carries a closed-form sum when one is known, a tree
 * for display (built with the expression builders), and placeholders standing for integrals that
 * were not done in closed form, or for map functions that have no closed form. Placeholders are
 * symbols named "zzI<n>" / "zzF<name>" and are replaced in the LaTeX by ∫ notation or "name(t)".
 */
import {
  type Expr, add, call, differentiate, div, mul, neg, num, pow, sub, substitute, sym, toLatex,
} from "../../expr";
import { type Sum, addSums, constant, derivative, expSum, fromExpr, mulSums, negSum, powSum, reciprocal } from "./sums";
import { definiteIntegral, expAntiderivative, asSum, type Antiderivative } from "./integrate";
import { antiderivativeToExpr, sumToExpr } from "./to-expr";
import { tidy } from "./tidy";

export interface Quantity {
  sum: Sum | null;
  /** Antiderivative form when this quantity is an integral done in closed form (for exp of it). */
  anti?: Antiderivative;
  expr: Expr;
  closed: boolean;
}

/** LaTeX for each placeholder symbol. */
export class PlaceholderBook {
  private readonly integrals = new Map<string, string>();
  private readonly functions = new Map<string, string>();
  private n = 0;
  integral(latexOfIntegral: string): Expr {
    const name = `zzI${this.n++}`;
    this.integrals.set(name, latexOfIntegral);
    return sym(name);
  }
  /** A map function with no closed form, e.g. ("delta", "\\delta"). */
  func(name: string, latex: string): Quantity {
    const s = `zzF${name}`;
    this.functions.set(s, latex);
    return { sum: null, expr: sym(s), closed: false };
  }
  /** LaTeX of a tree in the variable `v` ("t" or "s"), placeholders replaced. */
  latex(e: Expr, v: "t" | "s" = "t"): string {
    let tex = toLatex(v === "t" ? e : substitute(e, { t: sym("s") }));
    for (const [name, l] of this.integrals) tex = tex.split(toLatex(sym(name))).join(l);
    for (const [name, l] of this.functions) tex = tex.split(toLatex(sym(name))).join(`${l}(${v})`);
    return tex;
  }
}

function display(sum: Sum | null, fallback: Expr): Expr {
  if (sum) {
    const e = sumToExpr(sum);
    if (e) return e;
  }
  return tidy(fallback);
}

export function qFromExpr(e: Expr): Quantity {
  const sum = fromExpr(e);
  return { sum, expr: display(sum, e), closed: true };
}
export function qConst(v: number): Quantity {
  return { sum: constant(v), expr: display(constant(v), num(v)), closed: true };
}

type Bin = (a: Sum, b: Sum) => Sum | null;
function binary(a: Quantity, b: Quantity, op: Bin, build: (x: Expr, y: Expr) => Expr): Quantity {
  const sum = a.sum && b.sum ? op(a.sum, b.sum) : null;
  return { sum, expr: display(sum, build(a.expr, b.expr)), closed: a.closed && b.closed };
}
export const qAdd = (a: Quantity, b: Quantity) => binary(a, b, addSums, add);
export const qSub = (a: Quantity, b: Quantity) => binary(a, b, (x, y) => addSums(x, negSum(y)), sub);
export const qMul = (a: Quantity, b: Quantity) => binary(a, b, mulSums, mul);
export const qDiv = (a: Quantity, b: Quantity) =>
  binary(a, b, (x, y) => { const r = reciprocal(y); return r && mulSums(x, r); }, div);
export const qScale = (a: Quantity, k: number) => qMul(qConst(k), a);
export function qNeg(a: Quantity): Quantity {
  const sum = a.sum && negSum(a.sum);
  const anti = a.anti && { sum: negSum(a.anti.sum), logs: a.anti.logs.map((l) => ({ ...l, coef: -l.coef })) };
  return { sum, anti, expr: display(sum, neg(a.expr)), closed: a.closed };
}
export function qPow(a: Quantity, p: number): Quantity {
  const sum = a.sum && powSum(a.sum, p);
  return { sum, expr: display(sum, p === 0.5 ? call("sqrt", a.expr) : pow(a.expr, num(p))), closed: a.closed };
}
/** d/dt of a closed quantity (sum rule termwise, or the symbolic derivative of the tree). */
export function qDeriv(a: Quantity): Quantity {
  const sum = a.sum && derivative(a.sum);
  return { sum, expr: display(sum, differentiate(a.expr, "t")), closed: a.closed };
}

/** exp(a), using the antiderivative when a is a closed-form integral with logarithms. */
export function qExp(a: Quantity, t0: number): Quantity {
  let sum: Sum | null = null;
  if (a.anti) sum = expAntiderivative(a.anti, t0);
  else if (a.sum) sum = expSum(a.sum);
  return { sum, expr: display(sum, call("exp", a.expr)), closed: a.closed };
}

/**
 * ∫_{t0}^{t} integrand(s) ds: closed form when the integrand is a sum whose terms integrate,
 * otherwise a placeholder printed as \int_{t_0}^{t} … \,ds.
 */
export function qIntegral(integrand: Quantity, t0: number, book: PlaceholderBook): Quantity {
  if (integrand.expr.kind === "num" && integrand.expr.value === 0) return qConst(0);
  if (integrand.sum && integrand.closed) {
    const F = definiteIntegral(integrand.sum, t0);
    const e = F && antiderivativeToExpr(F, t0);
    if (F && e) return { sum: asSum(F), anti: F, expr: e, closed: true };
  }
  const t0tex = toLatex(t0 < 0 ? neg(num(-t0)) : num(t0));
  const body = book.latex(integrand.expr, "s");
  return { sum: null, expr: book.integral(`\\int_{${t0tex}}^{t} \\left(${body}\\right) ds`), closed: false };
}
