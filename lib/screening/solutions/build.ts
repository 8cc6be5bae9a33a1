/**
 * buildSolutions: the exact solutions available for a transformed member (by class and canonical
 * sign), their parameter lists, check values and a |u|² grid of the first one (≤ 64 × 64).
 */
import type { Variant } from "../spec/types";
import type { TransformationResult, MapTable } from "../transform/types";
import { canonicalFeature, solutionsFor, withDefaults } from "./catalogue";
import { evaluateSolution, intensityOnGrid } from "./evaluate";
import type { CheckPoint, IntensityGrid, SolutionSet, SolutionSpec } from "./types";

const GRID = 64;

function linspace(a: number, b: number, n: number): number[] {
  return Array.from({ length: n }, (_, i) => (i === n - 1 ? b : a + ((b - a) * i) / (n - 1)));
}

/** x-range that shows the solution over the whole map window. */
export function plotRange(spec: SolutionSpec, table: MapTable, params: Record<string, number>): [number, number] {
  const p = withDefaults(spec, params);
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = 0; i < table.t.length; i++) {
    const beta = table.values.beta[i];
    const f = canonicalFeature(spec.kind, p, table.values.gamma[i]);
    const xc = (f.centre - table.values.eps[i]) / beta;
    const half = (f.period !== undefined ? 1.5 * f.period : 8 * f.width) / Math.abs(beta);
    if (f.period !== undefined && i > 0) continue; // periodic: frame the first period pattern at t0
    lo = Math.min(lo, xc - half);
    hi = Math.max(hi, xc + half);
  }
  if (!(Number.isFinite(lo) && Number.isFinite(hi) && hi > lo)) return [-10, 10];
  return [lo, hi];
}

export function buildSolutions(variant: Variant, transformation: TransformationResult): SolutionSet {
  if (!transformation.ok) return { ok: false, reason: `no transformation: ${transformation.reason}` };
  if (transformation.class !== variant.class) return { ok: false, reason: "the transformation belongs to another class" };
  const specs = solutionsFor(transformation.class, transformation.sigma);
  const table = transformation.table;
  const [m0, m1] = transformation.mapWindow;
  const tCheck = 0.8 >= m0 && 0.8 <= m1 ? 0.8 : (m0 + m1) / 2;
  const checkPoints: CheckPoint[] = specs.map((s) => {
    const u = evaluateSolution(s, table, {}, 0.5, tCheck);
    return { solutionId: s.id, x: 0.5, t: tCheck, re: u.re, im: u.im };
  });
  let plot: IntensityGrid | null = null;
  if (specs.length) {
    const s = specs[0];
    const params = withDefaults(s);
    const [x0, x1] = plotRange(s, table, params);
    const xs = linspace(x0, x1, GRID);
    const ts = linspace(m0, m1, GRID);
    plot = { solutionId: s.id, quantity: "|u|^2", params, x: xs, t: ts, values: intensityOnGrid(s, table, params, xs, ts) };
  }
  const notes = transformation.truncation ? [`solutions are given on the map window [${m0}, ${m1}] (${transformation.truncation.reason})`] : [];
  return { ok: true, class: transformation.class, sigma: transformation.sigma, solutions: specs, checkPoints, plot, notes };
}
