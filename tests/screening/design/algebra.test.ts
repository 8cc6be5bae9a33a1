// The design engine's exact algebra: rationals from decimal literals, the normal form (checked
// against mathjs as an independent evaluator of the original text) and the single-denominator form.
import { describe, it, expect } from "vitest";
import { create, all } from "mathjs";
import { exprToString, parseExpression } from "@/lib/screening/expr";
import type { Expr } from "@/lib/screening/expr";
import { simplifyVerified } from "@/lib/screening/design";
import * as Q from "@/lib/screening/design/rational";

const math = create(all);

function parse(text: string, symbols: string[] = []): Expr {
  const r = parseExpression(text, { symbols: new Set(["t", ...symbols]) });
  if (!r.ok) throw new Error(`${text}: ${r.error.message}`);
  return r.expr;
}

/** mathjs evaluates the user text and our simplified text independently (reference evaluator). */
function agreeWithMathjs(original: string, simplified: string, window: [number, number]): number {
  let worst = 0;
  for (const u of [0.11, 0.29, 0.47, 0.63, 0.88]) {
    const t = window[0] + u * (window[1] - window[0]);
    const a = math.evaluate(original.replaceAll("sech(", "1/cosh("), { t }) as number;
    const b = math.evaluate(simplified.replaceAll("sech(", "1/cosh("), { t }) as number;
    worst = Math.max(worst, Math.abs(a - b) / Math.max(1, Math.abs(a)));
  }
  return worst;
}

describe("exact rationals from decimal literals", () => {
  it("reads decimals exactly and folds without rounding", () => {
    // 0.1 + 0.2 = 3/10 exactly (the binary doubles give 0.30000000000000004).
    const s = Q.add(Q.fromDecimalText("0.1")!, Q.fromDecimalText("0.2")!);
    expect(Q.key(s)).toBe("3/10");
    expect(Q.key(Q.fromDecimalText("-1.25e-3")!)).toBe("-1/800");
    expect(Q.key(Q.fromDecimalText("6.02E23")!)).toBe("602000000000000000000000");
    expect(Q.fromDecimalText("0x10")).toBeNull();
    expect(Q.fromDecimalText("1/3")).toBeNull();
  });

  it("takes exact rational roots only when they exist", () => {
    expect(Q.key(Q.powRational(Q.rational(9n, 4n), Q.rational(1n, 2n))!)).toBe("3/2");
    expect(Q.key(Q.powRational(Q.rational(8n), Q.rational(-2n, 3n))!)).toBe("1/4");
    expect(Q.powRational(Q.rational(2n), Q.rational(1n, 2n))).toBeNull();
    expect(Q.powRational(Q.rational(-4n), Q.rational(1n, 2n))).toBeNull();
  });
});

describe("normal form (display simplification, verified)", () => {
  const W: [number, number] = [0.5, 5];
  // Identities from M. Abramowitz, I. A. Stegun, "Handbook of Mathematical Functions", 1964:
  // exp laws 4.2.1 ff., sech = 1/cosh 4.5.x; the rest is elementary algebra.
  const cases: [string, string][] = [
    ["exp(t/5)*0.2/exp(t/5)", "1 / 5"],
    ["(2 + 2*t)/(1 + t)", "2"],
    ["exp(2*log(1 + t))", "2 * t + t^2 + 1"],
    ["(1 + t)*(1 - t)", "-t^2 + 1"],
    ["0.1 + 0.1*cos(t) - 0.1*cos(t) + 0.2", "0.3"],
    ["sech(t)*cosh(t)", "1"],
    ["exp(-t)*exp(t/2)", "exp(-(t / 2))"],
    ["sqrt(t^2)", "t"],
    ["(t^2 - 1)/(t - 1)", "t + 1"],
    ["sin(-t) + sin(t)", "0"],
  ];
  for (const [input, expected] of cases) {
    it(`${input} → ${expected}`, () => {
      const r = simplifyVerified(parse(input), { window: W, values: {} });
      expect(r.simplified).toBe(true);
      expect(exprToString(r.expr)).toBe(expected);
      expect(agreeWithMathjs(input, exprToString(r.expr), W)).toBeLessThan(1e-12);
    });
  }

  it("does not apply a rule that needs a positive base where the base changes sign", () => {
    // sqrt(t^2) = |t| on [-2, 2]: the normal form must not return t.
    const r = simplifyVerified(parse("sqrt(t^2)"), { window: [-2, 2], values: {} });
    expect(exprToString(r.expr)).not.toBe("t");
    expect(agreeWithMathjs("sqrt(t^2)", exprToString(r.expr), [-2, 2])).toBeLessThan(1e-12);
  });

  it("puts a sum over one denominator and cancels exact factors (kdv.md §7 forcing)", () => {
    // (0.1 + 0.49 c + 0.138 c²)/(1 + 0.3 c) = 0.1 + 0.46 c with c = cos t, since
    // (1 + 0.3c)(0.1 + 0.46c) = 0.1 + 0.49c + 0.138c² (expanded by hand).
    const input = "(0.1 + 0.49*cos(t) + 0.138*cos(t)^2)/(1 + 0.3*cos(t)) + 0.3*sin(t)/(1 + 0.3*cos(t)) - 0.3*sin(t)/(1 + 0.3*cos(t))";
    const r = simplifyVerified(parse(input), { window: [0, 2], values: {} });
    expect(exprToString(r.expr)).toBe("0.46 * cos(t) + 0.1");
  });

  it("re-parses every simplified text to the same function", () => {
    for (const input of ["t*exp(-t)/(1 + t^2) - 3/(2*t)", "h0*exp(t/5)/(1 + 2*alpha0*t)", "(1 + t)^(-1/2)*exp(0.1*t)^3"]) {
      const ctx = { window: [0.3, 3] as [number, number], values: { h0: 1.5, alpha0: 0.2 } };
      const r = simplifyVerified(parse(input, ["h0", "alpha0"]), ctx);
      const back = parse(exprToString(r.expr), ["h0", "alpha0"]);
      expect(exprToString(back)).toBe(exprToString(r.expr));
    }
  });
});
