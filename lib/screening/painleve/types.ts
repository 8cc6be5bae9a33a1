/**
 * Types of the Painlevé stage: equation templates built from terms, and the JSON-serialisable
 * result with its evidence (../shared/math/painleve.md §5 "Equation template", §6 Step 8).
 */
import type { Expr } from "../expr/types";
import type { EquationClass } from "../spec/types";
import type { Complex } from "./jet-algebra";

/** ∂_x^x ∂_t^t of one dependent variable. */
export interface Factor {
  variable: string;
  x: number;
  t: number;
}

/**
 * One term: constant × coefficient(t) × x^xPower × Π factors (painleve.md §5). A term without
 * factors is a forcing term. `coefficient` names an entry of the coefficient map ("1" is the
 * constant 1) or is an expression in t.
 */
export interface Term {
  constant: Complex;
  coefficient: string | Expr;
  xPower: number;
  factors: Factor[];
}

/**
 * An equation (scalar) or a system, as lists of terms. For NLS-type systems `conjugatePair`
 * marks that equation 1 is the formal conjugate of equation 0 (u ↔ v, constants conjugated;
 * the coefficient functions are real), so extra terms are added to both.
 */
export interface EquationTemplate {
  id: string;
  title: string;
  variables: string[];
  equations: Term[][];
  conjugatePair: boolean;
  /** The built-in class this template is, unmodified (enables the closed-form oracle and invariant). */
  classOracle?: EquationClass;
  /** Default jet length N (painleve.md §6 Step 6: NLS 8, KdV 9, mKdV 8). */
  defaultJetLength: number;
  /** Coefficients that must not vanish (preconditions a h ≠ 0, p q ≠ 0). */
  nonvanishing: string[];
}

export type PainleveVerdict = "passes" | "fails" | "undecided";

/** One compatibility condition at one point, branch and resonance (painleve.md §6 Step 8). */
export interface ConditionEvidence {
  resonance: number;
  /** C at τ^0; for 2×2 systems normalised to ℓ = (m21, -m11). */
  value: Complex;
  /** Term scale scale_0 at τ^0 of the condition as computed (painleve.md §6 Step 6, §8 tables). */
  scale: number;
  /** scale_0 / |λ_0|, the scale of the normalised value (equal to scale for scalar equations). */
  scaleNormalised: number;
  /** rho_P for each Taylor order used (orders 0..min(3, valid)-1). */
  rhoByOrder: number[];
  rho: number;
  /** Trustworthy Taylor orders of C. */
  valid: number;
  /** Closed-form prediction at τ^0 (built-in classes: C4 = -2aR/(h u0), C6 = K/p, C3 = u0 Q/2). */
  predicted?: Complex;
}

export interface BranchEvidence {
  /** Leading coefficients at τ^0 per variable. */
  leading: Record<string, Complex>;
  /** Expansion coefficients w_0 … w_J at τ^0 per variable. */
  coefficients: Record<string, Complex[]>;
  resonances: number[];
  /** det M(j) at τ^0 for j = 1 … D+1. */
  determinants: { j: number; value: Complex }[];
  conditions: ConditionEvidence[];
}

export interface PointEvidence {
  t: number;
  /** Draws needed at this point (1 = first draw accepted). */
  draws: number;
  branches: BranchEvidence[];
}

/** Summary per positive resonance over all points and branches. */
export interface ResonanceSummary {
  resonance: number;
  /** True when the condition vanished (rho_P below the pass threshold) at every point and branch. */
  holdsIdentically: boolean;
  worstRho: number;
}

export interface InvariantEvidence {
  /** "R" (NLS), "K" (KdV), "Q" (mKdV). */
  name: string;
  values: { t: number; value: number }[];
  rhoInv: number;
  /** Outcome of the shared zero test (double plus 40/80-digit confirmation). */
  outcome: string;
  precision: string;
}

export interface SymbolicCondition {
  resonance: number;
  /** The class formula, e.g. "C_4 = -\\frac{2 a R}{h u_0}". */
  generic: string;
  /** The same with the family's coefficients substituted (LaTeX via toLatex). */
  latex: string;
  /** Re-parseable text of the substituted condition. */
  text: string;
}

export interface JetRunEvidence {
  precision: string;
  jetLength: number;
  points: PointEvidence[];
  rhoMax: number;
  rhoMaxAt: { point: number; branch: number; resonance: number; order: number } | null;
  outcome: "pass" | "fail" | "undecided";
  thresholds: { pass: number; fail: number };
}

export interface PainleveEvidence {
  template: string;
  class: EquationClass | null;
  seed: number;
  /** Candidate leading exponents found by dominant balance (as fractions, e.g. "-1/2"). */
  balances: string[];
  exponents: Record<string, string> | null;
  lowest: number | null;
  /** Degree D of det M(j). */
  determinantDegree: number | null;
  resonances: number[] | null;
  /** Negative resonances other than -1 (flagged, the test continues). */
  flaggedResonances: number[];
  conditions: ResonanceSummary[];
  /** The decisive jet run (double, or the extended-precision recheck when one was made). */
  jet: JetRunEvidence | null;
  /** The double-precision run when a recheck replaced it as decisive. */
  doubleJet?: JetRunEvidence;
  invariant?: InvariantEvidence;
  nontrivialCondition?: SymbolicCondition;
  /** Leading-order consistency ratio of the second equation (systems). */
  leadingConsistency?: number;
  /** Free parameters and the values substituted for them. */
  parameters: Record<string, number>;
  notes: string[];
}

interface ResultBase {
  reason: string;
  evidence: PainleveEvidence;
  /** When the window is split at singular points, the verdict of each piece (the pipeline fills it). */
  subWindows?: { window: [number, number]; verdict: "passes" | "fails" | "undecided"; reason: string }[];
}
export type PainleveResult =
  | ({ verdict: "passes" } & ResultBase)
  | ({ verdict: "fails" } & ResultBase)
  | ({ verdict: "undecided" } & ResultBase);

/** Deterministic inputs instead of random draws (test vectors of painleve.md §8, and replays). */
export interface FixedDraws {
  /** Sample times (one per point). */
  points: number[];
  /** ψ Taylor coefficients (real), one list per point or one for all. */
  psi: number[][];
  /** NLS-type systems: u0 Taylor coefficients per point (or one for all). */
  u0?: Complex[][];
  /** Free functions at resonances, in order of appearance per point (or one list for all). */
  free?: Complex[][][];
}

export interface PainleveOptions {
  seed?: number;
  /** Jet length N (Taylor orders 0..N-1); default per class (painleve.md §6 Step 6). */
  order?: number;
  /** Extra terms added to the class equation (to the u-equation, and conjugated to v for NLS). */
  extraTerms?: Term[];
  /** Values for free parameters (found by the reducibility stage). */
  values?: Record<string, number>;
  /** Number of sample points (default 3, painleve.md §6 Step 1). */
  points?: number;
  /** Deterministic draws (test vectors). */
  fixed?: FixedDraws;
  /** Skip the extended-precision recheck (benchmarks of the double pass only). */
  skipRecheck?: boolean;
}
