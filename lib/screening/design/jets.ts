/**
 * Taylor jets (double precision) for the numerical designs: jets of the fixed coefficients and
 * their derivatives at a point, and the jet of an ODE solution from its state at that point by
 * Picard iteration in truncated series (each pass fixes one more coefficient; painleve.md §5 for
 * the jet arithmetic; the iteration is the Taylor-series method, E. Hairer, S. P. Nørsett,
 * G. Wanner, "Solving Ordinary Differential Equations I", 2nd ed. 1993, §I.8) [from memory].
 */
import { DoubleField, constantJet, evalJet, jetAdd, jetDerivative, jetDiv, jetExp, jetMul, jetScale, jetSqrt, jetSub, variableJet } from "../expr";
import type { Expr, Jet } from "../expr";

export type J = Jet<number>;
export const F = DoubleField;

/** Coefficient jets at t: value(name, order) and its derivatives, every jet of length order + 1. */
export interface CoefficientJets {
  /** The jet of coefficient `name` (k-th derivative when k > 0), of length order + 1. */
  get(name: string, derivative?: number): J;
  order: number;
}

/** Jets of the fixed coefficient trees at t (derivatives up to `maxDerivative` kept exact). */
export function coefficientJets(coefficients: Record<string, Expr>, t: number, order: number, maxDerivative = 2): CoefficientJets {
  const full = order + maxDerivative;
  const env = { t: variableJet(t, full, F) };
  const cache = new Map<string, J[]>();
  return {
    order,
    get(name: string, derivative = 0): J {
      let list = cache.get(name);
      if (!list) {
        const expr = coefficients[name];
        let jet = expr ? evalJet(expr, env, full, F) : constantJet(0, full, F);
        list = [jet];
        for (let d = 1; d <= maxDerivative; d++) list.push((jet = jetDerivative(jet, F)));
        cache.set(name, list);
      }
      if (derivative > maxDerivative) throw new Error(`derivative ${derivative} of ${name} not prepared`);
      return list[derivative].slice(0, order + 1);
    },
  };
}

/** y' = f(t, y) with jets: given jets of t and y (length order + 1), return the jets of y'. */
export type JetRhs = (coefficients: CoefficientJets, y: J[]) => J[];

/** The Taylor jet of the solution through y(t) = state, to `order`, by Picard iteration. */
export function solutionJet(rhs: JetRhs, coefficients: CoefficientJets, state: readonly number[]): J[] {
  const order = coefficients.order;
  let y: J[] = state.map((v) => constantJet(v, order, F));
  for (let pass = 0; pass < order; pass++) {
    const f = rhs(coefficients, y);
    y = state.map((v, c) => {
      const next = constantJet(v, order, F);
      for (let k = 0; k < order; k++) next[k + 1] = f[c][k] / (k + 1);
      return next;
    });
  }
  return y;
}

/** Jet arithmetic in double precision, shorter to write in the ODE right-hand sides. */
export const jx = {
  add: (...xs: J[]): J => xs.reduce((a, b) => jetAdd(a, b, F)),
  sub: (a: J, b: J): J => jetSub(a, b, F),
  mul: (...xs: J[]): J => xs.reduce((a, b) => jetMul(a, b, F)),
  div: (a: J, b: J): J => jetDiv(a, b, F),
  scale: (a: J, s: number): J => jetScale(a, s, F),
  exp: (a: J): J => jetExp(a, F),
  sqrt: (a: J): J => jetSqrt(a, F),
  /** A constant jet as long as `like`. */
  k: (v: number, like: J): J => constantJet(v, like.length - 1, F),
};
