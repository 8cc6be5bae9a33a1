/**
 * Verification stage: residuals of the original and canonical equations from exact derivatives
 * (bivariate Taylor series), and for vc-NLS a split-step Fourier simulation compared with the
 * mapped-back solution. Every result, failing or not, is returned as evidence.
 *
 * Syntax
 *   verifySolutions(variant, transformation, solutions, options?) → VerificationResult
 * Example
 *   const v = verifySolutions(variant, tr, set, { splitStepSteps: 4000 });
 *   v.residuals[0].maxRelResidual;   // ~1e-15 for a reducible member
 * See also
 *   ../transform, ../solutions.
 */
export { verifySolutions } from "./verify";
export { originalResidual, canonicalResidual } from "./residual";
export type { ResidualPoint } from "./residual";
export { runSplitStep } from "./split-step";
export type { SplitStepProblem } from "./split-step";
export { bijetOps, bijetX, bijetOfT, bijetConstant, bijetDerivative } from "./bijet";
export type { Bijet } from "./bijet";
export type { ResidualEvidence, SplitStepEvidence, VerificationResult, VerifyOptions } from "./types";
