/**
 * Input limits of the family-file parser (input hygiene, not numerical tolerances).
 * Documented in docs/family-format.md, "Limits".
 */

/** Largest accepted file: 2 MiB of UTF-8. */
export const MAX_FILE_BYTES = 2 * 1024 * 1024;
/** Default cap on the number of variants (sweep points) one file may expand to. */
export const DEFAULT_VARIANT_CAP = 5000;
/** Deepest YAML nesting accepted; a family file needs 5 levels, so 32 leaves ample room. */
export const MAX_YAML_DEPTH = 32;
/** Aliases (`*name`) per YAML document. */
export const MAX_ALIASES = 100;
/** Nodes a document may have once every alias is expanded (stops "billion laughs" inputs). */
export const MAX_EXPANDED_NODES = 100_000;
/** Identifier length for parameters, helper functions and variables. */
export const MAX_NAME_LENGTH = 32;
export const MAX_TITLE_LENGTH = 200;
export const MAX_NOTES_LENGTH = 20_000;
export const MAX_TAGS = 32;
export const MAX_TAG_LENGTH = 40;
/** Largest integer power of a field or of x expanded in an equation string (u^n, x^n). */
export const MAX_EQUATION_POWER = 8;
/** Longest equation string (characters); each of its terms is also held to the expression limit. */
export const MAX_EQUATION_LENGTH = 4000;
