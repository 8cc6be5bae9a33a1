import { describe, it, expect } from "vitest";
import { buildTransformation, coefficientSet, type MapTable } from "../../../lib/screening/transform";
import { buildSolutions, solutionsFor, withDefaults } from "../../../lib/screening/solutions";
import { originalResidual, verifySolutions } from "../../../lib/screening/verify";
import { KDV_EXAMPLE, NLS_CASES, mkdvExample, nlsVariant, nonJsonLeaves, variant } from "../transform/fixtures";
import type { Variant } from "../../../lib/screening/spec/types";

function verify(v: Variant) {
  const tr = buildTransformation(v);
  const set = buildSolutions(v, tr);
  return verifySolutions(v, tr, set, { skipSplitStep: true });
}

describe("mapped-back solutions satisfy their ORIGINAL equation to ≤ 1e-8 relative (exact derivatives)", () => {
  // nls.md §11 rows: damped NLS with exponentially growing nonlinearity (c2), trap cases (d), (k2),
  // focusing (d2), dilation and drift (e), potentials (g1); both signs.
  for (const c of NLS_CASES) {
    it(`NLS (${c.id}), all solutions of both signs (nls.md §11)`, () => {
      for (const dark of [false, true]) {
        const r = verify(nlsVariant(c, dark, [0, 1.4]));
        expect(r.residuals.length).toBe(dark ? 4 : 6);
        for (const e of r.residuals) {
          expect(e.passed).toBe(true);
          expect(e.maxRelResidual).toBeLessThan(1e-8);
          expect(e.points).toBe(30);
        }
      }
    });
  }
  it("KdV worked example with all seven coefficients (kdv.md §7): soliton and cnoidal", () => {
    const r = verify(variant("kdv", KDV_EXAMPLE, [0, 2]));
    expect(r.residuals.filter((e) => e.equation === "original").map((e) => e.solutionId)).toEqual(["kdv-soliton", "kdv-cnoidal"]);
    for (const e of r.residuals) expect(e.maxRelResidual).toBeLessThan(1e-8);
    expect(r.passed).toBe(true);
  });
  it("cylindrical KdV u_t + u/(2t) + 6uu_x + u_xxx = 0 (kdv.md §2; references.md V9)", () => {
    const r = verify(variant("kdv", { p: "6", q: "1", r: "1/(2*t)" }, [1, 4]));
    for (const e of r.residuals) expect(e.maxRelResidual).toBeLessThan(1e-8);
  });
  it("mKdV worked examples (mkdv.md §6): soliton (σ = +1) and kink (σ = −1)", () => {
    for (const s of [1, -1] as const) {
      const r = verify(variant("mkdv", mkdvExample(s), [0, 2]));
      expect(r.residuals[0].solutionId).toBe(s === 1 ? "mkdv-soliton" : "mkdv-kink");
      for (const e of r.residuals) expect(e.maxRelResidual).toBeLessThan(1e-8);
    }
  });
  it("results are JSON-safe", () => {
    expect(nonJsonLeaves(verify(variant("kdv", KDV_EXAMPLE, [0, 2])))).toEqual([]);
  });
});

describe("controls: the residual detects wrong maps", () => {
  it("(c1) damped NLS with constant h: the naive candidate e^{−t/10} χ_bright(x, t/2) is not a solution (nls.md §11: residual 0.128)", () => {
    const v = variant("nls", { a: "1/2", k: "0.1", h: "1" }, [0, 1]);
    const coefs = coefficientSet(v);
    const t = [0, 0.4, 0.8];
    const table: MapTable = {
      class: "nls", t,
      values: { A: t.map((s) => Math.exp(-s / 10)), alpha: [0, 0, 0], beta: [1, 1, 1], gamma: t.map((s) => s / 2), delta: [0, 0, 0], eps: [0, 0, 0], kappa: [0, 0, 0] },
      slopes: { A: t.map((s) => -Math.exp(-s / 10) / 10), alpha: [0, 0, 0], beta: [0, 0, 0], gamma: [0.5, 0.5, 0.5], delta: [0, 0, 0], eps: [0, 0, 0], kappa: [0, 0, 0] },
    };
    const spec = solutionsFor("nls", 1)[0];
    const r = originalResidual("nls", spec.kind, withDefaults(spec), table, 2, coefs.values(0.8), 0.5);
    expect(r.rel).toBeGreaterThan(1e-3);
    expect(r.residual).toBeGreaterThan(0.01);
  });
  it("the KdV soliton without the B x term fails the original equation (kdv.md §7 control: residual 0.300)", () => {
    const v = variant("kdv", KDV_EXAMPLE, [0, 2]);
    const tr = buildTransformation(v);
    if (!tr.ok) throw new Error(tr.reason);
    const table: MapTable = { ...tr.table, values: { ...tr.table.values, B: tr.table.values.B.map(() => 0) }, slopes: { ...tr.table.slopes, B: tr.table.slopes.B.map(() => 0) } };
    const spec = solutionsFor("kdv", null)[0];
    const i = 102; // t = 0.796875
    const r = originalResidual("kdv", spec.kind, withDefaults(spec), table, i, coefficientSet(v).values(table.t[i]), 0.5);
    expect(r.residual).toBeGreaterThan(0.1);
  });
  it("a not-reducible variant yields no verification evidence and passed = false", () => {
    const v = variant("nls", { a: "1/2", k: "0.1", h: "1" }, [0, 1]);
    const r = verify(v);
    expect(r.passed).toBe(false);
    expect(r.residuals).toEqual([]);
  });
});
