/**
 * Free parameters: the values (or relations) that make the invariant vanish identically.
 */
import { describe, it, expect } from "vitest";
import { runReducibility } from "../../../lib/screening/reducibility";
import { buildVariant } from "./build-variant";

describe("free parameters", () => {
  it("constant damping: b0 = k²/a is the only value (nls.md §10, 'constant k: passes iff b = k²/a')", async () => {
    // Source: derived in ../shared/math (nls.md §10); here a = 1, k = 0.3 → b0 = 0.09 exactly.
    const r = await runReducibility(buildVariant("nls", { a: "1", b: "b0", k: "0.3", h: "1" }, [0, 2], ["b0"]));
    expect(r.verdict).toBe("reducible");
    expect(r.constraints).toEqual([{ parameter: "b0", value: 0.09, exact: "0.09", role: "determined", solution: 0 }]);
    const s = r.evidence.freeParameters?.solutions[0];
    expect(s?.kind).toBe("isolated");
    expect(s?.windows[0].confirmation.every((c) => c.outcome === "zero")).toBe(true);
  });

  it("expulsive trap with growing interaction h = e^{0.6t}: b0 = λ²/2 = 0.18", async () => {
    // Source: nls.md §10 (Gross–Pitaevskii: expulsive ω² = -λ² with G ∝ e^{λt}); with a = 1/2,
    // c = k = 0: R = λ² - 4ab = 0 → b0 = λ²/2 = 0.18 (derived from nls.md §3).
    const r = await runReducibility(buildVariant("nls", { a: "1/2", b: "b0", h: "exp(0.6*t)" }, [0, 2], ["b0"]));
    expect(r.verdict).toBe("reducible");
    expect(r.constraints[0].exact).toBe("0.18");
  });

  it("two unknowns with one relation: b0 = k0² is reported as a one-parameter family", async () => {
    // Source: nls.md §10 (constant k passes iff b = k²/a), a = 1.
    const r = await runReducibility(buildVariant("nls", { a: "1", b: "b0", k: "k0", h: "1" }, [0, 2], ["b0", "k0"]));
    expect(r.verdict).toBe("reducible");
    const solutions = r.evidence.freeParameters?.solutions ?? [];
    expect(solutions).toHaveLength(1);
    expect(solutions[0].kind).toBe("family");
    expect(solutions[0].dimension).toBe(1);
    const value = (p: string): number => solutions[0].constraints.find((c) => c.parameter === p)?.value ?? NaN;
    expect(value("b0")).toBeCloseTo(value("k0") ** 2, 12);
    expect(solutions[0].constraints.map((c) => c.role).sort()).toEqual(["chosen", "determined"]);
  });

  it("damped NLS: h = e^{2kt}/(d1 + d2 t) passes for every d1, d2 (nls.md §10)", async () => {
    // Source: nls.md §10 "Damped NLS, a = 1, b = c = 0, constant k: passes iff h = e^{2kt}/(d1 + d2 t)".
    const r = await runReducibility(buildVariant("nls", { a: "1", k: "0.2", h: "exp(0.4*t)/(d1 + d2*t)" }, [0, 2], ["d1", "d2"]));
    expect(r.verdict).toBe("reducible");
    const s = r.evidence.freeParameters?.solutions ?? [];
    expect(s).toHaveLength(1);
    expect(s[0].kind).toBe("any");
    expect(s[0].dimension).toBe(2);
  });

  it("vc-KdV q = p(C1∫p + C2): any C1, C2 pass (kdv.md §2, r = s = m = 0)", async () => {
    // Source: kdv.md §2, "r = s = m = 0: the test passes iff q = p (d1 ∫p + d2)"; p = cos t, ∫p = sin t.
    const r = await runReducibility(buildVariant("kdv", { p: "cos(t)", q: "cos(t)*(C1*sin(t) + C2)" }, [0.1, 1.4], ["C1", "C2"]));
    expect(r.verdict).toBe("reducible");
    expect(r.evidence.freeParameters?.solutions[0].kind).toBe("any");
  });

  it("vc-KdV q = p(C1∫p + C2) with damping r = 0.1: no value works", async () => {
    // Source: kdv.md §2: with r ≠ 0 the condition is Y = (q/p)e^{∫(r-2s)} = d1∫p e^{-∫(r+s)} + d2, which q = p(C1∫p + C2) misses.
    const r = await runReducibility(buildVariant("kdv", { p: "cos(t)", q: "cos(t)*(C1*sin(t) + C2)", r: "0.1" }, [0.1, 1.4], ["C1", "C2"]));
    expect(r.verdict).toBe("not-reducible");
    expect(r.constraints).toEqual([]);
  });

  it("vc-mKdV p = κ q e^{2∫(r-s)}: the rate in the exponent is determined (mkdv.md §2)", async () => {
    // Source: mkdv.md §2: Q = q'/q - p'/p + 2(r - s) = 0 with q = 1, r = 0.25, s = 0, p = 6 e^{g0 t} → g0 = 0.5.
    const r = await runReducibility(buildVariant("mkdv", { p: "6*exp(g0*t)", q: "1", r: "0.25" }, [0, 2], ["g0"]));
    expect(r.verdict).toBe("reducible");
    expect(r.constraints[0].exact).toBe("0.5");
  });

  it("no value works: b = b0 cos t with constant damping", async () => {
    // R = 4(k² - a b0 cos t) cannot vanish for all t (derived from nls.md §3, constant a, h, k).
    const r = await runReducibility(buildVariant("nls", { a: "1", b: "b0*cos(t)", k: "0.3", h: "1" }, [0, 2], ["b0"]));
    expect(r.verdict).toBe("not-reducible");
    expect(r.evidence.freeParameters?.solutions).toEqual([]);
    expect(r.evidence.freeParameters?.bestResidual).toBeGreaterThan(1e-3);
  });

  it("a double root: free damping k0 with constant a, h passes only at k0 = 0 (multiplicity 2)", async () => {
    // Source: nls.md §10: constant h with constant k fails with R = 4k², so k0 = 0 is a double root.
    const r = await runReducibility(buildVariant("nls", { a: "1", k: "k0", h: "1" }, [0, 2], ["k0"]));
    expect(r.verdict).toBe("reducible");
    expect(r.constraints[0].exact).toBe("0");
    expect(r.evidence.freeParameters?.solutions[0].multiplicity).toBe(2);
  });

  it("a double root away from zero: h = e^{0.3t} with free damping k0 passes only at k0 = 0.15 (multiplicity 2)", async () => {
    // Derived in ../shared/math (nls.md §3): a = 1/2, b = c = 0 give W = -0.3 + 2 k0 and R = W², a double root at k0 = 0.15.
    // Regression: the multiplicity-scaled Newton step lands on the root, then the next 0/0-like step left it.
    const r = await runReducibility(buildVariant("nls", { a: "1/2", k: "k0", h: "exp(0.3*t)" }, [0, 5], ["k0"]));
    expect(r.verdict).toBe("reducible");
    expect(r.constraints[0].exact).toBe("0.15");
    expect(r.evidence.freeParameters?.solutions[0].multiplicity).toBe(2);
  });

  it("two isolated roots: b = b0 with h = e^{g0 t}, b0 = 0.25 fixed by g0² = 4ab0 → g0 = ±1", async () => {
    // a = 1, c = k = 0: R = g0² - 4 b0 (derived from nls.md §3); b0 = 1/4 → g0 = ±1.
    const r = await runReducibility(buildVariant("nls", { a: "1", b: "0.25", h: "exp(g0*t)" }, [0, 2], ["g0"]));
    expect(r.verdict).toBe("reducible");
    const values = r.constraints.map((c) => c.value).sort((x, y) => x - y);
    expect(values).toEqual([-1, 1]);
  });
});
