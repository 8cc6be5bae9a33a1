/**
 * Free parameters: the values that make the invariant vanish identically, by weighted least
 * squares over random sample points (ENGINE-NOTES §6 "numeric, when R is affine in the unknowns"),
 * solved by Levenberg–Marquardt (K. Levenberg 1944; D. W. Marquardt, J. SIAM 11 (1963) 431–441)
 * from several starts, with exact gradients from dual numbers. Residual at point t_j:
 * r_j = X(t_j; θ) · |N_j(θ0)| / S_j(θ0), X the invariant (R, K or Q = P/N, nls.md §3), S the term
 * scale; at θ0 this is the signed rho_inv, and using X (not P) keeps θ away from a h = 0.
 */
import { DoubleField } from "../expr";
import type { Expr } from "../expr";
import type { Rng } from "../random";
import {
  FREE_SOLVE_ACCEPT,
  FREE_SOLVE_DEDUPE,
  FREE_SOLVE_MAX_ITERATIONS,
  FREE_SOLVE_RANK,
  FREE_SOLVE_RANK_ABSOLUTE,
  FREE_SOLVE_STARTS,
} from "../tolerances";
import { dualField } from "./dual";
import type { InvariantDefinition } from "./invariants";
import { normalStep, pivotColumns, svd } from "./linalg";
import type { Matrix } from "./linalg";
import { polynomialParts } from "./terms";

export interface SolveProblem {
  def: InvariantDefinition;
  /** Coefficients with the free parameters as symbols. */
  coefficients: Record<string, Expr>;
  free: string[];
  points: number[];
}

interface Evaluation {
  r: number[];
  j: Matrix;
  maxAbs: number;
}

/** Weights |N_j|/S_j at θ (null if some point is singular there). */
export function weightsAt(problem: SolveProblem, theta: number[]): number[] | null {
  const params: Record<string, number> = {};
  problem.free.forEach((name, i) => (params[name] = theta[i]));
  const weights: number[] = [];
  for (const t of problem.points) {
    try {
      const parts = polynomialParts(problem.def, problem.coefficients, t, params, DoubleField);
      const w = parts.scale === 0 ? 1 : Math.abs(parts.normalizer) / parts.scale;
      if (!Number.isFinite(w) || w === 0) return null;
      weights.push(w);
    } catch {
      return null;
    }
  }
  return weights;
}

/** Weighted residuals and their Jacobian in the parameters listed by `active` (others fixed). */
export function evaluateResiduals(problem: SolveProblem, theta: number[], weights: number[], active: number[]): Evaluation | null {
  const F = dualField(DoubleField, active.length);
  const params: Record<string, ReturnType<typeof F.constant>> = {};
  problem.free.forEach((name, i) => {
    const k = active.indexOf(i);
    params[name] = k >= 0 ? F.variable(theta[i], k) : F.constant(theta[i]);
  });
  const r: number[] = [];
  const j: Matrix = [];
  let maxAbs = 0;
  for (let idx = 0; idx < problem.points.length; idx++) {
    try {
      const parts = polynomialParts(problem.def, problem.coefficients, F.constant(problem.points[idx]), params, F);
      const x = F.div(parts.p, parts.normalizer);
      const value = x.v * weights[idx];
      const row = x.d.map((g) => g * weights[idx]);
      if (!Number.isFinite(value) || row.some((g) => !Number.isFinite(g))) return null;
      r.push(value);
      j.push(row);
      maxAbs = Math.max(maxAbs, Math.abs(value));
    } catch {
      return null;
    }
  }
  return { r, j, maxAbs };
}

export interface LmResult {
  theta: number[];
  maxResidual: number;
  iterations: number;
}

/** Levenberg–Marquardt on the active parameters from `start` (Marquardt 1963 damping). */
export function levenbergMarquardt(problem: SolveProblem, start: number[], weights: number[], active: number[]): LmResult | null {
  let theta = start.slice();
  let current = evaluateResiduals(problem, theta, weights, active);
  if (!current) return null;
  let cost = current.r.reduce((acc, x) => acc + x * x, 0);
  let lambda = 1e-3;
  let iterations = 0;
  // Converged well below the acceptance level (the high-precision refinement does the rest), or stalled.
  const target = 1e-4 * FREE_SOLVE_ACCEPT;
  for (; iterations < FREE_SOLVE_MAX_ITERATIONS && current.maxAbs > target; iterations++) {
    const step = normalStep(current.j, current.r, lambda, DoubleField);
    if (!step || step.some((x) => !Number.isFinite(x))) {
      lambda *= 10;
      if (lambda > 1e16) break;
      continue;
    }
    const trial = theta.slice();
    active.forEach((p, k) => (trial[p] += step[k]));
    const next = evaluateResiduals(problem, trial, weights, active);
    const nextCost = next ? next.r.reduce((acc, x) => acc + x * x, 0) : Infinity;
    if (!next || !(nextCost < cost)) {
      lambda *= 4;
      if (lambda > 1e16) break;
      continue;
    }
    const size = Math.hypot(...step);
    const stalled = nextCost > (1 - 1e-10) * cost;
    theta = trial;
    current = next;
    cost = nextCost;
    lambda = Math.max(lambda / 3, 1e-15);
    if (stalled || size <= 1e-15 * (1 + Math.hypot(...theta))) break;
  }
  return { theta, maxResidual: current.maxAbs, iterations };
}

export interface Candidate {
  theta: number[];
  maxResidual: number;
  weights: number[];
  starts: number;
}

/** Random starts θ_i = N(0,1) · 10^U(-1,1) (design choice: spans magnitudes 0.1 … 10). */
function randomStart(rng: Rng, n: number): number[] {
  return Array.from({ length: n }, () => rng.normal() * Math.pow(10, rng.uniform(-1, 1)));
}

function close(a: number[], b: number[]): boolean {
  const diff = Math.hypot(...a.map((x, i) => x - b[i]));
  return diff <= FREE_SOLVE_DEDUPE * (1 + Math.hypot(...a));
}

/** Run LM from FREE_SOLVE_STARTS starts; converged ones, deduplicated, plus the best residual seen. */
export function findCandidates(problem: SolveProblem, rng: Rng): { candidates: Candidate[]; bestResidual: number; starts: number } {
  const n = problem.free.length;
  const all = problem.free.map((_, i) => i);
  const candidates: Candidate[] = [];
  let bestResidual = Infinity;
  let starts = 0;
  for (let attempt = 0; attempt < 4 * FREE_SOLVE_STARTS && starts < FREE_SOLVE_STARTS; attempt++) {
    const start = randomStart(rng, n);
    const weights = weightsAt(problem, start);
    if (!weights) continue;
    if (!evaluateResiduals(problem, start, weights, [])) continue;
    starts++;
    const result = levenbergMarquardt(problem, start, weights, all);
    if (!result) continue;
    bestResidual = Math.min(bestResidual, result.maxResidual);
    if (result.maxResidual > FREE_SOLVE_ACCEPT) continue;
    const existing = candidates.find((c) => close(c.theta, result.theta));
    if (existing) {
      existing.starts++;
      continue;
    }
    candidates.push({ theta: result.theta, maxResidual: result.maxResidual, weights, starts: 1 });
  }
  return { candidates, bestResidual, starts };
}

export interface RankAnalysis {
  rank: number;
  /** Parameters determined by the others (pivot columns), by index. */
  pivots: number[];
  nullDirections: number[][];
  /** Right singular vector of the smallest singular value. */
  weakest: number[];
}

/**
 * Rank of the Jacobian at the candidate: singular values above both FREE_SOLVE_RANK × the largest
 * and an absolute floor (a direction that does not move the rho-like residual is not a constraint).
 */
export function analyseRank(problem: SolveProblem, c: Candidate): RankAnalysis {
  const all = problem.free.map((_, i) => i);
  const e = evaluateResiduals(problem, c.theta, c.weights, all);
  if (!e) return { rank: all.length, pivots: all, nullDirections: [], weakest: all.map((i) => (i === 0 ? 1 : 0)) };
  const { sigma, v } = svd(e.j);
  const floor = (FREE_SOLVE_RANK_ABSOLUTE * Math.sqrt(problem.points.length)) / (1 + Math.hypot(...c.theta));
  const threshold = Math.max(FREE_SOLVE_RANK * (sigma[0] ?? 0), floor);
  const rank = sigma.filter((s) => s > threshold).length;
  const nullDirections = sigma.map((_, k) => k).filter((k) => k >= rank).map((k) => v.map((row) => row[k]));
  const weakest = v.map((row) => row[row.length - 1]);
  return { rank, pivots: rank === all.length ? all : pivotColumns(e.j, rank), nullDirections, weakest };
}

/** Is the weighted residual still ≤ FREE_SOLVE_ACCEPT at θ (R ≡ 0 there too)? */
export function stillSolves(problem: SolveProblem, theta: number[], weights: number[]): boolean {
  const e = evaluateResiduals(problem, theta, weights, []);
  return e !== null && e.maxAbs <= FREE_SOLVE_ACCEPT;
}

/** Re-solve only the pivot parameters with the others held at `theta`'s values. */
export function resolvePivots(problem: SolveProblem, theta: number[], weights: number[], pivots: number[]): number[] | null {
  const r = levenbergMarquardt(problem, theta, weights, pivots);
  return r && r.maxResidual <= FREE_SOLVE_ACCEPT ? r.theta : null;
}

/** A value rounded to 2 significant digits (a readable point on a family); 1 if that is 0. */
export function niceValue(x: number): number {
  if (x === 0) return 0;
  const r = Number(x.toPrecision(2));
  return r === 0 ? 1 : r;
}

/** Estimated order of vanishing along `direction` (|r| ∝ δ^m): 1 for a regular root, ≥ 2 for a multiple one. */
export function multiplicityAlong(problem: SolveProblem, c: Candidate, direction: number[]): number {
  const all = problem.free.map((_, i) => i);
  const delta = 1e-4 * (1 + Math.hypot(...c.theta));
  const norm = (d: number): number => {
    const e = evaluateResiduals(problem, c.theta.map((x, i) => x + d * direction[i]), c.weights, all);
    return e ? Math.hypot(...e.r) : NaN;
  };
  const ratio = norm(delta) / norm(delta / 2);
  const m = Math.round(Math.log2(ratio));
  return Number.isFinite(m) ? Math.min(Math.max(m, 1), 8) : 1;
}
