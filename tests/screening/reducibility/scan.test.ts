/**
 * Where the preconditions fail on the window (README "Preconditions": a h ≠ 0, p q ≠ 0, finite
 * coefficients; nls.md §0 "split the window at the sign change"), and the per-sub-window verdicts.
 */
import { describe, it, expect } from "vitest";
import { runReducibility, scanCoefficients } from "../../../lib/screening/reducibility";
import { buildVariant } from "./build-variant";

const NLS = ["a", "b", "c", "e", "f", "g", "h", "k"];
const scanNls = (c: Record<string, string>, window: [number, number]) =>
  scanCoefficients(buildVariant("nls", c, window).coefficients, NLS, ["a", "h"], window);

describe("coefficient scan", () => {
  it("finds the pole of h = 1/cos t at π/2 (nls.md §7 example d2)", () => {
    // Source: nls.md §7, (d2): h = 1/cos t, focusing time t* = π/2.
    const s = scanNls({ a: "1/2", b: "-1/2", h: "1/cos(t)" }, [0, 3]);
    expect(s.points).toHaveLength(1);
    expect(s.points[0].kind).toBe("pole");
    expect(s.points[0].coefficient).toBe("h");
    expect(Math.abs(s.points[0].t - Math.PI / 2)).toBeLessThan(1e-11);
    expect(s.subWindows).toHaveLength(2);
  });

  it("finds a simple zero of a, a touching zero of h and an even pole of b", () => {
    // a = t - 1 vanishes at 1; h = (t - 2)^2 touches 0 at 2; b = 1/(t - 0.5)^2 has a double pole at 0.5 (from memory: elementary).
    const s = scanNls({ a: "t - 1", h: "(t - 2)^2 + 0", b: "1/(t - 0.5)^2" }, [0, 3]);
    const found = s.points.map((p) => [p.coefficient, p.kind, Number(p.t.toFixed(6))]);
    expect(found).toEqual([
      ["b", "pole", 0.5],
      ["a", "zero", 1],
      ["h", "zero", 2],
    ]);
    expect(s.subWindows).toHaveLength(4);
  });

  it("reports an undefined region (sqrt of a negative) and an endpoint pole", () => {
    // sqrt(t - 1) is not real for t < 1; 1/(2t) is infinite at the window start t = 0 (kdv.md §2 cylindrical).
    const s = scanNls({ a: "1/2", h: "1", k: "sqrt(t - 1)" }, [0, 3]);
    expect(s.undefinedRegions).toHaveLength(1);
    expect(s.undefinedRegions[0].from).toBe(0);
    expect(Math.abs(s.undefinedRegions[0].to - 1)).toBeLessThan(1e-11);
    const e = scanCoefficients(buildVariant("kdv", { p: "6", q: "1", r: "1/(2*t)" }, [0, 5]).coefficients, ["p", "q", "r"], ["p", "q"], [0, 5]);
    expect(e.points).toHaveLength(0);
    expect(e.endpoints.length).toBeGreaterThanOrEqual(1);
    expect(e.subWindows).toEqual([[e.subWindows[0][0], 5]]);
  });

  it("notices a coefficient that vanishes identically", () => {
    const s = scanNls({ a: "1/2", h: "0" }, [0, 1]);
    expect(s.vanishing).toEqual(["h"]);
    expect(s.subWindows).toHaveLength(0);
  });
});

describe("sub-window verdicts", () => {
  it("(d2) across its focusing time: both sub-windows reducible, so reducible overall", async () => {
    // Source: nls.md §10 (GP: ω = 1 with G = -1/cos t passes) and §11 (d2).
    const r = await runReducibility(buildVariant("nls", { a: "1/2", b: "-1/2", h: "1/cos(t)" }, [0, 3]));
    expect(r.verdict).toBe("reducible");
    expect(r.evidence.windows.map((w) => w.verdict)).toEqual(["reducible", "reducible"]);
    expect(r.evidence.singularities.points[0].kind).toBe("pole");
  });

  it("a zero of h splits the window; each side gets its own verdict and sign", async () => {
    // h = (t - 1) e^{t/5}, a = 1/2, k = 0.1: W = -1/(t-1), R = 2/(t-1)² ≠ 0 on both sides (derived from nls.md §3).
    const r = await runReducibility(buildVariant("nls", { a: "1/2", k: "0.1", h: "(t - 1)*exp(t/5)" }, [0, 3]));
    expect(r.verdict).toBe("not-reducible");
    expect(r.evidence.windows).toHaveLength(2);
    expect(r.evidence.windows.map((w) => w.sigma)).toEqual([-1, 1]);
  });

  it("a coefficient undefined on part of the window leaves a reducible member undecided (singular point)", async () => {
    // e does not enter R (nls.md §3), so R ≡ 0 where e is defined; e = sqrt(t - 1) is undefined on [0, 1).
    const r = await runReducibility(buildVariant("nls", { a: "1/2", h: "1", e: "sqrt(t - 1)" }, [0, 3]));
    expect(r.verdict).toBe("undecided");
    if (r.verdict === "undecided") expect(r.reason).toBe("singular-point");
    expect(r.evidence.windows.map((w) => w.verdict)).toEqual(["reducible"]);
  });

  it("the same coefficient in c (which enters R) gives not-reducible on the defined part", async () => {
    // c = sqrt(t - 1), a = 1/2, h = 1: W = -2c, R = -2c' ≠ 0 (derived from nls.md §3).
    const r = await runReducibility(buildVariant("nls", { a: "1/2", h: "1", c: "sqrt(t - 1)" }, [0, 3]));
    expect(r.verdict).toBe("not-reducible");
  });

  it("h ≡ 0 (the linear case) is undecided with the reason", async () => {
    // Source: nls.md §0 — h ≡ 0 is outside the R test (covered by §2 alone).
    const r = await runReducibility(buildVariant("nls", { a: "1/2" }, [0, 1]));
    expect(r.verdict).toBe("undecided");
    if (r.verdict === "undecided") {
      expect(r.reason).toBe("singular-point");
      expect(r.message).toMatch(/h vanishes identically/);
    }
  });
});
