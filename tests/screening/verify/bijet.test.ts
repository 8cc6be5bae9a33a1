import { describe, it, expect } from "vitest";
import { bijetDerivative, bijetOfT, bijetOps, bijetX } from "../../../lib/screening/verify";

// Exact derivatives by hand (calculus): f(x, t) = exp(x t) sin(x + t²), at (0.3, 0.7).
describe("bivariate Taylor series (bijets)", () => {
  const o = bijetOps(3, 2);
  const x = bijetX(0.3, 3, 2);
  const t = bijetOfT([0.7, 1, 0], 3, 2);
  it("exp(x t) sin(x + t²): f_x, f_t, f_xx, f_xt, f_tt, f_xxx against hand-derived formulas", () => {
    const f = o.mul(o.exp(o.mul(x, t)), o.sin(o.add(x, o.mul(t, t))));
    const X = 0.3;
    const T = 0.7;
    const E = Math.exp(X * T);
    const s = Math.sin(X + T * T);
    const c = Math.cos(X + T * T);
    expect(Math.abs(bijetDerivative(f, 0, 0) - E * s)).toBeLessThan(1e-15);
    expect(Math.abs(bijetDerivative(f, 1, 0) - E * (T * s + c))).toBeLessThan(1e-15);
    expect(Math.abs(bijetDerivative(f, 0, 1) - E * (X * s + 2 * T * c))).toBeLessThan(1e-15);
    expect(Math.abs(bijetDerivative(f, 2, 0) - E * (T * T * s + 2 * T * c - s))).toBeLessThan(1e-14);
    // f_xt = E[(1 + X T) s + X c + 2T(T s + c) ... ] computed as d/dt of E(T s + c)
    const fxt = E * X * (T * s + c) + E * (s + T * 2 * T * c - 2 * T * s);
    expect(Math.abs(bijetDerivative(f, 1, 1) - fxt)).toBeLessThan(1e-14);
    // f_tt = d/dt E(X s + 2T c) = E X (X s + 2T c) + E(2 X T c + 2c − 4T² s)
    const ftt = E * X * (X * s + 2 * T * c) + E * (2 * X * T * c + 2 * c - 4 * T * T * s);
    expect(Math.abs(bijetDerivative(f, 0, 2) - ftt)).toBeLessThan(1e-14);
    // f_xxx = E(T³ s + 3T² c − 3T s − c)
    expect(Math.abs(bijetDerivative(f, 3, 0) - E * (T ** 3 * s + 3 * T * T * c - 3 * T * s - c))).toBeLessThan(1e-14);
  });
  it("division, sech, tanh: d/dx of sech(x)/x and tanh'' (sech' = −sech tanh, tanh' = sech²)", () => {
    const o1 = bijetOps(2, 1);
    const xv = bijetX(0.8, 2, 1);
    const g = o1.div(o1.sech(xv), xv);
    const S = 1 / Math.cosh(0.8);
    const Th = Math.tanh(0.8);
    expect(Math.abs(bijetDerivative(g, 1, 0) - (-S * Th / 0.8 - S / 0.64))).toBeLessThan(1e-15);
    const th = o1.tanh(xv);
    expect(Math.abs(bijetDerivative(th, 2, 0) - -2 * S * S * Th)).toBeLessThan(1e-15);
  });
  it("Jacobi functions: (sn)'' = −sn(dn² + m cn²) (A&S 16.16 chain rule)", () => {
    const o1 = bijetOps(2, 1);
    const z = bijetX(0.5, 2, 1);
    const w = o1.jacobi(z, 0.64);
    const sn = bijetDerivative(w.sn, 0, 0);
    const cn = bijetDerivative(w.cn, 0, 0);
    const dn = bijetDerivative(w.dn, 0, 0);
    expect(Math.abs(bijetDerivative(w.sn, 2, 0) + sn * (dn * dn + 0.64 * cn * cn))).toBeLessThan(1e-15);
    expect(Math.abs(bijetDerivative(w.dn, 1, 0) + 0.64 * sn * cn)).toBeLessThan(1e-15);
  });
  it("cos and sin of a large argument keep their derivatives accurate (regression: θ + kπ/2 rounding at θ ~ 1e8)", () => {
    const o1 = bijetOps(2, 1);
    const th = bijetX(1e8 + 0.3, 2, 1);
    const c = o1.cos(th);
    const X = 1e8 + 0.3;
    expect(Math.abs(bijetDerivative(c, 1, 0) + Math.sin(X))).toBeLessThan(1e-15);
    expect(Math.abs(bijetDerivative(c, 2, 0) + Math.cos(X))).toBeLessThan(1e-15);
  });
});
