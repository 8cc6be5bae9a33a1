/**
 * Polynomial roots and interpolation used for the leading order and det M(j)
 * (../shared/math/painleve.md §6 Steps 3–4). Reference: polynomials with known roots (built from
 * their factors) and mathjs polynomialRoot (general reference library) on a cubic.
 */
import { describe, expect, it } from "vitest";
import { polynomialRoot } from "mathjs";
import { interpolate, polynomialRoots } from "../../../lib/screening/painleve/polynomial";
import type { Complex } from "../../../lib/screening/painleve";

const c = (re: number, im = 0): Complex => ({ re, im });
/** Ascending coefficients of Π (z - r). */
function fromRoots(roots: Complex[]): Complex[] {
  let p: Complex[] = [c(1)];
  for (const r of roots) {
    const next = Array.from({ length: p.length + 1 }, () => c(0));
    p.forEach((a, i) => {
      next[i + 1] = c(next[i + 1].re + a.re, next[i + 1].im + a.im);
      next[i] = c(next[i].re - (a.re * r.re - a.im * r.im), next[i].im - (a.re * r.im + a.im * r.re));
    });
    p = next;
  }
  return p;
}
const sortKey = (z: Complex) => z.re * 1000 + z.im;
function expectRoots(found: Complex[], expected: Complex[], tol: number) {
  const f = [...found].sort((a, b) => sortKey(a) - sortKey(b));
  const e = [...expected].sort((a, b) => sortKey(a) - sortKey(b));
  expect(f).toHaveLength(e.length);
  f.forEach((z, i) => expect(Math.hypot(z.re - e[i].re, z.im - e[i].im)).toBeLessThan(tol));
}

describe("polynomialRoots", () => {
  it("the NLS resonance polynomial (j+1) j (j-3)(j-4) (painleve.md §2)", () => {
    const roots = [c(-1), c(0), c(3), c(4)];
    expectRoots(polynomialRoots(fromRoots(roots)), roots, 1e-12);
  });
  it("complex roots, degree 5", () => {
    const roots = [c(1, 2), c(1, -2), c(-0.5, 0.25), c(3), c(0, -1)];
    expectRoots(polynomialRoots(fromRoots(roots)), roots, 1e-10);
  });
  it("quadratic without cancellation: roots 1e-8 and 1e8", () => {
    expectRoots(polynomialRoots(fromRoots([c(1e-8), c(1e8)])), [c(1e-8), c(1e8)], 1e-6);
    const small = polynomialRoots(fromRoots([c(1e-8), c(1e8)])).find((z) => Math.abs(z.re) < 1);
    expect(Math.abs(small!.re - 1e-8)).toBeLessThan(1e-20);
  });
  it("exact zero coefficients: z³ - z gives 0 and ±1 (mKdV-like leading polynomial)", () => {
    expectRoots(polynomialRoots([c(0), c(-1), c(0), c(1)]), [c(0), c(1), c(-1)], 1e-14);
  });
  it("agrees with mathjs polynomialRoot on a cubic", () => {
    // mathjs takes ascending coefficients: 6 - 11x + 6x² - x³ → roots 1, 2, 3.
    const ref = polynomialRoot(-6, 11, -6, 1).map((z) => (typeof z === "number" ? c(z) : c(z.re, z.im)));
    expectRoots(polynomialRoots([c(-6), c(11), c(-6), c(1)]), ref, 1e-10);
  });
});

describe("interpolate", () => {
  it("recovers q (j+1)(j-4)(j-6) from j = 1..4 (the KdV det M(j), painleve.md §3)", () => {
    const q = 1.7;
    const js = [1, 2, 3, 4];
    const ys = js.map((j) => c(q * (j + 1) * (j - 4) * (j - 6)));
    const p = interpolate(js, ys);
    const expected = [24 * q, 14 * q, -9 * q, q]; // q(j³ - 9j² + 14j + 24)
    p.forEach((z, i) => expect(z.re).toBeCloseTo(expected[i], 11));
  });
});
