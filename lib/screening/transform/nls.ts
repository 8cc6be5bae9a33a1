/**
 * vc-NLS → canonical NLS: the explicit map of ../shared/math/nls.md §5 tabulated by integrating
 *   Λ' = −(W + c), γ' = a e^{2Λ}, δ' = f − 2g α_r − (W + c) δ, ε' = −(2a δ + g) β, κ' = e − a δ² − g δ
 * (β = sign(β0) e^Λ, α_r = W/(4a), W = a'/a − h'/h + 2(k − c) from coefficient jets), plus the
 * linear characteristic equation (L) μ'' − (a'/a − 2c) μ' − 4ab μ = 0 of nls.md §2 for the
 * focusing times (zeros of μ, nls.md §7) and as an independent route to β.
 */
import { DoubleField, JetEvaluationError, jetDerivative, jetDiv, jetScale, jetSub, jetAdd } from "../expr";
import type { Variant } from "../spec/types";
import { integrateOnGrid, refineZero, uniformGrid, type OdeSystem } from "../ode";
import { ODE_ABS_TOL, ODE_REL_TOL, RHO_INV_FAIL, SINGULAR_MARGIN_FRACTION } from "../tolerances";
import type { CoefficientSet } from "./coefficients";
import { sampleInvariant } from "./invariants";
import {
  SCAN_INTERVALS, TABLE_INTERVALS, curve, firstFailure, fmt, guardPoints, maxRelDiff,
} from "./common";
import { nlsFormulas } from "./formulas-nls";
import type {
  ConstantOverrides, FreeConstant, MapTable, SingularTime, TransformationResult,
} from "./types";

const F = DoubleField;

/** W = a'/a − h'/h + 2(k − c) as a jet (nls.md §3), one order below the input jets. */
export function wJet(j: Record<string, number[]>): number[] {
  const n = j.a.length - 1;
  const a = j.a.slice(0, n);
  const h = j.h.slice(0, n);
  const la = jetDiv(jetDerivative(j.a, F), a, F);
  const lh = jetDiv(jetDerivative(j.h, F), h, F);
  const kc = jetScale(jetSub(j.k.slice(0, n), j.c.slice(0, n), F), 2, F);
  return jetAdd(jetSub(la, lh, F), kc, F);
}

/** The linear system for (μ, μ', ∫c) of nls.md §2 (L). */
function muSystem(coefs: CoefficientSet): OdeSystem {
  return {
    dimension: 3,
    rhs(t, y) {
      const j = coefs.jets(t, 1);
      const a = j.a[0];
      const la = j.a[1] / a;
      return [y[1], (la - 2 * j.c[0]) * y[1] + 4 * a * j.b[0] * y[0], j.c[0]];
    },
  };
}

/** The quadrature system of nls.md §5 "For numerical work", y = (Λ, γ, δ, ε, κ). */
function mapSystem(coefs: CoefficientSet, betaSign: number): OdeSystem {
  return {
    dimension: 5,
    rhs(t, y) {
      const j = coefs.jets(t, 1);
      const a = j.a[0];
      const W = j.a[1] / a - j.h[1] / j.h[0] + 2 * (j.k[0] - j.c[0]);
      const alpha = W / (4 * a);
      const [L, , delta] = y;
      const beta = betaSign * Math.exp(L);
      const g = j.g[0];
      return [
        -(W + j.c[0]),
        a * beta * beta,
        j.f[0] - 2 * g * alpha - (W + j.c[0]) * delta,
        -(2 * a * delta + g) * beta,
        j.e[0] - a * delta * delta - g * delta,
      ];
    },
  };
}

function coefficientsOk(coefs: CoefficientSet, sigma: number, aSign: number) {
  return (t: number): boolean => {
    const v = coefs.values(t);
    return Number.isFinite(v.a) && Number.isFinite(v.h) && v.a !== 0 && v.h !== 0 &&
      Math.sign(v.a) === aSign && Math.sign(v.h / v.a) === sigma;
  };
}

export function buildNlsTransformation(variant: Variant, coefs: CoefficientSet, overrides: ConstantOverrides = {}): TransformationResult {
  const [t0, t1] = variant.window;
  const span = t1 - t0;
  const guard = sampleInvariant(coefs, guardPoints(t0, t1));
  if (Number.isNaN(guard.rho)) {
    return { ok: false, code: "precondition", reason: "the invariant R could not be evaluated at any sample point of the window (coefficients singular there)" };
  }
  if (guard.rho >= RHO_INV_FAIL) {
    return {
      ok: false, code: "not-reducible",
      reason: `the invariant R of nls.md §3 is not zero: rho_inv = ${fmt(guard.rho)} ≥ ${RHO_INV_FAIL} (−a²h²R = ${guard.values.map(fmt).join(", ")} at t = ${guard.points.map(fmt).join(", ")}); no map of the form of nls.md §1 exists`,
    };
  }
  let j0: Record<string, number[]>;
  try {
    j0 = coefs.jets(t0, 2);
  } catch (err) {
    if (err instanceof JetEvaluationError) return { ok: false, code: "precondition", reason: `coefficients are singular at the window start t0 = ${t0}: ${err.message}` };
    throw err;
  }
  const a0 = j0.a[0];
  const h0 = j0.h[0];
  if (a0 === 0 || h0 === 0) return { ok: false, code: "precondition", reason: "a(t0) h(t0) = 0: the map needs a h ≠ 0 (nls.md §0); h ≡ 0 is the linear case" };
  const sigma = (Math.sign(h0 / a0) as 1 | -1);
  const W0 = wJet(j0)[0];
  const alpha0 = W0 / (4 * a0);

  const beta0 = overrides.beta0 ?? 1;
  if (!(beta0 !== 0 && Number.isFinite(beta0))) return { ok: false, code: "precondition", reason: "beta0 must be a finite nonzero number" };
  const gamma0 = overrides.gamma0 ?? 0;
  const delta0 = overrides.delta0 ?? 0;
  const eps0 = overrides.eps0 ?? 0;
  const kappa0 = overrides.kappa0 ?? 0;
  const A0 = Math.abs(beta0) * Math.sqrt(2 * Math.abs(a0 / h0));

  // 1. Where the coefficients stay admissible (finite, a h ≠ 0, fixed signs).
  const singularTimes: SingularTime[] = [];
  const okAt = coefficientsOk(coefs, sigma, Math.sign(a0));
  const scan = uniformGrid(t0, t1, SCAN_INTERVALS);
  let admissibleEnd = t1;
  for (let i = 1; i < scan.length; i++) {
    if (!okAt(scan[i])) {
      admissibleEnd = firstFailure(okAt, scan[i - 1], scan[i], 1e-12 * Math.max(1, Math.abs(t1)));
      break;
    }
  }

  // 2. μ from the linear equation (L): zeros are focusing times (nls.md §7).
  const muSys = muSystem(coefs);
  const muInit = [1, W0, 0];
  // (L) involves a, b, c only, so μ continues through a pole of h (where it has its zero).
  const muRun = integrateOnGrid(muSys, scan, muInit);
  const muEnd = muRun.t[muRun.t.length - 1];
  let stop = admissibleEnd;
  for (let i = 1; i < muRun.t.length; i++) {
    const prev = muRun.y[i - 1][0];
    const cur = muRun.y[i][0];
    if (prev !== 0 && Math.sign(cur) !== Math.sign(prev)) {
      const tz = refineZero(muSys, muRun.t[i - 1], muRun.y[i - 1], muRun.t[i], 0, 1e-13 * Math.max(1, Math.abs(t1)));
      const slope = integrateOnGrid(muSys, [muRun.t[i - 1], tz], muRun.y[i - 1]);
      const muPrime = slope.ok ? slope.y[1][1] : NaN;
      singularTimes.push({
        t: tz, kind: "focusing",
        detail: `zero of mu (nls.md §7): mu'(t*) = ${fmt(muPrime)}; beta ~ 1/(t − t*), A ~ |t − t*|^(-1/2), the width tends to 0 and |h| has a pole there`,
      });
      if (stop > tz) stop = tz;
    }
  }
  if (admissibleEnd < t1 && !singularTimes.some((s) => Math.abs(s.t - admissibleEnd) < 1e-6 * span)) {
    singularTimes.push({ t: admissibleEnd, kind: "coefficient-singular", detail: "a or h is not finite, vanishes or changes sign here (nls.md §0 precondition; split the window there)" });
  }
  if (!muRun.ok && muEnd < stop) {
    singularTimes.push({ t: muRun.stoppedAfter, kind: "integration-stopped", detail: `the linear mu equation could not be continued: ${muRun.message}` });
    stop = Math.min(stop, muRun.stoppedAfter);
  }
  singularTimes.sort((x, y) => x.t - y.t);
  let mapEnd = stop < t1 ? stop - SINGULAR_MARGIN_FRACTION * span : t1;
  if (!(mapEnd > t0 + 1e-3 * span)) {
    return { ok: false, code: "precondition", reason: `a singular time t* = ${fmt(stop)} lies at the window start; no map window remains` };
  }

  // 3. The quadrature system on the map window.
  const betaSign = Math.sign(beta0);
  const sys = mapSystem(coefs, betaSign);
  const grid = uniformGrid(t0, mapEnd, TABLE_INTERVALS);
  const run = integrateOnGrid(sys, grid, [Math.log(Math.abs(beta0)), gamma0, delta0, eps0, kappa0]);
  const notes: string[] = [];
  if (!run.ok) {
    if (run.t.length < 3) return { ok: false, code: "integration-failed", reason: `the map ODE failed at the start: ${run.message}` };
    singularTimes.push({ t: run.stoppedAfter, kind: "integration-stopped", detail: `the map ODE (nls.md §5) could not be continued: ${run.message}` });
    mapEnd = run.t[run.t.length - 1];
    notes.push(`map window cut at t = ${fmt(mapEnd)} where the quadrature system stopped (${run.failure})`);
  }
  const table = tabulate(coefs, run.t, run.y, betaSign);
  // μ on the same nodes, for the second route to β and the plot.
  const muTable = integrateOnGrid(muSys, run.t, muInit);
  let betaFromMuMaxRelDiff: number | undefined;
  const muValues = muTable.y.map((y) => y[0]);
  if (muTable.ok) {
    const betaMu = muTable.y.map((y) => beta0 / y[0] * Math.exp(-y[2]));
    betaFromMuMaxRelDiff = maxRelDiff(betaMu, table.values.beta);
  }

  const constants: FreeConstant[] = [
    { name: "alpha(t0)", latex: "\\alpha(t_0)", value: alpha0, status: "forced", meaning: "chirp at t0; forced to W(t0)/(4a0) by the matching condition (nls.md §6)" },
    { name: "sigma", latex: "\\sigma", value: sigma, status: "forced", meaning: "sign of the canonical equation, sign(h/a) (nls.md §1 (M))" },
    { name: "A0", latex: "A_0", value: A0, status: "forced", meaning: "amplitude, |beta0| sqrt(2|a0/h0|), forced by the matching condition (M)" },
    { name: "beta0", latex: "\\beta_0", value: beta0, status: "free", defaultValue: 1, meaning: "scaling chi → λ chi(λ xi, λ² tau)" },
    { name: "gamma0", latex: "\\gamma_0", value: gamma0, status: "free", defaultValue: 0, meaning: "time translation of the canonical equation" },
    { name: "delta0", latex: "\\delta_0", value: delta0, status: "free", defaultValue: 0, meaning: "Galilean boost" },
    { name: "eps0", latex: "\\varepsilon_0", value: eps0, status: "free", defaultValue: 0, meaning: "space translation" },
    { name: "kappa0", latex: "\\kappa_0", value: kappa0, status: "free", defaultValue: 0, meaning: "phase rotation" },
  ];
  const identity = Math.abs(W0) <= 1e-14 * (Math.abs(j0.a[1] / a0) + Math.abs(j0.h[1] / h0) + 1) &&
    Math.abs(Math.abs(h0 / a0) - 2) <= 1e-14 && beta0 === 1 && gamma0 === 0 && delta0 === 0 && eps0 === 0 && kappa0 === 0;
  const formulas = nlsFormulas(coefs, { t0, beta0, gamma0, delta0, eps0, kappa0, sigma }, table);

  const coefCurves = uniformGrid(t0, t1, 199).map((t) => coefs.values(t));
  const tc = uniformGrid(t0, t1, 199);
  return {
    ok: true,
    class: "nls",
    sigma,
    requestedWindow: [t0, t1],
    mapWindow: [t0, mapEnd],
    truncation: mapEnd < t1 ? { at: mapEnd, reason: `stopped ${fmt(SINGULAR_MARGIN_FRACTION * 100)}% of the window before the singular time t* = ${fmt(stop)}` } : undefined,
    constants,
    identityAtStart: {
      holds: identity,
      condition: "the map is the identity at t0 iff W(t0) = 0 and |h0/a0| = 2 (with the default free constants) (nls.md §6)",
    },
    formulas,
    table,
    singularTimes,
    checks: { invariantRho: guard.rho, invariantPoints: guard.points, betaFromMuMaxRelDiff },
    integrator: {
      method: "odex (Gragg–Bulirsch–Stoer extrapolation), restarted at each node",
      relTol: ODE_REL_TOL, absTol: ODE_ABS_TOL, nodes: table.t.length,
      evaluations: run.stats.evaluations + muRun.stats.evaluations,
      acceptedSteps: run.stats.acceptedSteps + muRun.stats.acceptedSteps,
      rejectedSteps: run.stats.rejectedSteps + muRun.stats.rejectedSteps,
    },
    plot: {
      coefficients: coefs.names.map((n) => curve(n, n, tc, coefCurves.map((v) => v[n]))),
      mapCurves: [
        curve("mu", "\\mu", muTable.t, muValues),
        curve("beta", "\\beta", table.t, table.values.beta),
        curve("gamma", "\\gamma", table.t, table.values.gamma),
      ],
    },
    notes,
  };
}

/** Values and slopes of A, α, β, γ, δ, ε, κ at the nodes (slopes: (S2)–(S7); α' from jets of W/(4a)). */
function tabulate(coefs: CoefficientSet, t: number[], ys: number[][], betaSign: number): MapTable {
  const names = ["A", "alpha", "beta", "gamma", "delta", "eps", "kappa"];
  const values: Record<string, number[]> = {};
  const slopes: Record<string, number[]> = {};
  for (const n of names) {
    values[n] = [];
    slopes[n] = [];
  }
  const sys = mapSystem(coefs, betaSign);
  for (let i = 0; i < t.length; i++) {
    const j = coefs.jets(t[i], 2);
    const W = wJet(j);
    const a = j.a[0];
    const alphaJet = jetDiv(W, jetScale(j.a.slice(0, 2), 4, F), F);
    const y = ys[i];
    const d = sys.rhs(t[i], y);
    const beta = betaSign * Math.exp(y[0]);
    const A = Math.abs(beta) * Math.sqrt(2 * Math.abs(a / j.h[0]));
    const put = (n: string, v: number, s: number) => {
      values[n].push(v);
      slopes[n].push(s);
    };
    put("A", A, -(2 * a * alphaJet[0] + j.k[0]) * A);
    put("alpha", alphaJet[0], alphaJet[1]);
    put("beta", beta, d[0] * beta);
    put("gamma", y[1], d[1]);
    put("delta", y[2], d[2]);
    put("eps", y[3], d[3]);
    put("kappa", y[4], d[4]);
  }
  return { class: "nls", t: [...t], values, slopes };
}
