import { describe, it, expect } from "vitest";
import { buildTransformation } from "../../../lib/screening/transform";
import type { TransformationOk } from "../../../lib/screening/transform";
import { NLS_CASES, NLS_FAILING, nlsVariant, nonJsonLeaves, variant } from "./fixtures";

// Closed forms of the map for the rows of ../shared/math/nls.md §11 (derived in ../shared/math,
// nls.md §11 table, checked there by spec_nls_examples.py): [alpha, beta, gamma, delta, eps, kappa, A].
type Fn = (t: number) => number;
const ROWS: Record<string, Fn[]> = {
  a: [() => 0, () => 1, (t) => t / 2, () => 0, () => 0, () => 0, () => 1],
  b: [() => 0, () => 1, (t) => t / 2, (t) => 0.3 * t, (t) => -0.15 * t * t, (t) => -0.015 * t ** 3, () => 1],
  c2: [() => 0, () => 1, (t) => t / 2, () => 0, () => 0, () => 0, (t) => Math.exp(-t / 10)],
  d: [(t) => 1 / (4 * (1 + t)), (t) => (1 + t) ** -0.5, (t) => Math.log(1 + t) / 2, () => 0, () => 0, () => 0, (t) => (1 + t) ** -0.25],
  d2: [(t) => -Math.tan(t) / 2, (t) => 1 / Math.cos(t), (t) => Math.tan(t) / 2, () => 0, () => 0, () => 0, (t) => Math.cos(t) ** -0.5],
  e: [() => -0.5, Math.exp, (t) => (Math.exp(2 * t) - 1) / 2, (t) => (Math.exp(t) - 1) / 2, (t) => -Math.exp(2 * t) / 2 + 1.5 * Math.exp(t) - 1,
    (t) => -t / 2 - Math.exp(2 * t) / 8 + 0.75 * Math.exp(t) - 5 / 8, (t) => Math.exp(0.75 * t)],
  e3: [() => -0.5, Math.exp, (t) => (Math.exp(2 * t) - 1) / 2, () => 0, () => 0, () => 0, Math.exp],
  k1: [(t) => 1 / (2 * (1 + t)), (t) => 1 / (1 + t), (t) => t / (2 * (1 + t)), () => 0, () => 0, () => 0, (t) => 1 / (1 + t)],
  k2: [() => 0.1, (t) => Math.exp(-t / 5), (t) => 1.25 * (1 - Math.exp(-0.4 * t)), () => 0, () => 0, () => 0, (t) => Math.exp(-t / 5)],
  g1: [() => 0, () => 1, (t) => t / 2, (t) => 0.3 * (1 - Math.cos(t)), (t) => -t / 2 + 0.3 * Math.sin(t),
    (t) => (-51 * t) / 400 + (23 * Math.sin(t)) / 20 - (9 * Math.sin(2 * t)) / 800, () => 1],
};
const NAMES = ["alpha", "beta", "gamma", "delta", "eps", "kappa", "A"];

function ok(r: ReturnType<typeof buildTransformation>): TransformationOk {
  if (!r.ok) throw new Error(r.reason);
  return r;
}

describe("vc-NLS transformation: tabulated map against the closed forms of nls.md §11", () => {
  for (const c of NLS_CASES) {
    it(`case (${c.id}) on [0, 1.4]`, () => {
      const r = ok(buildTransformation(nlsVariant(c, false, [0, 1.4])));
      expect(r.sigma).toBe(1);
      const fns = ROWS[c.id];
      NAMES.forEach((name, k) => {
        const got = r.table.values[name];
        r.table.t.forEach((t, i) => {
          const want = fns[k](t);
          expect(Math.abs(got[i] - want)).toBeLessThan(1e-9 * Math.max(1, Math.abs(want)));
        });
      });
      // slopes consistent with the closed forms (central difference of the exact function)
      const i = 100;
      const t = r.table.t[i];
      NAMES.forEach((name, k) => {
        const h = 1e-5;
        const fd = (fns[k](t + h) - fns[k](t - h)) / (2 * h);
        expect(Math.abs(r.table.slopes[name][i] - fd)).toBeLessThan(1e-7 * Math.max(1, Math.abs(fd)));
      });
      // two routes to beta (linear mu equation vs quadratures) agree (nls.md §2 vs §5)
      expect(r.checks.betaFromMuMaxRelDiff).toBeLessThan(1e-9);
    });
  }

  it("dark-soliton versions (h → −h) have sigma = −1 and the same map (nls.md §11 settings)", () => {
    const r = ok(buildTransformation(nlsVariant(NLS_CASES[3], true, [0, 1.4])));
    expect(r.sigma).toBe(-1);
    expect(Math.abs(r.table.values.gamma[256] - Math.log(2.4) / 2)).toBeLessThan(1e-10);
  });

  it("forced and free constants follow nls.md §6 (forced chirps (d) 1/4, (e) −1/2, (k1) 1/2, (k2) 0.1)", () => {
    const want: Record<string, number> = { d: 0.25, e: -0.5, k1: 0.5, k2: 0.1 };
    for (const [id, a0] of Object.entries(want)) {
      const r = ok(buildTransformation(nlsVariant(NLS_CASES.find((c) => c.id === id)!, false, [0, 1])));
      const alpha = r.constants.find((k) => k.name === "alpha(t0)")!;
      expect(alpha.status).toBe("forced");
      expect(Math.abs(alpha.value - a0)).toBeLessThan(1e-14);
      const free = r.constants.filter((k) => k.status === "free").map((k) => k.name);
      expect(free).toEqual(["beta0", "gamma0", "delta0", "eps0", "kappa0"]);
      expect(r.constants.find((k) => k.name === "sigma")!.status).toBe("forced");
    }
  });

  it("the map is the identity at t0 iff W(t0) = 0 and |h0/a0| = 2 (nls.md §6)", () => {
    const id = (cid: string) => ok(buildTransformation(nlsVariant(NLS_CASES.find((c) => c.id === cid)!, false, [0, 1]))).identityAtStart.holds;
    expect(id("a")).toBe(true);
    expect(id("c2")).toBe(true); // W(0) = −1/5 + 2·0.1 = 0, |h/a| = 2
    expect(id("d")).toBe(false); // forced chirp 1/4
    expect(id("e3")).toBe(false); // |h/a| = 2 but W(0) = −2
  });

  it("a chosen beta0 rescales the map: beta → beta0 beta, gamma → beta0² gamma (scaling symmetry, nls.md §6)", () => {
    const c = NLS_CASES.find((x) => x.id === "e")!;
    const r1 = ok(buildTransformation(nlsVariant(c, false, [0, 1])));
    const r2 = ok(buildTransformation(nlsVariant(c, false, [0, 1]), { beta0: 2 }));
    expect(Math.abs(r2.table.values.beta[200] - 2 * r1.table.values.beta[200])).toBeLessThan(1e-9);
    expect(Math.abs(r2.table.values.gamma[200] - 4 * r1.table.values.gamma[200])).toBeLessThan(1e-8);
    expect(Math.abs(r2.table.values.A[0] - 2)).toBeLessThan(1e-14); // A0 = |beta0| sqrt(2|a0/h0|) = 2
  });
});

describe("focusing times (nls.md §7)", () => {
  it("(d2) h = 1/cos t on [0, 3]: focusing at π/2, map window cut before it", () => {
    const d2 = NLS_CASES.find((c) => c.id === "d2")!;
    const r = ok(buildTransformation(nlsVariant(d2, false, [0, 3])));
    const focus = r.singularTimes.filter((s) => s.kind === "focusing");
    expect(focus.length).toBe(1);
    expect(Math.abs(focus[0].t - Math.PI / 2)).toBeLessThan(1e-9);
    expect(r.mapWindow[1]).toBeLessThan(Math.PI / 2);
    expect(r.truncation).toBeDefined();
    // beta ≈ sec t up to the end of the map window (nls.md §11 (d2))
    const n = r.table.t.length - 1;
    expect(Math.abs(r.table.values.beta[n] * Math.cos(r.table.t[n]) - 1)).toBeLessThan(1e-9);
  });

  it("Gross–Pitaevskii form, omega = 1, G = −1/cos t (a = 1/2, b = −1/2, h = 1/cos t) on [0, 5]: zeros of mu at π/2 and 3π/2 (nls.md §10)", () => {
    const r = ok(buildTransformation(variant("nls", { a: "1/2", b: "-1/2", h: "1/cos(t)" }, [0, 5])));
    const ts = r.singularTimes.filter((s) => s.kind === "focusing").map((s) => s.t);
    expect(ts.length).toBe(2);
    expect(Math.abs(ts[0] - Math.PI / 2)).toBeLessThan(1e-9);
    expect(Math.abs(ts[1] - (3 * Math.PI) / 2)).toBeLessThan(1e-9);
  });

  it("no singular time when R ≡ 0 and h stays finite (nls.md §4)", () => {
    const r = ok(buildTransformation(nlsVariant(NLS_CASES.find((c) => c.id === "k2")!, false, [0, 10])));
    expect(r.singularTimes).toEqual([]);
    expect(r.mapWindow).toEqual([0, 10]);
  });
});

describe("refusals", () => {
  for (const c of NLS_FAILING) {
    it(`not-reducible member (${c.id}) with R = ${c.R} gets no transformation and says why (nls.md §11)`, () => {
      const r = buildTransformation(nlsVariant(c));
      expect(r.ok).toBe(false);
      if (r.ok) return;
      expect(r.code).toBe("not-reducible");
      expect(r.reason).toMatch(/invariant R/);
      expect(r.reason).toMatch(/rho_inv/);
    });
  }
  it("free parameters left in the coefficients are refused", () => {
    const v = variant("nls", { a: "1/2", h: "1" }, [0, 1]);
    v.coefficients.k = { kind: "sym", name: "k0" };
    v.free = ["k0"];
    const r = buildTransformation(v);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.code).toBe("free-parameters");
  });
  it("a window with t1 ≤ t0 is refused", () => {
    const r = buildTransformation(variant("nls", { a: "1/2", h: "1" }, [1, 1]));
    expect(r.ok).toBe(false);
  });
});

describe("result shape", () => {
  it("is JSON-serialisable and the plot data is down-sampled (≤ 200 points per curve)", () => {
    const r = ok(buildTransformation(nlsVariant(NLS_CASES.find((c) => c.id === "d2")!, false, [0, 3])));
    expect(nonJsonLeaves(r)).toEqual([]);
    const text = JSON.stringify(r);
    expect(JSON.stringify(JSON.parse(text))).toBe(text);
    for (const c of [...r.plot.coefficients, ...r.plot.mapCurves]) {
      expect(c.t.length).toBeLessThanOrEqual(200);
      expect(c.values.length).toBe(c.t.length);
    }
    // h has a pole at π/2 inside the requested window: the coefficient curve is finite or null
    const h = r.plot.coefficients.find((c) => c.name === "h")!;
    for (const v of h.values) expect(v === null || Number.isFinite(v)).toBe(true);
    expect(r.plot.mapCurves.map((c) => c.name)).toEqual(["mu", "beta", "gamma"]);
  });
});
