/**
 * Resonances of the constant-coefficient equations.
 * Sources: M. J. Ablowitz, P. A. Clarkson, "Solitons, Nonlinear Evolution Equations and Inverse
 * Scattering", Cambridge Univ. Press 1991, chapter on the Painlevé tests [from memory]:
 * NLS (as the u, v = ū system) r = -1, 0, 3, 4; KdV r = -1, 4, 6; mKdV r = -1, 3, 4.
 * The KdV values also appear in J. Weiss, M. Tabor, G. Carnevale, J. Math. Phys. 24 (1983)
 * 522–526 [from memory]. The determinant formulas det M(j) = a²(j+1)j(j-3)(j-4),
 * q(j+1)(j-4)(j-6) and q(j+1)(j-3)(j-4) are derived in ../shared/math/painleve.md §2–§4.
 */
import { describe, expect, it } from "vitest";
import { runPainleve } from "../../../lib/screening/painleve";
import { variant } from "./helpers";

describe("resonances (Ablowitz & Clarkson 1991, from memory)", () => {
  it("NLS i u_t + u_xx + 2|u|²u: -1, 0, 3, 4 and det M(j) = a²(j+1)j(j-3)(j-4)", () => {
    const r = runPainleve(variant("nls", { a: "1", h: "2" }));
    expect(r.evidence.resonances).toEqual([-1, 0, 3, 4]);
    expect(r.evidence.lowest).toBe(-3);
    expect(r.evidence.exponents).toEqual({ u: "-1", v: "-1" });
    for (const d of r.evidence.jet!.points[0].branches[0].determinants) {
      const j = d.j;
      expect(d.value.re).toBeCloseTo((j + 1) * j * (j - 3) * (j - 4), 9);
      expect(Math.abs(d.value.im)).toBeLessThan(1e-9);
    }
    expect(r.verdict).toBe("passes");
  });
  it("KdV u_t + 6uu_x + u_xxx: -1, 4, 6 and det M(j) = q(j+1)(j-4)(j-6)", () => {
    const r = runPainleve(variant("kdv", { p: "6", q: "1" }));
    expect(r.evidence.resonances).toEqual([-1, 4, 6]);
    expect(r.evidence.exponents).toEqual({ u: "-2" });
    for (const d of r.evidence.jet!.points[0].branches[0].determinants) {
      expect(d.value.re).toBeCloseTo((d.j + 1) * (d.j - 4) * (d.j - 6), 9);
    }
    expect(r.verdict).toBe("passes");
  });
  it("mKdV u_t + 6u²u_x + u_xxx: -1, 3, 4 on both branches u0 = ±i", () => {
    const r = runPainleve(variant("mkdv", { p: "6", q: "1" }));
    expect(r.evidence.resonances).toEqual([-1, 3, 4]);
    const branches = r.evidence.jet!.points[0].branches;
    expect(branches).toHaveLength(2);
    for (const b of branches) {
      expect(b.resonances).toEqual([-1, 3, 4]);
      expect(Math.abs(b.leading.u.re)).toBeLessThan(1e-12);
      expect(Math.abs(Math.abs(b.leading.u.im) - 1)).toBeLessThan(1e-12); // u0 = ±sqrt(-6q/p) = ±i
      for (const d of b.determinants) expect(d.value.re).toBeCloseTo((d.j + 1) * (d.j - 3) * (d.j - 4), 9);
    }
    expect(r.verdict).toBe("passes");
  });
  it("defocusing mKdV (p/q < 0) has real branches u0 = ±1 and the same resonances", () => {
    const r = runPainleve(variant("mkdv", { p: "-6", q: "1" }));
    expect(r.evidence.resonances).toEqual([-1, 3, 4]);
    for (const b of r.evidence.jet!.points[0].branches) expect(Math.abs(Math.abs(b.leading.u.re) - 1)).toBeLessThan(1e-12);
  });
  it("variable coefficients do not move the resonances (painleve.md §2–§4)", () => {
    expect(runPainleve(variant("nls", { a: "1+0.3*sin(t)", h: "2/(1+t^2)", b: "0.1", c: "0.2" })).evidence.resonances).toEqual([-1, 0, 3, 4]);
    expect(runPainleve(variant("kdv", { p: "t", q: "t^2", r: "0.1" })).evidence.resonances).toEqual([-1, 4, 6]);
    expect(runPainleve(variant("mkdv", { p: "exp(t)", q: "1+t", s: "0.3" })).evidence.resonances).toEqual([-1, 3, 4]);
  });
});
