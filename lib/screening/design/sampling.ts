/**
 * Numerical evaluation on the design window: sample points, a positivity oracle for the normal
 * form, and the check that a rewritten tree is the same function as the original.
 */
import { evalNumber, simplifyConstants } from "../expr";
import type { Expr } from "../expr";
import { DESIGN_SAME_FUNCTION } from "../tolerances";
import { polyToExpr, toPoly, together } from "./normal";
import { exprToString } from "../expr";
import type { NormalContext } from "./normal";

export interface WindowContext {
  window: [number, number];
  /** Values of every symbol except t (integration constants). */
  values: Record<string, number>;
}

/** n interior points of the window (midpoints of n equal cells): coefficients may be singular at the ends. */
export function interiorPoints([t0, t1]: [number, number], n: number): number[] {
  return Array.from({ length: n }, (_, i) => t0 + ((i + 0.5) / n) * (t1 - t0));
}

/** Points used to decide "the same function"; a fixed irregular set so that no rule matches by symmetry. */
export function checkPoints(window: [number, number]): number[] {
  const [t0, t1] = window;
  const u = [0.013, 0.071, 0.137, 0.229, 0.318, 0.402, 0.497, 0.563, 0.641, 0.733, 0.817, 0.902, 0.958, 0.991];
  return u.map((x) => t0 + x * (t1 - t0));
}

export function valueAt(expr: Expr, ctx: WindowContext, t: number): number {
  try {
    return evalNumber(expr, { ...ctx.values, t });
  } catch {
    return NaN;
  }
}

/** Positive and finite at 33 interior points and near both ends. */
export function positiveOnWindow(expr: Expr, ctx: WindowContext): boolean {
  const [t0, t1] = ctx.window;
  const span = t1 - t0;
  const pts = [...interiorPoints(ctx.window, 33), t0 + 1e-9 * span, t1 - 1e-9 * span];
  return pts.every((t) => {
    const v = valueAt(expr, ctx, t);
    return Number.isFinite(v) && v > 0;
  });
}

export function normalContext(ctx: WindowContext): NormalContext {
  const cache = new Map<Expr, boolean>();
  return {
    positive(expr: Expr): boolean {
      let v = cache.get(expr);
      if (v === undefined) cache.set(expr, (v = positiveOnWindow(expr, ctx)));
      return v;
    },
  };
}

/** Two trees agree (relative DESIGN_SAME_FUNCTION) at the check points where the first is finite, and are finite together. */
export function sameFunction(a: Expr, b: Expr, ctx: WindowContext): boolean {
  let compared = 0;
  for (const t of checkPoints(ctx.window)) {
    const x = valueAt(a, ctx, t);
    const y = valueAt(b, ctx, t);
    if (!Number.isFinite(x) || !Number.isFinite(y)) {
      if (Number.isFinite(x) !== Number.isFinite(y)) return false;
      continue;
    }
    compared++;
    if (Math.abs(x - y) > DESIGN_SAME_FUNCTION * Math.max(Math.abs(x), Math.abs(y), 1e-300)) {
      // Values that are rounding-level zeros of both trees count as equal.
      if (Math.max(Math.abs(x), Math.abs(y)) > 1e-13) return false;
    }
  }
  return compared >= 4;
}

/** Candidate forms of a tree: the normal form and its single-denominator form. */
function candidates(folded: Expr, normal: NormalContext): Expr[] {
  const poly = toPoly(folded, normal);
  const out = [polyToExpr(poly)];
  const joined = together(poly);
  if (joined) out.push(polyToExpr(joined));
  return out;
}

/**
 * The shortest (as text) of the normal-form candidates that is verified to be the same function,
 * else the lightly folded tree.
 */
export function simplifyVerified(expr: Expr, ctx: WindowContext, normal: NormalContext = normalContext(ctx)): { expr: Expr; simplified: boolean } {
  const folded = simplifyConstants(expr);
  let best: Expr | null = null;
  let bestLength = Infinity;
  try {
    for (const c of candidates(folded, normal)) {
      const length = exprToString(c).length;
      if (length < bestLength && sameFunction(folded, c, ctx)) {
        best = c;
        bestLength = length;
      }
    }
  } catch {
    // A failing normal form only costs the simplification.
  }
  return best ? { expr: best, simplified: true } : { expr: folded, simplified: false };
}
