/**
 * Equation templates of the three product classes as term lists (../shared/math/painleve.md §5,
 * "Equation template"), plus helpers to add terms outside the classes.
 */
import type { Expr } from "../expr/types";
import type { EquationClass } from "../spec/types";
import type { Complex } from "./jet-algebra";
import type { EquationTemplate, Factor, Term } from "./types";

const C = (re: number, im = 0): Complex => ({ re, im });
const f = (variable: string, x = 0, t = 0): Factor => ({ variable, x, t });

/** A term: constant × coefficient × x^xPower × factors. */
export function term(constant: Complex | number, coefficient: string | Expr, xPower: number, factors: Factor[]): Term {
  return { constant: typeof constant === "number" ? C(constant) : constant, coefficient, xPower, factors };
}
export { f as factor };

/** The formal conjugate of a u-equation term: constants conjugated, u ↔ v (painleve.md §2, §5). */
export function conjugateTerm(t: Term, swap: Record<string, string> = { u: "v", v: "u" }): Term {
  return {
    constant: C(t.constant.re, -t.constant.im),
    coefficient: t.coefficient,
    xPower: t.xPower,
    factors: t.factors.map((fa) => ({ ...fa, variable: swap[fa.variable] ?? fa.variable })),
  };
}

// i u_t + a u_xx + (b x^2 + f x + e) u + h u^2 v + i k u + i c x u_x + i g u_x   (painleve.md §2, §5)
const NLS_U: Term[] = [
  term(C(0, 1), "1", 0, [f("u", 0, 1)]),
  term(1, "a", 0, [f("u", 2)]),
  term(1, "b", 2, [f("u")]),
  term(1, "f", 1, [f("u")]),
  term(1, "e", 0, [f("u")]),
  term(C(0, 1), "k", 0, [f("u")]),
  term(C(0, 1), "c", 1, [f("u", 1)]),
  term(C(0, 1), "g", 0, [f("u", 1)]),
  term(1, "h", 0, [f("u"), f("u"), f("v")]),
];

export const NLS_TEMPLATE: EquationTemplate = {
  id: "nls",
  title: "vc-NLS",
  variables: ["u", "v"],
  equations: [NLS_U, NLS_U.map((t) => conjugateTerm(t))],
  conjugatePair: true,
  classOracle: "nls",
  defaultJetLength: 8,
  nonvanishing: ["a", "h"],
};

// u_t + p u u_x + q u_xxx + r u + (s x + g) u_x - l - m x   (painleve.md §3, §5)
export const KDV_TEMPLATE: EquationTemplate = {
  id: "kdv",
  title: "vc-KdV",
  variables: ["u"],
  equations: [
    [
      term(1, "1", 0, [f("u", 0, 1)]),
      term(1, "p", 0, [f("u"), f("u", 1)]),
      term(1, "q", 0, [f("u", 3)]),
      term(1, "r", 0, [f("u")]),
      term(1, "s", 1, [f("u", 1)]),
      term(1, "g", 0, [f("u", 1)]),
      term(-1, "l", 0, []),
      term(-1, "m", 1, []),
    ],
  ],
  conjugatePair: false,
  classOracle: "kdv",
  defaultJetLength: 9,
  nonvanishing: ["p", "q"],
};

// u_t + p u^2 u_x + q u_xxx + r u + (s x + g) u_x   (painleve.md §4, §5)
export const MKDV_TEMPLATE: EquationTemplate = {
  id: "mkdv",
  title: "vc-mKdV",
  variables: ["u"],
  equations: [
    [
      term(1, "1", 0, [f("u", 0, 1)]),
      term(1, "p", 0, [f("u"), f("u"), f("u", 1)]),
      term(1, "q", 0, [f("u", 3)]),
      term(1, "r", 0, [f("u")]),
      term(1, "s", 1, [f("u", 1)]),
      term(1, "g", 0, [f("u", 1)]),
    ],
  ],
  conjugatePair: false,
  classOracle: "mkdv",
  defaultJetLength: 8,
  nonvanishing: ["p", "q"],
};

export const CLASS_TEMPLATES: Readonly<Record<EquationClass, EquationTemplate>> = {
  nls: NLS_TEMPLATE,
  kdv: KDV_TEMPLATE,
  mkdv: MKDV_TEMPLATE,
};

/**
 * The template with extra terms: appended to the (u-)equation, and for conjugate pairs their
 * formal conjugates to the v-equation. The closed-form oracle no longer applies.
 */
export function withExtraTerms(template: EquationTemplate, extra: Term[], title?: string): EquationTemplate {
  if (extra.length === 0) return template;
  const equations = template.equations.map((eq) => [...eq]);
  equations[0].push(...extra);
  if (template.conjugatePair) equations[1].push(...extra.map((t) => conjugateTerm(t)));
  return {
    ...template,
    id: `${template.id}+extra`,
    title: title ?? `${template.title} with ${extra.length} extra term(s)`,
    equations,
    classOracle: undefined,
  };
}

/** Extra term -ν u_xx (KdV–Burgers; painleve.md §8 K5). */
export function burgersTerm(nu: string | Expr): Term {
  return term(-1, nu, 0, [f("u", 2)]);
}

/** Extra term g |u|^4 u = g u^3 v^2 (quintic NLS; painleve.md §8 leading-order controls). */
export function quinticTerm(g: string | Expr): Term {
  return term(1, g, 0, [f("u"), f("u"), f("u"), f("v"), f("v")]);
}
