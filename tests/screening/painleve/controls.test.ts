/**
 * Failing controls, and their passing neighbours.
 * - KdV–Burgers u_t + uu_x + u_xxx - ν u_xx: not Painlevé for ν ≠ 0 (derived in
 *   ../shared/math/painleve.md §8 K5 and scripts/wtc_testvectors.py: C6 = (5625νψ'' + 25000ν²u4 +
 *   2ν⁶)/3125 ≠ 0).
 * - NLS with |u|⁴u: leading exponent -1/2 (painleve.md §8 leading-order controls).
 * - NLS with constant damping k ≠ 0, constant a, h: R = 4(k² - ck - ab) = 4k² ≠ 0 (nls.md §3
 *   "Constant coefficients"; references.md V7), so C4 = -2aR/(h u0) ≠ 0.
 */
import { describe, expect, it } from "vitest";
import { num } from "../../../lib/screening/expr";
import { burgersTerm, quinticTerm, runPainleve } from "../../../lib/screening/painleve";
import { expr, variant } from "./helpers";

describe("KdV–Burgers", () => {
  for (const nu of ["0.3", "0.05"]) {
    it(`ν = ${nu} fails at resonance 6`, () => {
      const r = runPainleve(variant("kdv", { p: "1", q: "1" }), { extraTerms: [burgersTerm(expr(nu))] });
      expect(r.verdict).toBe("fails");
      expect(r.reason).toMatch(/^condition at resonance 6 fails \(rho_P = /);
      expect(r.evidence.resonances).toEqual([-1, 4, 6]);
      expect(r.evidence.class).toBeNull(); // no class oracle once a term is added
    });
  }
  it("ν(t) = 0.1(1+t) already fails at resonance 4: C4 = u1' = -12ν'/5", () => {
    // Derived by hand from the recursion at j = 4 (coefficient of P^-1): the u u_x, u_xxx and
    // ν u_xx contributions cancel and only u'_1 survives; u1 = -12ν/5 from j = 1 (K5: -0.72 at ν = 0.3).
    const r = runPainleve(variant("kdv", { p: "1", q: "1" }), { extraTerms: [burgersTerm(expr("0.1*(1+t)"))] });
    expect(r.verdict).toBe("fails");
    expect(r.reason).toMatch(/^condition at resonance (4|6) fails/);
    for (const p of r.evidence.jet!.points) {
      const c4 = p.branches[0].conditions.find((c) => c.resonance === 4)!;
      expect(c4.value.re).toBeCloseTo((-12 * 0.1) / 5, 12);
      expect(Math.abs(c4.value.im)).toBeLessThan(1e-12);
    }
  });
  it("ν = 0 is the KdV itself and passes (the zero term is dropped)", () => {
    const r = runPainleve(variant("kdv", { p: "1", q: "1" }), { extraTerms: [burgersTerm(num(0))] });
    expect(r.verdict).toBe("passes");
  });
  it("C6 at t_s = 1 equals (5625νψ'' + 25000ν²u4 + 2ν⁶)/3125 (wtc_testvectors.py)", () => {
    const nu = 0.3;
    const r = runPainleve(variant("kdv", { p: "1", q: "1" }), {
      extraTerms: [burgersTerm(num(nu))],
      fixed: { points: [1], psi: [[0.3, 0.5, 0.5]], free: [[[{ re: 0.2, im: 0 }], [{ re: 0.1, im: 0 }]]] },
    });
    const c6 = r.evidence.jet!.points[0].branches[0].conditions.find((c) => c.resonance === 6)!;
    expect(c6.value.re).toBeCloseTo((5625 * nu * 1 + 25000 * nu * nu * 0.2 + 2 * nu ** 6) / 3125, 12);
  });
});

describe("quintic NLS", () => {
  for (const g of ["1", "0.01", "0.2*cos(t)"]) {
    it(`|u|⁴u with coefficient ${g} fails: non-integer leading exponent`, () => {
      const r = runPainleve(variant("nls", { a: "1", h: "2" }), { extraTerms: [quinticTerm(expr(g))] });
      expect(r.verdict).toBe("fails");
      expect(r.reason).toBe("non-integer leading exponent (alpha = -1/2)");
    });
  }
});

describe("NLS with constant damping and constant nonlinearity", () => {
  for (const [k, a, h] of [[0.1, 1, 2], [0.05, 0.5, -1], [-0.2, 2, 1]]) {
    it(`k = ${k}, a = ${a}, h = ${h}: R = 4k² and C4 = -2aR/(h u0) ≠ 0`, () => {
      const r = runPainleve(variant("nls", { a: String(a), h: String(h), k: String(k) }));
      expect(r.verdict).toBe("fails");
      expect(r.reason).toMatch(/^condition at resonance 4 fails/);
      for (const v of r.evidence.invariant!.values) expect(v.value).toBeCloseTo(4 * k * k, 14);
      for (const p of r.evidence.jet!.points) {
        for (const b of p.branches) {
          const c4 = b.conditions.find((c) => c.resonance === 4)!;
          const u0 = b.leading.u;
          const d = u0.re * u0.re + u0.im * u0.im;
          // -2a·4k²/(h u0) = -8ak²·conj(u0)/(h|u0|²)
          const s = (-8 * a * k * k) / (h * d);
          expect(Math.abs(c4.value.re - s * u0.re)).toBeLessThan(1e-12 * Math.max(1, c4.scale));
          expect(Math.abs(c4.value.im + s * u0.im)).toBeLessThan(1e-12 * Math.max(1, c4.scale));
        }
      }
    });
  }
  it("k = 0.1 with the compensating expulsive potential b = k²/a passes (wtc_verdicts case 2b)", () => {
    expect(runPainleve(variant("nls", { a: "1", h: "2", k: "0.1", b: "0.01" })).verdict).toBe("passes");
  });
  it("k = 0.1 with h = 2e^{0.2t} passes, h = 2e^{-0.2t} fails (wtc_verdicts cases 3, 3x)", () => {
    expect(runPainleve(variant("nls", { a: "1", h: "2*exp(0.2*t)", k: "0.1" })).verdict).toBe("passes");
    expect(runPainleve(variant("nls", { a: "1", h: "2*exp(-0.2*t)", k: "0.1" })).verdict).toBe("fails");
  });
});
