/**
 * vc-KdV designs: the coefficient that makes K ≡ 0 (../shared/math/kdv.md §2), for m, q, p, r.
 *
 *   Z = q'/q − p'/p + r − 2s,   K = Z' + Z(Z + r + s − p'/p) − p m
 *   K = (Ym Y')'/(Ym Y) − p m,  Y = (q/p) e^{∫(r−2s)},  Ym = e^{∫(r+s)}/p        (§2, equivalent forms)
 */
import { call, div, mul, num, sub } from "../../expr";
import type { Expr } from "../../expr";
import type { Ops } from "../context";
import { constantCoefficientSolution } from "../linear";
import { jx } from "../jets";
import type { CoefficientJets, J } from "../jets";
import type { ConstantSpec, SolverDefinition } from "./types";

const two = num(2);

/** Z of kdv.md §2 from trees. */
function Z(o: Ops, p: Expr, q: Expr, r: Expr, s: Expr): Expr {
  return o.add(sub(o.logD(q), o.logD(p)), sub(r, mul(two, s)));
}

const mSolver: SolverDefinition = {
  cls: "kdv",
  unknown: "m",
  condition: () => ({
    kind: "explicit",
    latex: "m = \\frac{Z' + Z\\left(Z + r + s - \\frac{p'}{p}\\right)}{p},\\quad Z = \\frac{q'}{q} - \\frac{p'}{p} + r - 2s",
    method: "K is linear in the forcing m: K = 0 gives m explicitly (kdv.md §2).",
  }),
  constants: [],
  closed(o) {
    const [p, q, r, s] = ["p", "q", "r", "s"].map((n) => o.c(n));
    const z = Z(o, p, q, r, s);
    const top = o.add(o.d(z), mul(z, sub(o.add(z, r, s), o.logD(p))));
    return { expr: o.norm(div(top, p)), notes: [] };
  },
};

const B0: ConstantSpec = {
  name: "B0",
  latex: "B_0",
  meaning: "B(t0) = Z(t0)/p0, the forced linear part u ∝ B x of the map at t0 (kdv.md §4). Default 0.",
  defaultValue: () => 0,
};

/** Y'' + (r + s − p'/p) Y' − p m Y = 0 as jets of [y, y', J] with J' = r − 2s. */
function yRhs(cj: CoefficientJets, y: J[]): J[] {
  const p = cj.get("p");
  const damping = jx.sub(jx.add(cj.get("r"), cj.get("s")), jx.div(cj.get("p", 1), p));
  const source = jx.mul(p, cj.get("m"));
  return [y[1], jx.sub(jx.mul(source, y[0]), jx.mul(damping, y[1])), jx.sub(cj.get("r"), jx.scale(cj.get("s"), 2))];
}

const qSolver: SolverDefinition = {
  cls: "kdv",
  unknown: "q",
  condition: (o) => ({
    kind: o.isZero(o.c("m")) ? "quadrature" : "linear-second-order",
    latex: "q = q_0\\,\\frac{p}{p_0}\\,e^{-\\int (r - 2s)}\\,y,\\quad \\left(Y_m y'\\right)' = p\\,m\\,Y_m\\,y,\\ Y_m = \\frac{e^{\\int (r + s)}}{p},\\ y(t_0) = 1,\\ y'(t_0) = p_0 B_0",
    method: "K = (Ym Y')'/(Ym Y) − pm is linear in Y = (q/p)e^{∫(r−2s)} (kdv.md §2); for m = 0, Y = d1 ∫ p e^{−∫(r+s)} + d2. Two constants (q0, B0).",
  }),
  constants: [
    { name: "q0", latex: "q_0", meaning: "q(t0). Default p0/6: with B0 = 0 the map is the identity at t0 (kdv.md §4).", defaultValue: (o) => o.value0(o.c("p")) / 6, nonzero: true },
    B0,
  ],
  closed(o) {
    const notes: string[] = [];
    const [p, r, s, m] = ["p", "r", "s", "m"].map((n) => o.c(n));
    const p0 = o.at0(p);
    const decay = o.integral(sub(r, mul(two, s)));
    if (!decay) return null;
    let y: Expr | null;
    if (o.isZero(m)) {
      const irs = o.integral(o.add(r, s));
      const inner = irs ? o.integral(mul(p, call("exp", mul(num(-1), irs)))) : null;
      if (inner) y = o.add(num(1), mul(o.k("B0"), inner));
      else if (o.dc.values.B0 === 0) {
        notes.push("B0 = 0 gives y = 1; other values need ∫ p e^{−∫(r+s)}, which has no elementary form here, and give a tabulated design");
        y = num(1);
      } else return null;
    } else {
      y = constantCoefficientSolution(o, sub(o.add(r, s), o.logD(p)), mul(num(-1), mul(p, m)), mul(p0, o.k("B0")));
    }
    if (!y) return null;
    return { expr: o.norm(o.mul(o.k("q0"), div(p, p0), call("exp", mul(num(-1), decay)), y)), notes };
  },
  numeric(o) {
    const p0 = o.value0(o.c("p"));
    const q0 = o.dc.values.q0;
    return {
      dimension: 3,
      initial: [1, p0 * o.dc.values.B0, 0],
      maxDerivative: 1,
      rhs: yRhs,
      output: (cj, y) => jx.mul(jx.scale(cj.get("p"), q0 / p0), jx.exp(jx.scale(y[2], -1)), y[0]),
      pole: { component: 0, kind: "zero", meaning: "q vanishes where y = 0: the designed equation leaves the KdV class there (q ≠ 0 is required)" },
      reason: "m ≠ 0 with coefficients that are not constant (no elementary solution of the linear equation), or a quadrature is not elementary",
    };
  },
};

const pSolver: SolverDefinition = {
  cls: "kdv",
  unknown: "p",
  condition: (o) => ({
    kind: o.isZero(o.c("m")) ? "quadrature" : "nonlinear-second-order",
    latex: o.isZero(o.c("m"))
      ? "p = p_0\\,\\frac{q}{q_0}\\,\\frac{e^{\\int (r - 2s)}}{\\sqrt{1 + 2B_0\\frac{p_0}{q_0}\\int q\\,e^{-3\\int s}}}"
      : "\\left(\\frac{e^{\\int (r+s)}}{q\\,e^{\\int (r-2s)}}\\,Y Y'\\right)' = m\\,e^{\\int (r+s)}\\,Y,\\quad p = \\frac{q\\,e^{\\int (r - 2s)}}{Y}",
    method: "With Y = (q/p)e^{∫(r−2s)}, K = 0 is (Ym Y')' = p m Ym Y with Ym = Y e^{∫(r+s)}/(q e^{∫(r−2s)}) (kdv.md §2): for m = 0 it integrates to Y² = Y0² + 2 Ym0 Y0' ∫ q e^{−3∫s}; for m ≠ 0 it is nonlinear and integrated numerically.",
  }),
  constants: [
    { name: "p0", latex: "p_0", meaning: "p(t0). Default 6 q0: with B0 = 0 the map is the identity at t0 (kdv.md §4).", defaultValue: (o) => 6 * o.value0(o.c("q")), nonzero: true },
    B0,
  ],
  closed(o) {
    const [q, r, s, m] = ["q", "r", "s", "m"].map((n) => o.c(n));
    if (!o.isZero(m)) return null;
    const notes: string[] = [];
    const q0 = o.at0(q);
    const grow = o.integral(sub(r, mul(two, s)));
    const is = o.integral(s);
    if (!grow || !is) return null;
    const inner = o.integral(mul(q, call("exp", mul(num(-3), is))));
    let root: Expr = num(1);
    if (inner) root = call("sqrt", o.add(num(1), o.mul(two, o.k("B0"), div(o.k("p0"), q0), inner)));
    else if (o.dc.values.B0 === 0) notes.push("B0 = 0 drops the square root; other values need ∫ q e^{−3∫s}, which has no elementary form here, and give a tabulated design");
    else return null;
    return { expr: o.norm(div(o.mul(o.k("p0"), div(q, q0), call("exp", grow)), root)), notes };
  },
  numeric(o) {
    const q0 = o.value0(o.c("q"));
    const p0 = o.dc.values.p0;
    const y0 = q0 / p0;
    return {
      dimension: 4,
      initial: [y0, (y0 * p0 * o.dc.values.B0 * y0) / q0, 0, 0],
      maxDerivative: 0,
      rhs: (cj, y) => {
        const e1 = jx.exp(y[2]);
        const e2 = jx.exp(y[3]);
        return [
          jx.div(jx.mul(cj.get("q"), e1, y[1]), jx.mul(e2, y[0])),
          jx.mul(cj.get("m"), e2, y[0]),
          jx.sub(cj.get("r"), jx.scale(cj.get("s"), 2)),
          jx.add(cj.get("r"), cj.get("s")),
        ];
      },
      output: (cj, y) => jx.div(jx.mul(cj.get("q"), jx.exp(y[2])), y[0]),
      pole: { component: 0, kind: "pole", meaning: "p has a pole where Y = (q/p)e^{∫(r−2s)} reaches 0" },
      reason: "m ≠ 0 makes the condition nonlinear in p (or a quadrature is not elementary)",
    };
  },
};

/** The Z(t0) of a given r0: Z0 = r0 + (q'/q − p'/p − 2s)(t0). */
function zShift(o: Ops): Expr {
  const [p, q, s] = ["p", "q", "s"].map((n) => o.c(n));
  return sub(sub(o.logD(q), o.logD(p)), mul(two, s));
}

const rSolver: SolverDefinition = {
  cls: "kdv",
  unknown: "r",
  condition: () => ({
    kind: "riccati",
    latex: "Z' = -2Z^{2} + \\left(\\frac{q'}{q} - 3s\\right)Z + p\\,m,\\quad r = Z - \\frac{q'}{q} + \\frac{p'}{p} + 2s",
    method: "r enters K through Z and Z + r + s − p'/p = 2Z − q'/q + 3s, so K = 0 is a Riccati equation for Z (kdv.md §2). It is solved through its linearisation Z = u'/(2u), u'' − (q'/q − 3s)u' − 2pm u = 0, which stays finite where Z blows up: r has a pole wherever u = 0.",
  }),
  constants: [
    {
      name: "r0",
      latex: "r_0",
      meaning: "r(t0). Default: the value with B(t0) = Z(t0)/p0 = 0, no linear background at t0 (kdv.md §4).",
      defaultValue: (o) => -o.value0(zShift(o)),
    },
  ],
  closed(o) {
    const notes: string[] = [];
    const [p, q, s, m] = ["p", "q", "s", "m"].map((n) => o.c(n));
    const z0 = o.norm(o.add(o.k("r0"), o.at0(zShift(o))));
    const z0Value = o.dc.values.r0 + o.value0(zShift(o));
    let u: Expr | null;
    if (o.isZero(m)) {
      const is = o.integral(s);
      const inner = is ? o.integral(mul(div(q, o.at0(q)), call("exp", mul(num(-3), is)))) : null;
      if (inner) u = o.add(num(1), o.mul(two, z0, inner));
      else if (Math.abs(z0Value) < 1e-15) {
        notes.push("r0 at its default (Z(t0) = 0) gives Z ≡ 0; other values need ∫ q e^{−3∫s}, which has no elementary form here, and give a tabulated design");
        u = num(1);
      } else return null;
    } else {
      u = constantCoefficientSolution(o, sub(mul(num(3), s), o.logD(q)), mul(num(-2), mul(p, m)), mul(two, z0));
    }
    if (!u) return null;
    const z = div(o.d(u), mul(two, u));
    return { expr: o.norm(o.add(sub(z, o.logD(q)), o.logD(p), mul(two, s))), notes };
  },
  numeric(o) {
    const z0 = o.dc.values.r0 + o.value0(zShift(o));
    return {
      dimension: 2,
      initial: [1, 2 * z0],
      maxDerivative: 1,
      rhs: (cj, y) => {
        const theta = jx.sub(jx.div(cj.get("q", 1), cj.get("q")), jx.scale(cj.get("s"), 3));
        return [y[1], jx.add(jx.mul(theta, y[1]), jx.scale(jx.mul(cj.get("p"), cj.get("m"), y[0]), 2))];
      },
      output: (cj, y) => {
        const z = jx.scale(jx.div(y[1], y[0]), 0.5);
        return jx.add(jx.sub(z, jx.div(cj.get("q", 1), cj.get("q"))), jx.div(cj.get("p", 1), cj.get("p")), jx.scale(cj.get("s"), 2));
      },
      pole: { component: 0, kind: "pole", meaning: "r has a pole where u = 0 (the Riccati solution Z = u'/(2u) blows up)" },
      reason: "the linearised equation has no elementary solution for these p, q, s, m",
    };
  },
};

export const KDV_SOLVERS: SolverDefinition[] = [mSolver, qSolver, pSolver, rSolver];
