/** Light, exact constant folding and removal of neutral elements. */
import Decimal from "decimal.js";
import type { Expr } from "./types";
import { E_TEXT, PI_TEXT } from "./constants";
import { call, div, mul, neg, num, pow, sub, add } from "./tree";

// Light, exact constant folding. Decimal literals are folded with exact decimal arithmetic, so a
// folded tree evaluates identically in every field; a fold that would round is not done.

/**
 * Wide enough that every fold below is exact: inputs are at most MAX_EXPRESSION_LENGTH (2000)
 * digits with exponents inside the double range, so sums need < 2800 digits and products < 4100.
 */
const ExactDecimal = Decimal.clone({ precision: 5000 });
/** Largest digits × exponent for an integer power fold, so that x^n stays exact at 5000 digits. */
const MAX_POWER_DIGITS = 4000;
/** Longest folded literal kept (significant digits), so folding cannot blow up the text. */
const MAX_FOLDED_DIGITS = 40;

function exactLiteral(d: Decimal): Expr | null {
  if (!d.isFinite() || d.sd() > MAX_FOLDED_DIGITS) return null;
  if (d.isNegative() && !d.isZero()) {
    const text = d.neg().toString();
    return neg(num(Number(text), text));
  }
  const text = d.toString();
  const value = Number(text);
  return Number.isFinite(value) ? num(value, text) : null;
}

function foldNumbers(kind: Extract<Expr, { left: Expr }>["kind"], a: string, b: string): Expr | null {
  const x = new ExactDecimal(a);
  const y = new ExactDecimal(b);
  switch (kind) {
    case "add":
      return exactLiteral(x.add(y));
    case "sub":
      return exactLiteral(x.sub(y));
    case "mul":
      return exactLiteral(x.mul(y));
    case "div": {
      if (y.isZero()) return null;
      // Keep q only if it is short and exact: q·y (≤ 40 + 2000 digits) is computed exactly.
      const q = x.div(y);
      return q.sd() <= MAX_FOLDED_DIGITS && q.mul(y).eq(x) ? exactLiteral(q) : null;
    }
    case "pow": {
      if (!y.isInteger() || y.isNegative() || y.gt(64) || x.sd() * y.toNumber() > MAX_POWER_DIGITS) return null;
      return exactLiteral(x.pow(y));
    }
  }
}

function isLiteral(e: Expr, v: number): boolean {
  return e.kind === "num" && e.value === v && e.text !== PI_TEXT && e.text !== E_TEXT;
}
/** A literal or the negation of one, as exact decimal text; pi and e are not folded. */
function literalText(e: Expr): string | null {
  if (e.kind === "num") return e.text === PI_TEXT || e.text === E_TEXT ? null : e.text;
  if (e.kind === "neg" && e.arg.kind === "num") {
    const t = literalText(e.arg);
    return t === null ? null : t.startsWith("-") ? t.slice(1) : `-${t}`;
  }
  return null;
}

export function simplifyConstants(expr: Expr): Expr {
  switch (expr.kind) {
    case "num":
    case "sym":
      return expr;
    case "call":
      return call(expr.fn, simplifyConstants(expr.arg));
    case "neg": {
      const a = simplifyConstants(expr.arg);
      if (a.kind === "neg") return a.arg;
      if (isLiteral(a, 0)) return a;
      return neg(a);
    }
    default: {
      const l = simplifyConstants(expr.left);
      const r = simplifyConstants(expr.right);
      const lt = literalText(l);
      const rt = literalText(r);
      if (lt !== null && rt !== null) {
        const folded = foldNumbers(expr.kind, lt, rt);
        if (folded) return folded;
      }
      return simplifyBinary(expr.kind, l, r);
    }
  }
}

function simplifyBinary(kind: Extract<Expr, { left: Expr }>["kind"], l: Expr, r: Expr): Expr {
  switch (kind) {
    case "add":
      if (isLiteral(l, 0)) return r;
      if (isLiteral(r, 0)) return l;
      if (r.kind === "neg") return sub(l, r.arg);
      return add(l, r);
    case "sub":
      if (isLiteral(r, 0)) return l;
      if (isLiteral(l, 0)) return r.kind === "neg" ? r.arg : neg(r);
      if (r.kind === "neg") return add(l, r.arg);
      return sub(l, r);
    case "mul":
      if (isLiteral(l, 0) || isLiteral(r, 0)) return num(0);
      if (isLiteral(l, 1)) return r;
      if (isLiteral(r, 1)) return l;
      if (l.kind === "neg") return simplifyNeg(simplifyBinary("mul", l.arg, r));
      if (r.kind === "neg") return simplifyNeg(simplifyBinary("mul", l, r.arg));
      return mul(l, r);
    case "div":
      if (isLiteral(l, 0) && !isLiteral(r, 0)) return num(0);
      if (isLiteral(r, 1)) return l;
      if (l.kind === "neg") return simplifyNeg(simplifyBinary("div", l.arg, r));
      if (r.kind === "neg") return simplifyNeg(simplifyBinary("div", l, r.arg));
      return div(l, r);
    case "pow":
      if (isLiteral(r, 0)) return num(1);
      if (isLiteral(r, 1)) return l;
      if (isLiteral(l, 1)) return num(1);
      return pow(l, r);
  }
}

function simplifyNeg(e: Expr): Expr {
  if (e.kind === "neg") return e.arg;
  if (isLiteral(e, 0)) return e;
  return neg(e);
}
