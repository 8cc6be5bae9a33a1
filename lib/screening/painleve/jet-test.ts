/**
 * The jet test at all sample points (../shared/math/painleve.md §6 Steps 1–6), in whichever
 * arithmetic `alg` provides. Returns the raw outcome; the verdict is made in verdict.ts.
 */
import type { Expr } from "../expr/types";
import { PAINLEVE_REDRAWS, PAINLEVE_TAYLOR_ORDERS } from "../tolerances";
import type { PointDraws } from "./draws";
import { ZeroPivotError, type Complex, type JetAlgebra } from "./jet-algebra";
import { doubleJets, type DoubleJet } from "./double-jets";
import { leadingBranches, MultipleRootError, type Branch, type ExpansionSetup } from "./leading";
import { cabs, cdiv } from "./polynomial";
import { pointContext } from "./residual";
import { resonances, runBranch, type ResonanceResult } from "./recursion";
import type { BranchEvidence, ConditionEvidence, EquationTemplate, PointEvidence } from "./types";

export type JetTestOutcome =
  | { kind: "ok"; points: PointEvidence[]; draws: PointDraws[]; resonances: number[]; flagged: number[]; minValid: number; leadingConsistency?: number }
  | { kind: "inconsistent"; ratio: number; detail: string; t: number }
  | { kind: "non-integer"; root: Complex; roots: Complex[]; t: number }
  | { kind: "not-covered"; detail: string }
  | { kind: "evaluation-failed"; detail: string };

type PointOutcome =
  | { kind: "ok"; evidence: PointEvidence; resonances: number[]; minValid: number; consistency?: number }
  | Exclude<JetTestOutcome, { kind: "ok" }>;

/** -0 → 0, so the evidence survives a JSON round trip unchanged. */
const plusZero = (z: Complex): Complex => ({ re: z.re + 0, im: z.im + 0 });

const isSingular = (err: unknown): boolean =>
  err instanceof ZeroPivotError || (err instanceof Error && err.name === "JetEvaluationError");

/** rho_P per Taylor order m < min(3, valid): |C_m| / scale_m (0/0 counts as 0; §6 Step 6). */
function rhoByOrder(mod: Float64Array, scale: Float64Array, valid: number): number[] {
  const out: number[] = [];
  for (let m = 0; m < Math.min(PAINLEVE_TAYLOR_ORDERS, valid); m++) {
    out.push(mod[m] === 0 ? 0 : scale[m] === 0 ? 1 : mod[m] / scale[m]);
  }
  return out;
}

/**
 * Step 4 needs M(j) at τ^0 only, which depends on Taylor orders 0..(highest t-derivative) of the
 * inputs: it is computed in a double algebra of that length (exact at τ^0, and cheap).
 */
function resonancesAtOrderZero<J, T>(
  alg: JetAlgebra<J, T>,
  template: EquationTemplate,
  coefficients: Record<string, Expr>,
  setup: ExpansionSetup,
  draws: PointDraws,
  lead: Branch<J>,
): ResonanceResult {
  const small = doubleJets(setup.maxTimeDerivative + 1);
  const ctx = pointContext(small, template, coefficients, draws.tText, draws.psi);
  const shortLead: Branch<DoubleJet> = {};
  for (const v of setup.variables) {
    const c = Array.from({ length: small.N }, (_, m) => alg.coefficient(lead[v], m));
    shortLead[v] = small.fromDoubles(c.map((z) => z.re), c.map((z) => z.im));
  }
  return resonances(ctx, setup, shortLead);
}

function runPoint<J, T>(
  alg: JetAlgebra<J, T>,
  template: EquationTemplate,
  coefficients: Record<string, Expr>,
  setup: ExpansionSetup,
  draws: PointDraws,
  known?: number[],
): PointOutcome {
  const ctx = pointContext(alg, template, coefficients, draws.tText, draws.psi);
  const system = setup.variables.length > 1;
  const u0 = system && draws.u0 ? alg.fromDoubles(draws.u0.map((c) => c.re), draws.u0.map((c) => c.im)) : null;
  const lead = leadingBranches(ctx, setup, u0);
  if (lead.kind === "inconsistent") return { kind: "inconsistent", ratio: lead.ratio, detail: lead.detail, t: ctx.t };
  if (lead.kind === "not-covered") return { kind: "not-covered", detail: lead.detail };
  const branches: BranchEvidence[] = [];
  let minValid = alg.N;
  let found: number[] = [];
  for (const b of lead.branches) {
    const res: ResonanceResult = known ? { kind: "integer", resonances: known, determinants: [] } : resonancesAtOrderZero(alg, template, coefficients, setup, draws, b);
    if (res.kind === "non-integer") return { kind: "non-integer", root: res.root, roots: res.roots, t: ctx.t };
    found = res.resonances;
    const positive = res.resonances.filter((r) => r > 0);
    if (new Set(positive).size !== positive.length) {
      return { kind: "not-covered", detail: `a multiple positive resonance (${positive.join(", ")})` };
    }
    const J = positive.length ? Math.max(...positive) : 0;
    const run = runBranch(ctx, setup, b, new Set(positive), J, () => {
      const c = draws.nextFree();
      return alg.fromDoubles(c.map((z) => z.re), c.map((z) => z.im));
    });
    const conditions: ConditionEvidence[] = run.conditions.map((c) => {
      const valid = alg.valid(c.value);
      minValid = Math.min(minValid, valid);
      const rhos = rhoByOrder(alg.modulus(c.value), c.scale, valid);
      const lambda = Number.isFinite(c.normalisation.re) && cabs(c.normalisation) > 0 ? c.normalisation : { re: 1, im: 0 };
      return {
        resonance: c.resonance,
        value: plusZero(cdiv(alg.coefficient(c.value, 0), lambda)),
        scale: c.scale[0],
        scaleNormalised: c.scale[0] / cabs(lambda),
        rhoByOrder: rhos,
        rho: rhos.length ? Math.max(...rhos) : 0,
        valid,
      };
    });
    const coeffs: Record<string, Complex[]> = {};
    const leading: Record<string, Complex> = {};
    for (const v of setup.variables) {
      coeffs[v] = run.known[v].map((w) => alg.coefficient(w, 0));
      leading[v] = alg.coefficient(b[v], 0);
    }
    branches.push({ leading, coefficients: coeffs, resonances: res.resonances, determinants: res.determinants, conditions });
  }
  for (const br of branches) {
    for (const c of br.conditions) {
      if (!Number.isFinite(c.rho)) return { kind: "evaluation-failed", detail: `non-finite condition at t = ${ctx.t}` };
    }
  }
  return {
    kind: "ok",
    evidence: { t: ctx.t, draws: 1, branches },
    resonances: found,
    minValid,
    consistency: lead.consistency,
  };
}

/**
 * The jet test at `count` points. `drawsFor(i, attempt)` supplies the inputs; a singular point
 * (non-finite coefficient, zero pivot) is redrawn up to PAINLEVE_REDRAWS times (§6 Step 1).
 * `knownResonances` (from an earlier run at the same points) skips Step 4.
 */
export function runJetTest<J, T>(
  alg: JetAlgebra<J, T>,
  template: EquationTemplate,
  coefficients: Record<string, Expr>,
  setup: ExpansionSetup,
  count: number,
  drawsFor: (index: number, attempt: number) => PointDraws,
  maxAttempts = PAINLEVE_REDRAWS,
  knownResonances?: number[],
): JetTestOutcome {
  const points: PointEvidence[] = [];
  const used: PointDraws[] = [];
  let minValid = alg.N;
  let resonancesFound: number[] = [];
  let consistency: number | undefined;
  for (let i = 0; i < count; i++) {
    let outcome: PointOutcome | null = null;
    let lastError = "";
    let attempt = 0;
    let draws: PointDraws | null = null;
    for (; attempt < maxAttempts && !outcome; attempt++) {
      draws = drawsFor(i, attempt);
      try {
        outcome = runPoint(alg, template, coefficients, setup, draws, knownResonances);
      } catch (err) {
        if (err instanceof MultipleRootError) return { kind: "not-covered", detail: err.message };
        if (!isSingular(err)) {
          return { kind: "evaluation-failed", detail: err instanceof Error ? err.message : String(err) };
        }
        lastError = `${(err as Error).message} at t = ${draws.tText}`;
      }
    }
    if (!outcome || !draws) {
      return { kind: "evaluation-failed", detail: `no regular sample point after ${maxAttempts} draws (${lastError})` };
    }
    if (outcome.kind !== "ok") return outcome;
    outcome.evidence.draws = attempt;
    points.push(outcome.evidence);
    used.push(draws);
    minValid = Math.min(minValid, outcome.minValid);
    resonancesFound = outcome.resonances;
    if (outcome.consistency !== undefined) consistency = Math.max(consistency ?? 0, outcome.consistency);
  }
  const flagged = resonancesFound.filter((r) => r < -1);
  return { kind: "ok", points, draws: used, resonances: resonancesFound, flagged, minValid, leadingConsistency: consistency };
}
