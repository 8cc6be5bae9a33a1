/**
 * parseFamilies: a family file (one or more YAML documents) → the valid families and located
 * errors. Deterministic: the same text always gives the same result, in file order.
 */
import type { FamilySpec, ParseFamiliesResult, SpecError } from "./types";
import { readYaml, type YNode, type YamlProblem } from "./yaml-tree";
import { LineIndex, childPath, indexPath, utf8Length } from "./source";
import { Reporter, getEntry, scanForbiddenKeys, type FileContext } from "./report";
import { readFamily, type FileState } from "./family";
import { isNullScalar, readNumber } from "./scalars";
import { DEFAULT_VARIANT_CAP, MAX_FILE_BYTES } from "./limits";

export interface ParseFamiliesOptions {
  /** File name, copied into every error and location. */
  file?: string;
  /** Most variants the whole file may expand to (default DEFAULT_VARIANT_CAP). */
  variantCap?: number;
}

export const SUPPORTED_VERSIONS: readonly number[] = [1];
const ROOT_KEYS = ["wavesieve", "families"] as const;

function megabytes(bytes: number): string {
  return (bytes / (1024 * 1024)).toFixed(1).replace(/\.0$/, "");
}

/** True when `path` is `prefix` or lies below it. */
function within(path: string, prefix: string): boolean {
  return path === prefix || path.startsWith(`${prefix}.`) || path.startsWith(`${prefix}[`);
}

function yamlError(problem: YamlProblem, ctx: FileContext): SpecError {
  const { line, column } = ctx.lines.position(problem.offset);
  const err: SpecError = { code: problem.code, message: problem.message, path: problem.path, line, column, document: problem.document };
  if (ctx.file !== undefined) err.file = ctx.file;
  return err;
}

/** The id written in an entry, for locating errors that are found outside the entry's own reading. */
function writtenId(node: YNode): string | undefined {
  if (node.kind !== "map") return undefined;
  const id = getEntry(node.entries, "id");
  return id && id.value.kind === "scalar" ? id.value.text : undefined;
}

function readDocument(root: YNode, index: number, problems: YamlProblem[], ctx: FileContext, state: FileState, out: FamilySpec[]): void {
  const rep = new Reporter(ctx, index);
  // Structural YAML problems (duplicate keys, tags, …) outside a family make the document unusable.
  const local = problems.filter((p) => p.document === index && !p.fatal);
  const outside = local.filter((p) => !within(p.path, "families") || /^families$/.test(p.path));
  for (const p of local) ctx.errors.push(yamlError(p, ctx));
  if (root.kind !== "map") {
    rep.error("document-not-mapping", "", root, "a family file document is a mapping that starts with 'wavesieve: 1' and has a 'families:' list");
    return;
  }
  for (const e of root.entries) {
    if (e.key.text !== "families") scanForbiddenKeys(e.value, childPath("", e.key.text), rep);
  }
  rep.unknownKeys(root.entries.filter((e) => !["__proto__", "constructor", "prototype"].includes(e.key.text)), ROOT_KEYS, "", "the document");
  for (const e of root.entries) {
    if (["__proto__", "constructor", "prototype"].includes(e.key.text)) {
      rep.error("forbidden-key", childPath("", e.key.text), e.key, `the key '${e.key.text}' is not allowed (reserved word); rename it`);
    }
  }
  const version = getEntry(root.entries, "wavesieve");
  if (!version) {
    rep.error("version-missing", "", root, `the document does not say its format version; start it with 'wavesieve: 1' (supported: ${SUPPORTED_VERSIONS.join(", ")})`);
    return;
  }
  const v = version.value.kind === "scalar" ? readNumber(version.value, "the format version") : null;
  if (!v || !v.ok || !SUPPORTED_VERSIONS.includes(v.value)) {
    const shown = version.value.kind === "scalar" ? `'${version.value.text}'` : "this value";
    rep.error("version-unsupported", "wavesieve", version.value, `format version ${shown} is not supported; this version of Wavesieve reads format ${SUPPORTED_VERSIONS.join(", ")} (write 'wavesieve: 1')`);
    return;
  }
  if (outside.length > 0) return;
  const families = getEntry(root.entries, "families");
  if (!families) {
    rep.error("families-missing", "", root, "the document has no 'families:' list");
    return;
  }
  const list = families.value;
  if (list.kind === "scalar" && isNullScalar(list)) {
    rep.error("families-empty", "families", families.key, "the 'families:' list is empty; give at least one family");
    return;
  }
  if (list.kind !== "seq") {
    rep.error("type", "families", list, "'families:' must be a list of families, each item starting with '- id: …'");
    return;
  }
  if (list.items.length === 0) {
    rep.error("families-empty", "families", list, "the 'families:' list is empty; give at least one family");
    return;
  }
  list.items.forEach((item, i) => {
    const path = indexPath("families", i);
    const familyRep = new Reporter(ctx, index);
    const yamlTrouble = local.filter((p) => within(p.path, path));
    if (yamlTrouble.length > 0) {
      // The entry's structure is in doubt: report only the YAML problems (already in the list), with the family's id.
      const id = writtenId(item);
      if (id !== undefined) {
        for (const err of ctx.errors) if (err.document === index && err.familyId === undefined && within(err.path, path)) err.familyId = id;
      }
      return;
    }
    const family = readFamily(item, path, familyRep, state);
    if (family) out.push(family);
  });
}

/**
 * Parse a family file. Valid families are returned even when others in the file are invalid;
 * an invalid family is never returned. Errors carry file, document, family id, YAML path, line,
 * column (and character within an expression).
 */
export function parseFamilies(yamlText: string, options: ParseFamiliesOptions = {}): ParseFamiliesResult {
  const errors: SpecError[] = [];
  const lines = new LineIndex(yamlText.length <= MAX_FILE_BYTES ? yamlText : "");
  const ctx: FileContext = { text: yamlText, lines, errors };
  if (options.file !== undefined) ctx.file = options.file;
  const fileError = (code: string, message: string): ParseFamiliesResult => {
    const err: SpecError = { code, message, path: "", line: 1, column: 1 };
    if (options.file !== undefined) err.file = options.file;
    return { families: [], errors: [err] };
  };

  // Every character is at least one byte, so a long text is refused before it is measured exactly.
  const bytes = utf8Length(yamlText);
  if (bytes > MAX_FILE_BYTES) {
    return fileError("file-too-large", `file too large (${megabytes(bytes)} MB; limit ${megabytes(MAX_FILE_BYTES)} MB)`);
  }
  if (yamlText.includes("\u0000")) return fileError("file-binary", "the file contains NUL characters; a family file is plain text (YAML)");

  const { documents, problems } = readYaml(yamlText);
  for (const p of problems) if (p.fatal) errors.push(yamlError(p, ctx));
  const state: FileState = { variantCap: options.variantCap ?? DEFAULT_VARIANT_CAP, variantsUsed: 0, ids: new Map() };
  const families: FamilySpec[] = [];
  let contentful = 0;
  for (const doc of documents) {
    if (doc.root === null) {
      if (problems.some((p) => p.document === doc.index)) contentful++;
      continue;
    }
    if (doc.root.kind === "scalar" && isNullScalar(doc.root)) continue;
    contentful++;
    readDocument(doc.root, doc.index, problems, ctx, state, families);
  }
  if (contentful === 0 && errors.length === 0) {
    return fileError("file-empty", "the file contains no YAML document; start it with 'wavesieve: 1' and a 'families:' list");
  }
  // File order (stable, so errors at one place keep the order they were found in).
  errors.sort((a, b) => (a.line ?? 0) - (b.line ?? 0) || (a.column ?? 0) - (b.column ?? 0));
  return { families, errors };
}
