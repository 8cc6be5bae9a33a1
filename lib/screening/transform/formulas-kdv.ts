/**
 * Display formulas of the vc-KdV map, kdv.md §3:
 *   B = Z/p,  β = β0 (p q0)/(q p0) e^{−∫(r−s)},  A = 6qβ²/p,
 *   C = (A/A0)[C0 + ∫ (l − gB) A0/A],  γ = γ0 + ∫ qβ³,  ε = ε0 − ∫ (pC + g) β.
 */
import type { CoefficientSet } from "./coefficients";
import type { MapFormula, MapTable } from "./types";
import {
  PlaceholderBook, type Quantity, qAdd, qConst, qDeriv, qDiv, qExp, qFromExpr, qIntegral, qMul, qNeg, qPow, qScale, qSub,
} from "./closed-form/quantity";
import { finishFormula } from "./closed-form/finish";

export const KDV_DEFINITIONS: Record<string, string> = {
  B: "\\frac{Z(t)}{p(t)},\\quad Z = \\frac{q'}{q} - \\frac{p'}{p} + r - 2s",
  beta: "\\beta_0 \\frac{p(t)\\,q_0}{q(t)\\,p_0} \\exp\\left(-\\int_{t_0}^{t} (r - s)\\,ds\\right)",
  A: "\\frac{6 q(t) \\beta(t)^2}{p(t)}",
  C: "\\frac{A(t)}{A_0}\\left[C_0 + \\int_{t_0}^{t} (l - gB)\\frac{A_0}{A}\\,ds\\right]",
  gamma: "\\gamma_0 + \\int_{t_0}^{t} q \\beta^3\\,ds",
  eps: "\\varepsilon_0 - \\int_{t_0}^{t} (pC + g)\\beta\\,ds",
};
const LATEX_NAME: Record<string, string> = { A: "A", B: "B", C: "C", beta: "\\beta", gamma: "\\gamma", eps: "\\varepsilon" };

export function kdvFormulas(coefs: CoefficientSet, k: { t0: number; beta0: number; eps0: number; gamma0: number; C0: number }, table: MapTable): MapFormula[] {
  try {
    const book = new PlaceholderBook();
    const c: Record<string, Quantity> = {};
    for (const n of coefs.names) c[n] = qFromExpr(coefs.exprs[n]);
    const v0 = coefs.values(k.t0);
    const ref = (name: string, q: Quantity): Quantity => (q.closed ? q : book.func(name, LATEX_NAME[name]));
    const Z = qAdd(qSub(qDiv(qDeriv(c.q), c.q), qDiv(qDeriv(c.p), c.p)), qSub(c.r, qScale(c.s, 2)));
    const B = qDiv(Z, c.p);
    const Irs = qIntegral(qSub(c.r, c.s), k.t0, book);
    const beta = qMul(qScale(qDiv(c.p, c.q), (k.beta0 * v0.q) / v0.p), qExp(qNeg(Irs), k.t0));
    const betaR = ref("beta", beta);
    const A = qDiv(qScale(qMul(c.q, qPow(betaR, 2)), 6), c.p);
    const A0 = (6 * v0.q * k.beta0 * k.beta0) / v0.p;
    const AR = ref("A", A);
    const C = qMul(qScale(AR, 1 / A0), qAdd(qConst(k.C0), qIntegral(qDiv(qScale(qSub(c.l, qMul(c.g, B)), A0), AR), k.t0, book)));
    const CR = ref("C", C);
    const gamma = qAdd(qConst(k.gamma0), qIntegral(qMul(c.q, qPow(betaR, 3)), k.t0, book));
    const eps = qSub(qConst(k.eps0), qIntegral(qMul(qAdd(qMul(c.p, CR), c.g), betaR), k.t0, book));
    const qs: Record<string, Quantity> = { A, B, C, beta, eps, gamma };
    return Object.keys(qs).map((name) => finishFormula(name, LATEX_NAME[name], qs[name], book, table, KDV_DEFINITIONS[name]));
  } catch (err) {
    const why = err instanceof Error ? err.message : String(err);
    return Object.keys(KDV_DEFINITIONS).map((name) => ({ name, latex: `${LATEX_NAME[name]}(t) = ${KDV_DEFINITIONS[name]}`, closedForm: false, note: `formula display failed: ${why}` }));
  }
}
