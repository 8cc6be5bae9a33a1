/**
 * Benchmark of the Painlevé stage (goal: NLS median ≤ 30 ms per variant).
 * Run: npx tsx bench/painleve.ts   → one JSON line with median and p95 ms per variant and class.
 * Variants: the members of ../shared/math/painleve.md §8 (random draws, not the fixed inputs) and
 * random members (half reducible) from tests/screening/painleve/random-families.ts; each is run
 * REPEAT times after one warm-up run. Times include the class invariant, the symbolic condition
 * and, where the verdict needs it, the extended-precision recheck.
 */
import { runPainleve } from "../lib/screening/painleve";
import type { EquationClass, Variant } from "../lib/screening/spec/types";
import { ENGINE_VERSION } from "../lib/screening/version";
import { variant } from "../tests/screening/painleve/helpers";
import { randomFamilies } from "../tests/screening/painleve/random-families";

const REPEAT = 5;
const RANDOM_PER_CLASS = 20;

const B_STAR =
  "(1330*sin(t) + 75*sin(2*t) - 90*sin(3*t) + 109*cos(t) - (2409/2)*cos(2*t) - 9*cos(3*t) + 809/2)/(40*(3*sin(t) + 10)^3)";
const K3 = {
  p: "1 + 0.3*cos(t)",
  q: "((1 + 0.3*cos(t))/1.3)*exp(0.1*t + 0.46*sin(t))",
  r: "0.1",
  s: "0.2*cos(t)",
  g: "0.5*sin(t)",
  l: "0.1*cos(t) + 0.13*sin(t) + 0.006*sin(t)*cos(t)",
  m: "0.06 + 0.052*cos(t)",
};
const SPEC_MEMBERS: Record<EquationClass, Variant[]> = {
  nls: [
    variant("nls", { a: "1", h: "2", k: "0.1" }),
    variant("nls", { a: "1+0.3*sin(t)", h: "2/(1+t^2)", b: "0.1", k: "0.05", c: "0.2", f: "0.4", e: "t" }),
    variant("nls", { a: "1+0.3*sin(t)", h: "2/(1+t^2)", b: "0.1", k: "0.05", c: "0.2", f: "0.4", e: "t", g: "0.3*cos(t)" }),
    variant("nls", { a: "1+0.3*sin(t)", k: "0.1", c: "0.2*cos(t)", h: "2*exp(0.3*t)", f: "0.4*t", e: "t^2", g: "0.5", b: B_STAR }),
  ],
  kdv: [
    variant("kdv", { p: "1", q: "1", r: "0.1" }),
    variant("kdv", { p: "t", q: "t^2" }),
    variant("kdv", K3),
    variant("kdv", { ...K3, m: "0.07 + 0.052*cos(t)" }),
  ],
  mkdv: [
    variant("mkdv", { p: "6", q: "1", r: "0.1" }),
    variant("mkdv", { p: "(6 + 3*sin(t))*exp(0.4*t)", q: "1 + 0.5*sin(t)", r: "0.2 + 0.1*cos(t)", s: "0.1*cos(t)", g: "0.3*t" }),
  ],
};

function quantile(sorted: number[], q: number): number {
  const i = Math.min(sorted.length - 1, Math.max(0, Math.ceil(q * sorted.length) - 1));
  return sorted[i];
}

const out: Record<string, unknown> = { bench: "painleve", engine: ENGINE_VERSION, repeat: REPEAT };
for (const cls of ["nls", "kdv", "mkdv"] as EquationClass[]) {
  const variants = [...SPEC_MEMBERS[cls], ...randomFamilies(cls, RANDOM_PER_CLASS, 4242).map((f) => f.variant)];
  const times: number[] = [];
  const verdicts: Record<string, number> = {};
  for (const v of variants) {
    runPainleve(v, { seed: 11 }); // warm-up (JIT, caches)
    for (let k = 0; k < REPEAT; k++) {
      const t0 = performance.now();
      const r = runPainleve(v, { seed: 11 + k });
      times.push(performance.now() - t0);
      verdicts[r.verdict] = (verdicts[r.verdict] ?? 0) + 1;
    }
  }
  times.sort((a, b) => a - b);
  out[cls] = {
    variants: variants.length,
    runs: times.length,
    median_ms: Number(quantile(times, 0.5).toFixed(2)),
    p95_ms: Number(quantile(times, 0.95).toFixed(2)),
    max_ms: Number(times[times.length - 1].toFixed(2)),
    verdicts,
  };
}
console.log(JSON.stringify(out));
