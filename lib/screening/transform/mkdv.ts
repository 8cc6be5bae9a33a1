/**
 * vc-mKdV → canonical mKdV: the map of ../shared/math/mkdv.md §3 tabulated by integrating
 *   (∫r)' = r, (∫s)' = s, ε' = −g β, γ' = q β³,  with A = A0 e^{−∫r}, β = β0 e^{−∫s},
 * A0 = ±|β0| sqrt(6|q0/p0|) (MKM), sigma = sign(p/q). No singular times exist (mkdv.md §3).
 */
import { JetEvaluationError } from "../expr";
import type { Variant } from "../spec/types";
import { integrateOnGrid, uniformGrid, type OdeSystem } from "../ode";
import { RHO_INV_FAIL, SINGULAR_MARGIN_FRACTION } from "../tolerances";
import type { CoefficientSet } from "./coefficients";
import { sampleInvariant } from "./invariants";
import { SCAN_INTERVALS, TABLE_INTERVALS, admissibleEnd, fmt, guardPoints, integratorEvidence, scalarMapPlot } from "./common";
import { mkdvFormulas } from "./formulas-mkdv";
import type { ConstantOverrides, FreeConstant, MapTable, SingularTime, TransformationResult } from "./types";

function mapSystem(coefs: CoefficientSet, beta0: number): OdeSystem {
  return {
    dimension: 4,
    rhs(t, y) {
      const v = coefs.values(t);
      const beta = beta0 * Math.exp(-y[1]);
      return [v.r, v.s, -v.g * beta, v.q * beta * beta * beta];
    },
  };
}

export function buildMkdvTransformation(variant: Variant, coefs: CoefficientSet, overrides: ConstantOverrides = {}): TransformationResult {
  const [t0, t1] = variant.window;
  const span = t1 - t0;
  const guard = sampleInvariant(coefs, guardPoints(t0, t1));
  if (Number.isNaN(guard.rho)) return { ok: false, code: "precondition", reason: "the invariant Q could not be evaluated at any sample point (coefficients singular there)" };
  if (guard.rho >= RHO_INV_FAIL) {
    return {
      ok: false, code: "not-reducible",
      reason: `the invariant Q of mkdv.md §2 is not zero: rho_inv = ${fmt(guard.rho)} ≥ ${RHO_INV_FAIL} (pqQ = ${guard.values.map(fmt).join(", ")} at t = ${guard.points.map(fmt).join(", ")}); no map of the form of mkdv.md §1 exists`,
    };
  }
  let v0: Record<string, number>;
  try {
    const j = coefs.jets(t0, 1);
    v0 = Object.fromEntries(Object.entries(j).map(([k, x]) => [k, x[0]]));
  } catch (err) {
    if (err instanceof JetEvaluationError) return { ok: false, code: "precondition", reason: `coefficients are singular at t0 = ${t0}: ${err.message}` };
    throw err;
  }
  if (v0.p === 0 || v0.q === 0) return { ok: false, code: "precondition", reason: "p(t0) q(t0) = 0: the map needs p q ≠ 0 (mkdv.md §0)" };
  const sigma = Math.sign(v0.p / v0.q) as 1 | -1;
  const beta0 = overrides.beta0 ?? 1;
  if (!(beta0 !== 0 && Number.isFinite(beta0))) return { ok: false, code: "precondition", reason: "beta0 must be a finite nonzero number" };
  const signA0 = (overrides.signA0 ?? 1) < 0 ? -1 : 1;
  const eps0 = overrides.eps0 ?? 0;
  const gamma0 = overrides.gamma0 ?? 0;
  const A0 = signA0 * Math.abs(beta0) * Math.sqrt(6 * Math.abs(v0.q / v0.p));

  const singularTimes: SingularTime[] = [];
  const okAt = (t: number) => {
    const v = coefs.values(t);
    return Number.isFinite(v.p) && Number.isFinite(v.q) && Math.sign(v.p) === Math.sign(v0.p) && Math.sign(v.q) === Math.sign(v0.q);
  };
  const admissible = admissibleEnd(okAt, t0, t1, SCAN_INTERVALS);
  let mapEnd = t1;
  const notes: string[] = [];
  if (admissible < t1) {
    singularTimes.push({ t: admissible, kind: "coefficient-singular", detail: "p or q is not finite, vanishes or changes sign here (mkdv.md §0 precondition)" });
    mapEnd = admissible - SINGULAR_MARGIN_FRACTION * span;
    if (!(mapEnd > t0 + 1e-3 * span)) return { ok: false, code: "precondition", reason: `p or q stops being admissible at t = ${fmt(admissible)}, at the window start` };
  }
  const sys = mapSystem(coefs, beta0);
  const run = integrateOnGrid(sys, uniformGrid(t0, mapEnd, TABLE_INTERVALS), [0, 0, eps0, gamma0]);
  if (!run.ok) {
    if (run.t.length < 3) return { ok: false, code: "integration-failed", reason: `the map ODE failed at the start: ${run.message}` };
    singularTimes.push({ t: run.stoppedAfter, kind: "integration-stopped", detail: `the map ODE (mkdv.md §3) could not be continued: ${run.message}` });
    mapEnd = run.t[run.t.length - 1];
    notes.push(`map window cut at t = ${fmt(mapEnd)} where the ODE stopped (${run.failure})`);
  }
  const table = tabulate(coefs, run.t, run.y, A0, beta0);
  const constants: FreeConstant[] = [
    { name: "sigma", latex: "\\sigma", value: sigma, status: "forced", meaning: "sign of the canonical equation, sign(p/q) (mkdv.md §1 (MKM))" },
    { name: "|A0|", latex: "|A_0|", value: Math.abs(A0), status: "forced", meaning: "amplitude |beta0| sqrt(6|q0/p0|), forced by (MKM)" },
    { name: "signA0", latex: "\\operatorname{sign} A_0", value: signA0, status: "free", defaultValue: 1, meaning: "the symmetry U → −U" },
    { name: "beta0", latex: "\\beta_0", value: beta0, status: "free", defaultValue: 1, meaning: "scaling U → λ U(λX, λ³T)" },
    { name: "eps0", latex: "\\varepsilon_0", value: eps0, status: "free", defaultValue: 0, meaning: "space translation" },
    { name: "gamma0", latex: "\\gamma_0", value: gamma0, status: "free", defaultValue: 0, meaning: "time translation" },
  ];
  const identity = Math.abs(Math.abs(v0.p) - 6 * Math.abs(v0.q)) <= 1e-14 * Math.abs(v0.p) && beta0 === 1 && signA0 === 1 && eps0 === 0 && gamma0 === 0;
  return {
    ok: true, class: "mkdv", sigma,
    requestedWindow: [t0, t1], mapWindow: [t0, mapEnd],
    truncation: mapEnd < t1 ? { at: mapEnd, reason: singularTimes.map((s) => s.detail).join("; ") } : undefined,
    constants,
    identityAtStart: { holds: identity, condition: "the map is the identity at t0 iff |p0| = 6|q0| (with the default free constants) (mkdv.md §4)" },
    formulas: mkdvFormulas(coefs, { t0, A0, beta0, eps0, gamma0 }, table),
    table, singularTimes,
    checks: { invariantRho: guard.rho, invariantPoints: guard.points },
    integrator: integratorEvidence(table.t.length, run),
    plot: scalarMapPlot(coefs, t0, t1, table),
    notes,
  };
}

/** Values and slopes of A, β, ε, γ ((MK1)–(MK4)). */
function tabulate(coefs: CoefficientSet, t: number[], ys: number[][], A0: number, beta0: number): MapTable {
  const values: Record<string, number[]> = { A: [], beta: [], eps: [], gamma: [] };
  const slopes: Record<string, number[]> = { A: [], beta: [], eps: [], gamma: [] };
  for (let i = 0; i < t.length; i++) {
    const v = coefs.values(t[i]);
    const A = A0 * Math.exp(-ys[i][0]);
    const beta = beta0 * Math.exp(-ys[i][1]);
    values.A.push(A);
    slopes.A.push(-v.r * A);
    values.beta.push(beta);
    slopes.beta.push(-v.s * beta);
    values.eps.push(ys[i][2]);
    slopes.eps.push(-v.g * beta);
    values.gamma.push(ys[i][3]);
    slopes.gamma.push(v.q * beta * beta * beta);
  }
  return { class: "mkdv", t: [...t], values, slopes };
}
