// Elementary antiderivatives of the design engine, against an independent quadrature: composite
// 5-point Gauss–Legendre (nodes and weights: Abramowitz & Stegun 1964, Table 25.4), evaluated by
// mathjs on the original text (a reference evaluator outside the engine).
import { describe, it, expect } from "vitest";
import { create, all } from "mathjs";
import { exprToString, parseExpression, evalNumber } from "@/lib/screening/expr";
import { antiderivative } from "@/lib/screening/design";

const math = create(all);

const GL_X = [0, 0.5384693101056831, -0.5384693101056831, 0.906179845938664, -0.906179845938664];
const GL_W = [0.5688888888888889, 0.4786286704993665, 0.4786286704993665, 0.2369268850561891, 0.2369268850561891];

function quadrature(text: string, a: number, b: number, cells = 200): number {
  const f = math.compile(text.replaceAll("sech(", "1/cosh("));
  let sum = 0;
  const h = (b - a) / cells;
  for (let i = 0; i < cells; i++) {
    const mid = a + (i + 0.5) * h;
    for (let j = 0; j < 5; j++) sum += GL_W[j] * (h / 2) * (f.evaluate({ t: mid + (h / 2) * GL_X[j] }) as number);
  }
  return sum;
}

function parse(text: string) {
  const r = parseExpression(text, { symbols: new Set(["t"]) });
  if (!r.ok) throw new Error(r.error.message);
  return r.expr;
}

// Integrands and the table rule each exercises (I. S. Gradshteyn, I. M. Ryzhik, "Table of
// Integrals, Series, and Products", 7th ed. 2007, section numbers from memory).
const CASES: [string, [number, number], string][] = [
  ["3*t^2 - 2", [0, 2], "powers, 2.01"],
  ["1/(2*(1 + t))", [0, 3], "1/(linear) → log, 2.01"],
  ["exp(-0.1*t)/2", [0, 5], "exponential, 2.31"],
  ["t^2*exp(-t)", [0, 4], "polynomial × exponential, 2.321"],
  ["exp(t/2)*cos(3*t)", [0, 2], "exponential × cosine, 2.663"],
  ["tan(t/4)", [0, 2], "tangent → −log cos, 2.526"],
  ["sin(t)*cos(t)^3", [0, 1.5], "substitution u = cos t, 2.51"],
  ["2*t/(1 + t^2)", [0, 3], "substitution u = 1 + t², log"],
  ["sech(2*t)^2", [0, 1], "sech² → tanh/2, 2.423"],
  ["cos(t)^2 + sinh(t)", [0, 2], "cos² and sinh, 2.513, 2.411"],
  ["(1 + t)^(-1/2)", [0, 3], "fractional power of a linear function"],
  ["t*exp(t^2)", [0, 1], "substitution u = t²"],
];

describe("antiderivative", () => {
  for (const [text, window, rule] of CASES) {
    it(`∫ ${text} on [${window.join(", ")}] (${rule})`, () => {
      const F = antiderivative(parse(text), { window, values: {} });
      expect(F, `no antiderivative for ${text}`).not.toBeNull();
      for (const u of [0.37, 1]) {
        const t = window[0] + u * (window[1] - window[0]);
        const exact = quadrature(text, window[0], t);
        const value = evalNumber(F!, { t });
        expect(Math.abs(value - exact)).toBeLessThan(1e-11 * Math.max(1, Math.abs(exact)));
      }
      expect(Math.abs(evalNumber(F!, { t: window[0] }))).toBeLessThan(1e-14);
    });
  }

  it("returns null where no elementary rule applies (1/(1 + t²) needs arctan, not in the language)", () => {
    expect(antiderivative(parse("1/(1 + t^2)"), { window: [0, 1], values: {} })).toBeNull();
    expect(antiderivative(parse("exp(t)/(1 + t)"), { window: [0, 1], values: {} })).toBeNull();
  });

  it("writes log|u| without abs, with the sign u has on the window", () => {
    const F = antiderivative(parse("1/(t - 3)"), { window: [0, 2], values: {} });
    // ∫_0^t ds/(s − 3) = log(1 − t/3): the argument is positive on [0, 2].
    expect(exprToString(F!)).toBe("log(-(t / 3) + 1)");
    expect(Math.abs(evalNumber(F!, { t: 2 }) - Math.log(1 / 3))).toBeLessThan(1e-14);
  });
});
