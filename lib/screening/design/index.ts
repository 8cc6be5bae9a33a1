/**
 * Design mode (the only entry point of lib/screening/design): solve for the coefficient that
 * makes a model integrable (invariant ≡ 0, ../shared/math/README.md), with its integration
 * constants; closed form where the algebra is elementary, else tabulated; screened before it is
 * returned.
 *
 * Syntax
 *   designModel({ class, solve, set: { name: expr }, window, parameters?, constants?, id?, title? },
 *               { seed?, symbolic?, symbolicTimeoutMs?, transformation?, signal? }) → Promise<DesignOutcome>
 *   solvableCoefficients(cls)       which unknowns each class offers
 *   designConstants(cls, unknown)   the integration constants of a solve (name, meaning)
 *
 * Example
 *   const out = await designModel({ class: "nls", solve: "b", set: { a: "1/2", h: "exp(t/5)" }, window: [0, 5] });
 *   if (out.ok) out.result.solution;   // { form: "closed", text: "0.02", latex: "0.02", … }  (b = W²/(4a), W = −1/5)
 *   out.ok && out.result.screening.reducibility;   // "reducible" (the ordinary pipeline)
 *
 * See also
 *   ../shared/math/nls.md §2–3, §7, §10; kdv.md §2; mkdv.md §2.
 */
import type { EquationClass } from "../spec/types";
import { solverFor } from "./solvers";

export { designModel } from "./design";
export type { DesignOptions } from "./design";
export { solvableCoefficients } from "./solvers";
export { validateRequest } from "./request";
export { antiderivative } from "./integrate";
export { simplifyVerified, sameFunction } from "./sampling";
export type { WindowContext } from "./sampling";
export { invariantStatistic } from "./statistic";
export type {
  DesignRequest,
  DesignResult,
  DesignOutcome,
  DesignError,
  DesignErrorCode,
  DesignConstant,
  DesignCurve,
  DesignPole,
  DesignSolution,
  DesignScreening,
  DesignTransformation,
  TableAccuracy,
  PointStatistic,
} from "./types";
export type { ConditionKind } from "./solvers";

/** The integration constants of a solve, for forms that show them before the first run. */
export function designConstants(cls: EquationClass, unknown: string): { name: string; meaning: string }[] {
  return solverFor(cls, unknown)?.constants.map((c) => ({ name: c.name, meaning: c.meaning })) ?? [];
}
