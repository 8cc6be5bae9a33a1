/**
 * Verdicts on the classic cases (reducible ⟺ invariant ≡ 0, README "Verdict vocabulary").
 * Each case names its source; "derived in ../shared/math (file §)" where the class files state it.
 */
import { describe, it, expect } from "vitest";
import { runReducibility } from "../../../lib/screening/reducibility";
import type { EquationClass } from "../../../lib/screening/spec/types";
import { buildVariant } from "./build-variant";

type Case = [name: string, cls: EquationClass, c: Record<string, string>, window: [number, number], verdict: "reducible" | "not-reducible", source: string];

const CASES: Case[] = [
  // Constant coefficients: R = 4(k^2 - ck - ab) (nls.md §3); K = (r-2s)(2r-s) - pm (kdv.md §2).
  ["constant NLS, a=1/2, h=1 (nls.md §11 case a)", "nls", { a: "1/2", h: "1" }, [0, 2], "reducible", "nls.md §11 (a)"],
  ["constant force f=0.3 (linear potential)", "nls", { a: "1/2", f: "0.3", h: "1" }, [0, 2], "reducible", "nls.md §11 (b); Serkin, Hasegawa, Belyaeva, PRL 98 (2007) 074102 [from memory]"],
  ["constant b = k^2/a with constant damping", "nls", { a: "1/2", k: "0.1", b: "0.02", h: "1" }, [0, 2], "reducible", "nls.md §10 and §11 (k2)"],
  ["constant coefficients with b ≠ k^2/a", "nls", { a: "1/2", k: "0.1", b: "0.05", h: "1" }, [0, 2], "not-reducible", "nls.md §3: R = 4(k²-ck-ab) = -0.06"],
  // Damping with constant versus exponentially growing nonlinearity (nls.md §10).
  ["damping, constant h (c1)", "nls", { a: "1/2", k: "0.1", h: "1" }, [0, 2], "not-reducible", "nls.md §11 (c1), R = 1/25; V7 of references.md"],
  ["damping, h = e^{2kt} (c2)", "nls", { a: "1/2", k: "0.1", h: "exp(t/5)" }, [0, 2], "reducible", "nls.md §11 (c2); Serkin & Hasegawa, PRL 85 (2000) 4502 [from memory]"],
  ["damping, h = e^{-2kt}", "nls", { a: "1", k: "0.1", h: "exp(-t/5)" }, [0, 2], "not-reducible", "nls.md §10: R = 16k²"],
  ["damping, h = e^{2kt}/(1 + 0.5t)", "nls", { a: "1", k: "0.1", h: "exp(t/5)/(1 + 0.5*t)" }, [0, 2], "reducible", "nls.md §10: h = e^{2kt}/(d1 + d2 t)"],
  ["k = 1/(2(t+1)) with b = 0 (k1)", "nls", { a: "1/2", k: "1/(2*(1+t))", h: "1" }, [0, 2], "reducible", "nls.md §10–11 (k1)"],
  // Time-dependent traps paired with the interaction (nls.md §10 Gross–Pitaevskii form: a=1/2, b=-ω²/2, h=-G).
  ["expulsive trap ω²=-λ², G = -e^{λt}", "nls", { a: "1/2", b: "0.49/2", h: "exp(0.7*t)" }, [0, 3], "reducible", "nls.md §10; Liang, Zhang, Liu, PRL 94 (2005) 050402 [from memory]"],
  ["expulsive trap with constant interaction", "nls", { a: "1/2", b: "0.49/2", h: "1" }, [0, 3], "not-reducible", "nls.md §10: w'' + ω²w ≠ 0 for w = 1/G constant"],
  ["confining trap ω=1, G = -1/cos t (d2)", "nls", { a: "1/2", b: "-1/2", h: "1/cos(t)" }, [0, 1.4], "reducible", "nls.md §10–11 (d2)"],
  ["trap b = -1/(8(1+t)^2), h = (1+t)^{-1/2} (d)", "nls", { a: "1/2", b: "-1/(8*(1+t)^2)", h: "(1+t)^(-1/2)" }, [0, 3], "reducible", "nls.md §11 (d)"],
  ["dilation and drift (e)", "nls", { a: "1", c: "1", k: "1/4", f: "1", g: "-1/2", h: "2*exp(t/2)" }, [0, 2], "reducible", "nls.md §11 (e)"],
  ["(e1): as (e) with h = 2", "nls", { a: "1", c: "1", k: "1/4", f: "1", g: "-1/2", h: "2" }, [0, 2], "not-reducible", "nls.md §11 (e1), R = -3/4"],
  ["(e2): a=1, c=1, k=1/2, h=2", "nls", { a: "1", c: "1", k: "1/2", h: "2" }, [0, 2], "not-reducible", "nls.md §11 (e2), R = -1"],
  ["(e3): a=1, c=1, h=2", "nls", { a: "1", c: "1", h: "2" }, [0, 2], "reducible", "nls.md §11 (e3)"],
  ["(g1): potential and drift only", "nls", { a: "1/2", e: "cos(t)", f: "0.3*sin(t)", g: "0.2", h: "1" }, [0, 2], "reducible", "nls.md §11 (g1)"],
  ["N2 member", "nls", { a: "1 + 0.3*sin(t)", h: "2/(1+t^2)", b: "0.1", k: "0.05", c: "0.2", f: "0.4", e: "t" }, [0, 2], "not-reducible", "painleve.md §8 N2, R(1) = 0.193"],
  // Fibre form (nls.md §10): a = -β2/2, h = γ, k = α/2; dispersion decreasing as e^{-∫α} at constant γ passes.
  ["fibre: β2 = -e^{-0.2z}, γ = 1, α = 0.2", "nls", { a: "exp(-0.2*t)/2", h: "1", k: "0.1" }, [0, 5], "reducible", "nls.md §10 (Kf = 0); Tajima, Opt. Lett. 12 (1987) 54 [from memory]"],
  // vc-KdV (kdv.md §2 special members).
  ["cylindrical KdV u_t + 6uu_x + u_xxx + u/(2t) = 0", "kdv", { p: "6", q: "1", r: "1/(2*t)" }, [1, 10], "reducible", "kdv.md §2; V9 of references.md [from memory]"],
  ["KdV p = t, q = t^3 (q = p(C1∫p + C2))", "kdv", { p: "t", q: "t^3" }, [0.5, 3], "reducible", "kdv.md §2"],
  ["KdV p = cos t, q = sin t cos t", "kdv", { p: "cos(t)", q: "sin(t)*cos(t)" }, [0.1, 1.4], "reducible", "kdv.md §2"],
  ["KdV q = p(2∫p + 3) with p = 1 + t^2", "kdv", { p: "1 + t^2", q: "(1 + t^2)*(2*(t + t^3/3) + 3)" }, [0, 2], "reducible", "kdv.md §2: q = p(C1∫p + C2)"],
  ["KdV p = t, q = t^2", "kdv", { p: "t", q: "t^2" }, [0.5, 3], "not-reducible", "kdv.md §2, K = -1/t²"],
  ["KdV constant damping r = 0.1", "kdv", { p: "6", q: "1", r: "0.1" }, [0, 3], "not-reducible", "kdv.md §2, K = 2r²"],
  ["KdV constant forcing m = 0.1", "kdv", { p: "6", q: "1", m: "0.1" }, [0, 3], "not-reducible", "kdv.md §2, K = -pm"],
  ["KdV r = 2s constant", "kdv", { p: "6", q: "1", r: "0.2", s: "0.1" }, [0, 3], "reducible", "kdv.md §2"],
  ["KdV all seven coefficients (K3)", "kdv", { p: "1 + 0.3*cos(t)", q: "(1 + 0.3*cos(t))/1.3*exp(0.1*t + 0.46*sin(t))", r: "0.1", s: "0.2*cos(t)", g: "0.5*sin(t)", m: "0.06 + 0.052*cos(t)", l: "0.1*cos(t)" }, [0, 3], "reducible", "kdv.md §7"],
  // vc-mKdV (mkdv.md §2: p ∝ q e^{2∫(r - s)}).
  ["mKdV p ∝ q e^{2∫(r-s)} (M2)", "mkdv", { q: "1 + 0.5*sin(t)", r: "0.2 + 0.1*cos(t)", s: "0.1*cos(t)", g: "0.3*t", p: "6*(1 + 0.5*sin(t))*exp(0.4*t)" }, [0, 3], "reducible", "mkdv.md §6"],
  ["mKdV defocusing p = -6 q e^{2∫(r-s)}", "mkdv", { q: "2", r: "0.3", p: "-12*exp(0.6*t)" }, [0, 3], "reducible", "mkdv.md §2"],
  ["mKdV constant damping", "mkdv", { p: "6", q: "1", r: "0.1" }, [0, 3], "not-reducible", "mkdv.md §2, Q = 2r"],
  ["mKdV r = 1/(2t)", "mkdv", { p: "6", q: "1", r: "1/(2*t)" }, [1, 5], "not-reducible", "mkdv.md §2, Q = 1/t"],
  ["mKdV r = s = 1/(2t)", "mkdv", { p: "6", q: "1", r: "1/(2*t)", s: "1/(2*t)" }, [1, 5], "reducible", "mkdv.md §2"],
];

describe("classic members", () => {
  for (const [name, cls, c, window, verdict, source] of CASES) {
    it(`${name} → ${verdict} [${source}]`, async () => {
      const report = await runReducibility(buildVariant(cls, c, window));
      expect(report.verdict).toBe(verdict);
      // Evidence: formula, engine version, three points × three orders with |R| and the scale, precision.
      expect(report.evidence.formula.polynomialForm.length).toBeGreaterThan(10);
      expect(report.evidence.engine).toMatch(/^\d+\.\d+\.\d+/);
      const samples = report.evidence.windows.flatMap((w) => w.samples);
      expect(samples.length).toBeGreaterThanOrEqual(verdict === "reducible" ? 3 : 1);
      for (const s of samples) expect(s.orders.map((o) => o.order)).toEqual([0, 1, 2]);
      if (verdict === "reducible") {
        // Every "zero" confirmed at 40 and 80 digits at all points and orders.
        for (const w of report.evidence.windows) {
          expect(w.confirmation).toHaveLength(9);
          expect(w.confirmation.every((x) => x.outcome === "zero")).toBe(true);
          expect(w.precision).toBe("double, decimal40, decimal80");
        }
      }
    });
  }
});

describe("sign forced by the map", () => {
  it("NLS sigma = sign(h/a); mKdV sigma = sign(p/q) (README forced signs)", async () => {
    // Source: README "The maps…" table: sigma = sign(h/a) (NLS), sign(p/q) (mKdV).
    const dark = await runReducibility(buildVariant("nls", { a: "1/2", h: "-1" }, [0, 1]));
    expect(dark.evidence.windows[0].sigma).toBe(-1);
    const focusing = await runReducibility(buildVariant("mkdv", { p: "6", q: "1" }, [0, 1]));
    expect(focusing.evidence.windows[0].sigma).toBe(1);
  });
});
