// Tabulated ("numerical") designs: the Taylor jets behind the statistic, the statistic itself
// against the engine's own polynomial form, random draws whose unknown has no elementary form,
// and an independent finite-difference check of a table in the explicit form of R.
import { describe, it, expect } from "vitest";
import { DoubleField, evalNumber, jetMul } from "@/lib/screening/expr";
import { designModel, invariantStatistic } from "@/lib/screening/design";
import type { DesignRequest, DesignResult } from "@/lib/screening/design";
import { solutionJet, coefficientJets } from "@/lib/screening/design/jets";
import { createRng } from "@/lib/screening/random";
import { parse } from "../reducibility/build-variant";

describe("Taylor jets of an ODE solution (Picard iteration)", () => {
  it("y' = y from y(0) = 1 gives 1/k! (the exponential series)", () => {
    const cj = coefficientJets({}, 0, 6, 0);
    const [y] = solutionJet((_c, s) => [s[0]], cj, [1]);
    const factorial = [1, 1, 2, 6, 24, 120, 720];
    y.forEach((c, k) => expect(c).toBeCloseTo(1 / factorial[k], 15));
  });

  it("y'' = -w y with w = cos² + sin² (= 1) from (sin 0.7, cos 0.7) gives the series of sin about 0.7", () => {
    // w = cos² t + sin² t = 1, entering through a coefficient jet as in the design right-hand sides.
    const cj = coefficientJets({ w: parse("cos(t)^2 + sin(t)^2") }, 0.7, 5, 0);
    const [y] = solutionJet((c, s) => [s[1], jetMul(c.get("w"), s[0], DoubleField).map((v) => -v)], cj, [Math.sin(0.7), Math.cos(0.7)]);
    // Taylor coefficients of sin about 0.7: sin^(k)(0.7)/k!.
    const d = [Math.sin(0.7), Math.cos(0.7), -Math.sin(0.7), -Math.cos(0.7), Math.sin(0.7), Math.cos(0.7)];
    const factorial = [1, 1, 2, 6, 24, 120];
    y.forEach((c, k) => expect(c).toBeCloseTo(d[k] / factorial[k], 14));
  });
});

describe("invariant statistic from jets", () => {
  it("constant coefficients give -a²h²R with R = 4(k² − ck − ab) (nls.md §3)", () => {
    const [a, b, c, h, k] = [0.5, 0.3, 0.2, 1.5, 0.4];
    const jets = Object.fromEntries(Object.entries({ a, b, c, h, k }).map(([n, v]) => [n, [v, 0, 0, 0, 0]]));
    const [order0] = invariantStatistic("nls", jets, 3);
    expect(order0.residual).toBeCloseTo(-(a * a * h * h) * 4 * (k * k - c * k - a * b), 14);
  });

  it("constant KdV coefficients give p²q K with K = (r − 2s)(2r − s) − pm (kdv.md §2)", () => {
    const [p, q, r, s, m] = [6, 1, 0.3, 0.1, 0.05];
    const jets = Object.fromEntries(Object.entries({ p, q, r, s, m }).map(([n, v]) => [n, [v, 0, 0, 0, 0]]));
    const [order0] = invariantStatistic("kdv", jets, 3);
    expect(order0.residual).toBeCloseTo(p * p * q * ((r - 2 * s) * (2 * r - s) - p * m), 13);
  });
});

const W: [number, number] = [0, 2];
const dec = (rng: ReturnType<typeof createRng>, lo: number, hi: number) => String(Math.round(rng.uniform(lo, hi) * 100) / 100 || 0.11);

/** Unknowns whose conditions have no elementary solution for these draws (b, m varying). */
const DRAWS: ((rng: ReturnType<typeof createRng>) => DesignRequest)[] = [
  (rng) => ({ class: "nls", solve: "h", set: { a: `0.5*(1 + ${dec(rng, 0.1, 0.4)}*sin(t))`, b: `${dec(rng, -0.5, 0.5)}*cos(t)`, k: dec(rng, -0.2, 0.2) }, window: W }),
  (rng) => ({ class: "nls", solve: "k", set: { a: "1/2", h: `1 + ${dec(rng, 0.1, 0.5)}*t`, b: `${dec(rng, -0.4, 0.4)}/(1 + t)` }, window: W }),
  (rng) => ({ class: "nls", solve: "a", set: { h: "1", b: `${dec(rng, -0.3, 0.3)}*(1 + 0.5*sin(t))`, k: dec(rng, -0.1, 0.1) }, window: W }),
  (rng) => ({ class: "kdv", solve: "q", set: { p: "6", m: `${dec(rng, -0.05, 0.05)}*(1 + cos(t))` }, window: W }),
  (rng) => ({ class: "kdv", solve: "r", set: { p: "6", q: `1 + ${dec(rng, 0.1, 0.5)}*t`, m: `${dec(rng, -0.05, 0.05)}*sin(t)` }, window: W }),
  (rng) => ({ class: "kdv", solve: "p", set: { q: "1", m: `${dec(rng, 0.01, 0.05)}*(1 + t)` }, window: W }),
  (rng) => ({ class: "mkdv", solve: "p", set: { q: "1", r: `${dec(rng, 0.1, 0.9)}/(1 + t^2)` }, window: W }),
];

describe("random draws without an elementary solution: numerical designs", () => {
  it("7 kinds × 3 draws: tabulated, accuracy stated, invariant statistic at rounding level", async () => {
    const rng = createRng(404);
    let count = 0;
    for (const draw of DRAWS) {
      for (let i = 0; i < 3; i++) {
        const request = draw(rng);
        const out = await designModel(request, { transformation: false });
        expect(out.ok, JSON.stringify(out.ok ? "" : out.errors)).toBe(true);
        if (!out.ok) continue;
        const r = out.result;
        expect(r.solution.form, JSON.stringify(request)).toBe("tabulated");
        expect(r.screening.kind).toBe("numerical-design");
        expect(r.screening.reducibility).toBe("reducible");
        expect(r.screening.rhoMax).toBeLessThan(1e-12);
        if (r.solution.form === "tabulated") expect(r.solution.accuracy.maxRelDiff).toBeLessThan(1e-8);
        expect(r.submittable).toBe(false);
        expect(r.yaml).toBeNull();
        count++;
      }
    }
    expect(count).toBe(21);
  }, 120_000);

  it("a table passes an independent finite-difference check of R (explicit form, nls.md §3); a perturbed table does not", async () => {
    const out = await designModel({ class: "nls", solve: "h", set: { a: "0.5*(1 + 0.2*sin(t))", b: "0.3*cos(t)", k: "0.1" }, window: W }, { transformation: false });
    expect(out.ok).toBe(true);
    const r = (out as { ok: true; result: DesignResult }).result;
    if (r.solution.form !== "tabulated") throw new Error("expected a table");
    const { t, values } = r.solution;
    const hv = values as number[];
    const step = t[1] - t[0];
    const aE = parse("0.5*(1 + 0.2*sin(t))");
    const bE = parse("0.3*cos(t)");
    const rel = (h: (i: number) => number, i: number) => {
      // 4th-order central differences (Abramowitz & Stegun 1964, 25.3.6).
      const d1 = (f: (j: number) => number) => (-f(i + 2) + 8 * f(i + 1) - 8 * f(i - 1) + f(i - 2)) / (12 * step);
      const a = (j: number) => evalNumber(aE, { t: t[j] });
      const W = (j: number) => {
        // W = a'/a − h'/h + 2k, evaluated with differences of the table itself.
        const la = (evalNumber(aE, { t: t[j] + 1e-6 }) - evalNumber(aE, { t: t[j] - 1e-6 })) / 2e-6 / a(j);
        const lh = (-h(j + 2) + 8 * h(j + 1) - 8 * h(j - 1) + h(j - 2)) / (12 * step) / h(j);
        return la - lh + 0.2;
      };
      const w = W(i);
      const wp = (-W(i + 2) + 8 * W(i + 1) - 8 * W(i - 1) + W(i - 2)) / (12 * step);
      const la = d1(a) / a(i);
      const terms = [wp, -la * w, w * w, -4 * a(i) * evalNumber(bE, { t: t[i] })];
      return Math.abs(terms.reduce((x, y) => x + y)) / terms.reduce((x, y) => x + Math.abs(y), 0);
    };
    const inner = [60, 100, 140];
    const good = Math.max(...inner.map((i) => rel((j) => hv[j], i)));
    const perturbed = Math.max(...inner.map((i) => rel((j) => hv[j] * (1 + 0.01 * t[j] * t[j]), i)));
    expect(good).toBeLessThan(1e-6);
    expect(perturbed).toBeGreaterThan(1e-3);
  });
});
