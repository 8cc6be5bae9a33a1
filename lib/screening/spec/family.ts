/**
 * One family entry → a validated FamilySpec with its variants, or null after reporting every
 * problem found. A family is returned whole or not at all.
 */
import { exprToString, num, substitute, type Expr } from "../expr";
import { CLASS_COEFFICIENTS, type EquationClass, type FamilySpec, type ParameterSpec, type Variant } from "./types";
import type { YEntry, YNode, YScalar } from "./yaml-tree";
import { getEntry, scanForbiddenKeys, type Reporter } from "./report";
import { childPath } from "./source";
import { isBoolScalar, isNullScalar, looksNumeric, readNumber } from "./scalars";
import { CLASSES, REQUIRED_COEFFICIENTS, nameProblem } from "./names";
import { dependsOnSpace, orderHelpers, positionOf, readExpression, toEngineVariables, type Scope } from "./expressions";
import { parseEquation } from "./equation";
import { combinations, variantCount } from "./sweep";
import { familyHash } from "./normalise";
import {
  FAMILY_KEYS,
  VARIABLE_KEYS,
  nullRecord,
  readClass,
  readId,
  readParameters,
  readStringMap,
  readTexts,
  readVariables,
  readWindow,
  type Context,
  type FileState,
  type Variables,
} from "./fields";

export type { FileState } from "./fields";

/** Newlines are never meaningful in an expression; replace them one-for-one so positions hold. */
function expressionText(node: YScalar): string {
  return node.text.replace(/[\r\n\t]/g, " ");
}

/** Reads an expression-valued scalar (a string, or a number written plainly). */
function expressionNode(node: YNode, p: string, what: string, c: Context): YScalar | null {
  if (node.kind !== "scalar" || isNullScalar(node) || isBoolScalar(node)) {
    c.rep.error("type", p, node, `${what} must be an expression such as "h0*exp(g0*z)" (or a number)`);
    return null;
  }
  if (looksNumeric(node)) {
    const read = readNumber(node, what);
    if (!read.ok) {
      c.rep.error("number-invalid", p, node, read.message);
      return null;
    }
  }
  return node;
}

function readHelpers(items: Array<[string, YEntry]>, scope: Scope, vars: Variables, params: Set<string>, c: Context, equationForm: boolean): Map<string, { variable: string; body: Expr }> | null {
  const p = childPath(c.path, "functions");
  const helpers = new Map<string, { variable: string; body: Expr }>();
  const bodies = new Map<string, string>();
  const nodes = new Map<string, YScalar>();
  const before = c.rep.count;
  for (const [name, e] of items) {
    const ep = childPath(p, name);
    const problem = nameProblem(name) ?? (params.has(name) ? `'${name}' is already a parameter` : null) ?? clashWithVariables(name, vars, equationForm);
    if (problem) {
      c.rep.error("name-invalid", ep, e.key, `helper function '${name}': ${problem}`);
      continue;
    }
    const node = expressionNode(e.value, ep, `helper function ${name}`, c);
    if (!node) continue;
    bodies.set(name, expressionText(node));
    nodes.set(name, node);
  }
  const order = orderHelpers(bodies);
  if (!order.ok) {
    const [first] = order.cycle;
    const node = nodes.get(first)!;
    const message =
      order.cycle.length === 2
        ? `helper function ${first} calls itself; helpers may use parameters and other helpers, but not recursively`
        : `helper functions call each other in a cycle (${order.cycle.join(" → ")}); helpers may use parameters and other helpers, but not recursively`;
    c.rep.error("helper-cycle", childPath(p, first), node, message, positionOf(bodies.get(first) ?? "", order.cycle[1]));
    return null;
  }
  for (const name of order.order) {
    const node = nodes.get(name)!;
    const text = bodies.get(name)!;
    const ep = childPath(p, name);
    const read = readExpression(text, { ...scope, helpers }, `helper function ${name}`);
    if (!read.ok) {
      c.rep.error(read.code, ep, node, read.message, read.char);
      continue;
    }
    if (dependsOnSpace(read.expr, scope)) {
      c.rep.error("coefficient-space-dependence", ep, node, `helper function ${name} must not depend on ${scope.space}: helpers are functions of ${scope.evolution} alone`, positionOf(text, scope.space));
      continue;
    }
    helpers.set(name, { variable: scope.evolution, body: read.expr });
  }
  return c.rep.count === before ? helpers : null;
}

function clashWithVariables(name: string, vars: Variables, equationForm: boolean): string | null {
  if (name === vars.evolution || name === vars.space) return `'${name}' is one of the family's variables`;
  if (equationForm && (name === vars.field || name.startsWith(`${vars.field}_`))) return `'${name}' is the unknown of the equation (or one of its derivatives)`;
  return null;
}

function readCoefficients(entries: YEntry[], cls: EquationClass, scope: Scope, c: Context): { exprs: Map<string, Expr>; texts: Record<string, string> } | null {
  const p = childPath(c.path, "coefficients");
  const entry = getEntry(entries, "coefficients")!;
  const items = c.rep.entries(entry.value, p, "coefficients");
  if (!items) return null;
  const before = c.rep.count;
  const allowed = CLASS_COEFFICIENTS[cls];
  const exprs = new Map<string, Expr>();
  const texts = nullRecord<string>();
  for (const e of items) {
    const name = e.key.text;
    const ep = childPath(p, name);
    if (!allowed.includes(name)) {
      const elsewhere = CLASSES.filter((k) => k !== cls && CLASS_COEFFICIENTS[k].includes(name));
      const also = elsewhere.length > 0 ? `; '${name}' is a coefficient of ${elsewhere.join(" and ")}` : "";
      c.rep.error("coefficient-unknown", ep, e.key, `'${name}' is not a coefficient of the ${cls} class; its coefficients are ${allowed.join(", ")}${also}`);
      continue;
    }
    const node = expressionNode(e.value, ep, `coefficient ${name}`, c);
    if (!node) continue;
    const text = expressionText(node);
    const read = readExpression(text, scope, `coefficient ${name}`);
    if (!read.ok) {
      c.rep.error(read.code, ep, node, read.message, read.char);
      continue;
    }
    if (dependsOnSpace(read.expr, scope)) {
      c.rep.error(
        "coefficient-space-dependence",
        ep,
        node,
        `coefficient ${name} must not depend on ${scope.space}; the ${scope.space}-dependence of the class is fixed by the normal form${cls === "nls" ? ` (b ${scope.space}^2 + f ${scope.space} + e)` : ` (s ${scope.space} + g)`}`,
        positionOf(text, scope.space),
      );
      continue;
    }
    exprs.set(name, read.expr);
    texts[name] = node.text;
  }
  const missing = REQUIRED_COEFFICIENTS[cls].filter((k) => !exprs.has(k) && !items.some((e) => e.key.text === k));
  if (missing.length > 0) {
    c.rep.error("coefficient-missing", p, entry.value, `the ${cls} class needs coefficient${missing.length > 1 ? "s" : ""} ${missing.join(" and ")} (the others default to 0)`);
  }
  return c.rep.count === before ? { exprs, texts } : null;
}

function readEquation(entries: YEntry[], cls: EquationClass, scope: Scope, field: string, c: Context): { exprs: Map<string, Expr>; texts: Record<string, string>; equation: string } | null {
  const entry = getEntry(entries, "equation")!;
  const p = childPath(c.path, "equation");
  const node = entry.value;
  if (node.kind !== "scalar" || isNullScalar(node) || looksNumeric(node) || isBoolScalar(node)) {
    c.rep.error("type", p, node, `the equation must be text such as "i*u_t + 1/2*u_xx + |u|^2*u = 0"`);
    return null;
  }
  const text = expressionText(node);
  const result = parseEquation({ text, cls, scope, field });
  if (!result.ok) {
    for (const problem of result.problems) c.rep.error(problem.code, p, node, problem.message, problem.char);
    return null;
  }
  const missing = REQUIRED_COEFFICIENTS[cls].filter((k) => !result.coefficients.has(k));
  if (missing.length > 0) {
    const sp = scope.space;
    const terms = new Map<string, string>([
      ["a", `a ${field}_${sp}${sp}`],
      ["h", `h |${field}|^2 ${field}`],
      ["p", cls === "kdv" ? `p ${field} ${field}_${sp}` : `p ${field}^2 ${field}_${sp}`],
      ["q", `q ${field}_${sp}${sp}${sp}`],
    ]);
    const shown = missing.map((k) => terms.get(k) ?? k).join(" and ");
    c.rep.error("coefficient-missing", p, node, `the equation has no ${shown} term; the ${cls} class needs ${missing.join(" and ")} to be nonzero`);
    return null;
  }
  const texts = nullRecord<string>();
  for (const [k, e] of result.coefficients) texts[k] = exprToString(e);
  return { exprs: result.coefficients, texts, equation: node.text };
}

/** The YAML text of the entry, dedented so that it reads as a mapping on its own. */
function entrySource(node: YNode, c: Context): string {
  const text = c.text;
  let end = node.end;
  let lineEnd = end;
  while (lineEnd < text.length && text[lineEnd] !== "\n") lineEnd++;
  if (/^[ \t]*(#.*)?$/.test(text.slice(end, lineEnd))) end = lineEnd;
  const indent = node.start - c.rep.ctx.lines.lineStart(node.start);
  const lines = text.slice(node.start, end).split("\n");
  return lines.map((line, i) => (i === 0 ? line : line.replace(new RegExp(`^ {0,${indent}}`), ""))).join("\n").replace(/\s+$/, "") + "\n";
}

/** Validate one family entry; null (with errors reported) when anything is wrong. */
export function readFamily(node: YNode, path: string, rep: Reporter, state: FileState): FamilySpec | null {
  const c: Context = { rep, path, text: rep.ctx.text };
  const start = rep.count;
  const entries = rep.entries(node, path, "a family");
  if (!entries) return null;
  const id = readId(entries, node, c, state);
  scanForbiddenKeys(node, path, rep);
  rep.unknownKeys(entries, FAMILY_KEYS, path, "a family");
  const cls = readClass(entries, node, c);
  const vars = readVariables(entries, c, getEntry(entries, "equation") !== undefined);
  const params = readParameters(entries, c, state.variantCap);
  const helperItems = readStringMap(entries, "functions", c);
  const window = readWindow(entries, node, c);
  const texts = readTexts(entries, c, id ?? "");

  const hasCoefficients = getEntry(entries, "coefficients") !== undefined;
  const hasEquation = getEntry(entries, "equation") !== undefined;
  if (hasCoefficients && hasEquation) {
    rep.error("coefficients-and-equation", childPath(path, "equation"), getEntry(entries, "equation")!.key, "give either coefficients or an equation, not both");
  } else if (!hasCoefficients && !hasEquation) {
    rep.error("required", path, node, "the family needs its coefficients (coefficients: …) or its equation (equation: \"… = 0\")");
  }
  if (!cls || !vars || !helperItems) return null;

  // Variables must not clash with the names the family declares.
  const declared = new Map<string, string>();
  for (const n of params.names) declared.set(n, "a parameter");
  for (const [n] of helperItems) if (!declared.has(n)) declared.set(n, "a helper function");
  for (const n of CLASS_COEFFICIENTS[cls]) if (!declared.has(n)) declared.set(n, `a coefficient of the ${cls} class`);
  const beforeClash = rep.count;
  for (const key of VARIABLE_KEYS) {
    if (key === "field" && !hasEquation) continue;
    const name = vars[key];
    const clash = declared.get(name);
    if (clash) {
      const v = getEntry(entries, "variables");
      rep.error("name-clash", v ? childPath(childPath(path, "variables"), key) : path, v ? v.value : node, `the ${key} variable '${name}' is also ${clash}; choose a different name`);
    }
  }
  if (hasEquation) {
    for (const [name, key] of params.keys) {
      const problem = clashWithVariables(name, vars, true);
      if (problem) rep.error("name-clash", childPath(childPath(path, "parameters"), name), key, `parameter '${name}': ${problem}`);
    }
  }
  // With an invalid or clashing name, every expression using it would be misreported.
  if (!params.namesOk || rep.count > beforeClash) return null;

  const scope: Scope = { evolution: vars.evolution, space: vars.space, parameters: params.names, helpers: new Map() };
  const helpers = readHelpers(helperItems, scope, vars, params.names, c, hasEquation);
  if (!helpers) return null;
  const fullScope: Scope = { ...scope, helpers };
  const coefficients = hasCoefficients && !hasEquation ? readCoefficients(entries, cls, fullScope, c) : hasEquation && !hasCoefficients ? readEquation(entries, cls, fullScope, vars.field, c) : null;
  if (rep.count > start || !coefficients || !window || !id) return null;

  // Variants: the cap is per file, counted in the order families appear.
  const specRecord = nullRecord<ParameterSpec>();
  for (const [name, spec] of params.specs) specRecord[name] = spec;
  const remaining = state.variantCap - state.variantsUsed;
  const count = variantCount(params.specs.map(([, s]) => s), Math.max(remaining, 0));
  if (count > remaining) {
    const sizes = params.specs.filter(([, s]) => s.kind === "values" || s.kind === "range").map(([n, s]) => `${n}: ${s.kind === "values" ? s.values.length : (s as { steps: number }).steps}`);
    const where = getEntry(entries, "parameters");
    const product = sizes.length > 0 ? ` (${sizes.join(" × ")})` : "";
    rep.error(
      "variant-cap",
      where ? childPath(path, "parameters") : path,
      where ? where.key : node,
      `the sweeps of this family give more variants${product} than the file has left: ${Math.max(remaining, 0)} of its limit of ${state.variantCap}; reduce the number of values or steps`,
    );
    return null;
  }
  state.variantsUsed += count;

  const engineCoefficients = new Map<string, Expr>();
  for (const name of CLASS_COEFFICIENTS[cls]) {
    const e = coefficients.exprs.get(name);
    engineCoefficients.set(name, e ? toEngineVariables(e, fullScope) : num(0));
  }
  const free = params.specs.filter(([, s]) => s.kind === "free").map(([n]) => n);
  const variants: Variant[] = combinations(params.specs).map((combo, index) => {
    const map = nullRecord<Expr>();
    const values = nullRecord<number>();
    for (const [name, point] of combo) {
      map[name] = point.expr;
      values[name] = point.value;
    }
    const coeffs = nullRecord<Expr>();
    for (const [name, e] of engineCoefficients) coeffs[name] = combo.length > 0 ? substitute(e, map) : e;
    return { familyId: id, index, class: cls, parameters: values, free: [...free], coefficients: coeffs, window: [window.window[0], window.window[1]] };
  });

  const functions = nullRecord<string>();
  for (const [name, e] of helperItems) functions[name] = e.value.kind === "scalar" ? e.value.text : "";
  const { line, column } = rep.ctx.lines.position(node.start);
  const location: FamilySpec["location"] = { path, line, column, document: rep.document, familyId: id };
  if (rep.ctx.file !== undefined) location.file = rep.ctx.file;

  const spec: FamilySpec = {
    id,
    title: texts.title,
    class: cls,
    variables: hasEquation ? { evolution: vars.evolution, space: vars.space, field: vars.field } : { evolution: vars.evolution, space: vars.space },
    parameters: specRecord,
    coefficientText: coefficients.texts,
    functions,
    window: window.window,
    tags: texts.tags,
    notes: texts.notes,
    source: entrySource(node, c),
    hash: familyHash(cls, engineCoefficients, params.specs, window.texts),
    variants,
    location,
  };
  if ("equation" in coefficients && typeof coefficients.equation === "string") spec.equation = coefficients.equation;
  return spec;
}
