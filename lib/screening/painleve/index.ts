/**
 * Painlevé stage: the singular-manifold (WTC) test with φ = x + ψ(t), by truncated Taylor series
 * ("jets"), working from the equation's terms (../shared/math/painleve.md).
 *
 * Syntax
 *   runPainleve(variant, { seed?, order?, extraTerms?, values? })          → PainleveResult
 *   runPainleveOnTerms(template, coefficients, window, options?)             → PainleveResult
 *   agreement(reducibilityVerdict, painleveVerdict)                          → "agree" | "conflict" | "inconclusive"
 *   NLS_TEMPLATE, KDV_TEMPLATE, MKDV_TEMPLATE, CLASS_TEMPLATES, withExtraTerms, term, factor,
 *   burgersTerm, quinticTerm, conjugateTerm                                 (term templates)
 *
 * Examples
 *   runPainleve(variant)                      // variant.class "nls", a = 1, h = 2, k = 0.1
 *     → { verdict: "fails", reason: "condition at resonance 4 fails (rho_P = …)", evidence }
 *   runPainleve(kdvVariant, { extraTerms: [burgersTerm(num(0.3))] })    // KdV–Burgers → fails
 *
 * See also
 *   ../reducibility (the invariant R, K, Q), ../zero (high-precision zero test).
 */
import type { Variant } from "../spec/types";
import { CLASS_TEMPLATES, withExtraTerms } from "./templates";
import type { PainleveOptions, PainleveResult } from "./types";
import { runPainleveOnTerms } from "./verdict";

export type {
  Term,
  Factor,
  EquationTemplate,
  PainleveVerdict,
  PainleveResult,
  PainleveEvidence,
  PainleveOptions,
  ConditionEvidence,
  BranchEvidence,
  PointEvidence,
  ResonanceSummary,
  InvariantEvidence,
  SymbolicCondition,
  JetRunEvidence,
  FixedDraws,
} from "./types";
export type { Complex } from "./jet-algebra";
export {
  NLS_TEMPLATE,
  KDV_TEMPLATE,
  MKDV_TEMPLATE,
  CLASS_TEMPLATES,
  withExtraTerms,
  term,
  factor,
  conjugateTerm,
  burgersTerm,
  quinticTerm,
} from "./templates";
export { runPainleveOnTerms, PASS_REASON, PASS_REASON_NO_INVARIANT } from "./verdict";
export { agreement, type Agreement, type ReducibilityVerdict } from "./agreement";
export { dominantBalances, type Balance, type Rational } from "./balance";

/**
 * The Painlevé test of one variant (painleve.md §6). Free parameters must be fixed by
 * `options.values` (the values the reducibility stage found); otherwise the result is undecided.
 */
export function runPainleve(variant: Variant, options: PainleveOptions = {}): PainleveResult {
  const base = CLASS_TEMPLATES[variant.class];
  const template = options.extraTerms?.length ? withExtraTerms(base, options.extraTerms) : base;
  return runPainleveOnTerms(template, variant.coefficients, variant.window, options);
}
