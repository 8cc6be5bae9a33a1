/**
 * vc-mKdV designs: the coefficient that makes Q ≡ 0 (../shared/math/mkdv.md §2), for p, q and
 * r − s (solved as r or as s).
 *
 *   Q = q'/q − p'/p + 2(r − s) = 0  ⟺  p = kappa_p q e^{2∫(r−s)}
 */
import { call, div, mul, num, sub } from "../../expr";
import { jx } from "../jets";
import type { SolverDefinition } from "./types";

const two = num(2);

const pSolver: SolverDefinition = {
  cls: "mkdv",
  unknown: "p",
  condition: () => ({
    kind: "quadrature",
    latex: "p = p_0\\,\\frac{q}{q_0}\\,e^{2\\int (r - s)}",
    method: "Q = 0 ⟺ p = kappa_p q e^{2∫(r−s)} (mkdv.md §2), with kappa_p = p0/q0; sigma = sign(p0/q0).",
  }),
  constants: [
    { name: "p0", latex: "p_0", meaning: "p(t0); sigma = sign(p0/q0). Default 6 q0: the map is the identity at t0 (mkdv.md §4).", defaultValue: (o) => 6 * o.value0(o.c("q")), nonzero: true },
  ],
  closed(o) {
    const [q, r, s] = ["q", "r", "s"].map((n) => o.c(n));
    const i = o.integral(sub(r, s));
    if (!i) return null;
    return { expr: o.norm(o.mul(o.k("p0"), div(q, o.at0(q)), call("exp", mul(two, i)))), notes: [] };
  },
  numeric(o) {
    const ratio = o.dc.values.p0 / o.value0(o.c("q"));
    return {
      dimension: 1,
      initial: [0],
      maxDerivative: 0,
      rhs: (cj) => [jx.sub(cj.get("r"), cj.get("s"))],
      output: (cj, y) => jx.mul(jx.scale(cj.get("q"), ratio), jx.exp(jx.scale(y[0], 2))),
      reason: "∫(r − s) has no elementary form here",
    };
  },
};

const qSolver: SolverDefinition = {
  cls: "mkdv",
  unknown: "q",
  condition: () => ({
    kind: "quadrature",
    latex: "q = q_0\\,\\frac{p}{p_0}\\,e^{-2\\int (r - s)}",
    method: "Q = 0 ⟺ q = p e^{−2∫(r−s)}/kappa_p (mkdv.md §2), with kappa_p = p0/q0.",
  }),
  constants: [
    { name: "q0", latex: "q_0", meaning: "q(t0); sigma = sign(p0/q0). Default p0/6: the map is the identity at t0 (mkdv.md §4).", defaultValue: (o) => o.value0(o.c("p")) / 6, nonzero: true },
  ],
  closed(o) {
    const [p, r, s] = ["p", "r", "s"].map((n) => o.c(n));
    const i = o.integral(sub(r, s));
    if (!i) return null;
    return { expr: o.norm(o.mul(o.k("q0"), div(p, o.at0(p)), call("exp", mul(num(-2), i)))), notes: [] };
  },
  numeric(o) {
    const ratio = o.dc.values.q0 / o.value0(o.c("p"));
    return {
      dimension: 1,
      initial: [0],
      maxDerivative: 0,
      rhs: (cj) => [jx.sub(cj.get("r"), cj.get("s"))],
      output: (cj, y) => jx.mul(jx.scale(cj.get("p"), ratio), jx.exp(jx.scale(y[0], -2))),
      reason: "∫(r − s) has no elementary form here",
    };
  },
};

const rSolver: SolverDefinition = {
  cls: "mkdv",
  unknown: "r",
  condition: () => ({
    kind: "explicit",
    latex: "r = s + \\frac{1}{2}\\left(\\frac{p'}{p} - \\frac{q'}{q}\\right)",
    method: "Q fixes r − s = (p'/p − q'/q)/2 (mkdv.md §2).",
  }),
  constants: [],
  closed(o) {
    const [p, q, s] = ["p", "q", "s"].map((n) => o.c(n));
    return { expr: o.norm(o.add(s, div(sub(o.logD(p), o.logD(q)), two))), notes: [] };
  },
};

const sSolver: SolverDefinition = {
  cls: "mkdv",
  unknown: "s",
  condition: () => ({
    kind: "explicit",
    latex: "s = r - \\frac{1}{2}\\left(\\frac{p'}{p} - \\frac{q'}{q}\\right)",
    method: "Q fixes r − s = (p'/p − q'/q)/2 (mkdv.md §2).",
  }),
  constants: [],
  closed(o) {
    const [p, q, r] = ["p", "q", "r"].map((n) => o.c(n));
    return { expr: o.norm(sub(r, div(sub(o.logD(p), o.logD(q)), two))), notes: [] };
  },
};

export const MKDV_SOLVERS: SolverDefinition[] = [pSolver, qSolver, rSolver, sSolver];
