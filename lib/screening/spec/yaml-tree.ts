/**
 * YAML → a positioned node tree, built from js-yaml's event stream (`parseEvents`), so every value
 * keeps its source offsets. Nothing here builds objects from user keys: mappings are entry lists.
 * Aliases point at the anchored node (a DAG); their number and the expanded size are limited.
 * (js-yaml 5.5 has no `listener` option and no value positions in `loadAll`; its `parseEvents`
 * gives source offsets for every node, so the tree is built here and no constructor runs at all.
 * Scalars are resolved by ./scalars with the YAML 1.2 core-schema rules.)
 */
import { EVENT_ID, SCALAR_STYLE, getScalarValue, parseEvents, type Event } from "js-yaml";
import { MAX_ALIASES, MAX_EXPANDED_NODES, MAX_YAML_DEPTH } from "./limits";

export interface YScalar {
  kind: "scalar";
  /** Offsets into the whole file, end-exclusive; quotes included. */
  start: number;
  end: number;
  /** Offsets of the value text itself (inside quotes). */
  valueStart: number;
  valueEnd: number;
  /** 1 plain, 2 single-quoted, 3 double-quoted, 4 literal block, 5 folded block. */
  style: number;
  /** Decoded text. */
  text: string;
  /** True for an empty (null) scalar such as `key:` with nothing after it. */
  empty: boolean;
}
export interface YSeq {
  kind: "seq";
  start: number;
  end: number;
  items: YNode[];
}
export interface YEntry {
  key: YScalar;
  value: YNode;
}
export interface YMap {
  kind: "map";
  start: number;
  end: number;
  entries: YEntry[];
}
export type YNode = YScalar | YSeq | YMap;

export interface YDocument {
  /** 0-based index of the document in the file. */
  index: number;
  root: YNode | null;
}

/** A problem found while reading YAML; `offset` is into the whole file. */
export interface YamlProblem {
  code: "yaml-syntax" | "yaml-depth" | "yaml-tag" | "yaml-complex-key" | "yaml-alias" | "yaml-duplicate-key";
  message: string;
  offset: number;
  document: number;
  path: string;
  /** Fatal problems make the whole document unusable; the others concern one value. */
  fatal: boolean;
}

export interface YamlReadResult {
  documents: YDocument[];
  problems: YamlProblem[];
}

const FRIENDLY_SYNTAX: ReadonlyArray<[RegExp, string]> = [
  [/tab characters must not be used in indentation/, "tab characters cannot be used for indentation in YAML; indent with spaces"],
  [/deficient indentation/, "the indentation is less than expected here (or a quote or bracket opened earlier is not closed)"],
  [/bad indentation of a mapping entry/, "a key is indented differently from the keys around it (or there are two ':' on one line, e.g. 'a: b: c')"],
  [/end of the stream or a document separator is expected/, "unexpected content: check the indentation, or a list item '- ' placed inside a mapping"],
  [/nesting exceeded maxDepth/, `the YAML is nested more than ${MAX_YAML_DEPTH} levels deep; a family file needs about 5`],
];

function friendlySyntax(reason: string): string {
  for (const [pattern, text] of FRIENDLY_SYNTAX) if (pattern.test(reason)) return text;
  return reason;
}

/**
 * Split the file into document chunks at `---` lines, so a syntax error in one document leaves
 * the others readable. Content before the first `---` that is only comments or directives is
 * kept with the next chunk.
 */
function documentChunks(text: string): { offset: number; text: string }[] {
  const marks: number[] = [];
  const re = /^---(?=[ \t\r\n]|$)/gm;
  for (let m = re.exec(text); m; m = re.exec(text)) marks.push(m.index);
  const bounds = [0, ...marks.filter((m) => m > 0), text.length];
  const chunks: { offset: number; text: string }[] = [];
  for (let i = 0; i + 1 < bounds.length; i++) {
    chunks.push({ offset: bounds[i], text: text.slice(bounds[i], bounds[i + 1]) });
  }
  // A preamble with no content belongs to the document after it.
  if (chunks.length > 1 && !/^[ \t]*[^\s#%]/m.test(chunks[0].text)) {
    const first = chunks.shift()!;
    chunks[0] = { offset: first.offset, text: first.text + chunks[0].text };
  }
  return chunks;
}

interface Frame {
  node: YSeq | YMap;
  anchor: string | null;
  pendingKey: YScalar | null;
  /** The pending key is a duplicate: its value is read but dropped. */
  dropValue: boolean;
  keys: Set<string>;
  path: string;
}

function pathOfChild(frame: Frame | undefined): string {
  if (!frame) return "";
  if (frame.node.kind === "seq") return `${frame.path}[${frame.node.items.length}]`;
  if (frame.pendingKey === null) return frame.path;
  const key = frame.pendingKey?.text ?? "";
  const plain = /^[A-Za-z_][A-Za-z0-9_-]*$/.test(key);
  const seg = plain ? key : `[${JSON.stringify(key)}]`;
  return frame.path === "" ? seg : plain ? `${frame.path}.${seg}` : frame.path + seg;
}

class DocumentTooComplex extends Error {}

/** Builds documents from one chunk's events; positions are shifted by `offset`. */
function buildDocuments(
  events: Event[],
  source: string,
  offset: number,
  firstIndex: number,
  problems: YamlProblem[],
): YDocument[] {
  const documents: YDocument[] = [];
  let index = firstIndex - 1;
  let stack: Frame[] = [];
  let anchors = new Map<string, YNode>();
  let open = new Set<string>();
  let aliases = 0;
  let root: YNode | null = null;
  let lastEnd = offset;
  let failed = false;

  const problem = (code: YamlProblem["code"], message: string, at: number, path: string, fatal = false) => {
    problems.push({ code, message, offset: at, document: index, path, fatal });
    if (fatal) failed = true;
  };

  // Attach a finished node to its parent; mapping keys must be scalars and unique.
  const attach = (node: YNode, isAliasKey = false) => {
    const top = stack[stack.length - 1];
    if (!top) {
      root = node;
      return;
    }
    if (top.node.kind === "seq") {
      top.node.items.push(node);
      return;
    }
    if (top.pendingKey === null) {
      if (node.kind !== "scalar" || isAliasKey) {
        problem("yaml-complex-key", "mapping keys must be plain names, not lists, mappings or aliases", node.start, top.path);
        top.pendingKey = { kind: "scalar", start: node.start, end: node.start, valueStart: node.start, valueEnd: node.start, style: 1, text: "", empty: true };
        top.dropValue = true;
        return;
      }
      top.dropValue = top.keys.has(node.text);
      if (top.dropValue) {
        problem("yaml-duplicate-key", `duplicate key '${node.text}': each key may appear only once in a mapping`, node.start, pathOfChild({ ...top, pendingKey: node }));
      }
      top.keys.add(node.text);
      top.pendingKey = node;
      return;
    }
    if (!top.dropValue) top.node.entries.push({ key: top.pendingKey, value: node });
    top.pendingKey = null;
    top.dropValue = false;
  };

  const anchorName = (e: { anchorStart: number; anchorEnd: number }) =>
    e.anchorStart >= 0 ? source.slice(e.anchorStart, e.anchorEnd) : null;

  const rejectTag = (e: { tagStart: number; tagEnd: number }) => {
    if (e.tagStart >= 0) {
      const tag = source.slice(e.tagStart, e.tagEnd);
      problem("yaml-tag", `YAML tags such as '${tag}' are not used in family files; write the value without it`, offset + e.tagStart, pathOfChild(stack[stack.length - 1]));
    }
  };

  for (const e of events) {
    switch (e.type) {
      case EVENT_ID.DOCUMENT:
        index++;
        stack = [];
        anchors = new Map();
        open = new Set();
        aliases = 0;
        root = null;
        failed = false;
        break;
      case EVENT_ID.SEQUENCE:
      case EVENT_ID.MAPPING: {
        rejectTag(e);
        const path = pathOfChild(stack[stack.length - 1]);
        const node: YSeq | YMap =
          e.type === EVENT_ID.SEQUENCE
            ? { kind: "seq", start: offset + e.start, end: offset + e.start, items: [] }
            : { kind: "map", start: offset + e.start, end: offset + e.start, entries: [] };
        const anchor = anchorName(e);
        if (anchor) open.add(anchor);
        stack.push({ node, anchor, pendingKey: null, dropValue: false, keys: new Set(), path });
        lastEnd = node.start;
        break;
      }
      case EVENT_ID.SCALAR: {
        rejectTag(e);
        const empty = e.valueStart < 0;
        const quoted = e.style === SCALAR_STYLE.SINGLE_QUOTED || e.style === SCALAR_STYLE.DOUBLE_QUOTED;
        const valueStart = empty ? lastEnd : offset + e.valueStart;
        const valueEnd = empty ? lastEnd : offset + e.valueEnd;
        const node: YScalar = {
          kind: "scalar",
          start: quoted ? valueStart - 1 : valueStart,
          end: quoted ? valueEnd + 1 : valueEnd,
          valueStart,
          valueEnd,
          style: e.style,
          text: empty ? "" : getScalarValue(source, e),
          empty,
        };
        lastEnd = node.end;
        const anchor = anchorName(e);
        attach(node);
        if (anchor) anchors.set(anchor, node);
        break;
      }
      case EVENT_ID.ALIAS: {
        const name = source.slice(e.anchorStart, e.anchorEnd);
        const at = offset + e.anchorStart - 1;
        aliases++;
        const target = anchors.get(name);
        if (aliases > MAX_ALIASES) {
          problem("yaml-alias", `more than ${MAX_ALIASES} aliases (*name) in one document`, at, pathOfChild(stack[stack.length - 1]), true);
          throw new DocumentTooComplex();
        }
        if (!target) {
          const why = open.has(name) ? `alias *${name} refers to the node that contains it` : `alias *${name} refers to no anchor &${name} defined before it`;
          problem("yaml-alias", why, at, pathOfChild(stack[stack.length - 1]));
          attach({ kind: "scalar", start: at, end: at, valueStart: at, valueEnd: at, style: 1, text: "", empty: true });
          break;
        }
        attach(target, true);
        break;
      }
      case EVENT_ID.POP: {
        const frame = stack.pop();
        if (!frame) {
          if (!failed) documents.push({ index, root: root && expandedSizeOk(root, index, problems) ? root : null });
          else documents.push({ index, root: null });
          break;
        }
        frame.node.end = closingEnd(source, offset, frame.node, lastEnd);
        lastEnd = frame.node.end;
        if (frame.anchor) {
          open.delete(frame.anchor);
          anchors.set(frame.anchor, frame.node);
        }
        attach(frame.node);
        break;
      }
    }
  }
  return documents;
}

/** End of a collection: after its last child, or after the closing bracket of a flow collection. */
function closingEnd(source: string, offset: number, node: YSeq | YMap, lastEnd: number): number {
  let i = lastEnd - offset;
  const opener = source.charAt(node.start - offset);
  if (opener !== "[" && opener !== "{") return lastEnd;
  if (i === node.start - offset) i++;
  while (i < source.length) {
    const c = source.charAt(i);
    if (c === "]" || c === "}") return offset + i + 1;
    if (c === "#") {
      while (i < source.length && source.charAt(i) !== "\n") i++;
      continue;
    }
    i++;
  }
  return offset + source.length;
}

/** Expanded node count (aliases counted in full), memoised on the DAG; refuses bombs. */
function expandedSizeOk(root: YNode, document: number, problems: YamlProblem[]): boolean {
  const memo = new Map<YNode, number>();
  const size = (n: YNode): number => {
    const known = memo.get(n);
    if (known !== undefined) return known;
    let s = 1;
    if (n.kind === "seq") for (const item of n.items) s += size(item);
    else if (n.kind === "map") for (const entry of n.entries) s += 1 + size(entry.value);
    s = Math.min(s, Number.MAX_SAFE_INTEGER);
    memo.set(n, s);
    return s;
  };
  const total = size(root);
  if (total > MAX_EXPANDED_NODES) {
    problems.push({
      code: "yaml-alias",
      message: `the document expands to ${total > 1e15 ? "more than 10^15" : total.toLocaleString("en-US")} values once its aliases (*name) are expanded; the limit is ${MAX_EXPANDED_NODES.toLocaleString("en-US")}`,
      offset: root.start,
      document,
      path: "",
      fatal: true,
    });
    return false;
  }
  return true;
}

/** Reads every document of a file. Documents with a syntax problem come back with `root: null`. */
export function readYaml(text: string): YamlReadResult {
  const problems: YamlProblem[] = [];
  const documents: YDocument[] = [];
  let next = 0;
  for (const chunk of documentChunks(text)) {
    let events: Event[];
    try {
      events = parseEvents(chunk.text, { maxDepth: MAX_YAML_DEPTH });
    } catch (error) {
      const mark = (error as { mark?: { position?: number } }).mark;
      const reason = (error as { reason?: unknown }).reason;
      const raw = typeof reason === "string" ? reason : String(error);
      problems.push({
        code: /maxDepth/.test(raw) ? "yaml-depth" : "yaml-syntax",
        message: `YAML syntax error: ${friendlySyntax(raw)}`,
        offset: chunk.offset + (typeof mark?.position === "number" ? mark.position : 0),
        document: next,
        path: "",
        fatal: true,
      });
      documents.push({ index: next, root: null });
      next++;
      continue;
    }
    let docs: YDocument[];
    try {
      docs = buildDocuments(events, chunk.text, chunk.offset, next, problems);
    } catch (error) {
      if (!(error instanceof DocumentTooComplex)) throw error;
      docs = [{ index: next, root: null }];
    }
    // A fatal problem makes the whole document unusable.
    for (const d of docs) {
      const bad = problems.some((p) => p.fatal && p.document === d.index);
      documents.push(bad ? { index: d.index, root: null } : d);
    }
    next += Math.max(docs.length, 1);
  }
  return { documents, problems };
}
