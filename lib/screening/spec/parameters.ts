/** Reading `parameters:` entries: a number, `free`, `{values: […]}` or `{range: [a, b], steps: n}`. */
import type { ParameterSpec } from "./types";
import type { YNode, YScalar } from "./yaml-tree";
import { getEntry, type Reporter } from "./report";
import { isNullScalar, readNumber } from "./scalars";
import { childPath, indexPath } from "./source";
import { closest } from "./suggest";

const SWEEP_KEYS = ["values", "range", "steps"] as const;
const FORM_HINT = "write a number, free, {values: [1, 2, 5]} or {range: [0, 1], steps: 5}";

function numberAt(node: YNode, path: string, what: string, rep: Reporter): { value: number; text: string } | null {
  if (node.kind !== "scalar") {
    rep.error("number-invalid", path, node, `${what} must be a number`);
    return null;
  }
  const read = readNumber(node, what);
  if (!read.ok) {
    rep.error("number-invalid", path, node, read.message);
    return null;
  }
  return { value: read.value, text: read.text };
}

/** One parameter's specification, or null after reporting why it is not valid. */
export function readParameter(name: string, node: YNode, path: string, rep: Reporter, cap: number): ParameterSpec | null {
  const what = `parameter ${name}`;
  if (node.kind === "scalar") {
    if (node.text.trim() === "free" && !isNullScalar(node)) return { kind: "free" };
    const read = readNumber(node as YScalar, what);
    if (!read.ok) {
      const free = /^[A-Za-z]+$/.test(node.text.trim()) && closest(node.text.trim(), ["free"]) === "free" ? " (did you mean 'free'?)" : "";
      rep.error("number-invalid", path, node, `${read.message}${free}; ${FORM_HINT}`);
      return null;
    }
    return { kind: "fixed", value: read.value, text: read.text };
  }
  if (node.kind === "seq") {
    rep.error("parameter-invalid", path, node, `${what}: a list of values is written {values: [${node.items.length > 0 ? "…" : ""}]}; ${FORM_HINT}`);
    return null;
  }
  const entries = rep.entries(node, path, what);
  if (!entries) return null;
  const before = rep.count;
  rep.unknownKeys(entries, SWEEP_KEYS, path, `the sweep of ${name}`);
  if (rep.count > before) return null;
  const values = getEntry(entries, "values");
  const range = getEntry(entries, "range");
  const steps = getEntry(entries, "steps");
  if (values && (range || steps)) {
    rep.error("parameter-invalid", path, node, `${what}: give either values or range and steps, not both`);
    return null;
  }
  if (values) {
    const vPath = childPath(path, "values");
    if (values.value.kind !== "seq" || values.value.items.length === 0) {
      rep.error("parameter-invalid", vPath, values.value, `${what}: values must be a non-empty list of numbers, e.g. [1, 2, 5]`);
      return null;
    }
    if (values.value.items.length > cap) {
      rep.error("variant-cap", vPath, values.value, `${what}: ${values.value.items.length} values exceed the file's limit of ${cap} variants`);
      return null;
    }
    const out: { value: number; text: string }[] = [];
    const seen = new Map<number, number>();
    values.value.items.forEach((item, i) => {
      const n = numberAt(item, indexPath(vPath, i), `${what}, value ${i + 1}`, rep);
      if (!n) return;
      const first = seen.get(n.value);
      if (first !== undefined) {
        rep.error("parameter-invalid", indexPath(vPath, i), item, `${what}: the value ${n.text} appears twice (values ${first + 1} and ${i + 1})`);
        return;
      }
      seen.set(n.value, i);
      out.push(n);
    });
    return rep.count === before ? { kind: "values", values: out } : null;
  }
  if (range || steps) {
    if (!range || !steps) {
      rep.error("parameter-invalid", path, node, `${what}: a range needs both range: [a, b] and steps: n (n ≥ 2 points, ends included)`);
      return null;
    }
    const rPath = childPath(path, "range");
    if (range.value.kind !== "seq" || range.value.items.length !== 2) {
      rep.error("parameter-invalid", rPath, range.value, `${what}: range must be a list of two numbers [a, b]`);
      return null;
    }
    const from = numberAt(range.value.items[0], indexPath(rPath, 0), `${what}, range start`, rep);
    const to = numberAt(range.value.items[1], indexPath(rPath, 1), `${what}, range end`, rep);
    const sPath = childPath(path, "steps");
    const n = numberAt(steps.value, sPath, `${what}, steps`, rep);
    if (!from || !to || !n) return null;
    if (!(from.value < to.value)) {
      rep.error("parameter-invalid", rPath, range.value, `${what}: the range [${from.text}, ${to.text}] must have its start below its end`);
      return null;
    }
    if (!Number.isInteger(n.value) || n.value < 2) {
      rep.error("parameter-invalid", sPath, steps.value, `${what}: steps must be a whole number of points, at least 2 (the ends are included); got ${n.text}`);
      return null;
    }
    if (n.value > cap) {
      rep.error("variant-cap", sPath, steps.value, `${what}: ${n.text} steps exceed the file's limit of ${cap} variants`);
      return null;
    }
    return { kind: "range", from: from.value, to: to.value, steps: n.value, fromText: from.text, toText: to.text };
  }
  rep.error("parameter-invalid", path, node, `${what}: ${FORM_HINT}`);
  return null;
}
