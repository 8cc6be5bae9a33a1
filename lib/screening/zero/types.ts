/**
 * Types of the zero test: is a sum of terms identically zero, judged by its size relative to the
 * sum of the terms' magnitudes (the rho_inv statistic of ../shared/math/nls.md §3).
 */
import type { Field } from "../expr";

/** Terms whose sum is the tested quantity, per Taylor order: result[order][term]. */
export type TermJets<T> = T[][];

/**
 * Where the terms come from. `terms` is called with the sample point as exact decimal text (so
 * every precision evaluates the same point) and may throw: a `SingularPointError` or a jet
 * failure means the point is singular; anything else is an evaluation failure.
 */
export interface TermSource {
  terms<T>(t: string, field: Field<T>): TermJets<T>;
}

/** The statistic at one Taylor order, in double. */
export interface OrderStatistic {
  order: number;
  /** Σ terms (for the invariants: the polynomial form, e.g. -a²h²R). */
  value: number;
  /** Σ |terms|, the term scale. */
  scale: number;
  /** |value| / scale (0 when scale is 0, nls.md §3). */
  rho: number;
  /** Running bound on the rounding error of `value` (absolute). */
  errorBound: number;
  /** |value| is within the rounding-error bound: the order counts as zero. */
  noise: boolean;
}

export interface DoubleSample {
  t: number;
  orders: OrderStatistic[];
}

/** How one (point, order) came out in high precision. */
export type ConfirmOutcome = "zero" | "nonzero" | "borderline";

export interface ConfirmStatistic {
  t: number;
  order: number;
  /** Decimal strings, 20 significant digits, at the lower and higher precision. */
  valueLow: string;
  scaleLow: string;
  rhoLow: number;
  /** Rounding-error bound of valueLow (absolute). */
  errorLow: string;
  valueHigh: string;
  scaleHigh: string;
  rhoHigh: number;
  errorHigh: string;
  outcome: ConfirmOutcome;
}

export type ZeroFailureReason = "singular-point" | "evaluation-failure";

export type ZeroOutcome = "zero" | "nonzero" | "borderline";

export interface ZeroThresholds {
  /** rho at or below → zero (double precision value; scaled for higher precision). */
  pass: number;
  /** rho at or above → nonzero (double precision value; scaled for higher precision). */
  fail: number;
}

export interface ZeroTestOptions {
  thresholds?: ZeroThresholds;
  /** A new sample point (number) when one is singular; omitted → no redraws. */
  redraw?: () => number;
  /** Significant digits of the two confirmation precisions. */
  digits?: readonly [number, number];
}

interface ZeroTestCommon {
  /** Sample points actually used (after redraws). */
  points: number[];
  samples: DoubleSample[];
  /** Largest double-precision rho over points and orders. */
  rhoMax: number;
  doubleOutcome: ZeroOutcome;
  confirmation: ConfirmStatistic[];
  /** "double" or e.g. "double, decimal40, decimal80". */
  precision: string;
  thresholds: ZeroThresholds;
  digits: readonly [number, number];
}

export type ZeroTestResult =
  | (ZeroTestCommon & { outcome: ZeroOutcome })
  | (ZeroTestCommon & { outcome: "failed"; reason: ZeroFailureReason; message: string; t: number });
