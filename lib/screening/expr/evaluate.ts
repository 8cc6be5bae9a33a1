/**
 * Evaluating a validated tree over jets (any field) and, for plain doubles, through the compiled form.
 */
import type { Expr, Field, Jet, UnaryFunction } from "./types";
import { DoubleField } from "./fields";
import {
  JetEvaluationError,
  constantJet,
  variableJet,
  jetAbs,
  jetAdd,
  jetCos,
  jetCosh,
  jetCoth,
  jetCsch,
  jetDiv,
  jetExp,
  jetLog,
  jetMul,
  jetNeg,
  jetPow,
  jetPowInt,
  jetSech,
  jetSin,
  jetSinh,
  jetSqrt,
  jetSub,
  jetTan,
  jetTanh,
} from "./jets";
import { compileExpression } from "./compile";
import { freeSymbols } from "./tree";

function applyFunction<T>(fn: UnaryFunction, a: Jet<T>, F: Field<T>): Jet<T> {
  switch (fn) {
    case "sin":
      return jetSin(a, F);
    case "cos":
      return jetCos(a, F);
    case "tan":
      return jetTan(a, F);
    case "exp":
      return jetExp(a, F);
    case "log":
      return jetLog(a, F);
    case "sqrt":
      return jetSqrt(a, F);
    case "sinh":
      return jetSinh(a, F);
    case "cosh":
      return jetCosh(a, F);
    case "tanh":
      return jetTanh(a, F);
    case "sech":
      return jetSech(a, F);
    case "csch":
      return jetCsch(a, F);
    case "coth":
      return jetCoth(a, F);
    case "abs":
      return jetAbs(a, F);
    default:
      throw new Error(`evalJet: '${String(fn)}' is not an allowed function`);
  }
}

/** An integer literal exponent (possibly negated), evaluated by repeated multiplication. */
function integerExponent(e: Expr): number | null {
  if (e.kind === "num") return Number.isSafeInteger(e.value) && Math.abs(e.value) <= 1024 ? e.value : null;
  if (e.kind === "neg") {
    const n = integerExponent(e.arg);
    return n === null ? null : -n;
  }
  return null;
}

function evalNode<T>(e: Expr, env: Record<string, Jet<T>>, n: number, F: Field<T>): Jet<T> {
  switch (e.kind) {
    case "num":
      // In double, `value` is the double of `text` (parseExpression checks they agree).
      return constantJet(F === (DoubleField as unknown) ? (e.value as unknown as T) : F.fromText(e.text), n - 1, F);
    case "sym": {
      if (!Object.prototype.hasOwnProperty.call(env, e.name)) {
        throw new Error(`evalJet: no value for symbol '${e.name}'`);
      }
      const j = env[e.name];
      if (j.length < n) throw new Error(`evalJet: jet of '${e.name}' has order ${j.length - 1} < ${n - 1}`);
      return j.length === n ? j : j.slice(0, n);
    }
    case "neg":
      return jetNeg(evalNode(e.arg, env, n, F), F);
    case "add":
      return jetAdd(evalNode(e.left, env, n, F), evalNode(e.right, env, n, F), F);
    case "sub":
      return jetSub(evalNode(e.left, env, n, F), evalNode(e.right, env, n, F), F);
    case "mul":
      return jetMul(evalNode(e.left, env, n, F), evalNode(e.right, env, n, F), F);
    case "div":
      return jetDiv(evalNode(e.left, env, n, F), evalNode(e.right, env, n, F), F);
    case "pow": {
      const base = evalNode(e.left, env, n, F);
      const k = integerExponent(e.right);
      if (k !== null) return jetPowInt(base, k, F);
      return jetPow(base, evalNode(e.right, env, n, F), F);
    }
    case "call":
      return applyFunction(e.fn, evalNode(e.arg, env, n, F), F);
    default:
      throw new Error(`evalJet: unknown node kind '${(e as { kind: string }).kind}'`);
  }
}

/**
 * The jet (Taylor coefficients c_0..c_order) of `expr`, given the jets of its symbols
 * (painleve.md §5: "coefficient expressions are evaluated over jets"). Throws
 * JetEvaluationError when the point is singular for the expression.
 */
export function evalJet<T>(expr: Expr, env: Record<string, Jet<T>>, order: number, field: Field<T>): Jet<T> {
  if (!Number.isInteger(order) || order < 0) throw new RangeError(`evalJet: bad order ${order}`);
  const r = evalNode(expr, env, order + 1, field);
  for (const c of r) {
    if (!field.isFinite(c)) throw new JetEvaluationError("non-finite", "a Taylor coefficient is not finite here");
  }
  return r;
}

/** evalJet in IEEE double. */
export function evalJetDouble(expr: Expr, env: Record<string, Jet<number>>, order: number): Jet<number> {
  return evalJet(expr, env, order, DoubleField);
}

/**
 * The jet of `expr` in `variable` at `point`, every other symbol being the constant in `constants`.
 * Convenience for coefficient functions c(t) with parameters.
 */
export function evalJetAt<T>(
  expr: Expr,
  variable: string,
  point: T,
  constants: Record<string, T>,
  order: number,
  field: Field<T>,
): Jet<T> {
  const env: Record<string, Jet<T>> = {};
  for (const name of Object.keys(constants)) env[name] = constantJet(constants[name], order, field);
  env[variable] = variableJet(point, order, field);
  return evalJet(expr, env, order, field);
}

const compiledForNumber = new WeakMap<Expr, { variables: string[]; fn: (...v: number[]) => number }>();

/** Plain double value of `expr`; compiles once per tree (cached), symbols from `env`. */
export function evalNumber(expr: Expr, env: Record<string, number>): number {
  let entry = compiledForNumber.get(expr);
  if (!entry) {
    const variables = [...freeSymbols(expr)].sort();
    entry = { variables, fn: compileExpression(expr, variables) };
    compiledForNumber.set(expr, entry);
  }
  const values = entry.variables.map((name) => {
    if (!Object.prototype.hasOwnProperty.call(env, name)) throw new Error(`evalNumber: no value for symbol '${name}'`);
    return env[name];
  });
  return entry.fn(...values);
}
