/**
 * LaTeX of a family member's equation in the normal form of its class (../shared/math/README.md,
 * "The three classes"), with each coefficient written out; zero terms are left away.
 */
import { simplifyConstants, toLatex, type Expr } from "@/lib/screening/expr";
import type { EquationClass } from "@/lib/screening/spec";

interface Slot {
  name: string;
  /** The term's monomial, e.g. "u_{xx}"; `i` marks terms multiplied by the imaginary unit. */
  monomial: string;
  i?: boolean;
}

/** Normal forms, left-hand sides, in the order of the class table. NLS groups b, f, e as one potential. */
const SLOTS: Record<EquationClass, Slot[]> = {
  nls: [
    { name: "a", monomial: "u_{xx}" },
    { name: "b", monomial: "x^{2} u" },
    { name: "f", monomial: "x u" },
    { name: "e", monomial: "u" },
    { name: "h", monomial: "|u|^{2} u" },
    { name: "k", monomial: "u", i: true },
    { name: "c", monomial: "x u_{x}", i: true },
    { name: "g", monomial: "u_{x}", i: true },
  ],
  kdv: [
    { name: "p", monomial: "u u_{x}" },
    { name: "q", monomial: "u_{xxx}" },
    { name: "r", monomial: "u" },
    { name: "s", monomial: "x u_{x}" },
    { name: "g", monomial: "u_{x}" },
  ],
  mkdv: [
    { name: "p", monomial: "u^{2} u_{x}" },
    { name: "q", monomial: "u_{xxx}" },
    { name: "r", monomial: "u" },
    { name: "s", monomial: "x u_{x}" },
    { name: "g", monomial: "u_{x}" },
  ],
};

/** The generic normal forms, coefficient names in place. */
export const NORMAL_FORM_LATEX: Record<EquationClass, string> = {
  nls: "i u_{t} + a\\,u_{xx} + (b x^{2} + f x + e)\\,u + h\\,|u|^{2} u + i k\\,u + i c\\,x u_{x} + i g\\,u_{x} = 0",
  kdv: "u_{t} + p\\,u u_{x} + q\\,u_{xxx} + r\\,u + (s x + g)\\,u_{x} = l + m x",
  mkdv: "u_{t} + p\\,u^{2} u_{x} + q\\,u_{xxx} + r\\,u + (s x + g)\\,u_{x} = 0",
};

const isZero = (e: Expr) => e.kind === "num" && e.value === 0;
const isOne = (e: Expr) => e.kind === "num" && e.value === 1;
const isMinusOne = (e: Expr) => (e.kind === "num" && e.value === -1) || (e.kind === "neg" && isOne(e.arg));

/** One signed term: sign and body, the coefficient bracketed when it is a sum. */
function signedTerm(coefficient: Expr, monomial: string, imaginary: boolean): { sign: "+" | "-"; body: string } | null {
  const c = simplifyConstants(coefficient);
  if (isZero(c)) return null;
  const unit = imaginary ? "i" : "";
  if (isOne(c)) return { sign: "+", body: `${unit}${unit ? " " : ""}${monomial}` };
  if (isMinusOne(c)) return { sign: "-", body: `${unit}${unit ? " " : ""}${monomial}` };
  let sign: "+" | "-" = "+";
  let inner = c;
  if (c.kind === "neg") {
    sign = "-";
    inner = c.arg;
  } else if (c.kind === "num" && c.value < 0) {
    sign = "-";
    inner = { kind: "num", value: -c.value, text: c.text.replace(/^-/, "") };
  }
  let tex = toLatex(inner);
  if (inner.kind === "add" || inner.kind === "sub") tex = `\\left(${tex}\\right)`;
  return { sign, body: `${unit ? "i\\," : ""}${tex}\\,${monomial}` };
}

function joinTerms(terms: { sign: "+" | "-"; body: string }[]): string {
  if (!terms.length) return "0";
  return terms.map((t, i) => (i === 0 ? (t.sign === "-" ? `-${t.body}` : t.body) : ` ${t.sign} ${t.body}`)).join("");
}

/** The member's equation with its coefficients (trees in t and x) substituted into the normal form. */
export function equationLatex(cls: EquationClass, coefficients: Record<string, Expr> | ReadonlyMap<string, Expr>): string {
  const get = (name: string): Expr | undefined => (coefficients instanceof Map ? coefficients.get(name) : (coefficients as Record<string, Expr>)[name]);
  const lead = cls === "nls" ? "i u_{t}" : "u_{t}";
  const terms: { sign: "+" | "-"; body: string }[] = [{ sign: "+", body: lead }];
  for (const slot of SLOTS[cls]) {
    const c = get(slot.name);
    const t = c ? signedTerm(c, slot.monomial, Boolean(slot.i)) : null;
    if (t) terms.push(t);
  }
  let rhs = "0";
  if (cls === "kdv") {
    const right = [
      get("l") ? signedTerm(get("l")!, "", false) : null,
      get("m") ? signedTerm(get("m")!, "x", false) : null,
    ].filter((t): t is { sign: "+" | "-"; body: string } => t !== null);
    rhs = joinTerms(right.map((t) => ({ ...t, body: t.body.replace(/\\,$/, "") || "1" })));
  }
  return `${joinTerms(terms)} = ${rhs}`;
}

/** "a(t) = …" lines for the coefficients that are given (nonzero). */
export function coefficientLines(coefficients: Record<string, Expr> | ReadonlyMap<string, Expr>, variable = "t"): { name: string; latex: string }[] {
  const entries = coefficients instanceof Map ? [...coefficients.entries()] : Object.entries(coefficients as Record<string, Expr>);
  return entries
    .filter(([, e]) => !isZero(simplifyConstants(e)))
    .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0))
    .map(([name, e]) => ({ name, latex: `${name}(${variable}) = ${toLatex(e)}` }));
}
