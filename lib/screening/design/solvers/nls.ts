/**
 * vc-NLS designs: the coefficient that makes R ≡ 0 (../shared/math/nls.md §3), for b, h, k, a.
 *
 *   W = a'/a − h'/h + 2(k − c),   R = W' − (a'/a)W + W² + 2cW − 4ab
 *   (L) m'' − (a'/a − 2c) m' − 4ab m = 0   with R = L[mu_req]/mu_req, mu_req = (a/h) e^{2∫(k−c)}  (§2, §3 R-lin)
 */
import { call, div, mul, num, sub } from "../../expr";
import type { Expr } from "../../expr";
import type { Ops } from "../context";
import { constantCoefficientSolution } from "../linear";
import { jx } from "../jets";
import type { CoefficientJets, J } from "../jets";
import type { ConstantSpec, SolverDefinition } from "./types";

const two = num(2);
const four = num(4);

/** W of nls.md §3 from trees. */
function W(o: Ops, a: Expr, h: Expr, k: Expr, c: Expr): Expr {
  return o.add(sub(o.logD(a), o.logD(h)), mul(two, sub(k, c)));
}

/** The linear solution m of (L) with m(t0) = 1, m'(t0) = s0, in closed form (nls.md §2, §10), or null. */
function characteristic(o: Ops, s0: Expr, s0Value: number, notes: string[], constantName: string): Expr | null {
  const a = o.c("a");
  const b = o.c("b");
  const c = o.c("c");
  if (o.isZero(b)) {
    // (L) with b = 0: (m' e^{2∫c}/a)' = 0, so m = 1 + s0 ∫ (a/a0) e^{−2∫c}.
    const ic = o.integral(c);
    const a0 = o.at0(a);
    const inner = ic ? o.integral(mul(div(a, a0), call("exp", mul(num(-2), ic)))) : null;
    if (inner) return o.norm(o.add(num(1), mul(s0, inner)));
    if (s0Value === 0) {
      notes.push(`${constantName} = 0 gives m = 1; other values need ∫ a e^{−2∫c}, which has no elementary form here, and give a tabulated design`);
      return num(1);
    }
    return null;
  }
  // Constant a'/a − 2c and ab: (L) has constant coefficients.
  return constantCoefficientSolution(o, sub(mul(two, c), o.logD(a)), mul(num(-4), mul(a, b)), s0);
}

/** Jets of the (L) right-hand side: [m, m'] → [m', (a'/a − 2c) m' + 4ab m]. */
function characteristicRhs(cj: CoefficientJets, y: J[]): J[] {
  const a = cj.get("a");
  const theta1 = jx.sub(jx.div(cj.get("a", 1), a), jx.scale(cj.get("c"), 2));
  const theta0 = jx.scale(jx.mul(a, cj.get("b")), 4);
  return [y[1], jx.add(jx.mul(theta1, y[1]), jx.mul(theta0, y[0]))];
}

const bSolver: SolverDefinition = {
  cls: "nls",
  unknown: "b",
  condition: () => ({
    kind: "explicit",
    latex: "b = \\frac{W' - \\frac{a'}{a}W + W^{2} + 2cW}{4a},\\quad W = \\frac{a'}{a} - \\frac{h'}{h} + 2(k - c)",
    method: "R is linear in b: R = 0 gives b explicitly (nls.md §3, explicit form of R).",
  }),
  constants: [],
  closed(o) {
    const [a, h, k, c] = ["a", "h", "k", "c"].map((n) => o.c(n));
    const w = W(o, a, h, k, c);
    const top = o.add(sub(o.d(w), mul(o.logD(a), w)), mul(w, w), mul(mul(two, c), w));
    return { expr: o.norm(div(top, mul(four, a))), notes: [] };
  },
};

const hConstants: ConstantSpec[] = [
  {
    name: "h0",
    latex: "h_0",
    meaning: "h(t0); sigma = sign(h0/a0). Default 2 a0: with alpha0 = 0 the map is the identity at t0 (nls.md §6).",
    defaultValue: (o) => 2 * o.value0(o.c("a")),
    nonzero: true,
  },
  {
    name: "alpha0",
    latex: "\\alpha_0",
    meaning: "the chirp alpha(t0) = W(t0)/(4 a0) of the map, i.e. m'(t0) = 4 a0 alpha0 (nls.md §6). Default 0: no chirp at t0.",
    defaultValue: () => 0,
  },
];

const hSolver: SolverDefinition = {
  cls: "nls",
  unknown: "h",
  condition: () => ({
    kind: "linear-second-order",
    latex: "h = h_0\\,\\frac{a}{a_0}\\,\\frac{e^{2\\int (k - c)}}{m},\\quad m'' - \\left(\\frac{a'}{a} - 2c\\right)m' - 4ab\\,m = 0,\\ m(t_0) = 1,\\ m'(t_0) = 4a_0\\alpha_0",
    method: "R = L[mu]/mu with mu = (a/h) e^{2∫(k−c)}: h is passing iff mu solves the linear characteristic equation (L) (nls.md §2, §3 R-lin, §7). Two constants (h0, alpha0); h has a pole (a focusing time) wherever m = 0.",
  }),
  constants: hConstants,
  closed(o) {
    const notes: string[] = [];
    const a = o.c("a");
    const a0 = o.at0(a);
    const s0 = mul(mul(four, a0), o.k("alpha0"));
    const m = characteristic(o, s0, 4 * o.value0(a0) * o.dc.values.alpha0, notes, "alpha0");
    const ikc = o.integral(sub(o.c("k"), o.c("c")));
    if (!m || !ikc) return null;
    return { expr: o.norm(div(o.mul(o.k("h0"), div(a, a0), call("exp", mul(two, ikc))), m)), notes };
  },
  numeric(o) {
    const a0 = o.value0(o.c("a"));
    const h0 = o.dc.values.h0;
    return {
      dimension: 3,
      initial: [1, 4 * a0 * o.dc.values.alpha0, 0],
      maxDerivative: 1,
      rhs: (cj, y) => [...characteristicRhs(cj, y), jx.sub(cj.get("k"), cj.get("c"))],
      output: (cj, y) => jx.div(jx.mul(jx.scale(cj.get("a"), h0 / a0), jx.exp(jx.scale(y[2], 2))), y[0]),
      pole: { component: 0, kind: "pole", meaning: "h has a pole where m = 0: a focusing time of the map (nls.md §7)" },
      reason: "(L) has no elementary solution for these a, b, c (b ≠ 0 and not constant-coefficient), or ∫(k − c) is not elementary",
    };
  },
};

const kConstants: ConstantSpec[] = [
  {
    name: "k0",
    latex: "k_0",
    meaning: "k(t0). Default: the value with no chirp at t0, W(t0) = 0, i.e. k0 = c0 + (h0'/h0 − a0'/a0)/2 (nls.md §6).",
    defaultValue: (o) => o.value0(o.add(o.c("c"), div(sub(o.logD(o.c("h")), o.logD(o.c("a"))), two))),
  },
];

const kSolver: SolverDefinition = {
  cls: "nls",
  unknown: "k",
  condition: () => ({
    kind: "riccati",
    latex: "W' = -W^{2} + \\left(\\frac{a'}{a} - 2c\\right)W + 4ab,\\quad k = c + \\frac{1}{2}\\left(W - \\frac{a'}{a} + \\frac{h'}{h}\\right)",
    method: "k enters R only through W, and R = 0 is a Riccati equation for W (nls.md §3). It is solved through its linearisation W = m'/m, L[m] = 0 (nls.md §2), which stays finite where W blows up: k has a pole wherever m = 0.",
  }),
  constants: kConstants,
  closed(o) {
    const notes: string[] = [];
    const [a, h, c] = ["a", "h", "c"].map((n) => o.c(n));
    const w0 = o.add(o.at0(sub(sub(o.logD(a), o.logD(h)), mul(two, c))), mul(two, o.k("k0")));
    const w0Value = o.value0(sub(sub(o.logD(a), o.logD(h)), mul(two, c))) + 2 * o.dc.values.k0;
    const m = characteristic(o, o.norm(w0), Math.abs(w0Value) < 1e-15 ? 0 : w0Value, notes, "k0 (at its chirp-free value)");
    if (!m) return null;
    const w = div(o.d(m), m);
    return { expr: o.norm(o.add(c, div(o.add(sub(w, o.logD(a)), o.logD(h)), two))), notes };
  },
  numeric(o) {
    const [a, h, c] = ["a", "h", "c"].map((n) => o.c(n));
    const w0 = o.value0(sub(sub(o.logD(a), o.logD(h)), mul(two, c))) + 2 * o.dc.values.k0;
    return {
      dimension: 2,
      initial: [1, w0],
      maxDerivative: 1,
      rhs: characteristicRhs,
      output: (cj, y) => {
        const w = jx.div(y[1], y[0]);
        const la = jx.div(cj.get("a", 1), cj.get("a"));
        const lh = jx.div(cj.get("h", 1), cj.get("h"));
        return jx.add(cj.get("c"), jx.scale(jx.add(jx.sub(w, la), lh), 0.5));
      },
      pole: { component: 0, kind: "pole", meaning: "k has a pole where m = 0 (the Riccati solution W = m'/m blows up)" },
      reason: "the linearised equation L[m] = 0 has no elementary solution for these a, b, c",
    };
  },
};

const aConstants: ConstantSpec[] = [
  {
    name: "a0",
    latex: "a_0",
    meaning: "a(t0). Default h0/2: with alpha0 = 0 the map is the identity at t0 (nls.md §6).",
    defaultValue: (o) => o.value0(o.c("h")) / 2,
    nonzero: true,
  },
  {
    name: "alpha0",
    latex: "\\alpha_0",
    meaning: "the chirp alpha(t0) = W(t0)/(4 a0) of the map (nls.md §6). Default 0: no chirp at t0.",
    defaultValue: () => 0,
  },
];

/** w0 = −h'/h + 2(k − c) as a jet (W = a'/a + w0). */
function w0Jet(cj: CoefficientJets): J {
  return jx.add(jx.scale(jx.div(cj.get("h", 1), cj.get("h")), -1), jx.scale(jx.sub(cj.get("k"), cj.get("c")), 2));
}

const aSolver: SolverDefinition = {
  cls: "nls",
  unknown: "a",
  condition: (o) =>
    o.isZero(o.c("b"))
      ? {
          kind: "linear-second-order",
          latex: "a = a_0\\,\\frac{h}{h_0}\\,e^{-2\\int (k - c)}\\,\\exp\\!\\left(\\frac{4a_0\\alpha_0}{h_0}\\int h\\,e^{-2\\int k}\\right)",
          method: "With b = 0, (L) for mu = (a/h) e^{2∫(k−c)} reads (mu' e^{2∫c}/a)' = 0, so mu'/mu = C h e^{−2∫k} (nls.md §2, §3 R-lin): a follows by two quadratures.",
        }
      : {
          kind: "nonlinear-second-order",
          latex: "\\lambda'' + \\left(2k - \\frac{h'}{h}\\right)\\lambda' + w_0' + w_0^{2} + 2cw_0 - 4b\\,\\mathrm{sign}(a_0)\\,e^{\\lambda} = 0,\\quad \\lambda = \\ln|a|,\\ w_0 = -\\frac{h'}{h} + 2(k - c)",
          method: "With ℓ = (ln|a|)', R = ℓ' + (2k − h'/h)ℓ + w0' + w0² + 2c w0 − 4ab (nls.md §3, explicit form with W = ℓ + w0): nonlinear in a when b ≠ 0, integrated numerically.",
        },
  constants: aConstants,
  closed(o) {
    if (!o.isZero(o.c("b"))) return null;
    const notes: string[] = [];
    const [h, k, c] = ["h", "k", "c"].map((n) => o.c(n));
    const h0 = o.at0(h);
    const ikc = o.integral(sub(k, c));
    const ik = o.integral(k);
    if (!ikc || !ik) return null;
    let expo: Expr = num(0);
    const inner = o.integral(mul(h, call("exp", mul(num(-2), ik))));
    if (inner) expo = div(o.mul(four, o.k("a0"), o.k("alpha0"), inner), h0);
    else if (o.dc.values.alpha0 === 0) notes.push("alpha0 = 0 drops the last factor; other values need ∫ h e^{−2∫k}, which has no elementary form here, and give a tabulated design");
    else return null;
    return { expr: o.norm(o.mul(o.k("a0"), div(h, h0), call("exp", mul(num(-2), ikc)), call("exp", expo))), notes };
  },
  numeric(o) {
    const a0 = o.dc.values.a0;
    const sa = Math.sign(a0);
    const [h, k, c] = ["h", "k", "c"].map((n) => o.c(n));
    const w00 = o.value0(o.add(mul(num(-1), o.logD(h)), mul(two, sub(k, c))));
    return {
      dimension: 2,
      initial: [Math.log(Math.abs(a0)), 4 * a0 * o.dc.values.alpha0 - w00],
      maxDerivative: 2,
      rhs: (cj, y) => {
        const hh = cj.get("h");
        const lh = jx.div(cj.get("h", 1), hh);
        const w0 = w0Jet(cj);
        // w0' = −(h''/h − (h'/h)²) + 2(k' − c').
        const w0p = jx.add(jx.scale(jx.sub(jx.div(cj.get("h", 2), hh), jx.mul(lh, lh)), -1), jx.scale(jx.sub(cj.get("k", 1), cj.get("c", 1)), 2));
        const f0 = jx.add(w0p, jx.mul(w0, w0), jx.scale(jx.mul(cj.get("c"), w0), 2));
        const damping = jx.sub(jx.scale(cj.get("k"), 2), lh);
        const source = jx.scale(jx.mul(cj.get("b"), jx.exp(y[0])), 4 * sa);
        return [y[1], jx.sub(jx.sub(source, jx.mul(damping, y[1])), f0)];
      },
      output: (_cj, y) => jx.scale(jx.exp(y[0]), sa),
      reason: "b ≠ 0 makes the condition nonlinear in a (or a quadrature is not elementary)",
    };
  },
};

export const NLS_SOLVERS: SolverDefinition[] = [bSolver, hSolver, kSolver, aSolver];
