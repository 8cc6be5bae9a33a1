/**
 * Result types of the transformation stage (../shared/math/nls.md §5–§7, kdv.md §3–§4,
 * mkdv.md §3–§4). Everything here is plain JSON: numbers, strings, arrays, records; a value that
 * is not finite is stored as null.
 */
import type { EquationClass } from "../spec/types";

/** Names of the tabulated map functions per class (README.md, "Symbols reserved across files"). */
export const MAP_FUNCTIONS: Readonly<Record<EquationClass, readonly string[]>> = {
  nls: ["A", "alpha", "beta", "gamma", "delta", "eps", "kappa"],
  kdv: ["A", "B", "C", "beta", "eps", "gamma"],
  mkdv: ["A", "beta", "eps", "gamma"],
};

/**
 * The map functions at the nodes of the map window. `values[name][i]` and `slopes[name][i]` are
 * f(t_i) and f'(t_i): states come from the integrator, slopes from the ODE right-hand sides
 * (and, for alpha and B, from Taylor-mode derivatives of their closed forms). Pure data, so the
 * browser can interpolate it (cubic Hermite) without the engine.
 */
export interface MapTable {
  class: EquationClass;
  t: number[];
  values: Record<string, number[]>;
  slopes: Record<string, number[]>;
}

export type ConstantStatus = "forced" | "free";

export interface FreeConstant {
  /** Symbol as in the class file, e.g. "beta0", "alpha(t0)", "sigma". */
  name: string;
  latex: string;
  value: number;
  status: ConstantStatus;
  /** What it means (the symmetry of the canonical equation it reflects), and why it is forced. */
  meaning: string;
  /** For free constants: the value used when the user changes nothing. */
  defaultValue?: number;
}

export interface MapFormula {
  name: string;
  /** LaTeX of the formula, e.g. "\\beta(t) = e^{t}". Integrals that were not done in closed form appear as \int. */
  latex: string;
  /** True when the right-hand side contains no unevaluated integral. */
  closedForm: boolean;
  /** When closedForm: max relative difference between the formula and the integrated table. */
  maxRelDiffToTable?: number;
  note?: string;
}

export type SingularKind = "focusing" | "coefficient-singular" | "integration-stopped";

export interface SingularTime {
  t: number;
  kind: SingularKind;
  /** E.g. "zero of mu (nls.md §7); mu'(t*) = -1.0". */
  detail: string;
}

export interface SampledCurve {
  name: string;
  latex: string;
  t: number[];
  /** null where the value is not finite (poles). */
  values: (number | null)[];
}

export interface TransformPlotData {
  /** Normal-form coefficients over the requested window. */
  coefficients: SampledCurve[];
  /** NLS: mu, beta, gamma over the map window; KdV/mKdV: beta, gamma, A. */
  mapCurves: SampledCurve[];
}

export interface IntegratorReport {
  method: string;
  relTol: number;
  absTol: number;
  nodes: number;
  evaluations: number;
  acceptedSteps: number;
  rejectedSteps: number;
}

export interface TransformChecks {
  /** Max over sample points and Taylor orders 0–2 of |invariant| / Σ|monomials| (guard only). */
  invariantRho: number;
  invariantPoints: number[];
  /**
   * NLS only: β from the linear μ equation (nls.md §2) against β from the quadrature system
   * (nls.md §5), max relative difference on the map window. Agreement is evidence that R ≡ 0.
   */
  betaFromMuMaxRelDiff?: number;
}

export interface TransformationOk {
  ok: true;
  class: EquationClass;
  /** Canonical sign (NLS, mKdV); null for KdV (single canonical sign). */
  sigma: 1 | -1 | null;
  requestedWindow: [number, number];
  /** Where the map is tabulated: the requested window, cut before the first singular time. */
  mapWindow: [number, number];
  /** Set when mapWindow ends before the requested window does. */
  truncation?: { at: number; reason: string };
  constants: FreeConstant[];
  /** Whether the map is the identity at t0, and the condition for it. */
  identityAtStart: { holds: boolean; condition: string };
  formulas: MapFormula[];
  table: MapTable;
  singularTimes: SingularTime[];
  checks: TransformChecks;
  integrator: IntegratorReport;
  plot: TransformPlotData;
  notes: string[];
}

export interface TransformationRefusal {
  ok: false;
  /** Why there is no map: the stage refused, or the pipeline did not run it (undecided, switched off, crashed). */
  code: "not-reducible" | "undecided" | "free-parameters" | "precondition" | "integration-failed" | "switched-off" | "stage-failed";
  reason: string;
}

export type TransformationResult = TransformationOk | TransformationRefusal;

/** Overrides of the free constants (names as in FreeConstant.name, e.g. "beta0"). */
export type ConstantOverrides = Partial<Record<string, number>>;
