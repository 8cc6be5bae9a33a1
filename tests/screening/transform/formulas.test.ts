import { describe, it, expect } from "vitest";
import { buildTransformation, type TransformationOk } from "../../../lib/screening/transform";
import { KDV_EXAMPLE, NLS_CASES, mkdvExample, nlsVariant, variant } from "./fixtures";

function ok(r: ReturnType<typeof buildTransformation>): TransformationOk {
  if (!r.ok) throw new Error(r.reason);
  return r;
}
const byName = (r: TransformationOk, n: string) => r.formulas.find((f) => f.name === n)!;

describe("display formulas (LaTeX), closed form where the quadratures are done, ∫ otherwise", () => {
  it("(e): every map function in closed form, matching nls.md §11 (e) and the table", () => {
    const r = ok(buildTransformation(nlsVariant(NLS_CASES.find((c) => c.id === "e")!, false, [0, 1.5])));
    for (const f of r.formulas) {
      expect(f.closedForm).toBe(true);
      expect(f.maxRelDiffToTable!).toBeLessThan(1e-10);
    }
    expect(byName(r, "beta").latex).toBe("\\beta(t) = e^{t}");
    expect(byName(r, "gamma").latex).toBe("\\gamma(t) = \\frac{1}{2} e^{2 t} - \\frac{1}{2}");
    expect(byName(r, "alpha").latex).toBe("\\alpha(t) = -\\frac{1}{2}");
  });

  it("(d) and (k1): logarithms and powers of 1 + t (nls.md §11)", () => {
    const d = ok(buildTransformation(nlsVariant(NLS_CASES.find((c) => c.id === "d")!, false, [0, 1])));
    expect(byName(d, "gamma").latex).toMatch(/\\ln\\left\(t \+ 1\\right\)/);
    expect(byName(d, "beta").closedForm).toBe(true);
    const k1 = ok(buildTransformation(nlsVariant(NLS_CASES.find((c) => c.id === "k1")!, false, [0, 1])));
    for (const f of k1.formulas) expect(f.closedForm).toBe(true);
  });

  it("(g1): kappa = −51t/400 + 23 sin(t)/20 − 9 sin(2t)/800 (nls.md §11) as fractions", () => {
    const r = ok(buildTransformation(nlsVariant(NLS_CASES.find((c) => c.id === "g1")!, false, [0, 1])));
    const k = byName(r, "kappa");
    expect(k.closedForm).toBe(true);
    expect(k.latex).toContain("\\frac{51}{400}");
    expect(k.latex).toContain("\\frac{9}{800}");
  });

  it("(d2): gamma = ∫ sec²/2 is not in the supported class and is shown with \\int (it is elementary: tan(t)/2 — a known limitation)", () => {
    const r = ok(buildTransformation(nlsVariant(NLS_CASES.find((c) => c.id === "d2")!, false, [0, 1])));
    const g = byName(r, "gamma");
    expect(g.closedForm).toBe(false);
    expect(g.latex).toContain("\\int_{0}^{t}");
    expect(byName(r, "beta").latex).toBe("\\beta(t) = \\frac{1}{\\cos\\left(t\\right)}");
  });

  it("KdV §7: beta = exp(−t/5 − 0.26 sin t), A = (60/13) exp(−0.3t − 0.06 sin t), B = 1/5 shown in closed form; gamma with ∫", () => {
    const r = ok(buildTransformation(variant("kdv", KDV_EXAMPLE, [0, 1])));
    expect(byName(r, "B").latex).toBe("B(t) = \\frac{1}{5}");
    expect(byName(r, "beta").closedForm).toBe(true);
    expect(byName(r, "A").latex).toContain("\\frac{60}{13}");
    expect(byName(r, "gamma").closedForm).toBe(false);
  });

  it("mKdV §6: A, beta closed; eps = −∫ 0.3 s e^{−0.1 sin s} ds is non-elementary and shown with ∫", () => {
    const r = ok(buildTransformation(variant("mkdv", mkdvExample(1), [0, 1])));
    expect(byName(r, "beta").closedForm).toBe(true);
    expect(byName(r, "eps").closedForm).toBe(false);
    expect(byName(r, "eps").latex).toContain("\\int");
  });
});
