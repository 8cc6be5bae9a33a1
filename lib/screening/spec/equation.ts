/**
 * Equation strings: `equation: "<lhs> = <rhs>"` as a practitioner writes it, brought to the normal
 * form of the family's class (../shared/math/README.md, "The three classes"), with each
 * coefficient read off as an expression. A term outside the class is reported with its position.
 *
 * Method: split both sides into top-level terms (keeping each term's position), parse each term
 * with the expression layer (derivatives u_t, u_x, u_xx, u_xxx and |u| become symbols), expand it
 * into monomials  coefficient × i^n × x^m × (field factor), sum like monomials, divide through by
 * the coefficient of u_t (NLS: of i u_t), and match each monomial against the class's terms.
 */
import { add, div, freeSymbols, mul, neg, num, simplifyConstants, type Expr } from "../expr";
import type { EquationClass } from "./types";
import { readExpression, type Scope } from "./expressions";
import { MAX_EQUATION_LENGTH, MAX_EQUATION_POWER } from "./limits";

export interface EquationProblem {
  code: string;
  message: string;
  /** 1-based character in the equation text. */
  char?: number;
}

export type EquationResult =
  | { ok: true; coefficients: Map<string, Expr> }
  | { ok: false; problems: EquationProblem[] };

/** The normal forms as printed in messages (../shared/math/README.md). */
export const NORMAL_FORM_TEXT: Readonly<Record<EquationClass, string>> = {
  nls: "i u_t + a u_xx + (b x^2 + f x + e) u + h |u|^2 u + i k u + i c x u_x + i g u_x = 0",
  kdv: "u_t + p u u_x + q u_xxx + r u + (s x + g) u_x = l + m x",
  mkdv: "u_t + p u^2 u_x + q u_xxx + r u + (s x + g) u_x = 0",
};
const CLASS_NAME: Readonly<Record<EquationClass, string>> = { nls: "vc-NLS", kdv: "vc-KdV", mkdv: "vc-mKdV" };

/**
 * One slot of a normal form: the field factor (signature), power of x and power of i, and how
 * the monomial's coefficient gives the normal-form coefficient (KdV's l and m sit on the right).
 */
interface Slot {
  coefficient: string;
  signature: string;
  x: number;
  i: number;
  negate?: boolean;
}

/** Field-factor signatures: "D<nt>,<nx>^k" for derivatives (D0,0 is u itself), "A^k" for |u|^k. */
const U = "D0,0^1";
const UT = "D1,0^1";
const UX = "D0,1^1";
const UXX = "D0,2^1";
const UXXX = "D0,3^1";

const SLOTS: Readonly<Record<EquationClass, readonly Slot[]>> = {
  // i u_t + a u_xx + (b x^2 + f x + e) u + h|u|^2 u + i k u + i c x u_x + i g u_x = 0
  nls: [
    { coefficient: "a", signature: UXX, x: 0, i: 0 },
    { coefficient: "b", signature: U, x: 2, i: 0 },
    { coefficient: "f", signature: U, x: 1, i: 0 },
    { coefficient: "e", signature: U, x: 0, i: 0 },
    { coefficient: "h", signature: `A^2*${U}`, x: 0, i: 0 },
    { coefficient: "k", signature: U, x: 0, i: 1 },
    { coefficient: "c", signature: UX, x: 1, i: 1 },
    { coefficient: "g", signature: UX, x: 0, i: 1 },
  ],
  // u_t + p u u_x + q u_xxx + r u + (s x + g) u_x = l + m x   (l, m move to the left with a minus)
  kdv: [
    { coefficient: "p", signature: `D0,0^1*D0,1^1`, x: 0, i: 0 },
    { coefficient: "q", signature: UXXX, x: 0, i: 0 },
    { coefficient: "r", signature: U, x: 0, i: 0 },
    { coefficient: "s", signature: UX, x: 1, i: 0 },
    { coefficient: "g", signature: UX, x: 0, i: 0 },
    { coefficient: "l", signature: "", x: 0, i: 0, negate: true },
    { coefficient: "m", signature: "", x: 1, i: 0, negate: true },
  ],
  // u_t + p u^2 u_x + q u_xxx + r u + (s x + g) u_x = 0
  mkdv: [
    { coefficient: "p", signature: `D0,0^2*D0,1^1`, x: 0, i: 0 },
    { coefficient: "q", signature: UXXX, x: 0, i: 0 },
    { coefficient: "r", signature: U, x: 0, i: 0 },
    { coefficient: "s", signature: UX, x: 1, i: 0 },
    { coefficient: "g", signature: UX, x: 0, i: 0 },
  ],
};

// ---------------------------------------------------------------------------------------------
// Terms and their positions

interface Term {
  /** 0-based offset of the term's first character (its sign included) in the equation text. */
  start: number;
  /** 0-based offset of the term after its sign: where messages point. */
  at: number;
  text: string;
  /** +1 on the left side, -1 on the right (moved to the left). */
  side: 1 | -1;
}

function isOperandEnd(text: string, i: number): boolean {
  let j = i - 1;
  while (j >= 0 && /\s/.test(text[j])) j--;
  if (j < 0) return false;
  const c = text[j];
  if (/[eE]/.test(c) && /(?:^|[^A-Za-z0-9_.])[0-9]*\.?[0-9]+[eE]$/.test(text.slice(0, j + 1))) return false;
  return /[A-Za-z0-9_.)\]|]/.test(c);
}

/** Top-level additive terms of one side, each with its own leading sign. */
function splitTerms(text: string, base: number, side: 1 | -1): Term[] {
  const terms: Term[] = [];
  let depth = 0;
  let inBars = false;
  let start = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text[i];
    if (c === "(" || c === "[" || c === "{") depth++;
    else if (c === ")" || c === "]" || c === "}") depth--;
    else if (c === "|") inBars = !inBars;
    else if ((c === "+" || c === "-") && depth === 0 && !inBars && isOperandEnd(text, i)) {
      terms.push({ start: base + start, at: 0, text: text.slice(start, i), side });
      start = i;
    }
  }
  terms.push({ start: base + start, at: 0, text: text.slice(start), side });
  return terms
    .map((t) => {
      const lead = /^\s*/.exec(t.text)?.[0].length ?? 0;
      const signed = /^\s*[+-]?\s*/.exec(t.text)?.[0].length ?? 0;
      return { start: t.start + lead, at: t.start + signed, text: t.text.trim(), side: t.side };
    })
    .filter((t) => t.text !== "");
}

/** Term text for messages: no leading '+', spaces collapsed. */
function shown(term: Term): string {
  return term.text.replace(/^\+\s*/, "").replace(/\s+/g, " ");
}

// ---------------------------------------------------------------------------------------------
// Monomials

interface Monomial {
  coef: Expr;
  x: number;
  i: number;
  /** Field factor → power, e.g. "D0,0" → 2, "A" → 2. */
  factors: Map<string, number>;
  terms: Set<number>;
}

class ExpansionError extends Error {}

interface FieldNames {
  field: string;
  space: string;
  /** Derivative symbol → [order in t, order in x]. */
  derivatives: Map<string, [number, number]>;
  imaginary: boolean;
}

function isPure(e: Expr, names: FieldNames): boolean {
  for (const s of freeSymbols(e)) {
    if (s === names.field || s === names.space || names.derivatives.has(s)) return false;
    if (names.imaginary && s === "i") return false;
  }
  return true;
}

const ONE = num(1);
function isOne(e: Expr): boolean {
  return e.kind === "num" && e.value === 1 && e.text === "1";
}
function isZero(e: Expr): boolean {
  return e.kind === "num" && e.value === 0;
}
function times(a: Expr, b: Expr): Expr {
  if (isOne(a)) return b;
  if (isOne(b)) return a;
  return mul(a, b);
}

function constant(coef: Expr, term: number): Monomial {
  return { coef, x: 0, i: 0, factors: new Map(), terms: new Set([term]) };
}

function product(a: Monomial, b: Monomial): Monomial {
  const factors = new Map(a.factors);
  for (const [k, p] of b.factors) factors.set(k, (factors.get(k) ?? 0) + p);
  return { coef: times(a.coef, b.coef), x: a.x + b.x, i: a.i + b.i, factors, terms: new Set([...a.terms, ...b.terms]) };
}

const MAX_MONOMIALS = 256;

function expand(e: Expr, names: FieldNames, term: number): Monomial[] {
  if (isPure(e, names)) return [constant(e, term)];
  switch (e.kind) {
    case "num":
      return [constant(e, term)];
    case "sym": {
      const m = constant(ONE, term);
      if (e.name === names.space) m.x = 1;
      else if (e.name === "i") m.i = 1;
      else {
        const d = e.name === names.field ? [0, 0] : names.derivatives.get(e.name)!;
        m.factors.set(`D${d[0]},${d[1]}`, 1);
      }
      return [m];
    }
    case "neg":
      return expand(e.arg, names, term).map((m) => ({ ...m, coef: neg(m.coef) }));
    case "add":
      return [...expand(e.left, names, term), ...expand(e.right, names, term)];
    case "sub":
      return [...expand(e.left, names, term), ...expand(e.right, names, term).map((m) => ({ ...m, coef: neg(m.coef) }))];
    case "mul": {
      const left = expand(e.left, names, term);
      const right = expand(e.right, names, term);
      if (left.length * right.length > MAX_MONOMIALS) throw new ExpansionError("the term expands to too many products");
      return left.flatMap((l) => right.map((r) => product(l, r)));
    }
    case "div":
      if (!isPure(e.right, names)) {
        throw new ExpansionError(`dividing by ${names.field}, its derivatives or ${names.space} is not part of the normal form`);
      }
      return expand(e.left, names, term).map((m) => ({ ...m, coef: div(m.coef, e.right) }));
    case "pow": {
      const n = e.right;
      if (n.kind !== "num" || !Number.isInteger(n.value) || n.value < 0 || n.value > MAX_EQUATION_POWER) {
        throw new ExpansionError(`only whole powers 0…${MAX_EQUATION_POWER} of ${names.field} and ${names.space} belong to a normal form`);
      }
      let out = [constant(ONE, term)];
      const base = expand(e.left, names, term);
      for (let k = 0; k < n.value; k++) {
        if (out.length * base.length > MAX_MONOMIALS) throw new ExpansionError("the term expands to too many products");
        out = out.flatMap((l) => base.map((r) => product(l, r)));
      }
      return out;
    }
    case "call":
      if (e.fn === "abs" && e.arg.kind === "sym" && e.arg.name === names.field) {
        const m = constant(ONE, term);
        m.factors.set("A", 1);
        return [m];
      }
      throw new ExpansionError(`${e.fn}(…) of ${names.field} or ${names.space} is not part of the normal form`);
  }
}

function signature(factors: Map<string, number>): string {
  return [...factors.entries()]
    .filter(([, p]) => p !== 0)
    .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0))
    .map(([k, p]) => `${k}^${p}`)
    .join("*");
}

/** i^n with n reduced to 0 or 1, the sign moved into the coefficient. */
function reduceI(m: Monomial): Monomial {
  const n = ((m.i % 4) + 4) % 4;
  return { ...m, i: n % 2, coef: n >= 2 ? neg(m.coef) : m.coef };
}

// ---------------------------------------------------------------------------------------------
// Pre-processing: |u| → abs(u), with a map back to the original positions

function rewriteBars(text: string, field: string): { text: string; origin: number[] } | { error: number } {
  let out = "";
  const origin: number[] = [];
  const re = new RegExp(`^\\|\\s*${field}\\s*\\|`);
  for (let i = 0; i < text.length; ) {
    if (text[i] === "|") {
      const m = re.exec(text.slice(i));
      if (!m) return { error: i };
      const replacement = `abs(${field})`;
      for (let k = 0; k < replacement.length; k++) origin.push(i);
      out += replacement;
      i += m[0].length;
      continue;
    }
    out += text[i];
    origin.push(i);
    i++;
  }
  return { text: out, origin };
}

/** Derivative symbols used in the text: field_ followed by evolution/space names, e.g. u_xx. */
function derivativeSymbols(text: string, field: string, evolution: string, space: string): Map<string, [number, number]> {
  const found = new Map<string, [number, number]>();
  const re = new RegExp(`(?<![A-Za-z0-9_])${field}_([A-Za-z0-9]+)(?![A-Za-z0-9_])`, "g");
  for (const m of text.matchAll(re)) {
    let rest = m[1];
    let nt = 0;
    let nx = 0;
    while (rest.length > 0) {
      if (rest.startsWith(evolution)) {
        nt++;
        rest = rest.slice(evolution.length);
      } else if (rest.startsWith(space)) {
        nx++;
        rest = rest.slice(space.length);
      } else break;
    }
    if (rest.length === 0) found.set(m[0], [nt, nx]);
  }
  return found;
}

// ---------------------------------------------------------------------------------------------

export interface EquationInput {
  text: string;
  cls: EquationClass;
  scope: Scope;
  /** Name of the unknown (default "u"). */
  field?: string;
}

/** Parse an equation string into the normal-form coefficients of its class (in the family's variables). */
export function parseEquation(input: EquationInput): EquationResult {
  const { text, cls, scope } = input;
  const field = input.field ?? "u";
  const problems: EquationProblem[] = [];
  const fail = (code: string, message: string, char?: number): EquationResult => ({
    ok: false,
    problems: [char === undefined ? { code, message } : { code, message, char }],
  });

  if (text.length > MAX_EQUATION_LENGTH) {
    return fail("equation-syntax", `the equation is too long (${text.length} characters; at most ${MAX_EQUATION_LENGTH})`);
  }
  const eq = [...text.matchAll(/=+/g)];
  if (eq.length === 0) return fail("equation-syntax", "an equation needs an '=' sign, e.g. '… = 0'");
  if (eq.length > 1 || eq[0][0].length > 1) {
    const at = eq.length > 1 ? (eq[1].index ?? 0) : (eq[0].index ?? 0);
    return fail("equation-syntax", "write exactly one '=' (the equation is 'left side = right side')", at + 1);
  }
  const at = eq[0].index ?? 0;
  const lhs = text.slice(0, at);
  const rhs = text.slice(at + 1);
  if (lhs.trim() === "") return fail("equation-syntax", "the left side of the equation is empty", 1);
  if (rhs.trim() === "") return fail("equation-syntax", "the right side of the equation is empty (write '= 0')", at + 2);
  const terms = [...splitTerms(lhs, 0, 1), ...splitTerms(rhs, at + 1, -1)];

  const names: FieldNames = {
    field,
    space: scope.space,
    derivatives: derivativeSymbols(text, field, scope.evolution, scope.space),
    imaginary: cls === "nls",
  };
  const extra = [field, ...names.derivatives.keys(), ...(cls === "nls" ? ["i"] : [])];

  const monomials: Monomial[] = [];
  terms.forEach((term, index) => {
    const rewritten = rewriteBars(term.text, field);
    if ("error" in rewritten) {
      problems.push({ code: "equation-syntax", message: `'|' must enclose the unknown alone, as in |${field}|^2*${field}`, char: term.start + rewritten.error + 1 });
      return;
    }
    const parsed = readExpression(rewritten.text, scope, `term '${shown(term)}'`, extra);
    if (!parsed.ok) {
      const local = parsed.char !== undefined ? (rewritten.origin[parsed.char - 1] ?? 0) : 0;
      problems.push({ code: parsed.code, message: parsed.message, char: term.start + local + 1 });
      return;
    }
    try {
      for (const m of expand(parsed.expr, names, index)) {
        monomials.push(term.side === 1 ? m : { ...m, coef: neg(m.coef) });
      }
    } catch (error) {
      if (!(error instanceof ExpansionError)) throw error;
      problems.push({ code: "equation-term", message: `term '${shown(term)}': ${error.message} (${CLASS_NAME[cls]}: ${NORMAL_FORM_TEXT[cls]})`, char: term.at + 1 });
    }
  });
  if (problems.length > 0) return { ok: false, problems };

  // Sum like monomials.
  const groups = new Map<string, Monomial>();
  for (const raw of monomials) {
    const m = reduceI(raw);
    const key = `${m.x}|${m.i}|${signature(m.factors)}`;
    const known = groups.get(key);
    if (known) groups.set(key, { ...known, coef: add(known.coef, m.coef), terms: new Set([...known.terms, ...m.terms]) });
    else groups.set(key, m);
  }

  // Terms that are exactly zero (such as the right side "0") drop out.
  for (const [key, m] of groups) if (isZero(simplifyConstants(m.coef))) groups.delete(key);

  // Normalise by the time-derivative term (NLS: i u_t must have coefficient 1).
  const timeTerms = [...groups.values()].filter((m) => signature(m.factors) === UT);
  const firstTerm = (m: Monomial) => terms[Math.min(...m.terms)];
  if (timeTerms.length === 0) {
    const what = cls === "nls" ? `i*${field}_${scope.evolution}` : `${field}_${scope.evolution}`;
    return fail("equation-no-time-derivative", `the equation has no ${what} term; the ${CLASS_NAME[cls]} normal form is ${NORMAL_FORM_TEXT[cls]}`);
  }
  const misplaced = timeTerms.filter((m) => m.x !== 0);
  if (misplaced.length > 0 || timeTerms.length > 1) {
    const term = firstTerm(misplaced[0] ?? timeTerms[1]);
    return fail("equation-term", `term '${shown(term)}': the ${field}_${scope.evolution} term must have a coefficient that depends on ${scope.evolution} only${cls === "nls" ? " and is purely imaginary or purely real" : ""}`, term.at + 1);
  }
  const lead = timeTerms[0];
  const leadIsOne = isOne(simplifyConstants(lead.coef));
  // NLS: C i^n u_t; multiplying by i^(1-n)/C makes it i u_t. KdV/mKdV: divide by C.
  const shiftI = cls === "nls" ? 1 - lead.i : 0;

  const slots = SLOTS[cls];
  const coefficients = new Map<string, Expr>();
  for (const raw of groups.values()) {
    if (raw === lead) continue;
    const m = reduceI({ ...raw, i: raw.i + shiftI });
    const coef = leadIsOne ? m.coef : div(m.coef, lead.coef);
    const sig = signature(m.factors);
    const slot = slots.find((s) => s.signature === sig && s.x === m.x && s.i === m.i);
    if (!slot) {
      for (const t of [...m.terms].sort((a, b) => a - b)) {
        const term = terms[t];
        problems.push({ code: "equation-term", message: outsideMessage(cls, shown(term), slots, sig, m, `${field}_${scope.evolution}`), char: term.at + 1 });
      }
      continue;
    }
    coefficients.set(slot.coefficient, simplifyConstants(slot.negate ? neg(coef) : coef));
  }
  if (problems.length > 0) return { ok: false, problems: dedupe(problems) };
  return { ok: true, coefficients };
}

function outsideMessage(cls: EquationClass, term: string, slots: readonly Slot[], sig: string, m: Monomial, timeDerivative: string): string {
  const base = `term '${term}' is not part of the ${CLASS_NAME[cls]} normal form ${NORMAL_FORM_TEXT[cls]}`;
  if (cls === "nls" && slots.some((s) => s.signature === sig && s.x === m.x)) {
    return `${base}: once the equation is divided so that it starts with i*${timeDerivative}, this term would need ${m.i === 1 ? "a real" : "an imaginary (i times real)"} coefficient`;
  }
  return base;
}

function dedupe(problems: EquationProblem[]): EquationProblem[] {
  const seen = new Set<string>();
  return problems.filter((p) => {
    const k = `${p.char}|${p.message}`;
    if (seen.has(k)) return false;
    seen.add(k);
    return true;
  });
}
