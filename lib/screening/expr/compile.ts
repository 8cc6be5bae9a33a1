/**
 * Fast double evaluation of a validated tree. Code generation emits only: argument names of our
 * own making (x0, x1, …) in place of symbols, numeric literals re-emitted by String(value),
 * operators and Math functions. No user text reaches the generated source. Where `new Function`
 * is blocked (content security policy), a closure tree is used instead.
 */
import type { Expr, UnaryFunction } from "./types";

const JS_FUNCTION: Record<UnaryFunction, (a: string) => string> = {
  sin: (a) => `Math.sin(${a})`,
  cos: (a) => `Math.cos(${a})`,
  tan: (a) => `Math.tan(${a})`,
  exp: (a) => `Math.exp(${a})`,
  log: (a) => `Math.log(${a})`,
  sqrt: (a) => `Math.sqrt(${a})`,
  sinh: (a) => `Math.sinh(${a})`,
  cosh: (a) => `Math.cosh(${a})`,
  tanh: (a) => `Math.tanh(${a})`,
  sech: (a) => `(1/Math.cosh(${a}))`,
  csch: (a) => `(1/Math.sinh(${a}))`,
  coth: (a) => `(1/Math.tanh(${a}))`,
  abs: (a) => `Math.abs(${a})`,
};

const NUMBER_FUNCTION: Record<UnaryFunction, (a: number) => number> = {
  sin: Math.sin,
  cos: Math.cos,
  tan: Math.tan,
  exp: Math.exp,
  log: Math.log,
  sqrt: Math.sqrt,
  sinh: Math.sinh,
  cosh: Math.cosh,
  tanh: Math.tanh,
  sech: (a) => 1 / Math.cosh(a),
  csch: (a) => 1 / Math.sinh(a),
  coth: (a) => 1 / Math.tanh(a),
  abs: Math.abs,
};

/** Trees may come from storage, so the node kinds that reach generated code are re-checked. */
function functionOf<V>(table: Record<UnaryFunction, V>, fn: string): V {
  if (!Object.prototype.hasOwnProperty.call(table, fn)) throw new Error(`compileExpression: '${fn}' is not an allowed function`);
  return table[fn as UnaryFunction];
}

function literal(v: number): string {
  if (typeof v !== "number") throw new Error("compileExpression: a literal is not a number");
  if (Number.isNaN(v)) return "(0/0)";
  if (v === Infinity) return "(1/0)";
  if (v === -Infinity) return "(-1/0)";
  return `(${String(v)})`;
}

function emit(e: Expr, slot: Map<string, number>): string {
  switch (e.kind) {
    case "num":
      return literal(e.value);
    case "sym": {
      const i = slot.get(e.name);
      if (i === undefined) throw new Error(`compileExpression: symbol '${e.name}' is not among the variables`);
      return `x${i}`;
    }
    case "neg":
      return `(-${emit(e.arg, slot)})`;
    case "add":
      return `(${emit(e.left, slot)}+${emit(e.right, slot)})`;
    case "sub":
      return `(${emit(e.left, slot)}-${emit(e.right, slot)})`;
    case "mul":
      return `(${emit(e.left, slot)}*${emit(e.right, slot)})`;
    case "div":
      return `(${emit(e.left, slot)}/${emit(e.right, slot)})`;
    case "pow":
      return `Math.pow(${emit(e.left, slot)},${emit(e.right, slot)})`;
    case "call":
      return functionOf(JS_FUNCTION, e.fn)(emit(e.arg, slot));
    default:
      throw new Error(`compileExpression: unknown node kind '${(e as { kind: string }).kind}'`);
  }
}

type Closure = (v: ArrayLike<number>) => number;

function closure(e: Expr, slot: Map<string, number>): Closure {
  switch (e.kind) {
    case "num": {
      const c = e.value;
      return () => c;
    }
    case "sym": {
      const i = slot.get(e.name);
      if (i === undefined) throw new Error(`compileExpression: symbol '${e.name}' is not among the variables`);
      return (v) => v[i];
    }
    case "neg": {
      const a = closure(e.arg, slot);
      return (v) => -a(v);
    }
    case "call": {
      const a = closure(e.arg, slot);
      const f = functionOf(NUMBER_FUNCTION, e.fn);
      return (v) => f(a(v));
    }
    default: {
      const l = closure(e.left, slot);
      const r = closure(e.right, slot);
      switch (e.kind) {
        case "add":
          return (v) => l(v) + r(v);
        case "sub":
          return (v) => l(v) - r(v);
        case "mul":
          return (v) => l(v) * r(v);
        case "div":
          return (v) => l(v) / r(v);
        case "pow":
          return (v) => Math.pow(l(v), r(v));
        default:
          throw new Error(`compileExpression: unknown node kind '${(e as { kind: string }).kind}'`);
      }
    }
  }
}

function slots(variables: string[]): Map<string, number> {
  const slot = new Map<string, number>();
  variables.forEach((name, i) => {
    if (slot.has(name)) throw new Error(`compileExpression: variable '${name}' listed twice`);
    slot.set(name, i);
  });
  return slot;
}

/** A closure-tree evaluator (no code generation). */
export function compileExpressionClosure(expr: Expr, variables: string[]): (...values: number[]) => number {
  const f = closure(expr, slots(variables));
  return (...values: number[]) => f(values);
}

/** A fast double evaluator: argument i is the value of variables[i]. */
export function compileExpression(expr: Expr, variables: string[]): (...values: number[]) => number {
  const slot = slots(variables);
  const body = `"use strict";return ${emit(expr, slot)};`;
  const params = variables.map((_, i) => `x${i}`);
  try {
    return new Function(...params, body) as (...values: number[]) => number;
  } catch (err) {
    if (err instanceof EvalError) return compileExpressionClosure(expr, variables);
    throw err;
  }
}
