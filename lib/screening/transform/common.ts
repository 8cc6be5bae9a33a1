/** Small numeric helpers shared by the class builders. */
import type { MapTable, SampledCurve } from "./types";
import type { CoefficientSet } from "./coefficients";
import { uniformGrid } from "../ode";
import { ODE_ABS_TOL, ODE_REL_TOL } from "../tolerances";

export const TABLE_INTERVALS = 256;
export const SCAN_INTERVALS = 512;
export const PLOT_POINTS = 200;

export function finiteOrNull(v: number): number | null {
  return Number.isFinite(v) ? v : null;
}

/** At most `max` evenly spread samples of a tabulated curve (always keeps both ends). */
export function downsample(t: readonly number[], v: readonly number[], max: number): { t: number[]; v: number[] } {
  if (t.length <= max) return { t: [...t], v: [...v] };
  const out = { t: [] as number[], v: [] as number[] };
  for (let i = 0; i < max; i++) {
    const j = Math.round((i * (t.length - 1)) / (max - 1));
    out.t.push(t[j]);
    out.v.push(v[j]);
  }
  return out;
}

export function curve(name: string, latex: string, t: readonly number[], v: readonly number[]): SampledCurve {
  const d = downsample(t, v, PLOT_POINTS);
  return { name, latex, t: d.t, values: d.v.map(finiteOrNull) };
}

/** First t in (a, b] where ok(t) fails, by bisection (ok(a) must hold); precision tol. */
export function firstFailure(ok: (t: number) => boolean, a: number, b: number, tol: number): number {
  let lo = a;
  let hi = b;
  for (let i = 0; i < 200 && hi - lo > tol; i++) {
    const mid = (lo + hi) / 2;
    if (ok(mid)) lo = mid;
    else hi = mid;
  }
  return hi;
}

/** Interior sample points of [t0, t1] for guards (fixed, reproducible fractions). */
export function guardPoints(t0: number, t1: number): number[] {
  return [0, 0.137, 0.371, 0.613, 0.887].map((f) => t0 + f * (t1 - t0));
}

/**
 * max_i |a_i − b_i| / max(|b_i|, 1e-3 · max|b|, floor). The floor keeps functions that are zero up
 * to rounding (e.g. a chirp that vanishes) from producing a relative difference of order 1.
 */
export function maxRelDiff(a: readonly number[], b: readonly number[], floor = 1e-300): number {
  let scale = 0;
  for (const v of b) scale = Math.max(scale, Math.abs(v));
  let m = 0;
  for (let i = 0; i < a.length; i++) m = Math.max(m, Math.abs(a[i] - b[i]) / Math.max(Math.abs(b[i]), scale * 1e-3, floor));
  return m;
}

export function fmt(v: number): string {
  return Number.isFinite(v) ? Number(v.toPrecision(10)).toString() : String(v);
}

/** End of the admissible part of [t0, t1]: the first point (scan + bisection) where ok fails, or t1. */
export function admissibleEnd(ok: (t: number) => boolean, t0: number, t1: number, intervals: number): number {
  for (let i = 1; i <= intervals; i++) {
    const t = i === intervals ? t1 : t0 + ((t1 - t0) * i) / intervals;
    if (!ok(t)) {
      const prev = t0 + ((t1 - t0) * (i - 1)) / intervals;
      return firstFailure(ok, prev, t, 1e-12 * Math.max(1, Math.abs(t1)));
    }
  }
  return t1;
}

/** How the map table was integrated, for the evidence (all three classes; runs' counts are added). */
export function integratorEvidence(nodes: number, ...runs: { stats: { evaluations: number; acceptedSteps: number; rejectedSteps: number } }[]) {
  const sum = (k: "evaluations" | "acceptedSteps" | "rejectedSteps") => runs.reduce((n, r) => n + r.stats[k], 0);
  return {
    method: "odex (Gragg–Bulirsch–Stoer extrapolation), restarted at each node",
    relTol: ODE_REL_TOL, absTol: ODE_ABS_TOL, nodes,
    evaluations: sum("evaluations"), acceptedSteps: sum("acceptedSteps"), rejectedSteps: sum("rejectedSteps"),
  };
}

/** Plot data of KdV and mKdV maps: the coefficients on 200 points and the curves β, γ, A. */
export function scalarMapPlot(coefs: CoefficientSet, t0: number, t1: number, table: MapTable) {
  const tc = uniformGrid(t0, t1, 199);
  const cv = tc.map((t) => coefs.values(t));
  return {
    coefficients: coefs.names.map((n) => curve(n, n, tc, cv.map((v) => v[n]))),
    mapCurves: [
      curve("beta", "\\beta", table.t, table.values.beta),
      curve("gamma", "\\gamma", table.t, table.values.gamma),
      curve("A", "A", table.t, table.values.A),
    ],
  };
}
