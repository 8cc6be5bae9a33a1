import { describe, it, expect } from "vitest";
import { buildTransformation } from "../../../lib/screening/transform";
import { buildSolutions } from "../../../lib/screening/solutions";
import { runSplitStep, verifySolutions, type VerifyOptions } from "../../../lib/screening/verify";
import { NLS_CASES, nlsVariant, variant } from "../transform/fixtures";
import type { Variant } from "../../../lib/screening/spec/types";

function check(v: Variant, options: VerifyOptions = {}) {
  const tr = buildTransformation(v);
  const set = buildSolutions(v, tr);
  return verifySolutions(v, tr, set, options);
}

describe("split-step Fourier simulation of the original vc-NLS vs the mapped-back bright soliton (≤ 1e-4)", () => {
  // nls.md §11 families with c ≡ 0; the window [0, 1.5] (d2: [0, 1.3], before its focusing time π/2).
  const cases: [string, [number, number]][] = [["a", [0, 1.5]], ["b", [0, 1.5]], ["c2", [0, 1.5]], ["d", [0, 1.5]], ["d2", [0, 1.3]], ["k1", [0, 1.5]], ["k2", [0, 1.5]], ["g1", [0, 1.5]]];
  for (const [id, win] of cases) {
    it(`(${id}) on [${win}] — grid and steps recorded`, () => {
      const r = check(nlsVariant(NLS_CASES.find((c) => c.id === id)!, false, win));
      const s = r.splitStep.find((e) => e.solutionId === "nls-bright")!;
      expect(s.status).toBe("passed");
      if (s.status === "not-applicable") return;
      expect(s.maxRelError).toBeLessThan(1e-4);
      expect(s.grid.N).toBeGreaterThanOrEqual(256);
      expect(s.grid.dx).toBeCloseTo((s.grid.xMax - s.grid.xMin) / s.grid.N, 12);
      expect(s.steps).toBe(2000);
      expect(s.checks.length).toBe(8);
      expect(s.window).toEqual(win);
      expect(r.passed).toBe(true);
    });
  }

  // Fibre form with dispersion decreasing as e^{-∫alphaL} at constant Kerr coefficient (nls.md §10,
  // Kf = 0; Tajima 1987 [from memory]), expulsive Gross–Pitaevskii trap with G = −e^{λt} (nls.md §10,
  // λ = 1/2), and a < 0 (normal-dispersion sign pattern with h < 0).
  const designed: [string, Record<string, string>, [number, number]][] = [
    ["fibre, dispersion ∝ e^{−0.1t}, loss 0.1", { a: "0.5*exp(-0.1*t)", k: "0.05", h: "1" }, [0, 5]],
    ["expulsive trap b = λ²/2, h = e^{λt}", { a: "1/2", b: "0.125", h: "exp(0.5*t)" }, [0, 3]],
    ["a = −1/2, h = −1", { a: "-0.5", h: "-1" }, [0, 2]],
  ];
  for (const [label, co, win] of designed) {
    it(`${label} (nls.md §10)`, () => {
      const r = check(variant("nls", co, win));
      const s = r.splitStep.find((e) => e.solutionId === "nls-bright")!;
      expect(s.status).toBe("passed");
      if (s.status !== "not-applicable") expect(s.maxRelError).toBeLessThan(1e-4);
      for (const e of r.residuals) expect(e.maxRelResidual).toBeLessThan(1e-8);
    });
  }

  it("Strang (order 2) alone also agrees on (a) with N = 512, 2000 steps (second-order splitting error ~ dt²)", () => {
    const tr = buildTransformation(nlsVariant(NLS_CASES[0], false, [0, 1.5]));
    const set = buildSolutions(nlsVariant(NLS_CASES[0], false, [0, 1.5]), tr);
    if (!tr.ok || !set.ok) throw new Error("no map");
    // free propagation of the exact soliton e^{iθ} sech: compare at the end only
    const spec = set.solutions[0];
    const N = 512;
    const xMin = -30;
    const xMax = 31;
    const dx = (xMax - xMin) / N;
    const init = new Float64Array(2 * N);
    const exact = (x: number, t: number) => {
      const g = t / 2; // gamma = t/2 for (a)
      const amp = 1 / Math.cosh(x - g);
      const ph = 0.5 * x + 0.75 * g;
      return [amp * Math.cos(ph), amp * Math.sin(ph)];
    };
    for (let j = 0; j < N; j++) [init[2 * j], init[2 * j + 1]] = exact(xMin + j * dx, 0);
    let err = NaN;
    runSplitStep({
      coefficients: () => ({ a: 0.5, b: 0, e: 0, f: 0, g: 0, h: 1, k: 0 }),
      times: Array.from({ length: 2001 }, (_, i) => (1.5 * i) / 2000), xMin, xMax, N, initial: init, order: 2,
      observeAt: [2000],
      observe(_n, t, u) {
        let e = 0;
        for (let j = 0; j < N; j++) {
          const [re, im] = exact(xMin + j * dx, t);
          e = Math.max(e, Math.hypot(u[2 * j] - re, u[2 * j + 1] - im));
        }
        err = e;
      },
    });
    expect(err).toBeLessThan(1e-5);
    expect(spec.id).toBe("nls-bright");
  });

  it("c ≢ 0 (case (e), dilation) is recorded as not applicable, with the reason", () => {
    const r = check(nlsVariant(NLS_CASES.find((c) => c.id === "e")!, false, [0, 1]));
    const s = r.splitStep.find((e) => e.solutionId === "nls-bright")!;
    expect(s.status).toBe("not-applicable");
    if (s.status === "not-applicable") expect(s.reason).toMatch(/c ≢ 0/);
    expect(r.passed).toBe(true); // the residual checks still pass
  });

  it("dark and periodic waves are recorded as not applicable (no decay at |x| → ∞)", () => {
    const r = check(nlsVariant(NLS_CASES[0], true, [0, 1]));
    expect(r.splitStep.map((s) => s.status)).toEqual(["not-applicable", "not-applicable"]);
  });

  it("a failing run is stored as evidence, not hidden (deliberately coarse: N = 64, 8 steps on (d))", () => {
    const r = check(nlsVariant(NLS_CASES.find((c) => c.id === "d")!, false, [0, 1.5]), { splitStepN: 64, splitStepSteps: 8 });
    const s = r.splitStep.find((e) => e.solutionId === "nls-bright")!;
    expect(s.status).toBe("failed");
    if (s.status === "not-applicable") return;
    expect(s.maxRelError).toBeGreaterThan(1e-4);
    expect(s.grid.N).toBe(64);
    expect(r.passed).toBe(false);
  });

  it("KdV / mKdV: no split-step check, said in the notes", () => {
    const r = check(variant("kdv", { p: "6", q: "1" }, [0, 1]));
    expect(r.splitStep).toEqual([]);
    expect(r.notes.join(" ")).toMatch(/vc-NLS only/);
  });
});
