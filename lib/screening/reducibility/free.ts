/**
 * The free-parameter part of the stage: candidates from the least-squares solve, their rank and
 * kind (isolated / family / any), high-precision refinement, then the ordinary screen of the
 * member with the values substituted (the verdict of each solution).
 */
import { evalNumber, num, substitute, toLatex } from "../expr";
import type { Expr } from "../expr";
import type { Rng } from "../random";
import type { FreeParameterEvidence, FreeSolutionEvidence } from "../report";
import { FREE_SOLVE_POINTS, SAMPLE_MARGIN } from "../tolerances";
import { algebriteText, invariantExpr, parseSymbolicAnswer } from "./display";
import { jsonNumber, screenFixed } from "./fixed";
import {
  analyseRank,
  findCandidates,
  multiplicityAlong,
  niceValue,
  resolvePivots,
  stillSolves,
} from "./free-solve";
import type { Candidate, SolveProblem } from "./free-solve";
import type { InvariantDefinition } from "./invariants";
import { refineSolution } from "./refine";
import type { SymbolicHook } from "./types";

/** Coefficients with parameter values (exact decimal texts) substituted as literals. */
export function substituteValues(coefficients: Record<string, Expr>, names: string[], texts: string[]): Record<string, Expr> {
  const map: Record<string, Expr> = {};
  names.forEach((name, i) => (map[name] = num(Number(texts[i]), texts[i])));
  const out: Record<string, Expr> = {};
  for (const [k, e] of Object.entries(coefficients)) out[k] = substitute(e, map);
  return out;
}

/** A candidate's kind, from the rank of the Jacobian and a move along the null space. */
interface Analysed {
  candidate: Candidate;
  kind: FreeSolutionEvidence["kind"];
  dimension: number;
  multiplicity: number;
  /** Indices of the determined parameters. */
  pivots: number[];
  chosen: number[];
  nullDirections: number[][];
}

/** Classify a candidate (cheap, double precision). */
function analyse(problem: SolveProblem, c: Candidate): Analysed {
  const n = problem.free.length;
  const all = problem.free.map((_, i) => i);
  const rank = analyseRank(problem, c);
  const base = { candidate: c, nullDirections: rank.nullDirections, multiplicity: 1 };
  if (rank.rank === n) {
    // Full rank by the thresholds, but a double root can still look regular: check the order of vanishing.
    const multiplicity = multiplicityAlong(problem, c, rank.weakest);
    return { ...base, multiplicity, kind: "isolated", dimension: 0, pivots: all, chosen: [] };
  }
  const chosen = all.filter((i) => !rank.pivots.includes(i));
  // Family test: move the chosen parameters, re-solve the pivots (Businger–Golub pivot set).
  const moved = c.theta.map((x, i) => (chosen.includes(i) ? x + 0.1 * (1 + Math.abs(x)) : x));
  const isFamily = rank.rank === 0 ? stillSolves(problem, moved, c.weights) : resolvePivots(problem, moved, c.weights, rank.pivots) !== null;
  if (isFamily) {
    return { ...base, kind: rank.rank === 0 ? "any" : "family", dimension: n - rank.rank, pivots: rank.pivots, chosen };
  }
  const multiplicity = Math.max(2, multiplicityAlong(problem, c, rank.nullDirections[0]));
  return { ...base, kind: "isolated", dimension: 0, multiplicity, pivots: all, chosen: [] };
}

const near = (a: number[], b: number[]): boolean =>
  Math.hypot(...a.map((x, i) => x - b[i])) <= 1e-6 * (1 + Math.hypot(...a));

/** Does `b` lie on `a`'s family? Continue a's pivots to b's chosen values (and the other way round). */
function sameSolution(problem: SolveProblem, a: Analysed, b: Analysed): boolean {
  if (a.kind === "any" || b.kind === "any") return a.kind === b.kind;
  if (a.kind !== "family" || b.kind !== "family") return false;
  const continued = (from: Analysed, to: Analysed): boolean => {
    const start = from.candidate.theta.map((x, i) => (from.chosen.includes(i) ? to.candidate.theta[i] : x));
    const r = resolvePivots(problem, start, from.candidate.weights, from.pivots);
    return r !== null && near(r, to.candidate.theta);
  };
  return continued(a, b) || continued(b, a);
}

/** Exact texts of every parameter: refined pivots; chosen ones at readable (2-digit) values. */
function refine(problem: SolveProblem, s: Analysed): string[] | null {
  const c = s.candidate;
  if (s.kind === "isolated") {
    // Schröder's multiplicity-m Newton step is implemented for one unknown only.
    if (s.multiplicity > 1 && problem.free.length > 1) return null;
    const plain = refineSolution(problem, c.theta, c.weights, s.pivots, {}, 1);
    if (s.multiplicity === 1) return plain?.texts ?? null;
    // The multiplicity estimate can be fooled by curvature: keep whichever iteration ends lower.
    const schroeder = refineSolution(problem, c.theta, c.weights, s.pivots, {}, s.multiplicity);
    const best = [plain, schroeder].filter((r) => r !== null).sort((x, y) => x.residual - y.residual)[0];
    return best?.texts ?? null;
  }
  const nice = c.theta.map((x, i) => (s.chosen.includes(i) ? niceValue(x) : x));
  const onFamily = s.kind === "any" ? nice : resolvePivots(problem, nice, c.weights, s.pivots) ?? c.theta;
  const fixed: Record<number, string> = {};
  for (const i of s.chosen) fixed[i] = String(onFamily[i]);
  if (s.kind === "any") return onFamily.map((x) => String(x));
  return refineSolution(problem, onFamily, c.weights, s.pivots, fixed, 1)?.texts ?? null;
}

/** Closed form of a single determined parameter through the symbolic hook, checked numerically. */
async function closedForm(
  problem: SolveProblem,
  parameter: string,
  values: Record<string, number>,
  hook: SymbolicHook,
  timeoutMs: number,
): Promise<string | undefined> {
  const others = problem.free.filter((p) => p !== parameter);
  const expression = algebriteText(invariantExpr(problem.def.equationClass, problem.coefficients));
  let answer: string | null = null;
  try {
    answer = await hook({ kind: "solve", expression, unknown: parameter, timeoutMs });
  } catch {
    return undefined;
  }
  if (!answer) return undefined;
  const body = answer.trim().replace(/^\[/, "").replace(/\]$/, "");
  for (const piece of splitTopLevel(body)) {
    const root = parseSymbolicAnswer(piece, others);
    if (!root) continue;
    let v: number;
    try {
      v = evalNumber(root, values);
    } catch {
      continue;
    }
    const target = values[parameter];
    if (Math.abs(v - target) <= 1e-8 * Math.max(1, Math.abs(target))) return `${parameter} = ${toLatex(root)}`;
  }
  return undefined;
}

function splitTopLevel(text: string): string[] {
  const out: string[] = [];
  let depth = 0;
  let start = 0;
  for (let i = 0; i < text.length; i++) {
    const ch = text[i];
    if (ch === "(" || ch === "[") depth++;
    else if (ch === ")" || ch === "]") depth--;
    else if (ch === "," && depth === 0) {
      out.push(text.slice(start, i));
      start = i + 1;
    }
  }
  out.push(text.slice(start));
  return out.filter((s) => s.trim() !== "");
}

/** Solve for the free parameters of one member and screen every solution found. */
export async function solveFree(
  def: InvariantDefinition,
  coefficients: Record<string, Expr>,
  free: string[],
  window: [number, number],
  rng: Rng,
  hook: SymbolicHook | undefined,
  timeoutMs: number,
): Promise<FreeParameterEvidence> {
  const [t0, t1] = window;
  const L = t1 - t0;
  const points = Array.from({ length: FREE_SOLVE_POINTS }, () =>
    Number(rng.uniform(t0 + SAMPLE_MARGIN * L, t1 - SAMPLE_MARGIN * L).toPrecision(12)),
  );
  const problem: SolveProblem = { def, coefficients, free, points };
  const found = findCandidates(problem, rng);
  const analysed: Analysed[] = [];
  for (const c of found.candidates) {
    const a = analyse(problem, c);
    const same = analysed.find((b) => sameSolution(problem, b, a));
    if (same) same.candidate.starts += c.starts;
    else analysed.push(a);
  }
  const solutions: FreeSolutionEvidence[] = [];
  for (const s of analysed) {
    const c = s.candidate;
    const index = solutions.length;
    const refined = refine(problem, s);
    const texts = refined ?? c.theta.map((x) => String(x));
    const role = (i: number): "determined" | "chosen" => (s.chosen.includes(i) ? "chosen" : "determined");
    const constraints = free.map((parameter, i) => ({ parameter, value: Number(texts[i]), exact: texts[i], role: role(i) }));
    const screen = screenFixed(def, substituteValues(coefficients, free, texts), window, rng);
    let { verdict, reason, message } = screen;
    if (!refined && verdict !== "reducible") {
      verdict = "undecided";
      reason = "borderline-after-confirmation";
      message = "rank-deficient root in several unknowns: not refined in high precision, so its confirmation is not conclusive";
    }
    const evidence: FreeSolutionEvidence = {
      index,
      kind: s.kind,
      dimension: s.dimension,
      multiplicity: s.multiplicity,
      constraints,
      nullDirections: s.nullDirections.map((d) => d.map((x) => (x === 0 ? 0 : x))),
      starts: c.starts,
      verdict,
      windows: screen.windows,
      singularities: screen.singularities,
    };
    if (reason) evidence.reason = reason;
    if (message) evidence.message = message;
    const determined = constraints.filter((k) => k.role === "determined");
    if (hook && determined.length === 1 && verdict === "reducible") {
      const values: Record<string, number> = {};
      constraints.forEach((k) => (values[k.parameter] = k.value));
      const form = await closedForm(problem, determined[0].parameter, values, hook, timeoutMs);
      if (form) evidence.closedForm = form;
    }
    solutions.push(evidence);
  }
  return { parameters: free, points, starts: found.starts, bestResidual: jsonNumber(found.bestResidual), solutions };
}
