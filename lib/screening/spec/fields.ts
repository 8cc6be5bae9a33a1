/**
 * Reading the plain fields of a family entry: id, class, variables, parameters, window and texts.
 * Each reader reports its own problems and returns null (or a safe default) when the field is bad.
 */
import type { EquationClass, ParameterSpec } from "./types";
import type { YEntry, YNode, YScalar } from "./yaml-tree";
import { getEntry, type Reporter } from "./report";
import { childPath, indexPath } from "./source";
import { isBoolScalar, isNullScalar, readNumber } from "./scalars";
import { CLASSES, SLUG, nameProblem, slugify, suggestClass, variableProblem } from "./names";
import { readParameter } from "./parameters";
import { MAX_NOTES_LENGTH, MAX_TAGS, MAX_TAG_LENGTH, MAX_TITLE_LENGTH } from "./limits";

export const FAMILY_KEYS = ["id", "title", "class", "variables", "parameters", "coefficients", "equation", "functions", "window", "tags", "notes"] as const;
export const VARIABLE_KEYS = ["evolution", "space", "field"] as const;

/** State shared by the families of one file. */
export interface FileState {
  variantCap: number;
  variantsUsed: number;
  /** id → line of its first use. */
  ids: Map<string, number>;
}

export function nullRecord<T>(): Record<string, T> {
  return Object.create(null) as Record<string, T>;
}

/** Text of a scalar the user meant as text (numbers keep their written form). */
export function scalarText(node: YNode): string | null {
  if (node.kind !== "scalar" || isNullScalar(node) || isBoolScalar(node)) return null;
  return node.text;
}

export interface Context {
  rep: Reporter;
  path: string;
  text: string;
}

export function readId(entries: YEntry[], node: YNode, c: Context, state: FileState): string | null {
  const entry = getEntry(entries, "id");
  if (!entry) {
    c.rep.error("required", c.path, node, "the family has no id; add a line such as 'id: tapered-amplifier-a'");
    return null;
  }
  const p = childPath(c.path, "id");
  const text = scalarText(entry.value);
  if (text === null) {
    c.rep.error("id-invalid", p, entry.value, "the id must be a short text such as 'tapered-amplifier-a'");
    return null;
  }
  c.rep.familyId = text;
  if (!SLUG.test(text)) {
    c.rep.error("id-invalid", p, entry.value, `the id '${text}' is not valid: use 1–64 lower-case letters, digits and '-', starting with a letter or digit (e.g. '${slugify(text)}')`);
    return null;
  }
  const line = c.rep.ctx.lines.position(entry.value.start).line;
  const first = state.ids.get(text);
  if (first !== undefined) {
    c.rep.error("id-duplicate", p, entry.value, `the id '${text}' is already used by the family at line ${first}; ids must be unique in a file`);
    return null;
  }
  state.ids.set(text, line);
  return text;
}

export function readClass(entries: YEntry[], node: YNode, c: Context): EquationClass | null {
  const entry = getEntry(entries, "class");
  if (!entry) {
    c.rep.error("required", c.path, node, "the family has no class; add 'class: nls', 'class: kdv' or 'class: mkdv'");
    return null;
  }
  const text = scalarText(entry.value);
  if (text !== null && (CLASSES as readonly string[]).includes(text)) return text as EquationClass;
  const hint = text === null ? null : suggestClass(text);
  const shown = text === null ? "this value" : `'${text}'`;
  c.rep.error("class-unknown", childPath(c.path, "class"), entry.value, `unknown class ${shown}; the classes are nls, kdv and mkdv${hint ? ` (did you mean '${hint}'?)` : ""}`);
  return null;
}

export interface Variables {
  evolution: string;
  space: string;
  field: string;
}

/** The unknown's name (`field`) only takes part in an equation family (or when written). */
export function readVariables(entries: YEntry[], c: Context, equationForm: boolean): Variables | null {
  const vars: Variables = { evolution: "t", space: "x", field: "u" };
  const entry = getEntry(entries, "variables");
  if (!entry) return vars;
  const p = childPath(c.path, "variables");
  const items = c.rep.entries(entry.value, p, "variables");
  if (!items) return null;
  const before = c.rep.count;
  c.rep.unknownKeys(items, VARIABLE_KEYS, p, "variables");
  for (const key of VARIABLE_KEYS) {
    const e = getEntry(items, key);
    if (!e) continue;
    const text = scalarText(e.value);
    const problem = text === null ? "give a name such as z" : variableProblem(text);
    if (problem !== null || text === null) {
      c.rep.error("variables-invalid", childPath(p, key), e.value, `${key} variable: ${problem}`);
      continue;
    }
    vars[key] = text;
  }
  const withField = equationForm || getEntry(items, "field") !== undefined;
  const names = withField ? [vars.evolution, vars.space, vars.field] : [vars.evolution, vars.space];
  if (new Set(names).size !== names.length) {
    const what = withField ? "the evolution variable, the space variable and the unknown need three different names" : "the evolution and space variables need different names";
    c.rep.error("variables-invalid", p, entry.value, `${what} (got ${names.join(", ")})`);
  }
  return c.rep.count === before ? vars : null;
}

export interface Parameters {
  specs: Array<[string, ParameterSpec]>;
  names: Set<string>;
  /** Keys, for locating later problems. */
  keys: Map<string, YScalar>;
  /** False when some parameter name itself is invalid (expressions would then misreport it). */
  namesOk: boolean;
}

export function readParameters(entries: YEntry[], c: Context, cap: number): Parameters {
  const out: Parameters = { specs: [], names: new Set(), keys: new Map(), namesOk: true };
  const entry = getEntry(entries, "parameters");
  if (!entry) return out;
  const p = childPath(c.path, "parameters");
  if (entry.value.kind === "scalar" && isNullScalar(entry.value)) return out;
  const items = c.rep.entries(entry.value, p, "parameters");
  if (!items) return { ...out, namesOk: false };
  for (const e of items) {
    const name = e.key.text;
    const ep = childPath(p, name);
    const problem = nameProblem(name);
    if (problem) {
      c.rep.error("name-invalid", ep, e.key, `parameter '${name}': ${problem}`);
      out.namesOk = false;
      continue;
    }
    out.names.add(name);
    out.keys.set(name, e.key);
    const spec = readParameter(name, e.value, ep, c.rep, cap);
    if (spec) out.specs.push([name, spec]);
  }
  return out;
}

export function readStringMap(entries: YEntry[], key: string, c: Context): Array<[string, YEntry]> | null {
  const entry = getEntry(entries, key);
  if (!entry) return [];
  if (entry.value.kind === "scalar" && isNullScalar(entry.value)) return [];
  const items = c.rep.entries(entry.value, childPath(c.path, key), key);
  return items ? items.map((e) => [e.key.text, e]) : null;
}

export function readWindow(entries: YEntry[], node: YNode, c: Context): { window: [number, number]; texts: [string, string] } | null {
  const entry = getEntry(entries, "window");
  if (!entry) {
    c.rep.error("required", c.path, node, "the family has no window; add the evolution interval, e.g. 'window: [0, 10]'");
    return null;
  }
  const p = childPath(c.path, "window");
  const v = entry.value;
  if (v.kind !== "seq" || v.items.length !== 2) {
    c.rep.error("window-invalid", p, v, "the window must be a list of two numbers [start, end], e.g. [0, 10]");
    return null;
  }
  const ends: { value: number; text: string }[] = [];
  v.items.forEach((item, i) => {
    const what = i === 0 ? "the window start" : "the window end";
    const read = item.kind === "scalar" ? readNumber(item, what) : ({ ok: false, message: `${what} must be a number` } as const);
    if (!read.ok) c.rep.error("window-invalid", indexPath(p, i), item, read.message);
    else ends.push({ value: read.value, text: read.text });
  });
  if (ends.length !== 2) return null;
  if (!(ends[0].value < ends[1].value)) {
    c.rep.error("window-invalid", p, v, `the window [${ends[0].text}, ${ends[1].text}] must start before it ends`);
    return null;
  }
  return { window: [ends[0].value, ends[1].value], texts: [ends[0].text, ends[1].text] };
}

export function readTexts(entries: YEntry[], c: Context, id: string): { title: string; tags: string[]; notes: string } {
  let title = id;
  const t = getEntry(entries, "title");
  if (t) {
    const text = scalarText(t.value);
    if (text === null || text.trim() === "" || text.includes("\n") || text.length > MAX_TITLE_LENGTH) {
      c.rep.error("title-invalid", childPath(c.path, "title"), t.value, `the title must be one line of text, at most ${MAX_TITLE_LENGTH} characters`);
    } else title = text.trim();
  }
  const tags: string[] = [];
  const g = getEntry(entries, "tags");
  if (g) {
    const p = childPath(c.path, "tags");
    if (g.value.kind !== "seq") c.rep.error("tags-invalid", p, g.value, "tags must be a list, e.g. [fibre, gain]");
    else if (g.value.items.length > MAX_TAGS) c.rep.error("tags-invalid", p, g.value, `at most ${MAX_TAGS} tags`);
    else {
      g.value.items.forEach((item, i) => {
        const text = scalarText(item);
        if (text === null || text.trim() === "" || text.length > MAX_TAG_LENGTH || /[\n,]/.test(text)) {
          c.rep.error("tags-invalid", indexPath(p, i), item, `each tag is a short text (1–${MAX_TAG_LENGTH} characters, no commas or line breaks)`);
        } else tags.push(text.trim());
      });
    }
  }
  let notes = "";
  const n = getEntry(entries, "notes");
  if (n) {
    const text = scalarText(n.value);
    if (text === null || text.length > MAX_NOTES_LENGTH) {
      c.rep.error("notes-invalid", childPath(c.path, "notes"), n.value, `notes must be text (at most ${MAX_NOTES_LENGTH} characters)`);
    } else notes = text;
  }
  return { title, tags, notes };
}
