/**
 * Public surface of the screening engine (pure: no I/O, no framework).
 *
 * Syntax
 *   parseFamilies(yamlText, { file? })            → { families: FamilySpec[], errors: SpecError[] }
 *   screenVariant(variant, options?)               → Promise<VariantReport>
 *   screenFamily(spec, options?)                   → Promise<FamilyReport>
 *   options: { seed?, symbolic?(task) → Promise<string | null>, symbolicTimeoutMs?,
 *              onStage?(stage, { familyId, variantIndex }), signal?, painleve? }
 *   ENGINE_VERSION
 *
 * Example
 *   const { families } = parseFamilies(text, { file: "trap.yaml" });
 *   const report = await screenFamily(families[0], { seed: 7 });
 *   report.variants[0].reducibility.verdict;   // "reducible" | "not-reducible" | "undecided"
 *
 * Reports are plain JSON (numbers and decimal strings), safe to store and to serialise.
 */
export { parseFamilies } from "./spec";
export type { FamilySpec, Variant, SpecError, ParseFamiliesResult, EquationClass } from "./spec/types";
export { screenVariant, screenFamily, summarise } from "./pipeline";
export type { ScreeningOptions, ScreeningStage } from "./pipeline";
export type { SymbolicHook, SymbolicTask } from "./reducibility";
export type {
  VariantReport,
  FamilyReport,
  FamilySummary,
  ReducibilityReport,
  ReducibilityVerdict,
  ReducibilityEvidence,
  PainleveReport,
  Constraint,
  UndecidedReason,
  WindowEvidence,
  SampleEvidence,
  FreeSolutionEvidence,
} from "./report";
export { ENGINE_VERSION } from "./version";
