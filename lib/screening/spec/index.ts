/**
 * Family file format (`wavesieve: 1`): the only entry point of lib/screening/spec.
 *
 *   parseFamilies(yamlText, { file?, variantCap? }) → { families: FamilySpec[], errors: SpecError[] }
 *   parseEquation({ text, cls, scope, field? })     equation string → normal-form coefficients
 *   sha256Hex(text), sha256(bytes)                   content hashes (pure TypeScript)
 *
 * The format is documented in docs/family-format.md.
 */
export type {
  EquationClass,
  FamilySpec,
  ParameterSpec,
  ParseFamiliesResult,
  SourceLocation,
  SpecError,
  Variant,
} from "./types";
export { CLASS_COEFFICIENTS } from "./types";
export { parseFamilies, SUPPORTED_VERSIONS, type ParseFamiliesOptions } from "./parse";
export { parseEquation, NORMAL_FORM_TEXT, type EquationInput, type EquationResult, type EquationProblem } from "./equation";
export type { Scope } from "./expressions";
export { sha256, sha256Hex } from "./hash";
export { normalisedFamilyJson, canonicalCoefficient } from "./normalise";
export { REQUIRED_COEFFICIENTS } from "./names";
export {
  MAX_FILE_BYTES,
  DEFAULT_VARIANT_CAP,
  MAX_YAML_DEPTH,
  MAX_ALIASES,
  MAX_EXPANDED_NODES,
  MAX_EQUATION_LENGTH,
} from "./limits";
