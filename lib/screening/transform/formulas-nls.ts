/**
 * Display formulas of the vc-NLS map, nls.md §5:
 *   α = W/(4a),  β = β0 (h/a)(a0/h0) e^{∫(c−2k)},  A = |β| sqrt(2|a/h|),  γ = γ0 + ∫ a β²,
 *   δ = β[δ0/β0 + ∫ (f − 2gα)/β],  ε = ε0 − ∫ (2aδ + g) β,  κ = κ0 + ∫ (e − aδ² − gδ).
 * Integrals are done in closed form where closed-form/ can; otherwise they are shown with ∫.
 */
import type { CoefficientSet } from "./coefficients";
import type { MapFormula, MapTable } from "./types";
import {
  PlaceholderBook, type Quantity, qAdd, qConst, qDeriv, qDiv, qExp, qFromExpr, qIntegral, qMul, qPow, qScale, qSub,
} from "./closed-form/quantity";
import { finishFormula } from "./closed-form/finish";

export interface NlsConstants {
  t0: number;
  beta0: number;
  gamma0: number;
  delta0: number;
  eps0: number;
  kappa0: number;
  sigma: number;
}

/** The definitions of nls.md §5, shown when no formula can be built. */
export const NLS_DEFINITIONS: Record<string, string> = {
  alpha: "\\frac{W(t)}{4a(t)},\\quad W = \\frac{a'}{a} - \\frac{h'}{h} + 2(k - c)",
  beta: "\\beta_0 \\frac{h(t)/a(t)}{h_0/a_0} \\exp\\int_{t_0}^{t} (c - 2k)\\,ds",
  A: "|\\beta(t)| \\sqrt{2\\,|a(t)/h(t)|}",
  gamma: "\\gamma_0 + \\int_{t_0}^{t} a \\beta^2\\,ds",
  delta: "\\beta(t)\\left[\\frac{\\delta_0}{\\beta_0} + \\int_{t_0}^{t} \\frac{f - 2g\\alpha}{\\beta}\\,ds\\right]",
  eps: "\\varepsilon_0 - \\int_{t_0}^{t} (2a\\delta + g)\\beta\\,ds",
  kappa: "\\kappa_0 + \\int_{t_0}^{t} (e - a\\delta^2 - g\\delta)\\,ds",
};

const LATEX_NAME: Record<string, string> = {
  A: "A", alpha: "\\alpha", beta: "\\beta", gamma: "\\gamma", delta: "\\delta", eps: "\\varepsilon", kappa: "\\kappa",
};

export function nlsFormulas(coefs: CoefficientSet, k: NlsConstants, table: MapTable): MapFormula[] {
  try {
    return build(coefs, k, table);
  } catch (err) {
    const why = err instanceof Error ? err.message : String(err);
    return Object.keys(NLS_DEFINITIONS).map((name) => ({
      name, latex: `${LATEX_NAME[name]}(t) = ${NLS_DEFINITIONS[name]}`, closedForm: false, note: `formula display failed: ${why}`,
    }));
  }
}

function build(coefs: CoefficientSet, k: NlsConstants, table: MapTable): MapFormula[] {
  const book = new PlaceholderBook();
  const c: Record<string, Quantity> = {};
  for (const n of coefs.names) c[n] = qFromExpr(coefs.exprs[n]);
  const v0 = coefs.values(k.t0);
  const ref = (name: string, q: Quantity): Quantity => (q.closed ? q : book.func(name, LATEX_NAME[name]));

  const W = qAdd(qSub(qDiv(qDeriv(c.a), c.a), qDiv(qDeriv(c.h), c.h)), qScale(qSub(c.k, c.c), 2));
  const alpha = qDiv(W, qScale(c.a, 4));
  const Ib = qIntegral(qSub(c.c, qScale(c.k, 2)), k.t0, book);
  const beta = qMul(qScale(qDiv(c.h, c.a), (k.beta0 * v0.a) / v0.h), qExp(Ib, k.t0));
  const betaR = ref("beta", beta);
  const A = qMul(qScale(betaR, Math.sign(k.beta0)), qPow(qScale(qDiv(c.a, c.h), 2 * k.sigma), 0.5));
  const gamma = qAdd(qConst(k.gamma0), qIntegral(qMul(c.a, qPow(betaR, 2)), k.t0, book));
  const Id = qIntegral(qDiv(qSub(c.f, qMul(qScale(c.g, 2), alpha)), betaR), k.t0, book);
  const delta = qMul(betaR, qAdd(qConst(k.delta0 / k.beta0), Id));
  const deltaR = ref("delta", delta);
  const eps = qSub(qConst(k.eps0), qIntegral(qMul(qAdd(qMul(qScale(c.a, 2), deltaR), c.g), betaR), k.t0, book));
  const kappa = qAdd(qConst(k.kappa0), qIntegral(qSub(qSub(c.e, qMul(c.a, qPow(deltaR, 2))), qMul(c.g, deltaR)), k.t0, book));

  const qs: Record<string, Quantity> = { alpha, beta, A, gamma, delta, eps, kappa };
  return Object.keys(qs).map((name) => finishFormula(name, LATEX_NAME[name], qs[name], book, table, NLS_DEFINITIONS[name]));
}
