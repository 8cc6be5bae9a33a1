/**
 * The Painlevé verdict for one family member (../shared/math/painleve.md §6 Steps 0–8, §7):
 * dominant balance from the terms, the jet test in double, the closed-form oracle and the class
 * invariant (built-in classes), the combination table of Step 7 and the extended-precision
 * recheck of §7 for everything not settled in double.
 */
import type { Expr } from "../expr/types";
import { decimalField } from "../expr";
import {
  PAINLEVE_MAX_JET_LENGTH,
  PAINLEVE_RECHECK_DIGITS,
  PAINLEVE_SAMPLE_POINTS,
  PAINLEVE_TAYLOR_ORDERS,
  RHO_INV_FAIL,
  RHO_INV_PASS,
  RHO_P_FAIL,
  RHO_P_PASS,
  UNIT_ROUNDOFF_DOUBLE,
} from "../tolerances";
import { unitRoundoff, zeroTest } from "../zero";
import { determinantDegree, dominantBalances, leadDegree, rationalText } from "./balance";
import { symbolicCondition } from "./condition-latex";
import { doubleJets } from "./double-jets";
import { fixedDraws, randomDraws, replayDraws, type PointDraws } from "./draws";
import { fieldJets } from "./field-jets";
import { invariantSource } from "./invariants";
import type { JetAlgebra } from "./jet-algebra";
import { runJetTest, type JetTestOutcome } from "./jet-test";
import type { ExpansionSetup } from "./leading";
import { applyOracle, doubleInvariant } from "./class-checks";
import { prepare, type Prepared } from "./prepare";
import {
  combine,
  complexText,
  jetEvidence,
  resonanceSummary,
  settledInDouble,
  type InvariantCall,
} from "./decision";
import type {
  EquationTemplate,
  PainleveEvidence,
  PainleveOptions,
  PainleveResult,
  PainleveVerdict,
} from "./types";

export { PASS_REASON, PASS_REASON_NO_INVARIANT } from "./decision";

function emptyEvidence(template: EquationTemplate, seed: number, parameters: Record<string, number>): PainleveEvidence {
  return {
    template: template.id,
    class: template.classOracle ?? null,
    seed,
    balances: [],
    exponents: null,
    lowest: null,
    determinantDegree: null,
    resonances: null,
    flaggedResonances: [],
    conditions: [],
    jet: null,
    parameters,
    notes: [],
  };
}

function result(verdict: PainleveVerdict, reason: string, evidence: PainleveEvidence): PainleveResult {
  return { verdict, reason, evidence } as PainleveResult;
}

/** Run the jet test in `alg`, doubling N while a condition has fewer than 3 valid orders (§6 Step 6). */
function jetRun<J, T>(
  makeAlg: (N: number) => JetAlgebra<J, T>,
  N0: number,
  prepared: Prepared,
  setup: ExpansionSetup,
  count: number,
  drawsFor: (N: number) => (i: number, attempt: number) => PointDraws,
  maxAttempts?: number,
  knownResonances?: number[],
): { outcome: JetTestOutcome; alg: JetAlgebra<J, T> } {
  let N = N0;
  for (;;) {
    const alg = makeAlg(N);
    const outcome = runJetTest(alg, prepared.template, prepared.coefficients, setup, count, drawsFor(N), maxAttempts, knownResonances);
    if (outcome.kind !== "ok" || outcome.minValid >= PAINLEVE_TAYLOR_ORDERS || 2 * N > PAINLEVE_MAX_JET_LENGTH) return { outcome, alg };
    N *= 2;
  }
}

/** The Painlevé test on an equation template with numeric coefficients (painleve.md §6). */
export function runPainleveOnTerms(
  template: EquationTemplate,
  coefficients: Record<string, Expr>,
  window: [number, number],
  options: PainleveOptions = {},
): PainleveResult {
  const seed = options.seed ?? 1;
  const prep = prepare(template, coefficients, options.values ?? {});
  const evidence = emptyEvidence(template, seed, prep.parameters);
  if (!prep.ok) return result("undecided", prep.reason, evidence);
  const prepared = prep.value;
  const tpl = prepared.template;

  // Step 0: dominant balance from the terms.
  const balances = dominantBalances(tpl.equations);
  evidence.balances = balances.map((b) => rationalText(b.alpha));
  if (balances.length === 0) return result("fails", "inconsistent leading order", evidence);
  const integer = balances.filter((b) => b.alpha.q === 1);
  if (integer.length === 0) {
    return result("fails", `non-integer leading exponent (alpha = ${evidence.balances.join(", ")})`, evidence);
  }
  if (integer.length > 1) evidence.notes.push(`several integer balances (${integer.map((b) => b.alpha.p).join(", ")}); the first is tested`);
  const balance = integer[0];
  const setup: ExpansionSetup = {
    variables: tpl.variables,
    alpha: balance.alpha.p,
    lowest: balance.lowest.p,
    leadDegree: leadDegree(tpl.equations, tpl.variables, balance),
    determinantDegree: determinantDegree(tpl.equations, balance),
    maxTimeDerivative: Math.max(0, ...tpl.equations.flat().flatMap((tm) => tm.factors.map((fa) => fa.t))),
  };
  evidence.exponents = Object.fromEntries(tpl.variables.map((v) => [v, String(setup.alpha)]));
  evidence.lowest = setup.lowest;
  evidence.determinantDegree = setup.determinantDegree;

  // Steps 1–6 in double precision.
  const system = tpl.variables.length > 1;
  const count = options.fixed ? options.fixed.points.length : options.points ?? PAINLEVE_SAMPLE_POINTS;
  const drawsFor = (N: number) => (i: number, attempt: number): PointDraws =>
    options.fixed ? fixedDraws(options.fixed, i, system) : randomDraws(seed, i, attempt, window, N, system);
  const { outcome, alg } = jetRun(doubleJets, options.order ?? tpl.defaultJetLength, prepared, setup, count, drawsFor, options.fixed ? 1 : undefined);
  switch (outcome.kind) {
    case "inconsistent":
      evidence.leadingConsistency = outcome.ratio;
      evidence.notes.push(`${outcome.detail} at t = ${outcome.t}`);
      return result("fails", "inconsistent leading order", evidence);
    case "non-integer":
      evidence.notes.push(`resonance roots at t = ${outcome.t}: ${outcome.roots.map(complexText).join(", ")}`);
      return result("fails", `non-integer resonance (r = ${complexText(outcome.root)})`, evidence);
    case "not-covered":
      return result("undecided", `undecided: evaluation failed (not covered: ${outcome.detail})`, evidence);
    case "evaluation-failed":
      return result("undecided", `undecided: evaluation failed (${outcome.detail})`, evidence);
  }
  evidence.resonances = outcome.resonances;
  evidence.flaggedResonances = outcome.flagged;
  if (outcome.leadingConsistency !== undefined) evidence.leadingConsistency = outcome.leadingConsistency;
  const doubleJet = jetEvidence(outcome, alg, { pass: RHO_P_PASS, fail: RHO_P_FAIL });
  evidence.jet = doubleJet;
  evidence.conditions = resonanceSummary(doubleJet);
  if (doubleJet.points.some((p) => p.branches.some((b) => b.conditions.some((c) => c.valid < PAINLEVE_TAYLOR_ORDERS)))) {
    return result("undecided", `undecided: evaluation failed (fewer than ${PAINLEVE_TAYLOR_ORDERS} valid Taylor orders at N = ${alg.N})`, evidence);
  }

  // Step 7: closed-form oracle and invariant (built-in classes only).
  let invariant: InvariantCall = "none";
  let rhoInv: number | null = null;
  const cls = tpl.classOracle;
  if (cls) {
    const engineError = applyOracle(cls, prepared.coefficients, doubleJet, tpl.variables[0]);
    if (engineError) return result("undecided", `undecided: evaluation failed (${engineError})`, evidence);
    const points = doubleJet.points.map((p) => p.t);
    const inv = doubleInvariant(cls, prepared.coefficients, points);
    evidence.invariant = inv.evidence;
    rhoInv = inv.evidence.rhoInv;
    invariant = inv.call;
    try {
      evidence.nontrivialCondition = symbolicCondition(cls, prepared.coefficients);
    } catch (err) {
      evidence.notes.push(`symbolic condition not formed: ${err instanceof Error ? err.message : String(err)}`);
    }
  }

  if (settledInDouble(doubleJet.outcome, invariant) || options.skipRecheck) {
    if (options.skipRecheck && !settledInDouble(doubleJet.outcome, invariant)) evidence.notes.push("extended-precision recheck skipped");
    const v = combine(doubleJet, invariant, rhoInv);
    return result(v.verdict, v.reason, evidence);
  }

  // §7: extended-precision recheck with the same points and draws, thresholds scaled by u_ext/u_double.
  const digits = PAINLEVE_RECHECK_DIGITS;
  const u = unitRoundoff(digits);
  const factor = u / UNIT_ROUNDOFF_DOUBLE;
  const lost = alg.N - outcome.minValid;
  const Nhp = Math.max(PAINLEVE_TAYLOR_ORDERS, lost + PAINLEVE_TAYLOR_ORDERS);
  const recorded = outcome.draws;
  const hp = jetRun(
    (N) => fieldJets(N, decimalField(digits), u, PAINLEVE_TAYLOR_ORDERS),
    Nhp,
    prepared,
    setup,
    recorded.length,
    () => (i) => replayDraws(recorded[i]),
    1,
    outcome.resonances,
  );
  if (hp.outcome.kind !== "ok") {
    const o = hp.outcome;
    const detail = o.kind === "inconsistent" || o.kind === "not-covered" || o.kind === "evaluation-failed" ? o.detail : complexText(o.root);
    return result("undecided", `undecided: evaluation failed (extended-precision recheck: ${o.kind}: ${detail})`, evidence);
  }
  const hpJet = jetEvidence(hp.outcome, hp.alg, { pass: RHO_P_PASS * factor, fail: RHO_P_FAIL * factor });
  evidence.doubleJet = doubleJet;
  evidence.jet = hpJet;
  evidence.conditions = resonanceSummary(hpJet);
  if (cls) {
    // "For undecided, rerun both statistics in extended precision" (painleve.md §9, mitigation 2).
    const zt = zeroTest(invariantSource(cls, prepared.coefficients), doubleJet.points.map((p) => p.t), {
      thresholds: { pass: RHO_INV_PASS, fail: RHO_INV_FAIL },
    });
    if (zt.outcome === "failed") return result("undecided", `undecided: evaluation failed (invariant: ${zt.message})`, evidence);
    invariant = zt.outcome;
    if (evidence.invariant) {
      evidence.invariant.outcome = zt.outcome;
      evidence.invariant.precision = zt.precision;
    }
  }
  const v = combine(hpJet, invariant, rhoInv);
  return result(v.verdict, v.reason, evidence);
}

