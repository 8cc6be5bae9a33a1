/**
 * The reducibility invariants in polynomial form, as tables of monomials, and their evaluation
 * over jets in any field.
 *
 * - NLS (R-poly): -a²h² R, 13 monomials (../shared/math/nls.md §3);
 * - KdV: p²q K, 14 monomials (../shared/math/kdv.md §2, "Polynomial form");
 * - mKdV: pq Q, 4 monomials (../shared/math/mkdv.md §2).
 */
import type { EquationClass } from "../spec/types";

/** A factor c^(derivative) raised to `power`. */
export type Factor = readonly [name: string, derivative: number, power: number];

export interface Monomial {
  coefficient: number;
  factors: readonly Factor[];
}

export interface InvariantDefinition {
  equationClass: EquationClass;
  /** The invariant's letter: R, K or Q (README "Symbols reserved across files"). */
  symbol: "R" | "K" | "Q";
  /** Coefficients entering the invariant. */
  inputs: readonly string[];
  /** Coefficients that must be finite and nonzero on the window (README "Preconditions"). */
  nonzero: readonly string[];
  /** The polynomial form P = normalizer · invariant, as monomials. */
  monomials: readonly Monomial[];
  /** The normalizer N in P = N · invariant (e.g. -a²h²), as one monomial. */
  normalizer: Monomial;
  /** Definition of the invariant in LaTeX, as in the class file. */
  definitionLatex: string;
  /** Highest derivative order of any coefficient in the monomials. */
  maxDerivative: number;
}

const m = (coefficient: number, ...factors: Factor[]): Monomial => ({ coefficient, factors });

/** nls.md §3 (R-poly): -a^2 h^2 R = Σ of these 13 monomials. */
const NLS_MONOMIALS: Monomial[] = [
  m(4, ["a", 0, 3], ["b", 0, 1], ["h", 0, 2]),
  m(-4, ["a", 0, 2], ["k", 0, 2], ["h", 0, 2]),
  m(4, ["a", 0, 2], ["c", 0, 1], ["k", 0, 1], ["h", 0, 2]),
  m(-2, ["a", 0, 2], ["k", 1, 1], ["h", 0, 2]),
  m(2, ["a", 0, 2], ["c", 1, 1], ["h", 0, 2]),
  m(-2, ["a", 0, 1], ["k", 0, 1], ["a", 1, 1], ["h", 0, 2]),
  m(-1, ["a", 0, 1], ["a", 2, 1], ["h", 0, 2]),
  m(1, ["a", 1, 2], ["h", 0, 2]),
  m(4, ["a", 0, 2], ["k", 0, 1], ["h", 0, 1], ["h", 1, 1]),
  m(-2, ["a", 0, 2], ["c", 0, 1], ["h", 0, 1], ["h", 1, 1]),
  m(1, ["a", 0, 1], ["a", 1, 1], ["h", 0, 1], ["h", 1, 1]),
  m(1, ["a", 0, 2], ["h", 0, 1], ["h", 2, 1]),
  m(-2, ["a", 0, 2], ["h", 1, 2]),
];

/** kdv.md §2 (polynomial form): p^2 q K = Σ of these 14 monomials. */
const KDV_MONOMIALS: Monomial[] = [
  m(-1, ["m", 0, 1], ["p", 0, 3], ["q", 0, 1]),
  m(2, ["p", 0, 2], ["q", 0, 1], ["r", 0, 2]),
  m(-5, ["p", 0, 2], ["q", 0, 1], ["r", 0, 1], ["s", 0, 1]),
  m(2, ["p", 0, 2], ["q", 0, 1], ["s", 0, 2]),
  m(1, ["p", 0, 2], ["q", 0, 1], ["r", 1, 1]),
  m(-2, ["p", 0, 2], ["q", 0, 1], ["s", 1, 1]),
  m(3, ["p", 0, 2], ["r", 0, 1], ["q", 1, 1]),
  m(-3, ["p", 0, 2], ["s", 0, 1], ["q", 1, 1]),
  m(1, ["p", 0, 2], ["q", 2, 1]),
  m(-4, ["p", 0, 1], ["q", 0, 1], ["r", 0, 1], ["p", 1, 1]),
  m(5, ["p", 0, 1], ["q", 0, 1], ["s", 0, 1], ["p", 1, 1]),
  m(-1, ["p", 0, 1], ["q", 0, 1], ["p", 2, 1]),
  m(-3, ["p", 0, 1], ["p", 1, 1], ["q", 1, 1]),
  m(3, ["q", 0, 1], ["p", 1, 2]),
];

/** mkdv.md §2: p q Q = p q' - q p' + 2pqr - 2pqs. */
const MKDV_MONOMIALS: Monomial[] = [
  m(1, ["p", 0, 1], ["q", 1, 1]),
  m(-1, ["q", 0, 1], ["p", 1, 1]),
  m(2, ["p", 0, 1], ["q", 0, 1], ["r", 0, 1]),
  m(-2, ["p", 0, 1], ["q", 0, 1], ["s", 0, 1]),
];

export const INVARIANTS: Readonly<Record<EquationClass, InvariantDefinition>> = {
  nls: {
    equationClass: "nls",
    symbol: "R",
    inputs: ["a", "b", "c", "h", "k"],
    nonzero: ["a", "h"],
    monomials: NLS_MONOMIALS,
    normalizer: m(-1, ["a", 0, 2], ["h", 0, 2]),
    definitionLatex:
      "R = W' - \\frac{a'}{a}W + W^{2} + 2cW - 4ab,\\quad W = \\frac{a'}{a} - \\frac{h'}{h} + 2(k - c)",
    maxDerivative: 2,
  },
  kdv: {
    equationClass: "kdv",
    symbol: "K",
    inputs: ["p", "q", "r", "s", "m"],
    nonzero: ["p", "q"],
    monomials: KDV_MONOMIALS,
    normalizer: m(1, ["p", 0, 2], ["q", 0, 1]),
    definitionLatex:
      "K = Z' + Z\\left(Z + r + s - \\frac{p'}{p}\\right) - pm,\\quad Z = \\frac{q'}{q} - \\frac{p'}{p} + r - 2s",
    maxDerivative: 2,
  },
  mkdv: {
    equationClass: "mkdv",
    symbol: "Q",
    inputs: ["p", "q", "r", "s"],
    nonzero: ["p", "q"],
    monomials: MKDV_MONOMIALS,
    normalizer: m(1, ["p", 0, 1], ["q", 0, 1]),
    definitionLatex: "Q = \\frac{q'}{q} - \\frac{p'}{p} + 2(r - s)",
    maxDerivative: 1,
  },
};

function factorLatex([name, derivative, power]: Factor): string {
  const primes = "'".repeat(derivative);
  return power === 1 ? `${name}${primes}` : `${name}${primes}^{${power}}`;
}

/** One monomial in LaTeX, without its sign. */
function monomialBody(mono: Monomial): string {
  const c = Math.abs(mono.coefficient);
  return (c === 1 ? "" : String(c)) + mono.factors.map(factorLatex).join("");
}

/** The polynomial form "N·X = Σ monomials" in LaTeX, generated from the table it is evaluated from. */
export function polynomialFormLatex(def: InvariantDefinition): string {
  const lhsSign = def.normalizer.coefficient < 0 ? "-" : "";
  const lhs = `${lhsSign}${monomialBody(def.normalizer)}${def.symbol}`;
  const rhs = def.monomials
    .map((mono, i) => {
      const sign = mono.coefficient < 0 ? "-" : i === 0 ? "" : "+";
      return `${i === 0 ? sign : ` ${sign} `}${monomialBody(mono)}`;
    })
    .join("");
  return `${lhs} = ${rhs}`;
}
