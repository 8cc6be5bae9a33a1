/**
 * The shape of one solve: which condition the unknown obeys, its integration constants, the
 * closed form where the algebra is elementary, and the ODE system to tabulate otherwise.
 */
import type { Expr } from "../../expr";
import type { EquationClass } from "../../spec/types";
import type { DesignContext, Ops } from "../context";
import type { J, JetRhs } from "../jets";
import type { CoefficientJets } from "../jets";

/** How the unknown is determined by the invariant's vanishing. */
export type ConditionKind =
  | "explicit"
  | "quadrature"
  | "linear-first-order"
  | "linear-second-order"
  | "riccati"
  | "nonlinear-second-order";

export interface ConstantSpec {
  /** Base symbol, e.g. "h0", "alpha0". */
  name: string;
  latex: string;
  meaning: string;
  /** Default value, from the fixed coefficients at t0. */
  defaultValue(ops: Ops): number;
  /** The constant must not be 0 (e.g. a value of a coefficient that may not vanish). */
  nonzero?: boolean;
}

export interface ClosedForm {
  expr: Expr;
  /** Said next to the formula (e.g. a constant that had to be 0 for the closed form). */
  notes: string[];
}

export interface NumericSystem {
  dimension: number;
  initial: number[];
  rhs: JetRhs;
  /** The solved coefficient from the state (jets in, jet out). */
  output(coefficients: CoefficientJets, y: J[]): J;
  /** Derivative order of the fixed coefficients the rhs and output use. */
  maxDerivative: number;
  /** A state component whose zeros are poles (or zeros) of the solved coefficient. */
  pole?: { component: number; kind: "pole" | "zero"; meaning: string };
  /** Why no closed form was built. */
  reason: string;
}

export interface ConditionDescription {
  kind: ConditionKind;
  /** The equation the unknown satisfies, in LaTeX (from the class file). */
  latex: string;
  /** What is solved and how, with the section of ../shared/math it comes from. */
  method: string;
}

export interface SolverDefinition {
  cls: EquationClass;
  unknown: string;
  /** The condition on the unknown for these fixed coefficients. */
  condition(ops: Ops): ConditionDescription;
  constants: ConstantSpec[];
  closed(ops: Ops): ClosedForm | null;
  numeric?(ops: Ops): NumericSystem;
}

export type { DesignContext };
