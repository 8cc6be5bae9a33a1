/**
 * The scale-aware zero test: double-precision statistic at a few points × Taylor orders, then a
 * confirmation of every "zero" and every borderline value in two higher precisions
 * (../shared/math/nls.md §3 "Numerical decision"; painleve.md §7 "Extended precision";
 * ../shared/ENGINE-NOTES.md §4 harness: 40/80 digits, agreement rule, magnitude bound).
 */
import type Decimal from "decimal.js";
import { DoubleField, decimalField } from "../expr";
import type { Field } from "../expr";
import {
  CONFIRM_AGREEMENT,
  CONFIRM_DIGITS,
  ERROR_BOUND_FACTOR,
  RHO_INV_FAIL,
  RHO_INV_PASS,
  SAMPLE_REDRAWS,
  UNIT_ROUNDOFF_DOUBLE,
} from "../tolerances";
import { SingularPointError } from "./errors";
import { unitRoundoff } from "./statistic";
import { trackedField } from "./tracked-field";
import type {
  ConfirmOutcome,
  ConfirmStatistic,
  DoubleSample,
  OrderStatistic,
  TermSource,
  ZeroFailureReason,
  ZeroOutcome,
  ZeroTestOptions,
  ZeroTestResult,
  ZeroThresholds,
} from "./types";

/** Sample points as exact decimal text: 12 significant digits, so every precision uses the same point. */
export function pointText(t: number): string {
  return String(Number(t.toPrecision(12)));
}

/** Thresholds scaled to a precision by u_ext/u_double (painleve.md §7). */
export function scaledThresholds(base: ZeroThresholds, digits: number): ZeroThresholds {
  const ratio = unitRoundoff(digits) / UNIT_ROUNDOFF_DOUBLE;
  return { pass: base.pass * ratio, fail: base.fail * ratio };
}

/** One order's statistic in a base field, with the value's rounding-error bound. */
interface Stat<T> {
  value: T;
  scale: T;
  rho: number;
  /** Absolute error bound of value (e·u), as a number; Infinity when unknown. */
  error: number;
  /** The same bound in units of u. */
  units: number;
  noise: boolean;
}

type Attempt<T> = { ok: true; stats: Stat<T>[] } | { ok: false; reason: ZeroFailureReason; message: string };

/**
 * Evaluate the terms at `t` and form Σ m, Σ |m| and rho (nls.md §3). With `track`, values carry a
 * running rounding-error bound (double pass); otherwise `unitsOfU` (the double pass's bound in
 * units of u, which to first order does not depend on the precision) scales to this precision's u.
 * An order is noise when |Σ m| ≤ ERROR_BOUND_FACTOR · bound.
 */
function evaluate<T>(
  source: TermSource,
  t: string,
  base: Field<T>,
  u: number,
  errorUnits: { track: true } | { track: false; unitsOfU: number[] },
): Attempt<T> {
  let rows: { v: T; e: number }[][];
  try {
    if (errorUnits.track) {
      rows = source.terms(t, trackedField(base, 16));
    } else {
      rows = source.terms(t, base).map((row) => row.map((v) => ({ v, e: 0 })));
    }
  } catch (err) {
    const message = err instanceof Error ? err.message : String(err);
    // Jet failures (zero divisor, log/sqrt domain, non-finite) mean the point is singular.
    if (err instanceof SingularPointError || (err instanceof Error && err.name === "JetEvaluationError")) {
      return { ok: false, reason: "singular-point", message };
    }
    return { ok: false, reason: "evaluation-failure", message };
  }
  const stats: Stat<T>[] = [];
  for (let order = 0; order < rows.length; order++) {
    let sum = base.zero;
    let scale = base.zero;
    let units = 0;
    for (const m of rows[order]) {
      if (!base.isFinite(m.v)) return { ok: false, reason: "singular-point", message: `a term is not finite at t = ${t}` };
      sum = base.add(sum, m.v);
      scale = base.add(scale, base.abs(m.v));
      units += m.e;
    }
    const absValue = base.abs(sum);
    // The summation itself adds at most (number of terms) roundings of the running sum's size.
    units += rows[order].length * base.toNumber(scale);
    if (!errorUnits.track) units = errorUnits.unitsOfU[order] ?? Infinity;
    const rho = base.isZero(scale) ? 0 : base.toNumber(base.div(absValue, scale));
    const error = units * u;
    // Compared in the field itself: a tiny value (e.g. 1e-684) must not underflow to 0 first.
    const bound = base.fromNumber(ERROR_BOUND_FACTOR * error);
    const noise = Number.isFinite(error) && error > 0 && !base.lt(bound, absValue);
    stats.push({ value: sum, scale, rho, error, units, noise });
  }
  return { ok: true, stats };
}

/** Double pass: an order is zero when rho ≤ pass or the value is rounding noise. */
function classifyDouble(orders: OrderStatistic[], th: ZeroThresholds): ZeroOutcome {
  let outcome: ZeroOutcome = "zero";
  for (const o of orders) {
    if (o.noise || o.rho <= th.pass) continue;
    if (o.rho >= th.fail) return "nonzero";
    outcome = "borderline";
  }
  return outcome;
}

const show = (d: Decimal): string => d.toSignificantDigits(20).toString();
const showNumber = (x: number): string => (Number.isFinite(x) && x !== 0 ? x.toPrecision(3) : String(x));

/**
 * One (point, order) in two precisions. Zero: zero (rho ≤ scaled pass, or noise) in both.
 * Nonzero: above the scaled fail threshold and not noise in both, and the two values agree to
 * CONFIRM_AGREEMENT (ENGINE-NOTES §4). Anything else is borderline.
 */
function classifyConfirm(low: Stat<Decimal>, high: Stat<Decimal>, thLow: ZeroThresholds, thHigh: ZeroThresholds): ConfirmOutcome {
  const zeroLow = low.noise || low.rho <= thLow.pass;
  const zeroHigh = high.noise || high.rho <= thHigh.pass;
  if (zeroLow && zeroHigh) return "zero";
  if (!zeroLow && !zeroHigh && low.rho >= thLow.fail && high.rho >= thHigh.fail) {
    const diff = low.value.sub(high.value).abs();
    if (diff.lte(high.value.abs().mul(CONFIRM_AGREEMENT))) return "nonzero";
  }
  return "borderline";
}

function confirmPoint(
  source: TermSource,
  t: string,
  digits: readonly [number, number],
  base: ZeroThresholds,
  unitsOfU: number[],
): { ok: true; stats: ConfirmStatistic[] } | { ok: false; reason: ZeroFailureReason; message: string } {
  const [dLow, dHigh] = digits;
  const errors = { track: false as const, unitsOfU };
  const a = evaluate(source, t, decimalField(dLow), unitRoundoff(dLow), errors);
  if (!a.ok) return a;
  const b = evaluate(source, t, decimalField(dHigh), unitRoundoff(dHigh), errors);
  if (!b.ok) return b;
  const thLow = scaledThresholds(base, dLow);
  const thHigh = scaledThresholds(base, dHigh);
  const stats = a.stats.map((low, order): ConfirmStatistic => {
    const high = b.stats[order];
    return {
      t: Number(t),
      order,
      valueLow: show(low.value),
      scaleLow: show(low.scale),
      rhoLow: low.rho,
      errorLow: showNumber(low.error),
      valueHigh: show(high.value),
      scaleHigh: show(high.scale),
      rhoHigh: high.rho,
      errorHigh: showNumber(high.error),
      outcome: classifyConfirm(low, high, thLow, thHigh),
    };
  });
  return { ok: true, stats };
}

function combine(outcomes: ConfirmOutcome[]): ZeroOutcome {
  if (outcomes.some((o) => o === "nonzero")) return "nonzero";
  if (outcomes.every((o) => o === "zero")) return "zero";
  return "borderline";
}

/**
 * Decide whether the terms of `source` sum to zero identically, from `points` in the window.
 * Double pass at every point; then 40/80-digit confirmation: of all points when the double pass
 * says zero or borderline, of the worst point first when it says nonzero (a double nonzero can be
 * cancellation noise inside a coefficient, ENGINE-NOTES §4 A5/A6), the rest only if needed.
 */
export function zeroTest(source: TermSource, points: number[], options: ZeroTestOptions = {}): ZeroTestResult {
  const thresholds = options.thresholds ?? { pass: RHO_INV_PASS, fail: RHO_INV_FAIL };
  const digits = options.digits ?? CONFIRM_DIGITS;
  const used: number[] = [];
  const samples: DoubleSample[] = [];
  const units: number[][] = [];
  let rhoMax = 0;
  let worst = 0;
  let worstRho = -1;
  const common = { samples, thresholds, digits };

  for (const start of points) {
    let t = Number(pointText(start));
    let result = evaluate(source, pointText(t), DoubleField, UNIT_ROUNDOFF_DOUBLE, { track: true });
    for (let r = 0; !result.ok && options.redraw && r < SAMPLE_REDRAWS; r++) {
      t = Number(pointText(options.redraw()));
      result = evaluate(source, pointText(t), DoubleField, UNIT_ROUNDOFF_DOUBLE, { track: true });
    }
    if (!result.ok) {
      const orders = samples.flatMap((s) => s.orders);
      return {
        ...common,
        confirmation: [],
        points: used,
        rhoMax,
        doubleOutcome: classifyDouble(orders, thresholds),
        precision: "double",
        outcome: "failed",
        reason: result.reason,
        message: result.message,
        t,
      };
    }
    used.push(t);
    const orders = result.stats.map((s, order): OrderStatistic => ({
      order,
      value: s.value,
      scale: s.scale,
      rho: s.rho,
      errorBound: s.error,
      noise: s.noise,
    }));
    for (const o of orders) {
      if (o.rho > rhoMax) rhoMax = o.rho;
      if (!o.noise && o.rho > worstRho) {
        worstRho = o.rho;
        worst = samples.length;
      }
    }
    samples.push({ t, orders });
    units.push(result.stats.map((s) => s.units));
  }

  const doubleOutcome = classifyDouble(samples.flatMap((s) => s.orders), thresholds);
  const precision = `double, decimal${digits[0]}, decimal${digits[1]}`;
  const confirmation: ConfirmStatistic[] = [];
  const indices = used.map((_, i) => i);
  const order = doubleOutcome === "nonzero" ? [worst, ...indices.filter((i) => i !== worst)] : indices;
  for (const index of order) {
    const c = confirmPoint(source, pointText(used[index]), digits, thresholds, units[index]);
    if (!c.ok) {
      return {
        ...common,
        confirmation,
        points: used,
        rhoMax,
        doubleOutcome,
        precision,
        outcome: "failed",
        reason: c.reason,
        message: `high precision: ${c.message}`,
        t: used[index],
      };
    }
    confirmation.push(...c.stats);
    // A confirmed nonzero settles it (R ≢ 0); otherwise every point is confirmed.
    if (c.stats.some((s) => s.outcome === "nonzero")) break;
  }
  return { ...common, confirmation, points: used, rhoMax, doubleOutcome, precision, outcome: combine(confirmation.map((c) => c.outcome)) };
}
