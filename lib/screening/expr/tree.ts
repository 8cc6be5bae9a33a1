/**
 * Tree utilities: builders, structural equality, substitution, free symbols and depth.
 * Canonical text, constant folding and differentiation live in ./to-string, ./simplify and
 * ./differentiate. Every function is pure and returns new nodes.
 */
import type { Expr, UnaryFunction } from "./types";
import { E_TEXT, PI_TEXT } from "./constants";

// ---------------------------------------------------------------------------------------------
// Builders

/** A numeric literal; `text` defaults to the shortest round-trip decimal of `n`. */
export function num(n: number, text?: string): Expr {
  return { kind: "num", value: n, text: text ?? String(n) };
}
export function sym(name: string): Expr {
  return { kind: "sym", name };
}
export function add(left: Expr, right: Expr): Expr {
  return { kind: "add", left, right };
}
export function sub(left: Expr, right: Expr): Expr {
  return { kind: "sub", left, right };
}
export function mul(left: Expr, right: Expr): Expr {
  return { kind: "mul", left, right };
}
export function div(left: Expr, right: Expr): Expr {
  return { kind: "div", left, right };
}
export function pow(left: Expr, right: Expr): Expr {
  return { kind: "pow", left, right };
}
export function neg(arg: Expr): Expr {
  return { kind: "neg", arg };
}
export function call(fn: UnaryFunction, arg: Expr): Expr {
  return { kind: "call", fn, arg };
}
/** The constant pi as a literal with 60 correct digits (so a decimal field reads it exactly enough). */
export function piNum(): Expr {
  return num(Math.PI, PI_TEXT);
}
/** Euler's number e as a literal with 60 correct digits. */
export function eNum(): Expr {
  return num(Math.E, E_TEXT);
}

// ---------------------------------------------------------------------------------------------
// Structure

export function isBinary(e: Expr): e is Extract<Expr, { left: Expr }> {
  return e.kind === "add" || e.kind === "sub" || e.kind === "mul" || e.kind === "div" || e.kind === "pow";
}

/** Structural equality (numbers compare by their text, so "0.1" ≠ "0.10" but both stay exact). */
export function exprEquals(a: Expr, b: Expr): boolean {
  if (a.kind !== b.kind) return false;
  switch (a.kind) {
    case "num":
      return b.kind === "num" && a.text === b.text;
    case "sym":
      return b.kind === "sym" && a.name === b.name;
    case "neg":
      return b.kind === "neg" && exprEquals(a.arg, b.arg);
    case "call":
      return b.kind === "call" && a.fn === b.fn && exprEquals(a.arg, b.arg);
    default:
      return isBinary(b) && exprEquals(a.left, b.left) && exprEquals(a.right, b.right);
  }
}

/** Replace symbols by trees; names not in `map` stay. */
export function substitute(expr: Expr, map: Record<string, Expr>): Expr {
  switch (expr.kind) {
    case "num":
      return expr;
    case "sym":
      return Object.prototype.hasOwnProperty.call(map, expr.name) ? map[expr.name] : expr;
    case "neg":
      return neg(substitute(expr.arg, map));
    case "call":
      return call(expr.fn, substitute(expr.arg, map));
    default:
      return { kind: expr.kind, left: substitute(expr.left, map), right: substitute(expr.right, map) };
  }
}

export function freeSymbols(expr: Expr, into: Set<string> = new Set()): Set<string> {
  switch (expr.kind) {
    case "num":
      break;
    case "sym":
      into.add(expr.name);
      break;
    case "neg":
    case "call":
      freeSymbols(expr.arg, into);
      break;
    default:
      freeSymbols(expr.left, into);
      freeSymbols(expr.right, into);
  }
  return into;
}

/** Number of nodes on the longest root-to-leaf path (a leaf has depth 1). */
export function exprDepth(expr: Expr): number {
  switch (expr.kind) {
    case "num":
    case "sym":
      return 1;
    case "neg":
    case "call":
      return 1 + exprDepth(expr.arg);
    default:
      return 1 + Math.max(exprDepth(expr.left), exprDepth(expr.right));
  }
}
