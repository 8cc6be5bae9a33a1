/**
 * Types of the expression layer: the validated tree every engine stage works on.
 *
 * A tree is built only by `parseExpression` (user text, whitelisted) or by engine code.
 * It never holds user strings that are later evaluated, so nothing in it can run code.
 */

/** One-argument functions a user may write (mathjs names). */
export type UnaryFunction =
  | "sin" | "cos" | "tan" | "exp" | "log" | "sqrt"
  | "sinh" | "cosh" | "tanh" | "sech" | "csch" | "coth" | "abs";

export type BinaryOperator = "add" | "sub" | "mul" | "div" | "pow";

export type Expr =
  /** A literal. `text` is the decimal as written (or produced), so high precision reads it exactly. */
  | { kind: "num"; value: number; text: string }
  /** A variable (the evolution variable "t", the space variable "x") or a free parameter. */
  | { kind: "sym"; name: string }
  | { kind: "neg"; arg: Expr }
  | { kind: BinaryOperator; left: Expr; right: Expr }
  | { kind: "call"; fn: UnaryFunction; arg: Expr };

/** An error in one expression; `char` is 1-based within the expression text. */
export interface ExprError {
  message: string;
  char?: number;
}

export type ParseResult = { ok: true; expr: Expr } | { ok: false; error: ExprError };

export interface ParseOptions {
  /** Names that may appear as symbols: variables and parameters (free or fixed). */
  symbols: ReadonlySet<string>;
  /**
   * User helper functions of one argument, already parsed; a call `beta2(z)` is inlined by
   * substituting the call's argument for `variable` in the body.
   */
  helpers?: ReadonlyMap<string, { variable: string; body: Expr }>;
  /** Defaults: 2000 characters, nesting depth 200 (see tolerances/limits). */
  maxLength?: number;
  maxDepth?: number;
}

/**
 * The number system a jet is computed in. `DoubleField` (IEEE double) and `decimalField(digits)`
 * (decimal.js) implement it, so one jet evaluator serves the fast pass and the high-precision check.
 */
export interface Field<T> {
  readonly name: string;
  readonly zero: T;
  readonly one: T;
  fromNumber(n: number): T;
  /** Exact decimal text, e.g. "0.1" → exactly 1/10 in a decimal field. */
  fromText(s: string): T;
  toNumber(a: T): number;
  add(a: T, b: T): T;
  sub(a: T, b: T): T;
  mul(a: T, b: T): T;
  div(a: T, b: T): T;
  neg(a: T): T;
  abs(a: T): T;
  exp(a: T): T;
  log(a: T): T;
  sin(a: T): T;
  cos(a: T): T;
  sinh(a: T): T;
  cosh(a: T): T;
  sqrt(a: T): T;
  /** a^b for real b (a > 0 unless b is an integer). */
  pow(a: T, b: T): T;
  isFinite(a: T): boolean;
  isZero(a: T): boolean;
  lt(a: T, b: T): boolean;
}

/**
 * A truncated Taylor series at a point t_s: `c[k] = f^(k)(t_s) / k!`, k = 0 … order.
 * Length is order + 1.
 */
export type Jet<T> = T[];
