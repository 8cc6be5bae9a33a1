/**
 * Sweeps: the values each parameter takes, and the cartesian product that turns a family into
 * its variants. Range points are computed exactly in decimal arithmetic: a point that is a
 * terminating decimal becomes one literal with its exact text; any other point (e.g. 1/3) becomes
 * the exact quotient of two literals, so the high-precision stage never sees a rounded value.
 */
import Decimal from "decimal.js";
import { div, num, type Expr } from "../expr";
import type { ParameterSpec } from "./types";

const Exact = Decimal.clone({ precision: 120 });
/** Wide enough that quotient × (steps - 1) is computed without rounding (120 + 4 digits). */
const Check = Decimal.clone({ precision: 400 });

export interface SweepPoint {
  value: number;
  expr: Expr;
}

function literal(text: string): Expr {
  return num(Number(text), text);
}

/** Number of values a parameter contributes to the product (fixed and free: 1). */
export function sweepSize(spec: ParameterSpec): number {
  if (spec.kind === "values") return spec.values.length;
  if (spec.kind === "range") return spec.steps;
  return 1;
}

/** The j-th of `steps` equally spaced points of [from, to], ends included, exactly. */
export function rangePoint(fromText: string, toText: string, steps: number, j: number): SweepPoint {
  if (j === 0) return { value: Number(fromText), expr: literal(fromText) };
  if (j === steps - 1) return { value: Number(toText), expr: literal(toText) };
  const a = new Exact(fromText);
  const b = new Exact(toText);
  const n = steps - 1;
  // point = (a (n - j) + b j) / n
  const numerator = a.mul(n - j).add(b.mul(j));
  const quotient = numerator.div(n);
  if (new Check(quotient).mul(n).eq(numerator)) {
    const text = quotient.toString();
    return { value: Number(text), expr: literal(text) };
  }
  const numeratorText = numerator.toString();
  return { value: quotient.toNumber(), expr: div(literal(numeratorText), literal(String(n))) };
}

/** The points of one swept or fixed parameter, in order. */
export function sweepPoints(spec: ParameterSpec): SweepPoint[] {
  switch (spec.kind) {
    case "fixed":
      return [{ value: spec.value, expr: literal(spec.text) }];
    case "values":
      return spec.values.map((v) => ({ value: v.value, expr: literal(v.text) }));
    case "range": {
      const fromText = spec.fromText ?? String(spec.from);
      const toText = spec.toText ?? String(spec.to);
      return Array.from({ length: spec.steps }, (_, j) => rangePoint(fromText, toText, spec.steps, j));
    }
    case "free":
      return [];
  }
}

/**
 * Product of the sweep sizes, stopping early once it exceeds `cap` (so huge products never
 * overflow); returns cap + 1 in that case.
 */
export function variantCount(specs: Iterable<ParameterSpec>, cap: number): number {
  let count = 1;
  for (const spec of specs) {
    count *= sweepSize(spec);
    if (count > cap) return cap + 1;
  }
  return count;
}

/**
 * Every combination of the fixed and swept parameters, first-declared parameter varying slowest.
 * Free parameters are left out (they stay symbols).
 */
export function combinations(params: ReadonlyArray<[string, ParameterSpec]>): Array<Array<[string, SweepPoint]>> {
  const swept = params.filter(([, spec]) => spec.kind !== "free").map(([name, spec]) => [name, sweepPoints(spec)] as const);
  let out: Array<Array<[string, SweepPoint]>> = [[]];
  for (const [name, points] of swept) {
    const next: Array<Array<[string, SweepPoint]>> = [];
    for (const prefix of out) for (const p of points) next.push([...prefix, [name, p]]);
    out = next;
  }
  return out;
}
