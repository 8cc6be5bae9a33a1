/**
 * The engine's pipeline: variant → reducibility → Painlevé test → VariantReport; a family is its
 * variants (sweeps) plus a summary of which pass (DESIGN.md "The flow of data").
 */
import { agreement, runPainleve } from "./painleve";
import { runReducibility } from "./reducibility";
import { buildTransformation } from "./transform";
import { buildSolutions } from "./solutions";
import { verifySolutions } from "./verify";
import type { VerifyOptions } from "./verify";
import type { TransformationRefusal } from "./transform/types";
import { num, substitute, type Expr } from "./expr";
import { createRng, hashSeed } from "./random";
import type { ReducibilityOptions } from "./reducibility";
import type { FamilyReport, FamilySummary, PainleveReport, ReducibilityReport, VariantReport } from "./report";
import type { FamilySpec, Variant } from "./spec/types";
import { ENGINE_VERSION } from "./version";

export type ScreeningStage = "reducibility" | "painleve" | "transformation" | "solutions" | "verification" | "done";

export interface ScreeningOptions extends ReducibilityOptions {
  /** Called as each stage starts, so a job can record where it was. */
  onStage?: (stage: ScreeningStage, where: { familyId: string; variantIndex: number }) => void;
  /** Checked between stages and variants; an aborted signal rejects with its reason. */
  signal?: AbortSignal;
  /** Run the Painlevé stage (default true). */
  painleve?: boolean;
  /** Build the transformation, solutions and numerical check of reducible variants (default true). */
  accepted?: boolean;
  /** Options of the verification stage (grid, steps, skip the split-step run). */
  verify?: VerifyOptions;
}

/** Values for the free parameters from the reducibility stage's first confirmed solution. */
function solvedValues(report: ReducibilityReport): Record<string, number> | null {
  const solutions = report.evidence.freeParameters?.solutions ?? [];
  const chosen = solutions.find((s) => s.verdict === "reducible") ?? solutions[0];
  if (!chosen) return null;
  const values: Record<string, number> = {};
  for (const c of chosen.constraints) values[c.parameter] = c.value;
  return values;
}

/** -0 → 0 throughout (JSON has no negative zero), so a stored report reads back equal. */
function withoutNegativeZero<T>(value: T): T {
  const walk = (x: unknown): unknown => {
    if (typeof x === "number") return x === 0 ? 0 : x;
    if (Array.isArray(x)) return x.map(walk);
    if (x !== null && typeof x === "object") {
      const out: Record<string, unknown> = {};
      for (const [k, v] of Object.entries(x)) out[k] = walk(v);
      return out;
    }
    return x;
  };
  return walk(value) as T;
}

// ---- The single place where the Painlevé stage plugs in (lib/screening/painleve). ----
function painleveStage(variant: Variant, reducibility: ReducibilityReport, options: ScreeningOptions): PainleveReport {
  if (options.painleve === false) return { verdict: "not-run", reason: "the Painlevé stage was switched off" };
  let values: Record<string, number> | undefined;
  if (variant.free.length > 0) {
    values = solvedValues(reducibility) ?? randomValues(variant, options.seed);
  }
  const painleveOptions = values ? { values } : {};
  const run = (v: Variant) => runPainleve(v, options.seed === undefined ? painleveOptions : { ...painleveOptions, seed: options.seed });
  const windows = subWindows(variant, reducibility);
  let result = run(variant);
  if (windows.length > 1) {
    // The window is split at zeros or poles of a, h (p, q): judge each piece on its own, as the
    // reducibility stage does; the member passes only if every piece passes.
    const pieces = windows.map((window) => ({ window, result: run({ ...variant, window }) }));
    const decisive = pieces.find((p) => p.result.verdict === "fails") ?? pieces.find((p) => p.result.verdict === "undecided") ?? pieces[0];
    result = {
      ...decisive.result,
      reason: `${decisive.result.reason} (window split at singular points; judged on [${decisive.window.join(", ")}])`,
      subWindows: pieces.map((p) => ({ window: p.window, verdict: p.result.verdict, reason: p.result.reason })),
    };
  }
  if (values && !solvedValues(reducibility)) {
    const at = Object.entries(values).map(([k, v]) => `${k} = ${v.toPrecision(6)}`).join(", ");
    return withoutNegativeZero({ ...result, reason: `${result.reason} (no integrable value of the free parameters was found; tested at the random value ${at})` });
  }
  return withoutNegativeZero(result);
}

/**
 * The pieces the reducibility stage screened (the window split at zeros and poles of the
 * coefficients that must not vanish), pulled 2 % in from each singular end so that no sample
 * lands on the singularity.
 */
function subWindows(variant: Variant, reducibility: ReducibilityReport): [number, number][] {
  const solution = reducibility.evidence.freeParameters?.solutions.find((s) => s.verdict === "reducible");
  const windows = (solution?.windows ?? reducibility.evidence.windows).map((w) => w.window);
  if (windows.length <= 1) return [variant.window];
  const [t0, t1] = variant.window;
  return windows.map(([a, b]) => {
    const pad = 0.02 * (b - a);
    return [a === t0 ? a : a + pad, b === t1 ? b : b - pad];
  });
}

/**
 * Values for free parameters that the reducibility stage could not solve: a random draw in
 * [0.3, 1.7] (the sampling box of ../shared/ENGINE-NOTES.md §4), so the Painlevé test still judges
 * the member — a family that fails for every value fails at a random one.
 */
function randomValues(variant: Variant, seed = 1): Record<string, number> {
  const rng = createRng(hashSeed(seed, variant.familyId, variant.index, "free-values"));
  return Object.fromEntries(variant.free.map((name) => [name, rng.uniform(0.3, 1.7)]));
}

/** The variant with its free parameters replaced by the first confirmed solution (exact decimals). */
function concreteVariant(variant: Variant, reducibility: ReducibilityReport): Variant | null {
  if (variant.free.length === 0) return variant;
  const solution = reducibility.evidence.freeParameters?.solutions.find((s) => s.verdict === "reducible");
  if (!solution) return null;
  const map: Record<string, Expr> = {};
  for (const c of solution.constraints) map[c.parameter] = num(c.value, c.exact);
  const coefficients = Object.fromEntries(Object.entries(variant.coefficients).map(([k, e]) => [k, substitute(e, map)]));
  const parameters = { ...variant.parameters, ...Object.fromEntries(solution.constraints.map((c) => [c.parameter, c.value])) };
  return { ...variant, coefficients, parameters, free: [] };
}

/**
 * For a reducible variant: the map to canonical form, exact solutions mapped back, and the
 * independent numerical check. A not-reducible or undecided variant gets none, with the reason.
 */
const refusal = (code: TransformationRefusal["code"], reason: string): { transformation: TransformationRefusal } => ({ transformation: { ok: false, code, reason } });

function acceptedStages(variant: Variant, reducibility: ReducibilityReport, options: ScreeningOptions, where: { familyId: string; variantIndex: number }, timings: Record<string, number>) {
  if (options.accepted === false) return refusal("switched-off", "the transformation stage was switched off");
  if (reducibility.verdict !== "reducible") return refusal(reducibility.verdict, `no transformation: the variant is ${reducibility.verdict} (${reducibility.summary})`);
  const concrete = concreteVariant(variant, reducibility);
  if (!concrete) return refusal("free-parameters", "no confirmed value of the free parameters to build the map with");
  const timed = <T>(stage: ScreeningStage, run: () => T): T => {
    options.signal?.throwIfAborted();
    options.onStage?.(stage, where);
    const start = performance.now();
    try {
      return run();
    } finally {
      timings[stage] = performance.now() - start;
    }
  };
  const transformation = timed("transformation", () => buildTransformation(concrete));
  if (!transformation.ok) return { transformation: withoutNegativeZero(transformation) };
  const solutions = timed("solutions", () => buildSolutions(concrete, transformation));
  const verification = timed("verification", () => verifySolutions(concrete, transformation, solutions, options.verify ?? {}));
  return withoutNegativeZero({ transformation, solutions, verification });
}

function failureReason(err: unknown): string {
  return err instanceof Error ? err.message : String(err);
}

/** Screen one variant through every stage. */
export async function screenVariant(variant: Variant, options: ScreeningOptions = {}): Promise<VariantReport> {
  const where = { familyId: variant.familyId, variantIndex: variant.index };
  const timings: Record<string, number> = {};
  options.signal?.throwIfAborted();
  options.onStage?.("reducibility", where);
  let start = performance.now();
  const reducibility = await runReducibility(variant, options);
  timings.reducibility = performance.now() - start;

  options.signal?.throwIfAborted();
  options.onStage?.("painleve", where);
  start = performance.now();
  let painleve: PainleveReport;
  try {
    painleve = painleveStage(variant, reducibility, options);
  } catch (err) {
    painleve = { verdict: "not-run", reason: `the Painlevé stage failed: ${err instanceof Error ? err.message : String(err)}` };
  }
  timings.painleve = performance.now() - start;
  let accepted: ReturnType<typeof acceptedStages>;
  try {
    accepted = acceptedStages(variant, reducibility, options, where, timings);
  } catch (err) {
    if (options.signal?.aborted) throw err;
    accepted = refusal("stage-failed", `the transformation stages failed: ${failureReason(err)}`);
  }
  options.onStage?.("done", where);
  return {
    familyId: variant.familyId,
    index: variant.index,
    class: variant.class,
    parameters: { ...variant.parameters },
    free: [...variant.free],
    window: [variant.window[0], variant.window[1]],
    engine: ENGINE_VERSION,
    reducibility,
    painleve,
    agreement: painleve.verdict === "not-run" ? "inconclusive" : agreement(reducibility.verdict, painleve.verdict),
    ...accepted,
    timings,
  };
}

function describe(v: VariantReport): string {
  const params = Object.entries(v.parameters).map(([k, x]) => `${k} = ${x}`);
  return params.length > 0 ? `#${v.index} (${params.join(", ")})` : `#${v.index}`;
}

/** Which variants pass, in words and as index lists. */
export function summarise(variants: VariantReport[]): FamilySummary {
  const by = (verdict: string): number[] => variants.filter((v) => v.reducibility.verdict === verdict).map((v) => v.index);
  const reducible = by("reducible");
  const notReducible = by("not-reducible");
  const undecided = by("undecided");
  const passing = variants.filter((v) => v.reducibility.verdict === "reducible").map(describe);
  let text: string;
  if (variants.length === 1) text = `the member is ${variants[0].reducibility.verdict}`;
  else if (reducible.length === variants.length) text = `all ${variants.length} variants are reducible`;
  else if (reducible.length === 0) text = `none of the ${variants.length} variants is reducible`;
  else text = `${reducible.length} of ${variants.length} variants are reducible: ${passing.join(", ")}`;
  if (undecided.length > 0 && variants.length > 1) text += `; undecided: ${undecided.map((i) => `#${i}`).join(", ")}`;
  return { variants: variants.length, reducible, notReducible, undecided, text };
}

/** Screen every variant of a family (sweeps give one variant each). */
export async function screenFamily(spec: FamilySpec, options: ScreeningOptions = {}): Promise<FamilyReport> {
  const variants: VariantReport[] = [];
  for (const variant of spec.variants) variants.push(await screenVariant(variant, options));
  return {
    id: spec.id,
    title: spec.title,
    class: spec.class,
    engine: ENGINE_VERSION,
    errors: [],
    variants,
    summary: summarise(variants),
  };
}
