/** Canonical, re-parseable text of a tree. */
import type { Expr } from "./types";
import { E_TEXT, PI_TEXT } from "./constants";

// Canonical text (re-parseable by parseExpression, minimal parentheses, mathjs precedence:
// + - < * / < unary minus < ^, and ^ is right-associative with a unary-minus exponent allowed).

const PRECEDENCE: Record<Expr["kind"], number> = {
  add: 1, sub: 1, mul: 2, div: 2, neg: 3, pow: 4, call: 5, sym: 5, num: 5,
};

function numText(e: Extract<Expr, { kind: "num" }>): string {
  if (e.text === PI_TEXT) return "pi";
  if (e.text === E_TEXT) return "e";
  return e.text;
}

/** A literal whose text starts with "-" prints like a negation. */
function effectivePrecedence(e: Expr): number {
  if (e.kind === "num" && e.text.startsWith("-")) return PRECEDENCE.neg;
  return PRECEDENCE[e.kind];
}

const OP_TEXT = { add: " + ", sub: " - ", mul: " * ", div: " / ", pow: "^" } as const;

export function exprToString(expr: Expr): string {
  switch (expr.kind) {
    case "num":
      return numText(expr);
    case "sym":
      return expr.name;
    case "call":
      return `${expr.fn}(${exprToString(expr.arg)})`;
    case "neg": {
      const inner = exprToString(expr.arg);
      // -a^b already means -(a^b); -a*b would mean (-a)*b, so products need parentheses.
      // "--a" would read like a typo, so a double negation keeps its parentheses.
      return effectivePrecedence(expr.arg) > PRECEDENCE.neg ? `-${inner}` : `-(${inner})`;
    }
    default: {
      const p = PRECEDENCE[expr.kind];
      const lp = effectivePrecedence(expr.left);
      const rp = effectivePrecedence(expr.right);
      let left = exprToString(expr.left);
      let right = exprToString(expr.right);
      if (expr.kind === "pow") {
        // Base: anything looser than ^ (including a negation) needs parentheses; ^ is right-assoc.
        if (lp <= p) left = `(${left})`;
        // Exponent: a negation or another power may follow ^ bare; sums and products may not.
        if (rp < PRECEDENCE.neg) right = `(${right})`;
      } else {
        if (lp < p) left = `(${left})`;
        // Left-associative: an equal-precedence right operand needs parentheses to keep its shape.
        if (rp <= p && rp !== PRECEDENCE.neg) right = `(${right})`;
      }
      return left + OP_TEXT[expr.kind] + right;
    }
  }
}
