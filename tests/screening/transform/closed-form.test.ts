import { describe, it, expect } from "vitest";
import { parseExpression, compileExpression, toLatex } from "../../../lib/screening/expr";
import { fromExpr, evalSum } from "../../../lib/screening/transform/closed-form/sums";
import { definiteIntegral, evalAntiderivative } from "../../../lib/screening/transform/closed-form/integrate";
import { antiderivativeToExpr, simpleFraction, sumToExpr } from "../../../lib/screening/transform/closed-form/to-expr";
import { tidy } from "../../../lib/screening/transform/closed-form/tidy";

const parse = (s: string) => {
  const r = parseExpression(s, { symbols: new Set(["t"]) });
  if (!r.ok) throw new Error(r.error.message);
  return r.expr;
};
/** Composite Simpson rule, 2000 panels: an independent numerical check of each antiderivative. */
function simpson(f: (t: number) => number, a: number, b: number): number {
  const n = 2000;
  const h = (b - a) / n;
  let s = f(a) + f(b);
  for (let i = 1; i < n; i++) s += (i % 2 ? 4 : 2) * f(a + i * h);
  return (s * h) / 3;
}

describe("closed-form quadratures (exponential–power class)", () => {
  // Integrands from the map quadratures of nls.md §11 and standard table integrals
  // (Gradshteyn & Ryzhik 2.321, 2.01 [from memory]); each result is checked by Simpson's rule.
  const cases = ["t*exp(2*t)", "cos(t)^2", "1/(1+t)", "(1+t)^(-1/2)", "t*(1+t)^(-3/2)", "exp(t)*sin(3*t)", "0.3*(1-cos(t))^2 + 0.2", "sinh(t)*cosh(2*t)", "t^3 - 2*t", "exp(-0.4*t)*1.25"];
  for (const text of cases) {
    it(`∫_0.2^t ${text}`, () => {
      const e = parse(text);
      const s = fromExpr(e);
      expect(s).not.toBeNull();
      const F = definiteIntegral(s!, 0.2);
      expect(F).not.toBeNull();
      const f = compileExpression(e, ["t"]);
      for (const t of [0.7, 1.9, 3.1]) {
        const want = simpson((u) => f(u), 0.2, t);
        expect(Math.abs(evalAntiderivative(F!, t) - want)).toBeLessThan(1e-10 * Math.max(1, Math.abs(want)));
        // the displayed tree evaluates to the same value
        const shown = antiderivativeToExpr(F!, 0.2)!;
        expect(Math.abs(compileExpression(shown, ["t"])(t) - want)).toBeLessThan(1e-10 * Math.max(1, Math.abs(want)));
      }
    });
  }

  it("outside the class: ∫ sec² and ∫ exp(sin t) give null (shown with ∫ by the caller)", () => {
    expect(fromExpr(parse("1/cos(t)^2"))).toBeNull();
    expect(fromExpr(parse("exp(sin(t))"))).toBeNull();
  });

  it("sums are exact rewrites: sin, cos by Euler's formula, products expanded (value check)", () => {
    const e = parse("sin(2*t+1)*cos(t) - cosh(t)^2 + 3");
    const s = fromExpr(e)!;
    const f = compileExpression(e, ["t"]);
    for (const t of [-1.3, 0, 0.4, 2.2]) expect(Math.abs(evalSum(s, t) - f(t))).toBeLessThan(1e-13);
    const shown = sumToExpr(s)!;
    for (const t of [-1.3, 0.4]) expect(Math.abs(compileExpression(shown, ["t"])(t) - f(t))).toBeLessThan(1e-13);
  });

  it("fractions are recognised for display: −51/400, 23/20, 9/800 (nls.md §11 (g1) kappa)", () => {
    expect(simpleFraction(-51 / 400)).toEqual([-51, 400]);
    expect(simpleFraction(23 / 20)).toEqual([23, 20]);
    expect(simpleFraction(9 / 800)).toEqual([9, 800]);
    expect(simpleFraction(Math.PI)).toBeNull();
  });
});

describe("tidy (display simplification outside the class)", () => {
  it("cancels factors and merges exponentials: (p/q)(q0/p0)·e^{…} of kdv.md §7 becomes exp(−t/5 − 0.26 sin t)", () => {
    const e = parse("(10/13)*(1+0.3*cos(t))/(((1+0.3*cos(t))/1.3)*exp(0.1*t+0.46*sin(t)))*exp(-0.1*t+0.2*sin(t))");
    const t = tidy(e);
    expect(toLatex(t)).toBe("\\exp\\left(-\\frac{1}{5} t - \\frac{13}{50} \\sin\\left(t\\right)\\right)");
  });
  it("keeps values: random trees agree before and after tidying", () => {
    for (const text of ["sin(t)/cos(t)^2/(1/cos(t))", "0.5*((1/cos(t))/0.5)", "sqrt(2*0.5/(1/cos(t)))*(1/cos(t))", "(t+1)^2/(2*t+2) - t/2", "exp(t)^3*exp(-2*t)"]) {
      const e = parse(text);
      const f = compileExpression(e, ["t"]);
      const g = compileExpression(tidy(e), ["t"]);
      for (const t of [0.1, 0.6, 1.2]) expect(Math.abs(f(t) - g(t))).toBeLessThan(1e-13 * Math.max(1, Math.abs(f(t))));
    }
  });
});
