/** The solves offered per class (issue 10): which unknowns design mode can solve for. */
import type { EquationClass } from "../../spec/types";
import { KDV_SOLVERS } from "./kdv";
import { MKDV_SOLVERS } from "./mkdv";
import { NLS_SOLVERS } from "./nls";
import type { SolverDefinition } from "./types";

const ALL: Record<EquationClass, SolverDefinition[]> = { nls: NLS_SOLVERS, kdv: KDV_SOLVERS, mkdv: MKDV_SOLVERS };

export function solverFor(cls: EquationClass, unknown: string): SolverDefinition | null {
  return ALL[cls].find((s) => s.unknown === unknown) ?? null;
}

/** Unknowns that can be solved for, per class, in the order offered. */
export function solvableCoefficients(cls: EquationClass): string[] {
  return ALL[cls].map((s) => s.unknown);
}

export type { SolverDefinition, ConstantSpec, ClosedForm, NumericSystem, ConditionKind, ConditionDescription } from "./types";
