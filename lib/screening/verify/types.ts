/** Result types of the verification stage. Failures are kept as evidence, never dropped. */
import type { EquationClass } from "../spec/types";

export interface ResidualEvidence {
  solutionId: string;
  /** Which equation: the original (mapped-back solution) or the canonical one. */
  equation: "original" | "canonical";
  points: number;
  maxRelResidual: number;
  worst: { x: number; t: number; residual: number; scale: number } | null;
  tolerance: number;
  passed: boolean;
  method: string;
}

export type SplitStepEvidence =
  | {
      solutionId: string;
      status: "passed" | "failed";
      grid: { N: number; xMin: number; xMax: number; dx: number };
      steps: number;
      /** Smallest and largest time step (steps are uniform in t + |γ|, see verify.ts). */
      dt: { min: number; max: number };
      window: [number, number];
      maxRelError: number;
      checks: { t: number; relError: number }[];
      tolerance: number;
      /** The resolution the automatic choice asked for (N may have been given by the caller). */
      suggestedN: number;
      elapsedMs: number;
      method: string;
      /** Earlier runs with coarser time steps that failed before the step was refined (step-refinement check). */
      coarser?: { steps: number; maxRelError: number; elapsedMs: number }[];
    }
  | { solutionId: string; status: "not-applicable"; reason: string };

export interface VerificationResult {
  class: EquationClass;
  residuals: ResidualEvidence[];
  splitStep: SplitStepEvidence[];
  /** True when every applicable check passed (not-applicable checks do not count either way). */
  passed: boolean;
  notes: string[];
}

export interface VerifyOptions {
  /** Split-step grid size (power of two); default: chosen from the solution's width and chirp. */
  splitStepN?: number;
  /** Split-step time steps over the map window (default 2000; rounded up to a multiple of 8). */
  splitStepSteps?: number;
  /** Skip the split-step simulation (e.g. for quick previews). */
  skipSplitStep?: boolean;
  /** Parameters per solution id (defaults from the solution spec otherwise). */
  params?: Record<string, Record<string, number>>;
}
