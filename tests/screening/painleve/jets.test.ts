/**
 * Complex jets and BiSeries (../shared/math/painleve.md §5). References: mathjs complex
 * arithmetic (a general reference library) for products and quotients; closed-form Taylor series
 * (geometric series, binomial theorem) for the recurrences; hand expansion for the P-series rules.
 */
import { describe, expect, it } from "vitest";
import { complex as mComplex, add as mAdd, multiply as mMul, type Complex as MComplex } from "mathjs";
import { decimalField } from "../../../lib/screening/expr";
import { doubleJets, type DoubleJet } from "../../../lib/screening/painleve/double-jets";
import { fieldJets } from "../../../lib/screening/painleve/field-jets";
import { ZeroPivotError } from "../../../lib/screening/painleve/jet-algebra";
import { biMul, dP, dT, fromJet, type BiSeries } from "../../../lib/screening/painleve/biseries";
import { createRng } from "../../../lib/screening/random";

const N = 7;
const alg = doubleJets(N);
const rng = createRng(42);
const randomJet = (): DoubleJet =>
  alg.fromDoubles(Array.from({ length: N }, () => rng.normal()), Array.from({ length: N }, () => rng.normal()));
const toMath = (j: DoubleJet): MComplex[] => Array.from({ length: N }, (_, m) => mComplex(j.re[m], j.im[m]));

describe("double complex jets", () => {
  it("mul is the truncated Cauchy product (checked against mathjs complex arithmetic)", () => {
    for (let trial = 0; trial < 20; trial++) {
      const a = randomJet(), b = randomJet();
      const p = alg.mul(a, b);
      const A = toMath(a), B = toMath(b);
      for (let n = 0; n < N; n++) {
        let s: MComplex = mComplex(0, 0);
        for (let k = 0; k <= n; k++) s = mAdd(s, mMul(A[k], B[n - k]) as MComplex) as MComplex;
        expect(Math.abs(p.re[n] - s.re)).toBeLessThan(1e-12);
        expect(Math.abs(p.im[n] - s.im)).toBeLessThan(1e-12);
      }
    }
  });
  it("div inverts mul: (a·b)/b = a", () => {
    for (let trial = 0; trial < 20; trial++) {
      const a = randomJet(), b = randomJet();
      const q = alg.div(alg.mul(a, b), b);
      for (let n = 0; n < N; n++) {
        expect(Math.abs(q.re[n] - a.re[n])).toBeLessThan(1e-9);
        expect(Math.abs(q.im[n] - a.im[n])).toBeLessThan(1e-9);
      }
    }
  });
  it("1/(1 - iτ) = Σ (iτ)^n (geometric series)", () => {
    const q = alg.div(alg.constant(1, 0), alg.fromDoubles([1], [0, -1]));
    const expected = [[1, 0], [0, 1], [-1, 0], [0, -1], [1, 0], [0, 1], [-1, 0]];
    expected.forEach(([re, im], n) => {
      expect(q.re[n]).toBeCloseTo(re, 15);
      expect(q.im[n]).toBeCloseTo(im, 15);
    });
  });
  it("(1 + τ)^3 by repeated mul (binomial coefficients 1, 3, 3, 1)", () => {
    const x = alg.fromDoubles([1, 1], []);
    const c = alg.mul(alg.mul(x, x), x);
    expect(Array.from(c.re)).toEqual([1, 3, 3, 1, 0, 0, 0]);
  });
  it("valid: mul/add take the minimum, d/dτ loses one order and shifts (m+1)c_{m+1}", () => {
    const a = alg.fromDoubles([1, 2, 3, 4, 5, 6, 7], []);
    const d = alg.dtau(a);
    expect(d.valid).toBe(N - 1);
    expect(Array.from(d.re)).toEqual([2, 6, 12, 20, 30, 42, 0]);
    const t = alg.truncate(a, 3);
    expect(alg.mul(t, a).valid).toBe(3);
    expect(alg.add(d, a).valid).toBe(N - 1);
    expect(Array.from(alg.mul(t, a).re).slice(3)).toEqual([0, 0, 0, 0]);
  });
  it("division by a jet with zero leading coefficient throws ZeroPivotError", () => {
    expect(() => alg.div(alg.constant(1, 0), alg.fromDoubles([0, 1], []))).toThrow(ZeroPivotError);
  });
  it("roots of unity are exact at multiples of π/2", () => {
    expect(alg.coefficient(alg.rootOfUnity(1, 4), 0)).toEqual({ re: 0, im: 1 });
    expect(alg.coefficient(alg.rootOfUnity(-1, 2), 0)).toEqual({ re: -1, im: 0 });
    const w = alg.coefficient(alg.rootOfUnity(1, 3), 0);
    expect(w.re).toBeCloseTo(-0.5, 15);
    expect(w.im).toBeCloseTo(Math.sqrt(3) / 2, 15);
  });
});

describe("decimal complex jets agree with double jets", () => {
  it("mul, div, dtau, scale at 40 digits match double to rounding", () => {
    const F = decimalField(40);
    const hp = fieldJets(N, F, 5e-40);
    for (let trial = 0; trial < 5; trial++) {
      const a = randomJet(), b = randomJet();
      const A = hp.fromDoubles(a.re, a.im), B = hp.fromDoubles(b.re, b.im);
      const pairs: [DoubleJet, ReturnType<typeof hp.mul>][] = [
        [alg.mul(a, b), hp.mul(A, B)],
        [alg.div(a, b), hp.div(A, B)],
        [alg.dtau(a), hp.dtau(A)],
        [alg.scale(a, 2, -3), hp.scale(A, 2, -3)],
      ];
      for (const [d, x] of pairs) {
        expect(hp.valid(x)).toBe(d.valid);
        for (let m = 0; m < d.valid; m++) {
          const z = hp.coefficient(x, m);
          expect(Math.abs(z.re - d.re[m])).toBeLessThan(1e-10 * Math.max(1, Math.abs(z.re)));
          expect(Math.abs(z.im - d.im[m])).toBeLessThan(1e-10 * Math.max(1, Math.abs(z.im)));
        }
      }
    }
  });
  it("the cube root of unity at 40 digits: w³ = 1 to ~1e-39", () => {
    const hp = fieldJets(3, decimalField(40), 5e-40);
    const w = hp.rootOfUnity(1, 3);
    const c = hp.coefficient(hp.sub(hp.mul(hp.mul(w, w), w), hp.constant(1, 0)), 0);
    expect(Math.hypot(c.re, c.im)).toBeLessThan(1e-38);
  });
});

describe("BiSeries (painleve.md §5)", () => {
  // ψ(t_s + τ) = 0.3 + 0.5τ + 0.5τ² as in painleve.md §8.
  const psi = alg.fromDoubles([0.3, 0.5, 0.5], []);
  const x: BiSeries<DoubleJet> = { lo: 0, rows: [alg.neg(psi), alg.constant(1, 0)], exact: true };
  it("x² = (P - ψ)² = ψ² - 2ψ P + P² (exact)", () => {
    const x2 = biMul(alg, x, x);
    expect(x2.exact).toBe(true);
    expect(x2.rows).toHaveLength(3);
    const psi2 = alg.mul(psi, psi);
    expect(Array.from(x2.rows[0].re)).toEqual(Array.from(psi2.re));
    expect(Array.from(x2.rows[1].re, (v) => v + 0)).toEqual(Array.from(alg.scale(psi, -2, 0).re, (v) => v + 0));
    expect(x2.rows[2].re[0]).toBe(1);
  });
  it("∂_P multiplies row k by lo + k; D_t(u0 P^-2) = u0' P^-2 - 2ψ' u0 P^-3", () => {
    const u0 = alg.fromDoubles([2, 1], []);
    const u: BiSeries<DoubleJet> = { lo: -2, rows: [u0], exact: false };
    const ux = dP(alg, u);
    expect(ux.lo).toBe(-3);
    expect(Array.from(ux.rows[0].re).slice(0, 2)).toEqual([-4, -2]);
    const ut = dT(alg, u, fromJet(alg.dtau(psi)));
    expect(ut.lo).toBe(-3);
    // hi drops by one (the ψ'∂_P part), so only the P^-3 row is known.
    expect(ut.rows).toHaveLength(1);
    // -2ψ'u0 with ψ' = 0.5 + τ, u0 = 2 + τ: -2(1 + 2.5τ + τ²) = -2 - 5τ - 2τ²
    expect(ut.rows[0].re[0]).toBeCloseTo(-2, 14);
    expect(ut.rows[0].re[1]).toBeCloseTo(-5, 14);
    expect(ut.rows[0].re[2]).toBeCloseTo(-2, 14);
  });
  it("a product of inexact series is known up to min(hi_a + lo_b, hi_b + lo_a)", () => {
    const a: BiSeries<DoubleJet> = { lo: -1, rows: [alg.constant(1, 0), alg.constant(2, 0), alg.constant(3, 0)], exact: false };
    const b: BiSeries<DoubleJet> = { lo: -2, rows: [alg.constant(1, 0), alg.constant(1, 0)], exact: false };
    const p = biMul(alg, a, b);
    expect(p.lo).toBe(-3);
    expect(p.rows).toHaveLength(2); // hi = min(1 - 2, -1 - 1) = -2
    expect(p.rows[1].re[0]).toBe(3); // 1·1 + 2·1
  });
});
