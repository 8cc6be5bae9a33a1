/**
 * Coefficient and helper expressions of a family: parsing through the expression layer with the
 * family's names in scope, error classification, helper ordering (no recursion or cycles) and the
 * renaming of the family's variables to the engine's t and x.
 */
import { ALLOWED_FUNCTIONS, freeSymbols, parseExpression, substitute, sym, type Expr } from "../expr";

export type Helpers = ReadonlyMap<string, { variable: string; body: Expr }>;

export interface Scope {
  evolution: string;
  space: string;
  /** All parameter names: fixed, swept and free. */
  parameters: ReadonlySet<string>;
  helpers: Helpers;
}

export type ExpressionRead =
  | { ok: true; expr: Expr }
  | { ok: false; code: string; message: string; char?: number };

const IDENTIFIER = /[A-Za-z_][A-Za-z0-9_]*/g;
const CONSTANTS: ReadonlySet<string> = new Set(["pi", "e"]);
export const BUILTIN_FUNCTIONS: ReadonlySet<string> = new Set<string>(ALLOWED_FUNCTIONS);

/** Identifiers of the text that are not inside a number, with 1-based positions and call flag. */
export function identifiers(text: string): { name: string; char: number; call: boolean }[] {
  const out: { name: string; char: number; call: boolean }[] = [];
  for (const m of text.matchAll(IDENTIFIER)) {
    const at = m.index ?? 0;
    const before = at > 0 ? text.charAt(at - 1) : "";
    // "1e5": the 'e5' belongs to the number.
    if (/[0-9.]/.test(before) && /^[eE][0-9]*$/.test(m[0])) continue;
    if (/[0-9]/.test(before)) continue;
    const rest = text.slice(at + m[0].length);
    out.push({ name: m[0], char: at + 1, call: /^\s*\(/.test(rest) });
  }
  return out;
}

/** A stable error code for a failed parse, from the expression layer's message and the names used. */
function classify(message: string, text: string, symbols: ReadonlySet<string>, helpers: Helpers): { code: string; char?: number } {
  const ids = identifiers(text);
  if (/^unknown symbol/.test(message)) {
    const id = ids.find((x) => !x.call && !symbols.has(x.name) && !CONSTANTS.has(x.name));
    return { code: "unknown-symbol", char: id?.char };
  }
  if (/^unknown function|is a parameter, not a function|inverse trigonometric|is not supported \(coefficients must be smooth/.test(message)) {
    const id = ids.find((x) => x.call && !BUILTIN_FUNCTIONS.has(x.name) && !helpers.has(x.name));
    return { code: "unknown-function", char: id?.char };
  }
  return { code: "expression-syntax" };
}

function unknownSymbolAdvice(scope: Scope, bodyOfHelper: boolean): string {
  const where = bodyOfHelper ? "" : `, or under functions if it is a function of ${scope.evolution}`;
  return `; declare it under parameters${where}`;
}

/**
 * Parse one coefficient or helper body. The space variable is in scope only so that its use can
 * be reported precisely: coefficients (and helpers) are functions of the evolution variable alone.
 */
export function readExpression(text: string, scope: Scope, what: string, extraSymbols: readonly string[] = []): ExpressionRead {
  const symbols = new Set<string>([...scope.parameters, scope.evolution, scope.space, ...extraSymbols]);
  const parsed = parseExpression(text, { symbols, helpers: scope.helpers });
  if (!parsed.ok) {
    const { code, char } = classify(parsed.error.message, text, symbols, scope.helpers);
    let message = `${what}: ${parsed.error.message}`;
    if (/missing operator/.test(parsed.error.message) && /[0-9.]\s+[A-Za-zµ°]/.test(text)) {
      message += " (units are not supported: give plain numbers in the family's own units)";
    }
    if (code === "unknown-symbol" && /^unknown symbol/.test(parsed.error.message)) {
      message = `${what}: ${parsed.error.message.replace(/\s*\(allowed here:.*\)$/, "")}${unknownSymbolAdvice(scope, what.startsWith("helper"))}`;
    }
    if (code === "unknown-function" && /^unknown function '([^']+)' \(allowed/.test(parsed.error.message)) {
      const name = /^unknown function '([^']+)'/.exec(parsed.error.message)?.[1] ?? "";
      message = `${what}: unknown function '${name}' (allowed: ${ALLOWED_FUNCTIONS.join(", ")}, and helpers declared under functions)`;
    }
    return { ok: false, code, message, char: parsed.error.char ?? char };
  }
  return { ok: true, expr: parsed.expr };
}

/** True when the expression mentions the space variable (after helper inlining). */
export function dependsOnSpace(expr: Expr, scope: Scope): boolean {
  return freeSymbols(expr).has(scope.space);
}

/** 1-based position of the first use of `name` in the text, if any. */
export function positionOf(text: string, name: string): number | undefined {
  return identifiers(text).find((id) => id.name === name)?.char;
}

/** Helpers a body calls, by name. */
export function calledHelpers(text: string, helperNames: ReadonlySet<string>): string[] {
  return identifiers(text).filter((id) => id.call && helperNames.has(id.name)).map((id) => id.name);
}

export type HelperOrder = { ok: true; order: string[] } | { ok: false; cycle: string[] };

/** Topological order of helpers (dependencies first); a cycle (or self-call) is returned as a path. */
export function orderHelpers(bodies: ReadonlyMap<string, string>): HelperOrder {
  const names = new Set(bodies.keys());
  const state = new Map<string, "visiting" | "done">();
  const order: string[] = [];
  const stack: string[] = [];
  let cycle: string[] | null = null;
  const visit = (name: string): void => {
    if (cycle) return;
    const s = state.get(name);
    if (s === "done") return;
    if (s === "visiting") {
      cycle = [...stack.slice(stack.indexOf(name)), name];
      return;
    }
    state.set(name, "visiting");
    stack.push(name);
    for (const dep of calledHelpers(bodies.get(name) ?? "", names)) visit(dep);
    stack.pop();
    state.set(name, "done");
    order.push(name);
  };
  for (const name of bodies.keys()) visit(name);
  if (cycle) return { ok: false, cycle };
  return { ok: true, order };
}

/** Rename the family's variables to the engine's t and x (simultaneously, so a swap is safe). */
export function toEngineVariables(expr: Expr, scope: Scope): Expr {
  if (scope.evolution === "t" && scope.space === "x") return expr;
  const map: Record<string, Expr> = Object.create(null) as Record<string, Expr>;
  map[scope.evolution] = sym("t");
  map[scope.space] = sym("x");
  return substitute(expr, map);
}
