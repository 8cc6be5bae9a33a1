/**
 * The screen of a design: the ordinary pipeline's evidence in the design's terms (closed forms),
 * and the invariant statistic from tabulated states (numerical designs; nls.md §3 "Numerical
 * decision" thresholds, README "Verdict vocabulary"), plus the map of the designed model.
 */
import { createRng, hashSeed } from "../random";
import { INVARIANTS } from "../reducibility";
import type { VariantReport } from "../report";
import type { EquationClass, Variant } from "../spec/types";
import { RHO_INV_FAIL, RHO_INV_PASS } from "../tolerances";
import { buildTransformation } from "../transform";
import type { Expr } from "../expr";
import { coefficientJets, solutionJet } from "./jets";
import type { NumericSystem } from "./solvers";
import { invariantStatistic } from "./statistic";
import type { DesignPole, DesignScreening, DesignTransformation, PointStatistic } from "./types";

const STATISTIC_ORDERS = 3;

function verdictOf(rhoMax: number): DesignScreening["reducibility"] {
  if (rhoMax <= RHO_INV_PASS) return "reducible";
  if (rhoMax >= RHO_INV_FAIL) return "not-reducible";
  return "undecided";
}

/** The pipeline's evidence in the design's terms. */
export type PipelineScreening = Extract<DesignScreening, { kind: "pipeline" }>;

export function pipelineScreening(report: VariantReport): PipelineScreening {
  const r = report.reducibility;
  const samples: PointStatistic[] = r.evidence.windows.flatMap((w) =>
    w.samples.map((s) => ({ t: s.t, rho: s.orders.map((o) => o.rho), residual: s.orders.map((o) => o.residual) })),
  );
  const rhoMax = Math.max(0, ...r.evidence.windows.map((w) => w.rhoMax));
  const p = report.painleve;
  return {
    kind: "pipeline",
    reducibility: r.verdict,
    painleve: p.verdict,
    painleveReason: "reason" in p && typeof p.reason === "string" ? p.reason : undefined,
    invariant: r.evidence.invariant,
    rhoMax,
    samples,
    summary: r.summary,
    precision: r.evidence.precision,
    engine: report.engine,
  };
}

export function transformationSummary(variant: Variant): DesignTransformation | undefined {
  try {
    const t = buildTransformation(variant);
    if (!t.ok) return undefined;
    return {
      sigma: t.sigma,
      mapWindow: t.mapWindow,
      identityAtStart: t.identityAtStart,
      formulas: t.formulas.map((f) => ({ name: f.name, latex: f.latex, closedForm: f.closedForm })),
      singularTimes: t.singularTimes.map((s) => ({ t: s.t, kind: s.kind, detail: s.detail })),
    };
  } catch {
    return undefined;
  }
}

/** Interior sample nodes for the numerical statistic, away from poles and from the ends. */
export function sampleNodes(t: number[], poles: DesignPole[], seed: number, key: string): number[] {
  const rng = createRng(hashSeed("design", key, seed));
  const span = t[t.length - 1] - t[0];
  const usable = t.map((_, i) => i).filter((i) => {
    const x = t[i];
    return x - t[0] > 0.05 * span && t[t.length - 1] - x > 0.05 * span && poles.every((p) => Math.abs(p.t - x) > 0.02 * span);
  });
  const out: number[] = [];
  for (let k = 0; k < 3 && usable.length > 0; k++) out.push(usable.splice(Math.floor(rng.next() * usable.length), 1)[0]);
  return out.sort((a, b) => a - b);
}

export function numericalScreening(req: { cls: EquationClass; unknown: string; coefficients: Record<string, Expr> }, system: NumericSystem, t: number[], states: number[][], nodes: number[]): DesignScreening {
  const def = INVARIANTS[req.cls];
  const order = STATISTIC_ORDERS - 1 + def.maxDerivative;
  const samples: PointStatistic[] = [];
  let rhoMax = 0;
  for (const i of nodes) {
    const cj = coefficientJets(req.coefficients, t[i], order, Math.max(system.maxDerivative, 1));
    const jets: Record<string, number[]> = {};
    for (const name of def.inputs) jets[name] = name === req.unknown ? system.output(cj, solutionJet(system.rhs, cj, states[i])) : cj.get(name);
    const stats = invariantStatistic(req.cls, jets, STATISTIC_ORDERS);
    for (const s of stats) rhoMax = Math.max(rhoMax, Number.isFinite(s.rho) ? s.rho : Infinity);
    samples.push({ t: t[i], rho: stats.map((s) => s.rho), residual: stats.map((s) => s.residual) });
  }
  const verdict = samples.length === 0 ? "undecided" : verdictOf(rhoMax);
  return {
    kind: "numerical-design",
    reducibility: verdict,
    invariant: def.symbol,
    rhoMax,
    samples,
    summary: `numerical design: rho_inv ≤ ${rhoMax.toExponential(1)} at ${samples.length} tabulated points (Taylor orders 0–2), with the solved coefficient's jets generated from the tabulated states`,
  };
}
