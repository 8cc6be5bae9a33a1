/**
 * Types of a parsed family file (format `wavesieve: 1`). See docs/family-format.md.
 */
import type { Expr } from "../expr/types";

export type EquationClass = "nls" | "kdv" | "mkdv";

/** Normal-form coefficient names per class (../shared/math/README.md). */
export const CLASS_COEFFICIENTS: Readonly<Record<EquationClass, readonly string[]>> = {
  nls: ["a", "b", "c", "e", "f", "g", "h", "k"],
  kdv: ["p", "q", "r", "s", "g", "l", "m"],
  mkdv: ["p", "q", "r", "s", "g"],
};

/** Where something is in the user's files. line/column are 1-based; char is within an expression. */
export interface SourceLocation {
  file?: string;
  /** 0-based index of the YAML document in the file. */
  document?: number;
  familyId?: string;
  /** YAML path, e.g. "families[2].coefficients.h". */
  path: string;
  line?: number;
  column?: number;
  char?: number;
}

export interface SpecError extends SourceLocation {
  /** Stable machine code, e.g. "yaml-syntax", "unknown-symbol", "variant-cap". */
  code: string;
  message: string;
}

export type ParameterSpec =
  | { kind: "fixed"; value: number; text: string }
  | { kind: "values"; values: { value: number; text: string }[] }
  /** `fromText`/`toText` keep the exact decimals of the ends (always set by parseFamilies). */
  | { kind: "range"; from: number; to: number; steps: number; fromText?: string; toText?: string }
  | { kind: "free" };

/**
 * One concrete member of a family, ready for the engine.
 * In `coefficients` the evolution variable is renamed to "t" (and the space variable to "x"),
 * helper functions are inlined and fixed/swept parameters are substituted as `num` nodes
 * (their `text` keeps the exact decimal). The only symbols left are "t" (and "x" where the class
 * allows it, which is nowhere in a normal-form coefficient) and the names in `free`.
 * Coefficients the user did not give are the number 0.
 */
export interface Variant {
  familyId: string;
  /** 0-based index within the family's sweep expansion. */
  index: number;
  class: EquationClass;
  /** Values of fixed and swept parameters for this variant. */
  parameters: Record<string, number>;
  /** Parameters declared `free`: unknown constants the screen solves for. */
  free: string[];
  coefficients: Record<string, Expr>;
  window: [number, number];
}

export interface FamilySpec {
  id: string;
  title: string;
  class: EquationClass;
  /** `field` is the name of the unknown in an `equation` string (default "u"). */
  variables: { evolution: string; space: string; field?: string };
  parameters: Record<string, ParameterSpec>;
  /** Coefficient expressions as the user wrote them (or as derived from `equation`). */
  coefficientText: Record<string, string>;
  /** The equation string if the family was given that way. */
  equation?: string;
  functions: Record<string, string>;
  window: [number, number];
  tags: string[];
  notes: string;
  /** The YAML text of this family's entry, for provenance. */
  source: string;
  /** sha256 of the normalised family (for de-duplication); hex. */
  hash: string;
  variants: Variant[];
  location: SourceLocation;
}

export interface ParseFamiliesResult {
  families: FamilySpec[];
  errors: SpecError[];
}
