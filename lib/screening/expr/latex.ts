/**
 * LaTeX for a validated tree (KaTeX-compatible): Greek names, subscripts, \frac, minimal
 * parentheses, juxtaposition for products and \cdot only before a number.
 */
import type { Expr, UnaryFunction } from "./types";
import { E_TEXT, PI_TEXT } from "./constants";

const GREEK: ReadonlySet<string> = new Set([
  "alpha", "beta", "gamma", "delta", "zeta", "eta", "theta", "iota", "kappa", "lambda", "mu",
  "nu", "xi", "pi", "rho", "sigma", "tau", "upsilon", "phi", "chi", "psi", "omega",
  "varphi", "vartheta", "varrho", "varsigma", "varepsilon",
  "Gamma", "Delta", "Theta", "Lambda", "Xi", "Pi", "Sigma", "Upsilon", "Phi", "Psi", "Omega",
]);

function escapeText(s: string): string {
  return s.replace(/[\\{}$&#%^_~]/g, (c) => `\\${c}`);
}

/** One name part: Greek → \name, eps/epsilon → \varepsilon, one letter → itself, else \mathrm{}. */
function namePart(s: string): string {
  if (s === "eps" || s === "epsilon") return "\\varepsilon";
  if (GREEK.has(s)) return `\\${s}`;
  if (/^\d+$/.test(s) || /^[A-Za-z]$/.test(s)) return s;
  return `\\mathrm{${escapeText(s)}}`;
}

/** a0 → a_{0}, beta2 → \beta_{2}, g_0 → g_{0}, mu_k → \mu_{k}, eps → \varepsilon. */
export function symbolLatex(name: string): string {
  const digits = /^([A-Za-z]+?)_?(\d+)$/.exec(name);
  if (digits) return `${namePart(digits[1])}_{${digits[2]}}`;
  const sub = /^([A-Za-z][A-Za-z0-9]*)_([A-Za-z0-9_]+)$/.exec(name);
  if (sub) return `${namePart(sub[1])}_{${namePart(sub[2])}}`;
  return namePart(name);
}

/** ".25" → "0.25", "2." → "2", as a reader expects. */
function tidyDecimal(s: string): string {
  return s.replace(/^(-?)\./, "$10.").replace(/\.$/, "");
}

function numberLatex(raw: string): { tex: string; scientific: boolean } {
  if (raw === PI_TEXT) return { tex: "\\pi", scientific: false };
  if (raw === E_TEXT) return { tex: "e", scientific: false };
  const text = raw.replace(/^([^eE]*)/, (m) => tidyDecimal(m));
  const m = /^([^eE]+)[eE]([+-]?)(\d+)$/.exec(text);
  if (!m) return { tex: text, scientific: false };
  const exponent = `${m[2] === "-" ? "-" : ""}${m[3].replace(/^0+(?=\d)/, "")}`;
  const mantissa = m[1];
  if (Number(mantissa) === 1) return { tex: `10^{${exponent}}`, scientific: false };
  return { tex: `${mantissa} \\cdot 10^{${exponent}}`, scientific: true };
}

const FUNCTION_NAME: Record<Exclude<UnaryFunction, "abs" | "sqrt" | "exp">, string> = {
  sin: "\\sin",
  cos: "\\cos",
  tan: "\\tan",
  log: "\\ln",
  sinh: "\\sinh",
  cosh: "\\cosh",
  tanh: "\\tanh",
  sech: "\\operatorname{sech}",
  csch: "\\operatorname{csch}",
  coth: "\\coth",
};
/** Functions written f^{n}(x) when raised to a positive integer power. */
const POWER_PREFIX: ReadonlySet<UnaryFunction> = new Set(["sin", "cos", "tan", "sinh", "cosh", "tanh", "sech", "csch", "coth"]);
/** Longest argument (LaTeX characters) still written as e^{…} rather than \exp(…). */
const MAX_EXP_SUPERSCRIPT = 24;

/** Rendered piece with its binding strength: 1 sum, 2 product, 3 negation, 4 power, 5 atom. */
interface Piece {
  tex: string;
  prec: number;
}

function paren(tex: string): string {
  return `\\left(${tex}\\right)`;
}
function wrapBelow(p: Piece, prec: number): string {
  return p.prec < prec ? paren(p.tex) : p.tex;
}

function render(e: Expr): Piece {
  switch (e.kind) {
    case "num": {
      const n = numberLatex(e.text);
      return { tex: n.tex, prec: n.scientific || n.tex.startsWith("-") ? 2 : 5 };
    }
    case "sym":
      return { tex: symbolLatex(e.name), prec: 5 };
    case "neg": {
      const a = render(e.arg);
      const inner = a.prec <= 1 || a.tex.startsWith("-") ? paren(a.tex) : a.tex;
      return { tex: `-${inner}`, prec: 3 };
    }
    case "add": {
      const l = render(e.left);
      if (e.right.kind === "neg") {
        const r = render(e.right.arg);
        return { tex: `${l.tex} - ${wrapBelow(r, 2)}`, prec: 1 };
      }
      const r = render(e.right);
      return { tex: `${l.tex} + ${r.tex.startsWith("-") ? paren(r.tex) : r.tex}`, prec: 1 };
    }
    case "sub": {
      const l = render(e.left);
      const r = render(e.right);
      const right = r.prec <= 1 || r.tex.startsWith("-") ? paren(r.tex) : r.tex;
      return { tex: `${l.tex} - ${right}`, prec: 1 };
    }
    case "mul": {
      const l = render(e.left);
      const r = render(e.right);
      const left = wrapBelow(l, 2);
      const right = r.prec < 2 || r.tex.startsWith("-") ? paren(r.tex) : r.tex;
      const separator = /^[\d.]/.test(right) ? " \\cdot " : " ";
      return { tex: `${left}${separator}${right}`, prec: 2 };
    }
    case "div":
      return { tex: `\\frac{${render(e.left).tex}}{${render(e.right).tex}}`, prec: 5 };
    case "pow": {
      const exponent = render(e.right).tex;
      const base = e.left;
      if (
        base.kind === "call" && POWER_PREFIX.has(base.fn) &&
        e.right.kind === "num" && Number.isInteger(e.right.value) && e.right.value > 0
      ) {
        const name = FUNCTION_NAME[base.fn as keyof typeof FUNCTION_NAME];
        return { tex: `${name}^{${exponent}}${paren(render(base.arg).tex)}`, prec: 5 };
      }
      const b = render(base);
      const atomicBase = b.prec >= 5 && (base.kind === "sym" || base.kind === "num" || (base.kind === "call" && base.fn === "abs"));
      return { tex: `${atomicBase ? b.tex : paren(b.tex)}^{${exponent}}`, prec: 4 };
    }
    case "call": {
      const arg = render(e.arg).tex;
      switch (e.fn) {
        case "abs":
          return { tex: `\\left|${arg}\\right|`, prec: 5 };
        case "sqrt":
          return { tex: `\\sqrt{${arg}}`, prec: 5 };
        case "exp":
          return arg.length <= MAX_EXP_SUPERSCRIPT && !arg.includes("\\frac")
            ? { tex: `e^{${arg}}`, prec: 4 }
            : { tex: `\\exp${paren(arg)}`, prec: 5 };
        default:
          return { tex: `${FUNCTION_NAME[e.fn]}${paren(arg)}`, prec: 5 };
      }
    }
  }
}

/** LaTeX of an expression, e.g. a0*(1+eps*cos(w*t)) → a_{0} \left(1 + \varepsilon \cos\left(w t\right)\right). */
export function toLatex(expr: Expr): string {
  return render(expr).tex;
}
