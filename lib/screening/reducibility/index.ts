/**
 * Reducibility stage (the only entry point of lib/screening/reducibility): is the member mapped
 * to its canonical equation by the point map of its class? (README; nls.md §3, kdv.md §2,
 * mkdv.md §2.)
 *
 * Syntax
 *   runReducibility(variant, { seed?, symbolic?, symbolicTimeoutMs? }) → Promise<ReducibilityReport>
 *
 * Example
 *   const report = await runReducibility(variant);   // variant of class "nls", a = 1/2, h = 1
 *   report.verdict;                                  // "reducible"
 *   report.evidence.windows[0].samples[0].orders[0]; // { residual, scale, rho, invariant, ... }
 *
 * See also
 *   ../zero (the high-precision zero test), ../report (the report types).
 */
export { runReducibility } from "./stage";
export { INVARIANTS, polynomialFormLatex } from "./invariants";
export type { InvariantDefinition, Monomial, Factor } from "./invariants";
export { invariantTerms, invariantJet, invariantSource } from "./terms";
export { invariantExpr, algebriteText, forAlgebrite } from "./display";
export { scanCoefficients } from "./scan";
export type { ScanResult } from "./scan";
export { dualField } from "./dual";
export type { SymbolicTask, SymbolicHook, ReducibilityOptions } from "./types";
