/**
 * Display formulas of the vc-mKdV map, mkdv.md §3:
 *   A = A0 e^{−∫r},  β = β0 e^{−∫s},  ε = ε0 − ∫ g β,  γ = γ0 + ∫ q β³.
 */
import type { CoefficientSet } from "./coefficients";
import type { MapFormula, MapTable } from "./types";
import { PlaceholderBook, type Quantity, qAdd, qConst, qExp, qFromExpr, qIntegral, qMul, qNeg, qPow, qScale, qSub } from "./closed-form/quantity";
import { finishFormula } from "./closed-form/finish";

export const MKDV_DEFINITIONS: Record<string, string> = {
  A: "A_0 \\exp\\left(-\\int_{t_0}^{t} r\\,ds\\right)",
  beta: "\\beta_0 \\exp\\left(-\\int_{t_0}^{t} s\\,ds\\right)",
  eps: "\\varepsilon_0 - \\int_{t_0}^{t} g\\beta\\,ds",
  gamma: "\\gamma_0 + \\int_{t_0}^{t} q\\beta^3\\,ds",
};
const LATEX_NAME: Record<string, string> = { A: "A", beta: "\\beta", gamma: "\\gamma", eps: "\\varepsilon" };

export function mkdvFormulas(coefs: CoefficientSet, k: { t0: number; A0: number; beta0: number; eps0: number; gamma0: number }, table: MapTable): MapFormula[] {
  try {
    const book = new PlaceholderBook();
    const c: Record<string, Quantity> = {};
    for (const n of coefs.names) c[n] = qFromExpr(coefs.exprs[n]);
    const A = qScale(qExp(qNeg(qIntegral(c.r, k.t0, book)), k.t0), k.A0);
    const beta = qScale(qExp(qNeg(qIntegral(c.s, k.t0, book)), k.t0), k.beta0);
    const betaR = beta.closed ? beta : book.func("beta", "\\beta");
    const eps = qSub(qConst(k.eps0), qIntegral(qMul(c.g, betaR), k.t0, book));
    const gamma = qAdd(qConst(k.gamma0), qIntegral(qMul(c.q, qPow(betaR, 3)), k.t0, book));
    const qs: Record<string, Quantity> = { A, beta, eps, gamma };
    return Object.keys(qs).map((name) => finishFormula(name, LATEX_NAME[name], qs[name], book, table, MKDV_DEFINITIONS[name]));
  } catch (err) {
    const why = err instanceof Error ? err.message : String(err);
    return Object.keys(MKDV_DEFINITIONS).map((name) => ({ name, latex: `${LATEX_NAME[name]}(t) = ${MKDV_DEFINITIONS[name]}`, closedForm: false, note: `formula display failed: ${why}` }));
  }
}
