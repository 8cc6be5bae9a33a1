/**
 * Report types of the screening engine. Every report is a plain JSON-serialisable object: numbers,
 * strings (high-precision values as decimal strings), arrays and records — no class instances.
 * Field names used by the CLI's --json output (engine, families[].id/class/errors/variants,
 * variants[].parameters/reducibility/painleve, verdict, constraints[].parameter/value, evidence)
 * are stable; fields may be added.
 */
import type { EquationClass, SpecError } from "./spec/types";
import type { PainleveResult } from "./painleve";
import type { ConfirmStatistic, ZeroFailureReason } from "./zero";
import type { TransformationResult } from "./transform/types";
import type { SolutionSet } from "./solutions/types";
import type { VerificationResult } from "./verify/types";

export type ReducibilityVerdict = "reducible" | "not-reducible" | "undecided";

/** Why a verdict is `undecided` (issue: singular point, evaluation failure, borderline after confirmation). */
export type UndecidedReason = ZeroFailureReason | "borderline-after-confirmation";

/** One Taylor order at one sample point, double precision. */
export interface OrderEvidence {
  order: number;
  /** The polynomial form's value (e.g. -a²h²R for NLS): Σ m_i. */
  residual: number;
  /** The term scale Σ |m_i|. */
  scale: number;
  /** rho_inv = |residual| / scale. */
  rho: number;
  /** Running rounding-error bound of `residual` (null if unbounded); `noise` when |residual| is within it. */
  errorBound: number | null;
  noise: boolean;
  /** Taylor coefficient `order` of the invariant itself (R, K or Q) at the point. */
  invariant: number | null;
}

export interface SampleEvidence {
  t: number;
  orders: OrderEvidence[];
}

export type SingularKind = "zero" | "pole" | "non-finite" | "jump";

export interface SingularPointEvidence {
  t: number;
  coefficient: string;
  kind: SingularKind;
}

export interface SingularityEvidence {
  /** Interior points where the window was split. */
  points: SingularPointEvidence[];
  /** Singular points at the window ends (no split; samples stay away from the ends). */
  endpoints: SingularPointEvidence[];
  /** Parts of the window where a coefficient is not a finite real number. */
  undefinedRegions: { from: number; to: number; coefficient: string }[];
  /** Coefficients that must be nonzero but vanish identically. */
  vanishing: string[];
}

/** The verdict on one sub-window (the whole window when nothing splits it). */
export interface WindowEvidence {
  window: [number, number];
  verdict: ReducibilityVerdict;
  reason?: UndecidedReason;
  message?: string;
  /** Largest double-precision rho_inv over points and orders. */
  rhoMax: number;
  doubleOutcome: "zero" | "nonzero" | "borderline";
  samples: SampleEvidence[];
  /** High-precision values (decimal strings) at the confirmed points. */
  confirmation: ConfirmStatistic[];
  /** Precisions used, e.g. "double, decimal40, decimal80". */
  precision: string;
  /** sign(h/a) (NLS) or sign(p/q) (mKdV) on this window, when defined. */
  sigma?: 1 | -1;
}

export interface ResidualDisplay {
  /** The residual with the coefficients substituted, in LaTeX; never used for the verdict. */
  latex: string;
  /** Whether the symbolic hook simplified it (otherwise the unsimplified expression tree). */
  simplified: boolean;
  source: "symbolic-hook" | "expression-tree";
}

/** One { parameter, value } of a free-parameter solution. */
export interface Constraint {
  parameter: string;
  value: number;
  /** The value as an exact decimal string (high precision; shortest form that agrees to ~90 digits). */
  exact: string;
  /** Which solution (index into evidence.freeParameters.solutions) this belongs to. */
  solution: number;
  /** "determined" by R ≡ 0, or "chosen" along a one-parameter (or larger) family of solutions. */
  role: "determined" | "chosen";
}

export interface FreeSolutionEvidence {
  index: number;
  /** isolated: a point; family: a manifold of dimension `dimension` (chosen parameters move along it); any: R ≡ 0 for all values. */
  kind: "isolated" | "family" | "any";
  dimension: number;
  /** For a rank-deficient isolated root, the estimated order of vanishing along the null direction. */
  multiplicity: number;
  constraints: Omit<Constraint, "solution">[];
  /** Closed form of the determined parameter, when the symbolic hook found one (LaTeX). */
  closedForm?: string;
  /** Null directions of the Jacobian at the solution (unit vectors over `parameters`). */
  nullDirections: number[][];
  /** How many Levenberg–Marquardt starts converged here. */
  starts: number;
  verdict: ReducibilityVerdict;
  reason?: UndecidedReason;
  message?: string;
  windows: WindowEvidence[];
  /** The coefficient scan with this solution's values substituted. */
  singularities: SingularityEvidence;
}

export interface FreeParameterEvidence {
  parameters: string[];
  points: number[];
  starts: number;
  /** Smallest max weighted residual reached (≈ rho_inv), over all starts; null if no start converged. */
  bestResidual: number | null;
  solutions: FreeSolutionEvidence[];
}

export interface ReducibilityEvidence {
  invariant: "R" | "K" | "Q";
  /** The residual formula used: its definition and the polynomial form evaluated (LaTeX). */
  formula: { definition: string; polynomialForm: string };
  engine: string;
  seed: number;
  thresholds: { pass: number; fail: number; digits: readonly [number, number] };
  precision: string;
  singularities: SingularityEvidence;
  windows: WindowEvidence[];
  display: ResidualDisplay;
  freeParameters?: FreeParameterEvidence;
}

interface ReducibilityCommon {
  constraints: Constraint[];
  evidence: ReducibilityEvidence;
  /** One-line summary for people. */
  summary: string;
}

export type ReducibilityReport =
  | (ReducibilityCommon & { verdict: "reducible" })
  | (ReducibilityCommon & { verdict: "not-reducible" })
  | (ReducibilityCommon & { verdict: "undecided"; reason: UndecidedReason; message: string });

/** What the Painlevé stage reports (lib/screening/painleve), or `not-run` with the reason it was skipped. */
export type PainleveReport = PainleveResult | { verdict: "not-run"; reason: string };

export interface VariantReport {
  familyId: string;
  index: number;
  class: EquationClass;
  parameters: Record<string, number>;
  free: string[];
  window: [number, number];
  engine: string;
  reducibility: ReducibilityReport;
  painleve: PainleveReport;
  /** Do the two judges agree? A `conflict` is flagged for curators (and is a bug to investigate). */
  agreement: "agree" | "conflict" | "inconclusive";
  /** The map to canonical form; for a variant that is not reducible, `ok: false` with the reason. */
  transformation: TransformationResult;
  /** Exact solutions of the original equation (reducible variants only). */
  solutions?: SolutionSet;
  /** The independent numerical check of those solutions (reducible variants only). */
  verification?: VerificationResult;
  /** Wall time per stage, milliseconds. */
  timings: Record<string, number>;
}

export interface FamilySummary {
  variants: number;
  reducible: number[];
  notReducible: number[];
  undecided: number[];
  /** Human-readable: which variants pass. */
  text: string;
}

export interface FamilyReport {
  id: string;
  title: string;
  class: EquationClass;
  engine: string;
  errors: SpecError[];
  variants: VariantReport[];
  summary: FamilySummary;
}
