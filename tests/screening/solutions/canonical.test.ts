import { describe, it, expect } from "vitest";
import { CATALOGUE, canonicalKdv, canonicalMkdv, canonicalNls, numberOps, withDefaults } from "../../../lib/screening/solutions";
import { canonicalResidual } from "../../../lib/screening/verify";
import { ellipticK } from "../../../lib/screening/special";

const o = numberOps;
const sech = (x: number) => 1 / Math.cosh(x);

describe("canonical formulas against textbook expressions", () => {
  it("NLS bright soliton: χ = η sech(η(ξ − 2Vτ − ξ0)) e^{i(Vξ + (η² − V²)τ + φ0)} (Ablowitz & Segur, Solitons and the IST, SIAM 1981 [from memory]; i χ_τ + χ_ξξ + 2|χ|²χ = 0, same convention)", () => {
    const p = { eta: 1.3, V: -0.4, xi0: 0.2, phi0: 0.7 };
    for (const [xi, tau] of [[0.5, 0.3], [-1.2, 0.8], [2.0, -0.5]]) {
      const chi = canonicalNls(o, "nls-bright", p, xi, tau);
      const amp = p.eta * sech(p.eta * (xi - 2 * p.V * tau - p.xi0));
      const ph = p.V * xi + (p.eta ** 2 - p.V ** 2) * tau + p.phi0;
      expect(Math.abs(chi.re - amp * Math.cos(ph))).toBeLessThan(1e-15);
      expect(Math.abs(chi.im - amp * Math.sin(ph))).toBeLessThan(1e-15);
    }
  });

  it("KdV soliton U = 2κ² sech²(κ(X − 4κ²T)) (Drazin & Johnson, Solitons: an Introduction, 1989, ch. 1–2 [from memory]; their u_t − 6uu_x + u_xxx = 0 with u = −U)", () => {
    const kappa = 0.9;
    for (const [X, T] of [[0.1, 0.2], [1.5, -0.3]]) {
      const U = canonicalKdv(o, "kdv-soliton", { eta: kappa, X0: 0 }, X, T);
      expect(Math.abs(U - 2 * kappa ** 2 * sech(kappa * (X - 4 * kappa ** 2 * T)) ** 2)).toBeLessThan(1e-15);
    }
  });

  it("mKdV soliton U = η sech(η(X − η²T)) of U_T + 6U²U_X + U_XXX = 0 (Wadati, J. Phys. Soc. Jpn. 34 (1973) 1289 [from memory])", () => {
    const U = canonicalMkdv(o, "mkdv-soliton", { eta: 1.1, X0: 0 }, 0.4, 0.3);
    expect(Math.abs(U - 1.1 * sech(1.1 * (0.4 - 1.21 * 0.3)))).toBeLessThan(1e-15);
  });

  // nls.md §8 check values at ξ = 0.5, τ = 0.3 (mpmath and scipy agree to < 1e-14).
  const CHECK: [string, Record<string, number>, number, number][] = [
    ["nls-dn", { eta: 1, mJ: 0.64, V: 0, xi0: 0, phi0: 0 }, 0.851056140456117, 0.367873661786278],
    ["nls-cn", { eta: 1, mJ: 0.64, V: 0, xi0: 0, phi0: 0 }, 0.70435111761199, 0.059305045003342],
    ["nls-sn", { eta: 1, mJ: 0.64, V: 0, xi0: 0, phi0: 0 }, 0.330224222879778, -0.176986941267819],
    ["nls-bright", { eta: 1, V: 0.5, xi0: 0, phi0: 0 }, 0.871798553108869, 0.448341684168893],
    ["nls-dark", { rho: 1, nu: 0.5, xi0: 0, phi0: 0 }, 0.40489825332458, 0.328808358523554],
  ];
  it.each(CHECK)("nls.md §8 check value of %s at (0.5, 0.3)", (kind, p, re, im) => {
    const chi = canonicalNls(o, kind as "nls-dn", p, 0.5, 0.3);
    expect(Math.abs(chi.re - re)).toBeLessThan(2e-14);
    expect(Math.abs(chi.im - im)).toBeLessThan(2e-14);
  });

  it("mJ → 1: dn and cn waves tend to the bright soliton with V = 0 (nls.md §8 limits: |dn − sech| = 2e-13 at 1 − 1e-12)", () => {
    const p = { eta: 1, mJ: 1 - 1e-12, V: 0, xi0: 0, phi0: 0 };
    const b = canonicalNls(o, "nls-bright", { eta: 1, V: 0, xi0: 0, phi0: 0 }, 0.7, 0.2);
    for (const kind of ["nls-dn", "nls-cn"] as const) {
      const w = canonicalNls(o, kind, p, 0.7, 0.2);
      expect(Math.hypot(w.re - b.re, w.im - b.im)).toBeLessThan(1e-11);
    }
  });

  it("KdV cnoidal wave: period 2K(mJ)/η in X; zero mean at Ub = −2η²(E/K − 1 + mJ) is not needed here (kdv.md §5)", () => {
    const p = { eta: 1.2, mJ: 0.64, Ub: 0.1, X0: 0 };
    const L = (2 * ellipticK(0.64)) / 1.2;
    const a = canonicalKdv(o, "kdv-cnoidal", p, 0.3, 0.5);
    const b = canonicalKdv(o, "kdv-cnoidal", p, 0.3 + L, 0.5);
    expect(Math.abs(a - b)).toBeLessThan(1e-13);
  });
});

describe("canonical solutions satisfy the canonical equations to 1e-12 (bivariate Taylor jets)", () => {
  const points = [[-2.1, -0.4], [-0.6, 0.1], [0, 0], [0.5, 0.3], [1.7, 0.9], [3.2, -1.3]];
  const variants: Record<string, Record<string, number>[]> = {
    "nls-bright": [{}, { eta: 2.2, V: -1.1, xi0: 0.4, phi0: 1 }],
    "nls-dark": [{}, { rho: 1.7, nu: -0.8, xi0: -0.3, phi0: 2 }, { rho: 0.6, nu: 0, xi0: 0, phi0: 0 }],
    "nls-dn": [{}, { eta: 1.5, mJ: 0.3, V: 0.7, xi0: 0.1, phi0: 0.2 }],
    "nls-cn": [{}, { eta: 0.8, mJ: 0.95, V: -0.4, xi0: 0, phi0: 0 }],
    "nls-sn": [{}, { eta: 1.4, mJ: 0.1, V: 0.3, xi0: 0, phi0: 0 }],
    "kdv-soliton": [{}, { eta: 1.6, X0: 0.5 }],
    "kdv-cnoidal": [{}, { eta: 1.1, mJ: 0.3, Ub: -0.7, X0: 0.2 }],
    "mkdv-soliton": [{}, { eta: 1.9, X0: -0.4 }],
    "mkdv-kink": [{}, { eta: 0.7, X0: 1 }],
  };
  for (const spec of CATALOGUE) {
    it(`${spec.id} (sigma = ${spec.sigma ?? "—"}; nls.md §8, kdv.md §5, mkdv.md §5)`, () => {
      for (const override of variants[spec.id]) {
        const p = withDefaults(spec, override);
        let nonTrivial = 0;
        for (const [xi, tau] of points) {
          const r = canonicalResidual(spec.kind, p, spec.sigma, xi, tau);
          expect(r.rel).toBeLessThan(1e-12);
          if (r.scale > 1e-3) nonTrivial++; // at a symmetric centre every term can vanish
        }
        expect(nonTrivial).toBeGreaterThan(3);
      }
    });
  }

  it("control: the bright soliton does not solve the defocusing equation (residual O(1))", () => {
    const spec = CATALOGUE.find((s) => s.id === "nls-bright")!;
    const r = canonicalResidual("nls-bright", withDefaults(spec), -1, 0.2, 0.1);
    expect(r.rel).toBeGreaterThan(0.1);
  });
});
