import { describe, it, expect } from "vitest";
import { integrateOnGrid, uniformGrid, refineZero } from "../../../lib/screening/ode";

describe("integrateOnGrid (odex wrapper)", () => {
  it("harmonic oscillator y'' = −ω² y matches cos(ωt) on a grid (exact solution)", () => {
    const w = 1.7;
    const grid = uniformGrid(0, 20, 40);
    const r = integrateOnGrid({ dimension: 2, rhs: (_t, y) => [y[1], -w * w * y[0]] }, grid, [1, 0]);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    let err = 0;
    r.t.forEach((t, i) => (err = Math.max(err, Math.abs(r.y[i][0] - Math.cos(w * t)))));
    expect(err).toBeLessThan(1e-10);
    expect(r.t[r.t.length - 1]).toBe(20);
  });

  it("μ'' + (1 + 0.5 cos t) μ = 0 matches mpmath odefun at 30 digits (ENGINE-NOTES §7 test problem; values computed with mpmath.odefun)", () => {
    const r = integrateOnGrid(
      { dimension: 2, rhs: (t, y) => [y[1], -(1 + 0.5 * Math.cos(t)) * y[0]] },
      [0, 10, 20, 50],
      [1, 0],
    );
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    const ref = [
      [-1.57123987274135810145, -0.0324701305514206904249],
      [1.34929152602079407898, -0.941969557923614620025],
      [0.502783355701599199562, 4.92672375850976767453],
    ];
    for (let i = 0; i < 3; i++) {
      expect(Math.abs(r.y[i + 1][0] - ref[i][0])).toBeLessThan(1e-9);
      expect(Math.abs(r.y[i + 1][1] - ref[i][1])).toBeLessThan(1e-9);
    }
  });

  it("Riccati c' = −4c² − 1 (pole at π/4, exact c = −tan(2t)/2) is reported as a failure, not as NaN success (ENGINE-NOTES §7)", () => {
    const r = integrateOnGrid({ dimension: 1, rhs: (_t, y) => [-4 * y[0] * y[0] - 1] }, uniformGrid(0, 1, 20), [0]);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(["blow-up", "non-finite", "max-steps"]).toContain(r.failure);
    // every node returned is finite and before the pole
    for (const y of r.y) expect(Number.isFinite(y[0])).toBe(true);
    expect(r.t[r.t.length - 1]).toBeLessThan(Math.PI / 4);
    expect(r.stoppedAfter).toBeGreaterThan(0.7);
  });

  it("a throwing right-hand side stops the run with rhs-error", () => {
    const r = integrateOnGrid({ dimension: 1, rhs: (t) => { if (t > 0.5) throw new Error("bad point"); return [1]; } }, [0, 0.4, 1], [0]);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.failure).toBe("rhs-error");
    expect(r.t).toEqual([0, 0.4]);
  });

  it("refineZero finds the zero π/(2ω) of μ = cos(ωt) (nls.md §7 linear example)", () => {
    const w = 1.3;
    const sys = { dimension: 2, rhs: (_t: number, y: readonly number[]) => [y[1], -w * w * y[0]] };
    const z = refineZero(sys, 1, [Math.cos(w), -w * Math.sin(w)], 1.5, 0, 1e-12);
    expect(Math.abs(z - Math.PI / (2 * w))).toBeLessThan(1e-10);
  });
});
