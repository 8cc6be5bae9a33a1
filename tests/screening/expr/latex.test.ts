import { describe, it, expect } from "vitest";
import katex from "katex";
import { toLatex } from "../../../lib/screening/expr";
import { CORPUS, parseOk } from "./helpers";

const SYMS = new Set(["t", "a0", "eps", "w", "beta2", "g_0", "omega", "mu_k", "Omega", "kappa", "scale_m", "mJ", "x1", "k", "L"]);

describe("toLatex", () => {
  const cases: [string, string][] = [
    ["a0*(1 + eps*cos(w*t))", "a_{0} \\left(1 + \\varepsilon \\cos\\left(w t\\right)\\right)"],
    ["beta2*g_0*omega", "\\beta_{2} g_{0} \\omega"],
    ["mu_k + Omega + kappa", "\\mu_{k} + \\Omega + \\kappa"],
    ["scale_m*mJ", "\\mathrm{scale}_{m} \\mathrm{mJ}"],
    ["sech(t)^2", "\\operatorname{sech}^{2}\\left(t\\right)"],
    ["csch(t) + coth(t) + sinh(t)", "\\operatorname{csch}\\left(t\\right) + \\coth\\left(t\\right) + \\sinh\\left(t\\right)"],
    ["abs(t - 1)", "\\left|t - 1\\right|"],
    ["sqrt(1 + t^2)", "\\sqrt{1 + t^{2}}"],
    ["1/(1 + t/L)", "\\frac{1}{1 + \\frac{t}{L}}"],
    ["exp(-2*k*t)", "e^{-2 k t}"],
    ["exp((1 + t)/(2 + t))", "\\exp\\left(\\frac{1 + t}{2 + t}\\right)"],
    ["2*3*t", "2 \\cdot 3 t"],
    ["pi*t^2", "\\pi t^{2}"],
    ["log(t)", "\\ln\\left(t\\right)"],
    ["-(t + 1)", "-\\left(t + 1\\right)"],
    ["t - (-a0)", "t - \\left(-a_{0}\\right)"],
    ["t + -a0", "t - a_{0}"],
    ["t*(-a0)", "t \\left(-a_{0}\\right)"],
    ["(-t)^2", "\\left(-t\\right)^{2}"],
    ["exp(t)^2", "\\left(e^{t}\\right)^{2}"],
    ["1e-7*t", "10^{-7} t"],
    ["2.5e-3*x1", "2.5 \\cdot 10^{-3} x_{1}"],
    [".25*t + 2.", "0.25 t + 2"],
  ];
  for (const [text, tex] of cases) {
    it(`${text} → ${tex}`, () => {
      expect(toLatex(parseOk(text, SYMS))).toBe(tex);
    });
  }

  it("every corpus expression renders without a KaTeX error (KaTeX as an independent parser)", () => {
    for (const text of CORPUS) {
      const tex = toLatex(parseOk(text));
      expect(() => katex.renderToString(tex, { throwOnError: true }), tex).not.toThrow();
    }
  });
});
