import { describe, it, expect } from "vitest";
import { buildTransformation, type TransformationOk } from "../../../lib/screening/transform";
import {
  buildSolutions, checkParameters, evaluateSolution, mapAt, solutionsFor, withDefaults, CATALOGUE,
} from "../../../lib/screening/solutions";
import { KDV_EXAMPLE, NLS_CASES, mkdvExample, nlsVariant, nonJsonLeaves, variant } from "../transform/fixtures";

function ok(r: ReturnType<typeof buildTransformation>): TransformationOk {
  if (!r.ok) throw new Error(r.reason);
  return r;
}

describe("mapped-back solutions at the check point u(0.5, 0.8) (nls.md §11 table)", () => {
  for (const c of NLS_CASES) {
    for (const dark of [false, true]) {
      it(`(${c.id}) ${dark ? "dark ρ = 1, ν = 1/2" : "bright η = 1, V = 1/2"}`, () => {
        const v = nlsVariant(c, dark, [0, 1.2]);
        const tr = ok(buildTransformation(v));
        const spec = solutionsFor("nls", dark ? -1 : 1)[0];
        const u = evaluateSolution(spec, tr.table, {}, 0.5, 0.8);
        const ref = dark ? c.dark! : c.bright!;
        // table values are given to 12 decimals; the map is integrated to ~1e-11
        expect(Math.hypot(u.re - ref[0], u.im - ref[1])).toBeLessThan(5e-10);
      });
    }
  }

  it("cn wave (η = 1, mJ = 0.64) mapped through (d): 0.6401892981602 + 0.0752538272752 i (nls.md §11)", () => {
    const tr = ok(buildTransformation(nlsVariant(NLS_CASES.find((c) => c.id === "d")!, false, [0, 1.2])));
    const cn = CATALOGUE.find((s) => s.id === "nls-cn")!;
    const u = evaluateSolution(cn, tr.table, { mJ: 0.64, eta: 1 }, 0.5, 0.8);
    expect(Math.abs(u.re - 0.6401892981602)).toBeLessThan(5e-12);
    expect(Math.abs(u.im - 0.0752538272752)).toBeLessThan(5e-12);
  });

  it("KdV soliton and cnoidal wave at (0.5, 0.8) (kdv.md §7 table)", () => {
    const tr = ok(buildTransformation(variant("kdv", KDV_EXAMPLE, [0, 2])));
    const [sol, cno] = solutionsFor("kdv", null);
    expect(Math.abs(evaluateSolution(sol, tr.table, {}, 0.5, 0.8).re - 0.569744519699357)).toBeLessThan(1e-10);
    expect(Math.abs(evaluateSolution(cno, tr.table, { eta: 1, mJ: 0.64, Ub: 0 }, 0.5, 0.8).re - 3.83112661581623)).toBeLessThan(1e-10);
  });

  it("mKdV soliton (σ = +1) and kink (σ = −1) at (0.5, 0.8) (mkdv.md §6 table)", () => {
    const plus = ok(buildTransformation(variant("mkdv", mkdvExample(1), [0, 2])));
    const minus = ok(buildTransformation(variant("mkdv", mkdvExample(-1), [0, 2])));
    expect(Math.abs(evaluateSolution(solutionsFor("mkdv", 1)[0], plus.table, {}, 0.5, 0.8).re - 0.712249253409969)).toBeLessThan(1e-10);
    expect(Math.abs(evaluateSolution(solutionsFor("mkdv", -1)[0], minus.table, {}, 0.5, 0.8).re - 0.768128726064296)).toBeLessThan(1e-10);
  });

  it("control: the same KdV soliton without the B x term differs by 0.300 at (0.5, 0.8) (kdv.md §7 control, there as a residual)", () => {
    const tr = ok(buildTransformation(variant("kdv", KDV_EXAMPLE, [0, 2])));
    const m = mapAt(tr.table, 0.8);
    expect(Math.abs(m.B * 0.5 - 0.1)).toBeLessThan(1e-12); // B = 1/5 exactly
  });
});

describe("buildSolutions", () => {
  it("offers bright, dn, cn for sigma = +1 and dark, sn for sigma = −1 (nls.md §8), each with named parameters, defaults and ranges", () => {
    const plus = nlsVariant(NLS_CASES[0], false, [0, 1]);
    const minus = nlsVariant(NLS_CASES[0], true, [0, 1]);
    const sp = buildSolutions(plus, buildTransformation(plus));
    const sm = buildSolutions(minus, buildTransformation(minus));
    expect(sp.ok && sp.solutions.map((s) => s.id)).toEqual(["nls-bright", "nls-dn", "nls-cn"]);
    expect(sm.ok && sm.solutions.map((s) => s.id)).toEqual(["nls-dark", "nls-sn"]);
    if (!sp.ok) return;
    for (const s of sp.solutions) {
      for (const p of s.parameters) {
        expect(p.min).toBeLessThan(p.max);
        expect(checkParameters(s, withDefaults(s))).toEqual([]);
      }
    }
    expect(checkParameters(sp.solutions[1], withDefaults(sp.solutions[1], { mJ: 1 }))).toHaveLength(1);
  });

  it("stores a ≤ 64 × 64 |u|² grid and check points; everything JSON-safe", () => {
    const v = nlsVariant(NLS_CASES.find((c) => c.id === "k2")!, false, [0, 3]);
    const tr = ok(buildTransformation(v));
    const s = buildSolutions(v, tr);
    expect(s.ok).toBe(true);
    if (!s.ok || !s.plot) return;
    expect(s.plot.t.length).toBeLessThanOrEqual(64);
    expect(s.plot.x.length).toBeLessThanOrEqual(64);
    expect(s.plot.values.length).toBe(s.plot.t.length);
    // the soliton is inside the frame: the peak |u|² over the first row equals (A η)² at t0
    const peak = Math.max(...s.plot.values[0].map((v) => v ?? 0));
    expect(peak).toBeGreaterThan(0.8);
    expect(peak).toBeLessThanOrEqual(1 + 1e-12);
    expect(nonJsonLeaves(s)).toEqual([]);
    expect(s.checkPoints.length).toBe(3);
  });

  it("a not-reducible member gets no solutions and says why", () => {
    const v = variant("nls", { a: "1/2", k: "0.1", h: "1" }, [0, 1]);
    const s = buildSolutions(v, buildTransformation(v));
    expect(s.ok).toBe(false);
    if (!s.ok) expect(s.reason).toMatch(/not zero/);
  });

  it("evaluateSolution re-evaluates with user parameters and is NaN outside the map window", () => {
    const v = nlsVariant(NLS_CASES[0], false, [0, 1]);
    const tr = ok(buildTransformation(v));
    const spec = solutionsFor("nls", 1)[0];
    // (a) is the identity map with gamma = t/2: u(x, t) = chi(x, t/2); η = 2 peak at x = 2V γ
    const u = evaluateSolution(spec, tr.table, { eta: 2, V: 0 }, 0, 0.6);
    expect(Math.abs(Math.hypot(u.re, u.im) - 2)).toBeLessThan(1e-12);
    const out = evaluateSolution(spec, tr.table, {}, 0, 1.5);
    expect(Number.isNaN(out.re)).toBe(true);
  });
});
