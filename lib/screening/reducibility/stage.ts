/**
 * The reducibility stage: one variant in, one ReducibilityReport out (README "Verdict
 * vocabulary"; nls.md §3, kdv.md §2, mkdv.md §2).
 */
import { createRng, hashSeed } from "../random";
import type { Constraint, ReducibilityEvidence, ReducibilityReport, ReducibilityVerdict, UndecidedReason } from "../report";
import type { Variant } from "../spec/types";
import { CONFIRM_DIGITS, RHO_INV_FAIL, RHO_INV_PASS, SYMBOLIC_TIMEOUT_MS } from "../tolerances";
import { ENGINE_VERSION } from "../version";
import { residualDisplay } from "./display";
import { screenFixed } from "./fixed";
import type { FixedScreen } from "./fixed";
import { solveFree } from "./free";
import { INVARIANTS, polynomialFormLatex } from "./invariants";
import type { ReducibilityOptions } from "./types";

const PRECISION = `double, decimal${CONFIRM_DIGITS[0]}, decimal${CONFIRM_DIGITS[1]}`;

function summaryText(symbol: string, verdict: ReducibilityVerdict, detail: string): string {
  switch (verdict) {
    case "reducible":
      return `${symbol} ≡ 0 to relative accuracy ${RHO_INV_PASS} (confirmed at ${CONFIRM_DIGITS.join("/")} digits)${detail}`;
    case "not-reducible":
      return `${symbol} ≢ 0${detail}`;
    case "undecided":
      return `undecided${detail}`;
  }
}

function finish(
  verdict: ReducibilityVerdict,
  reason: UndecidedReason | undefined,
  message: string | undefined,
  constraints: Constraint[],
  evidence: ReducibilityEvidence,
  detail: string,
): ReducibilityReport {
  const summary = summaryText(evidence.invariant, verdict, detail);
  if (verdict === "undecided") {
    return { verdict, reason: reason ?? "borderline-after-confirmation", message: message ?? "", constraints, evidence, summary };
  }
  return { verdict, constraints, evidence, summary };
}

/** For a not-reducible member: the largest rho_inv and the invariant's value there (nls.md §3: "always show R(t_s)"). */
function worstValue(symbol: string, screen: FixedScreen, verdict: ReducibilityVerdict): string {
  if (verdict !== "not-reducible") return "";
  let best: { rho: number; t: number; value: number | null } | null = null;
  for (const w of screen.windows) {
    for (const s of w.samples) {
      const o = s.orders[0];
      if (!o.noise && (best === null || o.rho > best.rho)) best = { rho: o.rho, t: s.t, value: o.invariant };
    }
  }
  if (!best) return "";
  const value = best.value === null ? "" : `, ${symbol}(${best.t}) = ${best.value.toPrecision(6)}`;
  return ` (rho_inv = ${best.rho.toPrecision(3)}${value})`;
}

/** Screen one variant for reducibility by the point map of its class. */
export async function runReducibility(variant: Variant, options: ReducibilityOptions = {}): Promise<ReducibilityReport> {
  const def = INVARIANTS[variant.class];
  const seed = options.seed ?? 1;
  const rng = createRng(hashSeed(seed, variant.familyId, variant.index));
  const timeoutMs = options.symbolicTimeoutMs ?? SYMBOLIC_TIMEOUT_MS;
  const display = await residualDisplay(variant.class, variant.coefficients, variant.free, options.symbolic, timeoutMs);
  const base = {
    invariant: def.symbol,
    formula: { definition: def.definitionLatex, polynomialForm: polynomialFormLatex(def) },
    engine: ENGINE_VERSION,
    seed,
    thresholds: { pass: RHO_INV_PASS, fail: RHO_INV_FAIL, digits: CONFIRM_DIGITS },
    precision: PRECISION,
    display,
  };

  if (variant.free.length === 0) {
    const screen: FixedScreen = screenFixed(def, variant.coefficients, variant.window, rng);
    const evidence: ReducibilityEvidence = { ...base, singularities: screen.singularities, windows: screen.windows };
    const split = screen.windows.length > 1 ? ` on ${screen.windows.length} sub-windows` : "";
    return finish(screen.verdict, screen.reason, screen.message, [], evidence, split + worstValue(def.symbol, screen, screen.verdict));
  }

  const free = await solveFree(def, variant.coefficients, variant.free, variant.window, rng, options.symbolic, timeoutMs);
  const passing = free.solutions.filter((s) => s.verdict === "reducible");
  const primary = passing[0] ?? free.solutions[0];
  const evidence: ReducibilityEvidence = {
    ...base,
    singularities: primary ? primary.singularities : { points: [], endpoints: [], undefinedRegions: [], vanishing: [] },
    windows: primary ? primary.windows : [],
    freeParameters: free,
  };
  const constraints: Constraint[] = passing.flatMap((s) => s.constraints.map((c) => ({ ...c, solution: s.index })));
  if (passing.length > 0) {
    const what = passing
      .map((s) => {
        if (s.kind === "any") return `every value of ${variant.free.join(", ")}`;
        const values = s.constraints.map((c) => `${c.parameter} = ${c.exact.length > 24 ? c.value.toPrecision(15) : c.exact}`).join(", ");
        if (s.kind === "family") return `${values} (a ${s.dimension}-parameter family${s.closedForm ? `: ${s.closedForm}` : ""})`;
        return s.multiplicity > 1 ? `${values} (multiplicity ${s.multiplicity})` : values;
      })
      .join("; ");
    return finish("reducible", undefined, undefined, constraints, evidence, ` for ${what}`);
  }
  const open = free.solutions.find((s) => s.verdict === "undecided");
  if (open) return finish("undecided", open.reason, open.message, constraints, evidence, `: ${open.message ?? ""}`);
  const message =
    free.solutions.length === 0
      ? ` for every value of ${variant.free.join(", ")} (least squares from ${free.starts} starts reached a smallest weighted residual of ${free.bestResidual === null ? "—" : free.bestResidual.toPrecision(3)})`
      : ` at every candidate solution found (${free.solutions.length}, none confirmed)`;
  return finish("not-reducible", undefined, undefined, constraints, evidence, message);
}
