/** Result types of the solutions stage: JSON data the UI can re-evaluate with evaluateSolution. */
import type { EquationClass } from "../spec/types";
import type { SolutionKind } from "./canonical";

export interface SolutionParameter {
  name: string;
  latex: string;
  defaultValue: number;
  min: number;
  max: number;
  /** Whether the bounds themselves are allowed (e.g. eta > 0 excludes min 0). */
  minInclusive: boolean;
  maxInclusive: boolean;
  description: string;
}

export interface SolutionSpec {
  id: string;
  kind: SolutionKind;
  class: EquationClass;
  label: string;
  /** The canonical sign the solution needs (null: KdV, single sign). */
  sigma: 1 | -1 | null;
  canonicalLatex: string;
  mappedLatex: string;
  parameters: SolutionParameter[];
  /** Decays to zero at |x| → ∞ (so a periodic box can hold it: the split-step check applies). */
  localized: boolean;
  /** Where the formula comes from. */
  source: string;
  /** Plot quantities and periods, in words with formulas. */
  features: string[];
}

export interface CheckPoint {
  solutionId: string;
  x: number;
  t: number;
  re: number;
  im: number;
}

export interface IntensityGrid {
  solutionId: string;
  quantity: "|u|^2";
  /** Default parameters used. */
  params: Record<string, number>;
  x: number[];
  t: number[];
  /** values[i][j] = |u(x_j, t_i)|²; null where not finite. */
  values: (number | null)[][];
}

export type SolutionSet =
  | { ok: true; class: EquationClass; sigma: 1 | -1 | null; solutions: SolutionSpec[]; checkPoints: CheckPoint[]; plot: IntensityGrid | null; notes: string[] }
  | { ok: false; reason: string };
