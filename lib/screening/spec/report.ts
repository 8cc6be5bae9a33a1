/** Located errors: every error carries file, document, family, YAML path, line, column (and char). */
import type { SpecError } from "./types";
import type { LineIndex } from "./source";
import type { YEntry, YMap, YNode, YScalar } from "./yaml-tree";
import { didYouMean } from "./suggest";
import { childPath } from "./source";

export interface FileContext {
  text: string;
  lines: LineIndex;
  file?: string;
  errors: SpecError[];
}

/** Keys that could reach an object's prototype if they were ever used as property names. */
export const FORBIDDEN_KEYS: ReadonlySet<string> = new Set(["__proto__", "constructor", "prototype"]);

export class Reporter {
  /** Errors reported through this reporter. */
  count = 0;
  familyId?: string;

  constructor(
    readonly ctx: FileContext,
    readonly document: number,
  ) {}

  /** Report at a node (or a file offset). With `char`, point at that character of an expression scalar. */
  error(code: string, path: string, where: YNode | number, message: string, char?: number): void {
    let offset = typeof where === "number" ? where : where.start;
    if (char !== undefined && typeof where !== "number" && where.kind === "scalar" && exprIsVerbatim(this.ctx.text, where)) {
      offset = where.valueStart + char - 1;
    }
    const { line, column } = this.ctx.lines.position(offset);
    const err: SpecError = { code, message, path, line, column, document: this.document };
    if (this.ctx.file !== undefined) err.file = this.ctx.file;
    if (this.familyId !== undefined) err.familyId = this.familyId;
    if (char !== undefined) err.char = char;
    this.ctx.errors.push(err);
    this.count++;
  }

  /** The entries of a mapping, or null (with an error) when the node is not a mapping. Forbidden keys are skipped (reported by the key scan). */
  entries(node: YNode, path: string, what: string): YEntry[] | null {
    if (node.kind !== "map") {
      this.error("type", path, node, `${what} must be a mapping of 'key: value' lines`);
      return null;
    }
    return node.entries.filter((e) => !FORBIDDEN_KEYS.has(e.key.text));
  }

  /** Report keys outside `allowed`, with a suggestion for likely typos. */
  unknownKeys(entries: YEntry[], allowed: readonly string[], path: string, where: string): void {
    for (const e of entries) {
      if (!allowed.includes(e.key.text)) {
        this.error(
          "unknown-key",
          childPath(path, e.key.text),
          e.key,
          `unknown key '${e.key.text}' in ${where}${didYouMean(e.key.text, allowed)}; allowed keys: ${allowed.join(", ")}`,
        );
      }
    }
  }
}

/** True when the scalar's decoded text is exactly its source text on one line (so char offsets map 1:1). */
function exprIsVerbatim(text: string, node: YScalar): boolean {
  if (node.empty) return false;
  const raw = text.slice(node.valueStart, node.valueEnd);
  return raw === node.text && !raw.includes("\n");
}

export function getEntry(entries: YEntry[], key: string): YEntry | undefined {
  return entries.find((e) => e.key.text === key);
}

/** Report every forbidden key under `node` (aliases included), returning how many there were. */
export function scanForbiddenKeys(node: YNode, path: string, rep: Reporter, seen = new Set<YNode>()): number {
  if (seen.has(node)) return 0;
  seen.add(node);
  let found = 0;
  if (node.kind === "map") {
    for (const e of (node as YMap).entries) {
      const p = childPath(path, e.key.text);
      if (FORBIDDEN_KEYS.has(e.key.text)) {
        rep.error("forbidden-key", p, e.key, `the key '${e.key.text}' is not allowed (reserved word); rename it`);
        found++;
      }
      found += scanForbiddenKeys(e.value, p, rep, seen);
    }
  } else if (node.kind === "seq") {
    node.items.forEach((item, i) => {
      found += scanForbiddenKeys(item, `${path}[${i}]`, rep, seen);
    });
  }
  return found;
}
