/**
 * ODE integration on a fixed output grid with odex (Hairer–Wanner GBS extrapolation), restarted
 * at every grid node (../shared/ENGINE-NOTES.md §7: restarting is more accurate than odex's
 * dense output, ~6e-13 at rtol 1e-13).
 *
 * Guards (ENGINE-NOTES §7: odex reports outcome 1 with y = NaN and the requested xEnd at a pole):
 * every segment's outcome is checked, every state is checked for finiteness, and a state whose
 * max-norm exceeds `blowUpLimit` stops the integration. The result then carries the nodes reached.
 */
import { Solver } from "./odex-binding.js";
import { ODE_ABS_TOL, ODE_BLOW_UP_LIMIT, ODE_MAX_STEPS_PER_SEGMENT, ODE_REL_TOL } from "../tolerances";

export interface OdeSystem {
  dimension: number;
  /** y' = rhs(t, y). May throw (e.g. a coefficient jet that cannot be formed); that stops the run. */
  rhs(t: number, y: readonly number[]): number[];
}

export interface OdeOptions {
  relTol?: number;
  absTol?: number;
  maxStepsPerSegment?: number;
  blowUpLimit?: number;
}

export interface OdeStats {
  evaluations: number;
  acceptedSteps: number;
  rejectedSteps: number;
}

export type OdeFailure = "blow-up" | "non-finite" | "max-steps" | "rhs-error";

export type OdeResult =
  | { ok: true; t: number[]; y: number[][]; stats: OdeStats }
  | {
      ok: false;
      failure: OdeFailure;
      message: string;
      /** Nodes reached before the failure (always includes the start). */
      t: number[];
      y: number[][];
      /** Left end of the segment that failed. */
      stoppedAfter: number;
      stats: OdeStats;
    };

const OUTCOME_CONVERGED = 0;
const OUTCOME_MAX_STEPS = 1;

function allFinite(y: readonly number[]): boolean {
  for (const v of y) if (!Number.isFinite(v)) return false;
  return true;
}
function maxAbs(y: readonly number[]): number {
  let m = 0;
  for (const v of y) m = Math.max(m, Math.abs(v));
  return m;
}

/** Integrates y' = f(t, y) from grid[0] (state y0) through every node of the monotone grid. */
export function integrateOnGrid(system: OdeSystem, grid: readonly number[], y0: readonly number[], options: OdeOptions = {}): OdeResult {
  const solver = new Solver(system.dimension);
  solver.relativeTolerance = options.relTol ?? ODE_REL_TOL;
  solver.absoluteTolerance = options.absTol ?? ODE_ABS_TOL;
  solver.maxSteps = options.maxStepsPerSegment ?? ODE_MAX_STEPS_PER_SEGMENT;
  const limit = options.blowUpLimit ?? ODE_BLOW_UP_LIMIT;
  const stats: OdeStats = { evaluations: 0, acceptedSteps: 0, rejectedSteps: 0 };
  const ts = [grid[0]];
  const ys = [[...y0]];
  let rhsError: string | null = null;
  const f = (t: number, y: number[]): number[] => {
    if (rhsError !== null) return y.map(() => NaN);
    try {
      return system.rhs(t, y);
    } catch (err) {
      rhsError = err instanceof Error ? err.message : String(err);
      return y.map(() => NaN);
    }
  };
  // Stop inside a segment as soon as a state is non-finite or too large.
  const watch = (_n: number, _x0: number, _x1: number, y: number[]): boolean => allFinite(y) && maxAbs(y) <= limit;
  const fail = (failure: OdeFailure, message: string, at: number): OdeResult => ({
    ok: false, failure, message, t: ts, y: ys, stoppedAfter: at, stats,
  });
  let y = [...y0];
  if (!allFinite(y)) return fail("non-finite", "initial state is not finite", grid[0]);
  for (let i = 1; i < grid.length; i++) {
    const a = grid[i - 1];
    const b = grid[i];
    solver.initialStepSize = Math.min(1e-4, Math.abs(b - a) / 4) || 1e-4;
    solver.maxStepSize = Math.abs(b - a);
    const r = solver.solve(f, a, y, b, watch);
    stats.evaluations += r.nEval;
    stats.acceptedSteps += r.nAccept;
    stats.rejectedSteps += r.nReject;
    if (rhsError !== null) return fail("rhs-error", `right-hand side failed near t = ${a}: ${rhsError}`, a);
    if (!allFinite(r.y)) return fail("non-finite", `state became non-finite between t = ${a} and ${b}`, a);
    if (maxAbs(r.y) > limit) return fail("blow-up", `state exceeded ${limit} between t = ${a} and ${b}`, a);
    if (r.outcome === OUTCOME_MAX_STEPS) return fail("max-steps", `more than ${solver.maxSteps} steps between t = ${a} and ${b}`, a);
    if (r.outcome !== OUTCOME_CONVERGED) return fail("non-finite", `integration stopped early between t = ${a} and ${b}`, a);
    y = r.y;
    ts.push(b);
    ys.push([...y]);
  }
  return { ok: true, t: ts, y: ys, stats };
}

/** Uniform grid of n + 1 nodes on [a, b]; the end node is exactly b. */
export function uniformGrid(a: number, b: number, n: number): number[] {
  const g: number[] = [];
  for (let i = 0; i <= n; i++) g.push(i === n ? b : a + ((b - a) * i) / n);
  return g;
}

/**
 * A zero of component `index` of the solution between tA (state yA) and tB, where the component
 * changes sign, by bisection with re-integration from tA (no interpolation error).
 */
export function refineZero(
  system: OdeSystem, tA: number, yA: readonly number[], tB: number, index: number, tol: number, options: OdeOptions = {},
): number {
  let lo = tA;
  let hi = tB;
  const sA = Math.sign(yA[index]);
  for (let it = 0; it < 80 && hi - lo > tol; it++) {
    const mid = (lo + hi) / 2;
    const r = integrateOnGrid(system, [tA, mid], yA, options);
    const v = r.ok ? r.y[r.y.length - 1][index] : NaN;
    if (!Number.isFinite(v)) hi = mid;
    else if (Math.sign(v) === sA) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}
