/**
 * Benchmark: every engine stage per NLS / KdV / mKdV variant on the demo families (examples/),
 * median and p95 per stage, and the whole-pipeline rate in variants per second on one core.
 * Plain script (no timed assertions anywhere in the tests). Prints one JSON object.
 */
import { readFileSync, readdirSync } from "node:fs";
import path from "node:path";
import os from "node:os";
import { parseFamilies, screenVariant, type Variant } from "@/lib/screening";

const quantile = (sorted: number[], q: number) => (sorted.length ? sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))] : NaN);

async function main() {
  const dir = path.resolve("examples");
  const variants: Variant[] = readdirSync(dir)
    .filter((f) => f.endsWith(".yaml"))
    .flatMap((f) => parseFamilies(readFileSync(path.join(dir, f), "utf8"), { file: f }).families.flatMap((fam) => fam.variants));
  const times: Record<string, Record<string, number[]>> = { nls: {}, kdv: {}, mkdv: {} };
  const totals: Record<string, number[]> = { nls: [], kdv: [], mkdv: [] };
  await screenVariant(variants[0], { seed: 1 }); // warm-up
  const started = performance.now();
  const cpuStart = process.cpuUsage();
  for (const v of variants) {
    const t0 = performance.now();
    const r = await screenVariant(v, { seed: 7 });
    totals[v.class].push(performance.now() - t0);
    for (const [stage, ms] of Object.entries(r.timings)) (times[v.class][stage] ??= []).push(ms);
  }
  const wallS = (performance.now() - started) / 1000;
  const cpu = process.cpuUsage(cpuStart);
  const stages: Record<string, Record<string, { n: number; medianMs: number; p95Ms: number }>> = {};
  for (const cls of Object.keys(times)) {
    stages[cls] = {};
    for (const [stage, list] of Object.entries({ ...times[cls], total: totals[cls] })) {
      const sorted = [...list].sort((a, b) => a - b);
      stages[cls][stage] = { n: sorted.length, medianMs: Number(quantile(sorted, 0.5).toFixed(1)), p95Ms: Number(quantile(sorted, 0.95).toFixed(1)) };
    }
  }
  console.log(
    JSON.stringify({
      bench: "pipeline",
      variants: variants.length,
      wallSeconds: Number(wallS.toFixed(1)),
      cpuSeconds: Number(((cpu.user + cpu.system) / 1e6).toFixed(1)),
      variantsPerSecondPerCore: Number((variants.length / ((cpu.user + cpu.system) / 1e6)).toFixed(2)),
      cores: os.cpus().length,
      node: process.version,
      stages,
    }),
  );
}

void main();
