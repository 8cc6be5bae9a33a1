/** Symbolic differentiation of a tree. */
import type { Expr, UnaryFunction } from "./types";
import { add, call, div, freeSymbols, mul, neg, num, pow, sub } from "./tree";
import { simplifyConstants } from "./simplify";

// Symbolic derivative d/d(variable), chain rule for every whitelisted function (standard calculus
// tables, e.g. Abramowitz & Stegun 1964, §4.3.105–4.3.110 and §4.5.73–4.5.78).

function dependsOn(e: Expr, v: string): boolean {
  return freeSymbols(e).has(v);
}

function outerDerivative(fn: UnaryFunction, u: Expr): Expr {
  switch (fn) {
    case "sin":
      return call("cos", u);
    case "cos":
      return neg(call("sin", u));
    case "tan":
      return div(num(1), pow(call("cos", u), num(2)));
    case "exp":
      return call("exp", u);
    case "log":
      return div(num(1), u);
    case "sqrt":
      return div(num(1), mul(num(2), call("sqrt", u)));
    case "sinh":
      return call("cosh", u);
    case "cosh":
      return call("sinh", u);
    case "tanh":
      return pow(call("sech", u), num(2));
    case "sech":
      return neg(mul(call("sech", u), call("tanh", u)));
    case "csch":
      return neg(mul(call("csch", u), call("coth", u)));
    case "coth":
      return neg(pow(call("csch", u), num(2)));
    case "abs":
      // sign(u) = u/|u|, valid away from u = 0.
      return div(u, call("abs", u));
  }
}

function derive(e: Expr, v: string): Expr {
  switch (e.kind) {
    case "num":
      return num(0);
    case "sym":
      return num(e.name === v ? 1 : 0);
    case "neg":
      return neg(derive(e.arg, v));
    case "add":
      return add(derive(e.left, v), derive(e.right, v));
    case "sub":
      return sub(derive(e.left, v), derive(e.right, v));
    case "mul":
      return add(mul(derive(e.left, v), e.right), mul(e.left, derive(e.right, v)));
    case "div":
      return div(
        sub(mul(derive(e.left, v), e.right), mul(e.left, derive(e.right, v))),
        pow(e.right, num(2)),
      );
    case "pow": {
      const u = e.left;
      const w = e.right;
      if (!dependsOn(w, v)) {
        // d(u^w) = w u^(w-1) u'
        return mul(mul(w, pow(u, simplifyConstants(sub(w, num(1))))), derive(u, v));
      }
      if (!dependsOn(u, v)) {
        // d(u^w) = u^w log(u) w'
        return mul(mul(e, call("log", u)), derive(w, v));
      }
      // d(u^w) = u^w (w' log u + w u'/u)
      return mul(e, add(mul(derive(w, v), call("log", u)), div(mul(w, derive(u, v)), u)));
    }
    case "call":
      return mul(outerDerivative(e.fn, e.arg), derive(e.arg, v));
  }
}

/** Symbolic d/d(variable), lightly simplified (for display and for the design feature). */
export function differentiate(expr: Expr, variable: string): Expr {
  return simplifyConstants(derive(expr, variable));
}
