import { describe, it, expect } from "vitest";
import { buildTransformation, type TransformationOk } from "../../../lib/screening/transform";
import { mapAt } from "../../../lib/screening/solutions";
import { KDV_EXAMPLE, mkdvExample, nonJsonLeaves, variant } from "./fixtures";

function ok(r: ReturnType<typeof buildTransformation>): TransformationOk {
  if (!r.ok) throw new Error(r.reason);
  return r;
}

describe("vc-KdV transformation (kdv.md §3, worked example §7)", () => {
  // Window [0, 1.6] puts a node exactly at t = 0.8 (256 intervals).
  const r = ok(buildTransformation(variant("kdv", KDV_EXAMPLE, [0, 1.6])));

  it("B = 1/5, C = sin(t)/10, beta = exp(−t/5 − 0.26 sin t), A = (60/13) exp(−0.3t − 0.06 sin t) (kdv.md §7, exact)", () => {
    r.table.t.forEach((t, i) => {
      expect(Math.abs(r.table.values.B[i] - 0.2)).toBeLessThan(1e-13);
      expect(Math.abs(r.table.values.C[i] - Math.sin(t) / 10)).toBeLessThan(1e-10);
      expect(Math.abs(r.table.values.beta[i] - Math.exp(-t / 5 - 0.26 * Math.sin(t)))).toBeLessThan(1e-10);
      expect(Math.abs(r.table.values.A[i] - (60 / 13) * Math.exp(-0.3 * t - 0.06 * Math.sin(t)))).toBeLessThan(1e-9);
    });
  });

  it("gamma(0.8) and eps(0.8) match the 30-digit quadrature of kdv.md §7", () => {
    const i = 128;
    expect(r.table.t[i]).toBeCloseTo(0.8, 14);
    expect(Math.abs(r.table.values.gamma[i] - 0.5779615425798)).toBeLessThan(1e-11);
    expect(Math.abs(r.table.values.eps[i] - -0.150643789146564)).toBeLessThan(1e-11);
  });

  it("forced constants B(t0) and A0; free beta0, eps0, gamma0, C0 (kdv.md §4)", () => {
    const forced = r.constants.filter((c) => c.status === "forced").map((c) => [c.name, c.value]);
    expect(forced[0][0]).toBe("B(t0)");
    expect(Math.abs((forced[0][1] as number) - 0.2)).toBeLessThan(1e-13);
    expect(Math.abs((forced[1][1] as number) - 60 / 13)).toBeLessThan(1e-13);
    expect(r.constants.filter((c) => c.status === "free").map((c) => c.name)).toEqual(["beta0", "eps0", "gamma0", "C0"]);
    expect(r.sigma).toBeNull();
    expect(r.singularTimes).toEqual([]);
  });

  it("the Galilean constant: C0 = λ A0 gives (C + λA, eps − 6λ gamma) (kdv.md §4, C0 row)", () => {
    const lam = 0.3;
    const A0 = 60 / 13;
    const r2 = ok(buildTransformation(variant("kdv", KDV_EXAMPLE, [0, 1.6]), { C0: lam * A0 }));
    const i = 200;
    expect(Math.abs(r2.table.values.C[i] - (r.table.values.C[i] + lam * r.table.values.A[i]))).toBeLessThan(1e-10);
    expect(Math.abs(r2.table.values.eps[i] - (r.table.values.eps[i] - 6 * lam * r.table.values.gamma[i]))).toBeLessThan(1e-10);
  });

  it("cylindrical KdV u_t + u/(2t) + 6uu_x + u_xxx = 0 is reducible (kdv.md §2 special members; classical, references.md V9)", () => {
    const c = ok(buildTransformation(variant("kdv", { p: "6", q: "1", r: "1/(2*t)" }, [1, 3])));
    // Z = r = 1/(2t), B = Z/p = 1/(12t), beta = (p q0)/(q p0) exp(−∫r) = t^{-1/2},
    // gamma = ∫ t^{-3/2} = 2(1 − t^{-1/2}), A = 6qβ²/p = 1/t, C = 0 (kdv.md §3, derived by hand)
    c.table.t.forEach((t, i) => {
      expect(Math.abs(c.table.values.beta[i] - 1 / Math.sqrt(t))).toBeLessThan(1e-11);
      expect(Math.abs(c.table.values.gamma[i] - 2 * (1 - 1 / Math.sqrt(t)))).toBeLessThan(1e-11);
      expect(Math.abs(c.table.values.A[i] - 1 / t)).toBeLessThan(1e-11);
      expect(Math.abs(c.table.values.B[i] - 1 / (12 * t))).toBeLessThan(1e-14);
      expect(Math.abs(c.table.values.C[i])).toBeLessThan(1e-14);
    });
    expect(c.identityAtStart.holds).toBe(false); // 6 q0 = p0 but Z(t0) = 1/2
  });

  it("members with K ≠ 0 are refused: constant damping (K = 2r²), constant m ≠ 0 (K = −pm), p = t, q = t² (kdv.md §2 table)", () => {
    const members: Record<string, string>[] = [{ p: "6", q: "1", r: "0.2" }, { p: "6", q: "1", m: "0.1" }, { p: "t", q: "t^2" }];
    for (const co of members) {
      const x = buildTransformation(variant("kdv", co, [1, 2]));
      expect(x.ok).toBe(false);
      if (!x.ok) {
        expect(x.code).toBe("not-reducible");
        expect(x.reason).toMatch(/invariant K/);
      }
    }
  });

  it("p = t, q = t³ and p = cos t, q = sin t cos t are reducible (kdv.md §2 table)", () => {
    expect(buildTransformation(variant("kdv", { p: "t", q: "t^3" }, [0.5, 2])).ok).toBe(true);
    expect(buildTransformation(variant("kdv", { p: "cos(t)", q: "sin(t)*cos(t)" }, [0.2, 1.2])).ok).toBe(true);
  });

  it("interpolated map (cubic Hermite) between nodes is accurate to 1e-10 (beta, C exact forms of kdv.md §7)", () => {
    for (const t of [0.0371, 0.5123, 1.3333]) {
      const m = mapAt(r.table, t);
      expect(Math.abs(m.beta - Math.exp(-t / 5 - 0.26 * Math.sin(t)))).toBeLessThan(1e-10);
      expect(Math.abs(m.C - Math.sin(t) / 10)).toBeLessThan(1e-10);
    }
  });

  it("is JSON-safe", () => {
    expect(nonJsonLeaves(r)).toEqual([]);
  });
});

describe("vc-mKdV transformation (mkdv.md §3, worked example §6)", () => {
  for (const sigma of [1, -1] as const) {
    it(`sigma = ${sigma}: beta = exp(−0.1 sin t), A = exp(−0.2t − 0.1 sin t), gamma(0.8), eps(0.8) (mkdv.md §6)`, () => {
      const r = ok(buildTransformation(variant("mkdv", mkdvExample(sigma), [0, 1.6])));
      expect(r.sigma).toBe(sigma);
      r.table.t.forEach((t, i) => {
        expect(Math.abs(r.table.values.beta[i] - Math.exp(-0.1 * Math.sin(t)))).toBeLessThan(1e-11);
        expect(Math.abs(r.table.values.A[i] - Math.exp(-0.2 * t - 0.1 * Math.sin(t)))).toBeLessThan(1e-11);
      });
      expect(Math.abs(r.table.values.gamma[128] - 0.84629767717658)).toBeLessThan(1e-11);
      expect(Math.abs(r.table.values.eps[128] - -0.0913308166891124)).toBeLessThan(1e-11);
      expect(r.constants.find((c) => c.name === "|A0|")!.value).toBeCloseTo(1, 14); // sqrt(6|q0/p0|) = 1
    });
  }
  it("control p = 6, q = 1, r = 0.1 (Q = 1/5) is refused (mkdv.md §6)", () => {
    const r = buildTransformation(variant("mkdv", { p: "6", q: "1", r: "0.1" }, [0, 1]));
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.reason).toMatch(/invariant Q/);
  });
  it("r = s = 1/(2t) with constant p, q passes (mkdv.md §2 examples)", () => {
    const r = ok(buildTransformation(variant("mkdv", { p: "6", q: "1", r: "1/(2*t)", s: "1/(2*t)" }, [1, 2])));
    r.table.t.forEach((t, i) => expect(Math.abs(r.table.values.beta[i] - 1 / Math.sqrt(t))).toBeLessThan(1e-11));
  });
  it("a coefficient that vanishes inside the window cuts the map window (mkdv.md §0 precondition)", () => {
    // Q ≡ 0 for p = 6q with q = cos t; q vanishes at π/2
    const r = ok(buildTransformation(variant("mkdv", { p: "6*cos(t)", q: "cos(t)" }, [0, 2])));
    expect(r.singularTimes[0].kind).toBe("coefficient-singular");
    expect(Math.abs(r.singularTimes[0].t - Math.PI / 2)).toBeLessThan(1e-9);
    expect(r.mapWindow[1]).toBeLessThan(Math.PI / 2);
  });
});
