/**
 * Screening one member with numeric coefficients: scan the window for precondition failures,
 * split it there, and run the zero test on each sub-window (nls.md §0 "split the window at the
 * sign change"; §3 "Numerical decision"; README "Verdict vocabulary").
 */
import { DoubleField, evalNumber } from "../expr";
import type { Expr } from "../expr";
import type { Rng } from "../random";
import type { ReducibilityVerdict, SampleEvidence, SingularityEvidence, UndecidedReason, WindowEvidence } from "../report";
import { CLASS_COEFFICIENTS } from "../spec/types";
import { INVARIANT_SAMPLE_POINTS, INVARIANT_TAYLOR_ORDERS, SAMPLE_MARGIN } from "../tolerances";
import { zeroTest } from "../zero";
import type { ZeroTestResult } from "../zero";
import type { InvariantDefinition } from "./invariants";
import { scanCoefficients } from "./scan";
import { invariantJet, invariantSource } from "./terms";

export interface FixedScreen {
  verdict: ReducibilityVerdict;
  reason?: UndecidedReason;
  message?: string;
  windows: WindowEvidence[];
  singularities: SingularityEvidence;
}

/** Invariant Taylor coefficients at a sample point (shown next to the verdict, nls.md §3). */
function invariantValues(def: InvariantDefinition, coefficients: Record<string, Expr>, t: number): (number | null)[] {
  try {
    return invariantJet(def, coefficients, t, {}, INVARIANT_TAYLOR_ORDERS, DoubleField);
  } catch {
    return new Array<null>(INVARIANT_TAYLOR_ORDERS).fill(null);
  }
}

/** sign(h/a) for NLS, sign(p/q) for mKdV (README "forced sign"); undefined if it varies or is 0. */
function forcedSign(def: InvariantDefinition, coefficients: Record<string, Expr>, points: number[]): 1 | -1 | undefined {
  if (def.equationClass === "kdv" || points.length === 0) return undefined;
  const [num, den] = def.equationClass === "nls" ? ["h", "a"] : ["p", "q"];
  const signs = points.map((t) => Math.sign(evalNumber(coefficients[num], { t }) / evalNumber(coefficients[den], { t })));
  if (signs.some((s) => s !== signs[0]) || !(signs[0] === 1 || signs[0] === -1)) return undefined;
  return signs[0] as 1 | -1;
}

/** A number as JSON keeps it: -0 → 0, non-finite → null. */
export function jsonNumber(x: number | null): number | null {
  if (x === null || !Number.isFinite(x)) return null;
  return x === 0 ? 0 : x;
}

/** -0 → 0 (JSON has no negative zero). */
const plain = (x: number): number => (x === 0 ? 0 : x);

function windowEvidence(
  def: InvariantDefinition,
  coefficients: Record<string, Expr>,
  window: [number, number],
  result: ZeroTestResult,
): WindowEvidence {
  const samples: SampleEvidence[] = result.samples.map((s) => {
    const values = invariantValues(def, coefficients, s.t);
    return {
      t: s.t,
      orders: s.orders.map((o) => ({
        order: o.order,
        residual: plain(o.value),
        scale: plain(o.scale),
        rho: plain(o.rho),
        errorBound: jsonNumber(o.errorBound),
        noise: o.noise,
        invariant: jsonNumber(values[o.order] ?? null),
      })),
    };
  });
  const common = {
    window,
    rhoMax: plain(result.rhoMax),
    doubleOutcome: result.doubleOutcome,
    samples,
    confirmation: result.confirmation,
    precision: result.precision,
  };
  const sigma = forcedSign(def, coefficients, result.points);
  const withSigma = sigma === undefined ? common : { ...common, sigma };
  switch (result.outcome) {
    case "zero":
      return { ...withSigma, verdict: "reducible" };
    case "nonzero":
      return { ...withSigma, verdict: "not-reducible" };
    case "borderline":
      return {
        ...withSigma,
        verdict: "undecided",
        reason: "borderline-after-confirmation",
        message: `rho_inv stays between the thresholds after the ${result.precision} confirmation`,
      };
    case "failed":
      return { ...withSigma, verdict: "undecided", reason: result.reason, message: `${result.message} (t = ${result.t})` };
  }
}

/** Screen numeric coefficients on `window`; parameter-free (free parameters already substituted). */
export function screenFixed(
  def: InvariantDefinition,
  coefficients: Record<string, Expr>,
  window: [number, number],
  rng: Rng,
): FixedScreen {
  const scan = scanCoefficients(coefficients, CLASS_COEFFICIENTS[def.equationClass], def.nonzero, window);
  const singularities: SingularityEvidence = {
    points: scan.points,
    endpoints: scan.endpoints,
    undefinedRegions: scan.undefinedRegions,
    vanishing: scan.vanishing,
  };
  if (scan.vanishing.length > 0) {
    return {
      verdict: "undecided",
      reason: "singular-point",
      message: `${scan.vanishing.join(", ")} vanishes identically on the window (precondition ${def.nonzero.join(" ")} ≠ 0)`,
      windows: [],
      singularities,
    };
  }
  const source = invariantSource(def, coefficients, {}, INVARIANT_TAYLOR_ORDERS);
  const windows = scan.subWindows.map((w): WindowEvidence => {
    const length = w[1] - w[0];
    const draw = (): number => rng.uniform(w[0] + SAMPLE_MARGIN * length, w[1] - SAMPLE_MARGIN * length);
    const points = Array.from({ length: INVARIANT_SAMPLE_POINTS }, draw);
    return windowEvidence(def, coefficients, w, zeroTest(source, points, { redraw: draw }));
  });
  return { ...combineWindows(windows, scan.undefinedRegions.length > 0), singularities, windows };
}

/** Reducible only if every sub-window is; any not-reducible sub-window decides the other way. */
function combineWindows(windows: WindowEvidence[], undefinedParts: boolean): Pick<FixedScreen, "verdict" | "reason" | "message"> {
  if (windows.some((w) => w.verdict === "not-reducible")) return { verdict: "not-reducible" };
  if (windows.length === 0) {
    return { verdict: "undecided", reason: "singular-point", message: "no part of the window satisfies the preconditions" };
  }
  const open = windows.find((w) => w.verdict === "undecided");
  if (open) return { verdict: "undecided", reason: open.reason ?? "borderline-after-confirmation", message: open.message ?? "" };
  if (undefinedParts) {
    return {
      verdict: "undecided",
      reason: "singular-point",
      message: "a coefficient is undefined on part of the window; only the rest was screened (all reducible)",
    };
  }
  return { verdict: "reducible" };
}
