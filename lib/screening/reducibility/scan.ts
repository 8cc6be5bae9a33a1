/**
 * Where the preconditions fail on the window: zeros of a, h (NLS) or p, q (KdV, mKdV), poles and
 * non-finite values of any coefficient (README "Preconditions"; nls.md §0: "split the window at
 * the sign change"). A grid scan, then bisection on sign changes, golden-section search for
 * touching zeros and even-order poles, and bisection on finiteness for undefined regions.
 */
import { compileExpression } from "../expr";
import type { Expr } from "../expr";
import {
  SCAN_BISECT_RELATIVE,
  SCAN_GRID_CELLS,
  SCAN_MIN_SUBWINDOW,
  SCAN_POLE_GROWTH,
  SCAN_TOUCH_ZERO,
} from "../tolerances";

export type SingularKind = "zero" | "pole" | "non-finite" | "jump";

export interface SingularPoint {
  t: number;
  coefficient: string;
  kind: SingularKind;
}

export interface UndefinedRegion {
  from: number;
  to: number;
  coefficient: string;
}

export interface ScanResult {
  /** Singular points inside the window, where it is split. */
  points: SingularPoint[];
  /** Singular points at (or within a negligible distance of) the window ends. */
  endpoints: SingularPoint[];
  /** Parts of the window where a coefficient is not a finite real number. */
  undefinedRegions: UndefinedRegion[];
  /** Coefficients that must be nonzero but vanish at every grid point (the equation leaves its class). */
  vanishing: string[];
  /** What remains to screen, in order. */
  subWindows: [number, number][];
}

type Fn = (t: number) => number;

const GOLDEN = (Math.sqrt(5) - 1) / 2;

/** Golden-section search for the extremum of g on [lo, hi]; returns the abscissa. */
function golden(g: Fn, lo: number, hi: number, iterations: number): number {
  let x1 = hi - GOLDEN * (hi - lo);
  let x2 = lo + GOLDEN * (hi - lo);
  let g1 = g(x1);
  let g2 = g(x2);
  for (let i = 0; i < iterations; i++) {
    if (g1 < g2) {
      hi = x2;
      x2 = x1;
      g2 = g1;
      x1 = hi - GOLDEN * (hi - lo);
      g1 = g(x1);
    } else {
      lo = x1;
      x1 = x2;
      g1 = g2;
      x2 = lo + GOLDEN * (hi - lo);
      g2 = g(x2);
    }
  }
  return (lo + hi) / 2;
}

/** Boundary between a finite point `good` and a non-finite point `bad`, by bisection. */
function bisectFinite(f: Fn, good: number, bad: number, tol: number): number {
  while (Math.abs(bad - good) > tol) {
    const mid = (good + bad) / 2;
    if (Number.isFinite(f(mid))) good = mid;
    else bad = mid;
  }
  return (good + bad) / 2;
}

/** A sign change of f in [lo, hi] (finite ends of opposite sign), by bisection. */
function bisectSign(f: Fn, lo: number, hi: number, tol: number): number {
  let flo = f(lo);
  while (hi - lo > tol) {
    const mid = (lo + hi) / 2;
    const fm = f(mid);
    if (!Number.isFinite(fm) || fm === 0) return mid;
    if (Math.sign(fm) === Math.sign(flo)) {
      lo = mid;
      flo = fm;
    } else hi = mid;
  }
  return (lo + hi) / 2;
}

/** Is t* a zero, a pole or a jump of f? By how |f| changes as the probe distance shrinks 1000×. */
function classify(f: Fn, t: number, spacing: number): SingularKind {
  const size = (d: number): number => {
    const l = f(t - d);
    const r = f(t + d);
    if (!Number.isFinite(l) || !Number.isFinite(r)) return Infinity;
    return Math.max(Math.abs(l), Math.abs(r));
  };
  const g1 = size(1e-4 * spacing);
  const g2 = size(1e-7 * spacing);
  if (!Number.isFinite(g2) || g2 > 10 * g1) return "pole";
  if (g2 < 0.1 * g1) return "zero";
  return "jump";
}

function scanOne(name: string, f: Fn, window: [number, number], mustBeNonzero: boolean, out: ScanResult): void {
  const [t0, t1] = window;
  const L = t1 - t0;
  const n = SCAN_GRID_CELLS;
  const h = L / n;
  const tol = SCAN_BISECT_RELATIVE * L;
  const ts = Array.from({ length: n + 1 }, (_, i) => (i === n ? t1 : t0 + i * h));
  const vs = ts.map(f);
  const finite = vs.map(Number.isFinite);
  const found: SingularPoint[] = [];
  if (mustBeNonzero && vs.every((v) => v === 0)) {
    out.vanishing.push(name);
    return;
  }

  // Runs of non-finite grid values: isolated points or undefined regions.
  for (let i = 0; i <= n; i++) {
    if (finite[i]) continue;
    let j = i;
    while (j + 1 <= n && !finite[j + 1]) j++;
    const left = i === 0 ? t0 : bisectFinite(f, ts[i - 1], ts[i], tol);
    const right = j === n ? t1 : bisectFinite(f, ts[j + 1], ts[j], tol);
    if (right - left <= SCAN_MIN_SUBWINDOW * L) {
      const t = (left + right) / 2;
      const kind = classify(f, t, h);
      found.push({ t, coefficient: name, kind: kind === "pole" ? "pole" : "non-finite" });
    } else {
      out.undefinedRegions.push({ from: left, to: right, coefficient: name });
    }
    i = j;
  }

  const absMax = Math.max(0, ...vs.filter((v) => Number.isFinite(v)).map(Math.abs));
  for (let i = 0; i < n; i++) {
    const a = vs[i];
    const b = vs[i + 1];
    if (!finite[i] || !finite[i + 1]) continue;
    if (a === 0) {
      if (mustBeNonzero) found.push({ t: ts[i], coefficient: name, kind: "zero" });
      continue;
    }
    if (a * b < 0) {
      const t = bisectSign(f, ts[i], ts[i + 1], tol);
      const kind = classify(f, t, h);
      if (kind !== "zero" || mustBeNonzero) found.push({ t, coefficient: name, kind });
    }
  }
  if (finite[n] && vs[n] === 0 && mustBeNonzero) found.push({ t: t1, coefficient: name, kind: "zero" });

  // Touching zeros (no sign change) and even-order poles: local extrema of |f| on the grid.
  for (let i = 1; i < n; i++) {
    if (!finite[i - 1] || !finite[i] || !finite[i + 1]) continue;
    const [l, c, r] = [Math.abs(vs[i - 1]), Math.abs(vs[i]), Math.abs(vs[i + 1])];
    if (vs[i - 1] * vs[i] < 0 || vs[i] * vs[i + 1] < 0 || c === 0) continue;
    if (mustBeNonzero && c <= l && c <= r) {
      const t = golden((x) => Math.abs(f(x)), ts[i - 1], ts[i + 1], 80);
      const v = Math.abs(f(t));
      if (Number.isFinite(v) && v <= SCAN_TOUCH_ZERO * absMax) found.push({ t, coefficient: name, kind: "zero" });
    }
    if (c >= l && c >= r) {
      const t = golden((x) => {
        const v = Math.abs(f(x));
        return Number.isFinite(v) ? -v : -Infinity;
      }, ts[i - 1], ts[i + 1], 80);
      const v = Math.abs(f(t));
      if (!Number.isFinite(v) || v > SCAN_POLE_GROWTH * Math.max(l, r)) found.push({ t, coefficient: name, kind: "pole" });
    }
  }

  for (const p of found) {
    const nearEnd = Math.min(p.t - t0, t1 - p.t) <= SCAN_MIN_SUBWINDOW * L;
    (nearEnd ? out.endpoints : out.points).push(p);
  }
}

/** Scan every coefficient on the window; `nonzero` lists those that must not vanish. */
export function scanCoefficients(
  coefficients: Record<string, Expr>,
  names: readonly string[],
  nonzero: readonly string[],
  window: [number, number],
  parameters: Record<string, number> = {},
): ScanResult {
  const out: ScanResult = { points: [], endpoints: [], undefinedRegions: [], vanishing: [], subWindows: [] };
  const paramNames = Object.keys(parameters);
  const paramValues = paramNames.map((p) => parameters[p]);
  for (const name of names) {
    const expr = coefficients[name];
    if (!expr) continue;
    const compiled = compileExpression(expr, ["t", ...paramNames]);
    const f: Fn = (t) => compiled(t, ...paramValues);
    scanOne(name, f, window, nonzero.includes(name), out);
  }
  out.points.sort((p, q) => p.t - q.t);
  out.undefinedRegions.sort((p, q) => p.from - q.from);
  out.subWindows = out.vanishing.length > 0 ? [] : subWindows(window, out.points, out.undefinedRegions);
  return out;
}

/** The window minus the singular points and undefined regions; negligible pieces dropped. */
function subWindows(window: [number, number], points: SingularPoint[], regions: UndefinedRegion[]): [number, number][] {
  const [t0, t1] = window;
  const minLength = SCAN_MIN_SUBWINDOW * (t1 - t0);
  const cuts: [number, number][] = [
    ...points.map((p): [number, number] => [p.t, p.t]),
    ...regions.map((r): [number, number] => [r.from, r.to]),
  ].sort((a, b) => a[0] - b[0]);
  const pieces: [number, number][] = [];
  let start = t0;
  for (const [from, to] of cuts) {
    if (from - start > minLength) pieces.push([start, from]);
    start = Math.max(start, to);
  }
  if (t1 - start > minLength) pieces.push([start, t1]);
  return pieces;
}
