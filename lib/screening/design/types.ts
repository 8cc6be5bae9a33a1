/**
 * Design mode: request and result types. Everything is plain JSON (numbers, strings, arrays,
 * records); a value that is not finite is stored as null.
 */
import type { EquationClass } from "../spec/types";
import type { ReducibilityVerdict } from "../report";
import type { ConditionKind } from "./solvers";

export interface DesignRequest {
  class: string;
  /** The coefficient to solve for. */
  solve: string;
  /** Fixed coefficients: name → expression text in t (parameters allowed). Others are 0. */
  set: Record<string, string>;
  window: [number, number];
  /** Parameter values used in the expressions: name → number (or exact decimal text). */
  parameters?: Record<string, number | string>;
  /** Integration constants, overriding their defaults: name → value. */
  constants?: Record<string, number>;
  /** Slug and title of the designed family (defaults are derived). */
  id?: string;
  title?: string;
}

export type DesignErrorCode =
  | "bad-request"
  | "unknown-class"
  | "unknown-coefficient"
  | "not-solvable"
  | "all-fixed"
  | "none-fixed"
  | "missing-required"
  | "expression"
  | "parameter"
  | "window"
  | "vanishes"
  | "singular"
  | "constant"
  | "no-solution"
  | "check-failed";

export interface DesignError {
  code: DesignErrorCode;
  message: string;
  /** The request field it is about, e.g. "set.a", "solve", "window", "constants.h0". */
  field?: string;
  /** 1-based character within an expression. */
  char?: number;
}

export interface DesignConstant {
  /** Symbol used in the formula and the YAML (the base name unless a parameter already had it). */
  name: string;
  latex: string;
  value: number;
  defaultValue: number;
  meaning: string;
  nonzero: boolean;
}

export interface DesignCurve {
  name: string;
  latex: string;
  role: "solved" | "fixed";
  t: number[];
  values: (number | null)[];
}

export interface DesignPole {
  t: number;
  kind: "pole" | "zero";
  detail: string;
}

export type DesignSolution =
  | {
      form: "closed";
      /** Canonical text of the solved coefficient (re-parseable; what the YAML carries). */
      text: string;
      latex: string;
      /** LaTeX of a shorter equivalent from the symbolic hook, when it answered and was verified. */
      displayLatex?: string;
    }
  | {
      form: "tabulated";
      /** Why there is no closed form. */
      reason: string;
      t: number[];
      values: (number | null)[];
      /** Where the table reaches (the window, or up to where the integration stopped). */
      reached: [number, number];
      stopped?: { t: number; message: string };
      accuracy: TableAccuracy;
    };

export interface TableAccuracy {
  method: string;
  relTol: number;
  referenceRelTol: number;
  /** max |v − v_ref| over the table, relative to max |v_ref|. */
  maxRelDiff: number;
  maxAbsDiff: number;
  nodes: number;
  text: string;
}

export interface PointStatistic {
  t: number;
  /** rho_inv per Taylor order 0–2. */
  rho: number[];
  /** The invariant's polynomial form (Σ m_i) per order. */
  residual: number[];
}

export type DesignScreening =
  | {
      kind: "pipeline";
      reducibility: ReducibilityVerdict;
      painleve: string;
      painleveReason?: string;
      invariant: "R" | "K" | "Q";
      /** Largest rho_inv over windows, points and orders (double precision). */
      rhoMax: number;
      samples: PointStatistic[];
      summary: string;
      precision: string;
      engine: string;
    }
  | {
      kind: "numerical-design";
      reducibility: ReducibilityVerdict;
      invariant: "R" | "K" | "Q";
      rhoMax: number;
      samples: PointStatistic[];
      summary: string;
    };

export interface DesignTransformation {
  sigma: 1 | -1 | null;
  mapWindow: [number, number];
  identityAtStart: { holds: boolean; condition: string };
  formulas: { name: string; latex: string; closedForm: boolean }[];
  singularTimes: { t: number; kind: string; detail: string }[];
}

export interface DesignResult {
  class: EquationClass;
  solve: string;
  window: [number, number];
  condition: { kind: ConditionKind; latex: string; method: string; invariant: "R" | "K" | "Q" };
  /** The fixed coefficients as given, and their LaTeX. */
  fixed: { name: string; text: string; latex: string }[];
  parameters: Record<string, number>;
  constants: DesignConstant[];
  solution: DesignSolution;
  poles: DesignPole[];
  screening: DesignScreening;
  plot: DesignCurve[];
  /** The designed family as a `wavesieve: 1` file (closed forms only). */
  yaml: string | null;
  submittable: boolean;
  submitNote: string;
  transformation?: DesignTransformation;
  notes: string[];
  engine: string;
}

export type DesignOutcome = { ok: true; result: DesignResult } | { ok: false; errors: DesignError[] };
