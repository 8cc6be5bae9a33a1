/**
 * vc-KdV → canonical KdV: the map of ../shared/math/kdv.md §3 tabulated by integrating
 *   Λ' = −(Z + s), C' = l − gB − (Z + r) C, γ' = q β³, ε' = −(pC + g) β
 * with Z = q'/q − p'/p + r − 2s, B = Z/p (forced), β = sign(β0) e^Λ, A = 6qβ²/p (KDM).
 * No focusing times exist (kdv.md §3); the window is cut only where p or q stops being admissible.
 */
import { DoubleField, JetEvaluationError, jetAdd, jetDerivative, jetDiv, jetScale, jetSub } from "../expr";
import type { Variant } from "../spec/types";
import { integrateOnGrid, uniformGrid, type OdeSystem } from "../ode";
import { RHO_INV_FAIL, SINGULAR_MARGIN_FRACTION } from "../tolerances";
import type { CoefficientSet } from "./coefficients";
import { sampleInvariant } from "./invariants";
import { SCAN_INTERVALS, TABLE_INTERVALS, admissibleEnd, fmt, guardPoints, integratorEvidence, scalarMapPlot } from "./common";
import { kdvFormulas } from "./formulas-kdv";
import type { ConstantOverrides, FreeConstant, MapTable, SingularTime, TransformationResult } from "./types";

const F = DoubleField;

/** Z = q'/q − p'/p + r − 2s as a jet (kdv.md §2), one order below the input jets. */
export function zJet(j: Record<string, number[]>): number[] {
  const n = j.p.length - 1;
  const lq = jetDiv(jetDerivative(j.q, F), j.q.slice(0, n), F);
  const lp = jetDiv(jetDerivative(j.p, F), j.p.slice(0, n), F);
  return jetAdd(jetSub(lq, lp, F), jetSub(j.r.slice(0, n), jetScale(j.s.slice(0, n), 2, F), F), F);
}

function mapSystem(coefs: CoefficientSet, betaSign: number): OdeSystem {
  return {
    dimension: 4,
    rhs(t, y) {
      const j = coefs.jets(t, 1);
      const Z = j.q[1] / j.q[0] - j.p[1] / j.p[0] + j.r[0] - 2 * j.s[0];
      const B = Z / j.p[0];
      const beta = betaSign * Math.exp(y[0]);
      const C = y[1];
      return [
        -(Z + j.s[0]),
        j.l[0] - j.g[0] * B - (Z + j.r[0]) * C,
        j.q[0] * beta * beta * beta,
        -(j.p[0] * C + j.g[0]) * beta,
      ];
    },
  };
}

export function buildKdvTransformation(variant: Variant, coefs: CoefficientSet, overrides: ConstantOverrides = {}): TransformationResult {
  const [t0, t1] = variant.window;
  const span = t1 - t0;
  const guard = sampleInvariant(coefs, guardPoints(t0, t1));
  if (Number.isNaN(guard.rho)) return { ok: false, code: "precondition", reason: "the invariant K could not be evaluated at any sample point (coefficients singular there)" };
  if (guard.rho >= RHO_INV_FAIL) {
    return {
      ok: false, code: "not-reducible",
      reason: `the invariant K of kdv.md §2 is not zero: rho_inv = ${fmt(guard.rho)} ≥ ${RHO_INV_FAIL} (p²qK = ${guard.values.map(fmt).join(", ")} at t = ${guard.points.map(fmt).join(", ")}); no map of the form of kdv.md §1 exists`,
    };
  }
  let j0: Record<string, number[]>;
  try {
    j0 = coefs.jets(t0, 2);
  } catch (err) {
    if (err instanceof JetEvaluationError) return { ok: false, code: "precondition", reason: `coefficients are singular at t0 = ${t0}: ${err.message}` };
    throw err;
  }
  const p0 = j0.p[0];
  const q0 = j0.q[0];
  if (p0 === 0 || q0 === 0) return { ok: false, code: "precondition", reason: "p(t0) q(t0) = 0: the map needs p q ≠ 0 (kdv.md §0)" };
  const Z0 = zJet(j0)[0];
  const beta0 = overrides.beta0 ?? 1;
  if (!(beta0 !== 0 && Number.isFinite(beta0))) return { ok: false, code: "precondition", reason: "beta0 must be a finite nonzero number" };
  const eps0 = overrides.eps0 ?? 0;
  const gamma0 = overrides.gamma0 ?? 0;
  const C0 = overrides.C0 ?? 0;
  const A0 = (6 * q0 * beta0 * beta0) / p0;

  const singularTimes: SingularTime[] = [];
  const okAt = (t: number) => {
    const v = coefs.values(t);
    return Number.isFinite(v.p) && Number.isFinite(v.q) && Math.sign(v.p) === Math.sign(p0) && Math.sign(v.q) === Math.sign(q0);
  };
  const admissible = admissibleEnd(okAt, t0, t1, SCAN_INTERVALS);
  let mapEnd = t1;
  const notes: string[] = [];
  if (admissible < t1) {
    singularTimes.push({ t: admissible, kind: "coefficient-singular", detail: "p or q is not finite, vanishes or changes sign here (kdv.md §0 precondition)" });
    mapEnd = admissible - SINGULAR_MARGIN_FRACTION * span;
    if (!(mapEnd > t0 + 1e-3 * span)) return { ok: false, code: "precondition", reason: `p or q stops being admissible at t = ${fmt(admissible)}, at the window start` };
  }
  const betaSign = Math.sign(beta0);
  const sys = mapSystem(coefs, betaSign);
  const run = integrateOnGrid(sys, uniformGrid(t0, mapEnd, TABLE_INTERVALS), [Math.log(Math.abs(beta0)), C0, gamma0, eps0]);
  if (!run.ok) {
    if (run.t.length < 3) return { ok: false, code: "integration-failed", reason: `the map ODE failed at the start: ${run.message}` };
    singularTimes.push({ t: run.stoppedAfter, kind: "integration-stopped", detail: `the map ODE (kdv.md §3) could not be continued: ${run.message}` });
    mapEnd = run.t[run.t.length - 1];
    notes.push(`map window cut at t = ${fmt(mapEnd)} where the ODE stopped (${run.failure})`);
  }
  const table = tabulate(coefs, run.t, run.y, betaSign);
  const constants: FreeConstant[] = [
    { name: "B(t0)", latex: "B(t_0)", value: Z0 / p0, status: "forced", meaning: "linear part of u, forced to Z(t0)/p0 by the matching condition (kdv.md §2)" },
    { name: "A0", latex: "A_0", value: A0, status: "forced", meaning: "amplitude 6 q0 beta0²/p0, forced by (KDM)" },
    { name: "beta0", latex: "\\beta_0", value: beta0, status: "free", defaultValue: 1, meaning: "scaling U → λ² U(λX, λ³T)" },
    { name: "eps0", latex: "\\varepsilon_0", value: eps0, status: "free", defaultValue: 0, meaning: "space translation" },
    { name: "gamma0", latex: "\\gamma_0", value: gamma0, status: "free", defaultValue: 0, meaning: "time translation" },
    { name: "C0", latex: "C_0", value: C0, status: "free", defaultValue: 0, meaning: "Galilean boost U → U + λ, X → X − 6λT" },
  ];
  const identity = Math.abs(6 * q0 - p0) <= 1e-14 * Math.abs(p0) && Math.abs(Z0) <= 1e-14 * (Math.abs(j0.q[1] / q0) + Math.abs(j0.p[1] / p0) + 1) &&
    beta0 === 1 && eps0 === 0 && gamma0 === 0 && C0 === 0;
  return {
    ok: true, class: "kdv", sigma: null,
    requestedWindow: [t0, t1], mapWindow: [t0, mapEnd],
    truncation: mapEnd < t1 ? { at: mapEnd, reason: singularTimes.map((s) => s.detail).join("; ") } : undefined,
    constants,
    identityAtStart: { holds: identity, condition: "the map is the identity at t0 iff 6 q0 = p0 and Z(t0) = 0 (with the default free constants) (kdv.md §4)" },
    formulas: kdvFormulas(coefs, { t0, beta0, eps0, gamma0, C0 }, table),
    table, singularTimes,
    checks: { invariantRho: guard.rho, invariantPoints: guard.points },
    integrator: integratorEvidence(table.t.length, run),
    plot: scalarMapPlot(coefs, t0, t1, table),
    notes,
  };
}

/** Values and slopes of A, B, C, β, ε, γ (slopes: (KD2)–(KD6); B' from jets of Z/p). */
function tabulate(coefs: CoefficientSet, t: number[], ys: number[][], betaSign: number): MapTable {
  const names = ["A", "B", "C", "beta", "eps", "gamma"];
  const values: Record<string, number[]> = {};
  const slopes: Record<string, number[]> = {};
  for (const n of names) {
    values[n] = [];
    slopes[n] = [];
  }
  const sys = mapSystem(coefs, betaSign);
  for (let i = 0; i < t.length; i++) {
    const j = coefs.jets(t[i], 2);
    const Bj = jetDiv(zJet(j), j.p.slice(0, 2), F);
    const d = sys.rhs(t[i], ys[i]);
    const beta = betaSign * Math.exp(ys[i][0]);
    const A = (6 * j.q[0] * beta * beta) / j.p[0];
    const put = (n: string, v: number, s: number) => {
      values[n].push(v);
      slopes[n].push(s);
    };
    put("A", A, -(j.p[0] * Bj[0] + j.r[0]) * A);
    put("B", Bj[0], Bj[1]);
    put("C", ys[i][1], d[1]);
    put("beta", beta, d[0] * beta);
    put("eps", ys[i][3], d[3]);
    put("gamma", ys[i][2], d[2]);
  }
  return { class: "kdv", t: [...t], values, slopes };
}
