import { describe, it, expect } from "vitest";
import { ellipticK, ellipticE, jacobiElliptic, jacobiEllipticJet } from "../../../lib/screening/special";

const rel = (a: number, b: number) => Math.abs(a - b) / Math.max(1, Math.abs(b));

describe("complete elliptic integrals K(m), E(m)", () => {
  // Abramowitz & Stegun, Handbook of Mathematical Functions, 1964, Table 17.1 (argument: modular
  // angle α, m = sin²α), 10 decimals. Values from memory; they agree with scipy.special.ellipk/ellipe.
  const table171: [number, number, number][] = [
    [10, 1.5828428043, 1.5588871966],
    [30, 1.6857503548, 1.4674622093],
    [45, 1.8540746773, 1.350643881],
    [60, 2.1565156475, 1.2110560276],
  ];
  it.each(table171)("A&S Table 17.1, α = %i°", (alphaDeg, K, E) => {
    const m = Math.sin((alphaDeg * Math.PI) / 180) ** 2;
    expect(Math.abs(ellipticK(m) - K)).toBeLessThan(6e-11);
    expect(Math.abs(ellipticE(m) - E)).toBeLessThan(6e-11);
  });

  // Computed with scipy.special.ellipk/ellipe and mpmath (30 digits), see
  // ../shared/math/scripts/spec_output_refvalues.txt (references.md §E).
  const ref: [number, number, number][] = [
    [0, 1.570796326794897, 1.570796326794897],
    [0.25, 1.685750354812596, 1.467462209339427],
    [0.5, 1.854074677301372, 1.350643881047676],
    [0.64, 1.995302777664729, 1.276349943169907],
    [0.9, 2.578092113348173, 1.104774732704073],
    [0.99, 3.695637362989875, 1.015993545025224],
  ];
  it.each(ref)("reference library values at m = %f", (m, K, E) => {
    expect(rel(ellipticK(m), K)).toBeLessThan(2e-15);
    expect(rel(ellipticE(m), E)).toBeLessThan(2e-15);
  });

  it("K(1/2) = Γ(1/4)²/(4√π) (lemniscatic case; A&S 17.3.? — closed form from memory)", () => {
    const gammaQuarter = 3.6256099082219083119; // Γ(1/4), A&S Table 6.1 (from memory)
    expect(rel(ellipticK(0.5), gammaQuarter ** 2 / (4 * Math.sqrt(Math.PI)))).toBeLessThan(2e-15);
  });

  it("Legendre relation E K' + E' K − K K' = π/2 (A&S 17.3.13; DLMF 19.7.1)", () => {
    for (const m of [0.1, 0.3, 0.5, 0.77]) {
      const K = ellipticK(m);
      const E = ellipticE(m);
      const Kp = ellipticK(1 - m);
      const Ep = ellipticE(1 - m);
      expect(Math.abs(E * Kp + Ep * K - K * Kp - Math.PI / 2)).toBeLessThan(4e-15);
    }
  });

  it("limits K(0) = E(0) = π/2, E(1) = 1, K(1) = ∞ (A&S 17.3.11–12)", () => {
    expect(ellipticK(0)).toBe(Math.PI / 2);
    expect(ellipticE(0)).toBe(Math.PI / 2);
    expect(ellipticE(1)).toBe(1);
    expect(ellipticK(1)).toBe(Infinity);
  });
});

describe("Jacobi elliptic functions sn, cn, dn (parameter mJ, A&S ch. 16)", () => {
  // Computed with scipy.special.ellipj / mpmath, see ../shared/math/scripts (spec_output_refvalues.txt).
  const ref: [number, number, number, number, number][] = [
    [0.5, 0.64, 0.4683288353882146, 0.8835542439171002, 0.9271610352274884],
    [1, 0.25, 0.8226355781298623, 0.5685689980951715, 0.9114920056691319],
    [0.3, 0.9, 0.2917320478186185, 0.9565000848277826, 0.9609386926583817],
    [2, 0.5, 0.9946623253580177, -0.1031836155277618, 0.7108610477840873],
  ];
  it.each(ref)("reference library values at z = %f, m = %f", (z, m, sn, cn, dn) => {
    const v = jacobiElliptic(z, m);
    expect(Math.abs(v.sn - sn)).toBeLessThan(2e-15);
    expect(Math.abs(v.cn - cn)).toBeLessThan(2e-15);
    expect(Math.abs(v.dn - dn)).toBeLessThan(2e-15);
  });

  it("special arguments z = K/2 and z = K (A&S 16.5, table of special values; from memory)", () => {
    for (const m of [0.1, 0.36, 0.64, 0.95]) {
      const K = ellipticK(m);
      const kp = Math.sqrt(1 - m); // complementary modulus k'
      const half = jacobiElliptic(K / 2, m);
      expect(Math.abs(half.sn - 1 / Math.sqrt(1 + kp))).toBeLessThan(3e-15);
      expect(Math.abs(half.cn - Math.sqrt(kp) / Math.sqrt(1 + kp))).toBeLessThan(3e-15);
      expect(Math.abs(half.dn - Math.sqrt(kp))).toBeLessThan(3e-15);
      const full = jacobiElliptic(K, m);
      expect(Math.abs(full.sn - 1)).toBeLessThan(3e-15);
      expect(Math.abs(full.cn)).toBeLessThan(3e-15);
      expect(Math.abs(full.dn - kp)).toBeLessThan(3e-15);
    }
  });

  it("periods 4K (sn, cn) and 2K (dn), oddness of sn (A&S 16.2, 16.8)", () => {
    const m = 0.64;
    const K = ellipticK(m);
    for (const z of [-3.1, -0.4, 0.7, 5.2]) {
      const a = jacobiElliptic(z, m);
      const b = jacobiElliptic(z + 4 * K, m);
      const c = jacobiElliptic(z + 2 * K, m);
      const d = jacobiElliptic(-z, m);
      expect(Math.abs(a.sn - b.sn)).toBeLessThan(1e-14);
      expect(Math.abs(a.cn - b.cn)).toBeLessThan(1e-14);
      expect(Math.abs(a.dn - c.dn)).toBeLessThan(1e-14);
      expect(Math.abs(a.sn + d.sn)).toBeLessThan(1e-15);
      expect(Math.abs(a.cn - d.cn)).toBeLessThan(1e-15);
    }
  });

  it("limits m → 0 (sin, cos, 1) and m → 1 (tanh, sech, sech) (A&S 16.6; NAG s21cbc doc)", () => {
    const z = 0.7;
    const m0 = jacobiElliptic(z, 1e-14);
    expect(Math.abs(m0.sn - Math.sin(z))).toBeLessThan(1e-14);
    expect(Math.abs(m0.cn - Math.cos(z))).toBeLessThan(1e-14);
    const m1 = jacobiElliptic(z, 1 - 1e-12);
    // ../shared/math/nls.md §8 measured |dn − sech| = 2e-13 at mJ = 1 − 1e-12
    expect(Math.abs(m1.dn - 1 / Math.cosh(z))).toBeLessThan(1e-12);
    expect(Math.abs(m1.sn - Math.tanh(z))).toBeLessThan(1e-12);
  });

  it("identities sn² + cn² = 1, dn² + m sn² = 1 (A&S 16.9.1)", () => {
    for (const m of [0.2, 0.5, 0.99]) {
      for (const z of [-2, 0.1, 1.3, 4.4]) {
        const v = jacobiElliptic(z, m);
        expect(Math.abs(v.sn ** 2 + v.cn ** 2 - 1)).toBeLessThan(4e-16);
        expect(Math.abs(v.dn ** 2 + m * v.sn ** 2 - 1)).toBeLessThan(4e-16);
      }
    }
  });

  it("jets: Taylor coefficients match central differences of the functions (A&S 16.16 derivatives)", () => {
    const m = 0.64;
    const z0 = 0.5;
    const jet = jacobiEllipticJet([z0, 1, 0, 0], m);
    const h = 1e-3;
    const f = (z: number) => jacobiElliptic(z, m);
    const d2 = (g: (z: number) => number) => (g(z0 + h) - 2 * g(z0) + g(z0 - h)) / (h * h);
    // second coefficient = f''/2; analytic sn'' = −sn(dn² + m cn²)
    const v = f(z0);
    expect(Math.abs(2 * jet.sn[2] - -v.sn * (v.dn ** 2 + m * v.cn ** 2))).toBeLessThan(1e-14);
    expect(Math.abs(2 * jet.cn[2] - d2((z) => f(z).cn))).toBeLessThan(1e-6);
    expect(Math.abs(2 * jet.dn[2] - d2((z) => f(z).dn))).toBeLessThan(1e-6);
    expect(Math.abs(jet.sn[1] - v.cn * v.dn)).toBeLessThan(1e-16);
  });
});
