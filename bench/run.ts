/**
 * `npm run bench`: runs every benchmark script one after another and prints one table.
 * Each script prints a JSON object; this collects them (raw JSON also saved to bench/out/).
 */
import { spawnSync } from "node:child_process";
import { mkdirSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";

interface Row {
  benchmark: string;
  measure: string;
  value: string;
  goal: string;
}

const only = process.argv.slice(2);
const scripts: { name: string; file: string; args?: string[] }[] = [
  { name: "spec-validate", file: "bench/spec-validate.ts" },
  { name: "reducibility", file: "bench/reducibility.ts" },
  { name: "painleve", file: "bench/painleve.ts" },
  { name: "pipeline", file: "bench/pipeline.ts" },
  { name: "verify", file: "bench/verify.ts" },
  { name: "queue-throughput", file: "bench/queue-throughput.ts" },
  { name: "registry-refresh", file: "bench/registry-refresh.ts" },
  { name: "registry-latency", file: "bench/registry-latency.ts" },
];

function run(file: string, args: string[] = []): unknown {
  const res = spawnSync(path.resolve("node_modules/.bin/tsx"), [file, ...args], { encoding: "utf8", maxBuffer: 64 * 1024 * 1024, env: { ...process.env, NODE_ENV: "production" } });
  if (res.status !== 0) throw new Error(`${file} exited ${res.status}: ${res.stderr.slice(-2000)}`);
  const out = res.stdout.trim();
  const start = out.lastIndexOf("\n{") >= 0 && !out.startsWith("{") ? out.lastIndexOf("\n{") + 1 : out.indexOf("{");
  return JSON.parse(out.slice(start));
}

type Json = Record<string, any>; // eslint-disable-line @typescript-eslint/no-explicit-any

const fmt = (ms: number) => `${ms.toFixed(ms < 10 ? 1 : 0)} ms`;

function rows(name: string, r: Json): Row[] {
  switch (name) {
    case "spec-validate":
      return [{ benchmark: "upload validation", measure: `${r.families} families (${r.variants} variants), median of ${r.runs}`, value: fmt(r.median_ms), goal: "< 2000 ms" }];
    case "reducibility":
    case "painleve":
      return (["nls", "kdv", "mkdv"] as const).map((c) => ({
        benchmark: `${name === "painleve" ? "Painlevé" : "reducibility"} stage`,
        measure: `${c.toUpperCase()} variant, median / p95`,
        value: `${fmt(r[c].medianMs ?? r[c].median_ms)} / ${fmt(r[c].p95Ms ?? r[c].p95_ms)}`,
        goal: c === "nls" ? (name === "painleve" ? "median ≤ 30 ms" : "median ≤ 20 ms") : "",
      }));
    case "pipeline": {
      const out: Row[] = [];
      for (const c of ["nls", "kdv", "mkdv"]) {
        for (const [stage, s] of Object.entries(r.stages[c] as Record<string, { n: number; medianMs: number; p95Ms: number }>)) {
          out.push({ benchmark: "pipeline (demo families)", measure: `${c.toUpperCase()} ${stage} (n = ${s.n}), median / p95`, value: `${fmt(s.medianMs)} / ${fmt(s.p95Ms)}`, goal: "" });
        }
      }
      out.push({ benchmark: "pipeline (demo families)", measure: `${r.variants} variants, all stages`, value: `${r.variantsPerSecondPerCore} variants/s per core`, goal: "" });
      return out;
    }
    case "verify":
      return [
        { benchmark: "split-step check", measure: `N = ${r.N} × ${r.steps} steps, 4th order (rel. error ${Number(r.yoshida4.relError).toExponential(1)})`, value: fmt(r.yoshida4.wallMs), goal: "≤ 500 ms" },
        { benchmark: "split-step check", measure: `N = ${r.N} × ${r.steps} steps, 2nd order (rel. error ${Number(r.strang.relError).toExponential(1)})`, value: fmt(r.strang.wallMs), goal: "" },
      ];
    case "queue-throughput":
      return (r.results as Json[]).map((x) => ({
        benchmark: "background queue",
        measure: `${x.threads} engine thread(s), ${x.variants} KdV variants: steady / including thread start-up`,
        value: `${Number(x.variantsPerSecondSteady).toFixed(1)} / ${Number(x.variantsPerSecondWall).toFixed(1)} variants/s`,
        goal: "",
      }));
    case "registry-refresh":
      return [{ benchmark: "registry summary of one sweep", measure: `${r.variants} done variants (${r.reportKb} KB reports), one refresh, median / max`, value: `${fmt(r.medianMs)} / ${fmt(r.maxMs)}`, goal: "" }];
    case "registry-latency":
      return (r.results as Json[]).map((x) => ({ benchmark: `registry API, ${r.entries} entries`, measure: `${x.query}, p50 / p95`, value: `${fmt(x.p50Ms)} / ${fmt(x.p95Ms)}`, goal: "p95 ≤ 50 ms" }));
    default:
      return [];
  }
}

function main() {
  const header = `Wavesieve benchmarks — ${os.cpus().length} cores (${os.cpus()[0]?.model ?? "unknown CPU"}), Node ${process.version}, ${new Date().toISOString()}`;
  mkdirSync("bench/out", { recursive: true });
  const table: Row[] = [];
  for (const s of scripts) {
    if (only.length && !only.includes(s.name)) continue;
    process.stderr.write(`[bench] ${s.name} …\n`);
    try {
      const result = run(s.file, s.args) as Json;
      writeFileSync(`bench/out/${s.name}.json`, JSON.stringify(result, null, 2));
      table.push(...rows(s.name, result));
    } catch (err) {
      table.push({ benchmark: s.name, measure: "failed", value: String(err instanceof Error ? err.message.split("\n")[0] : err), goal: "" });
    }
  }
  const w = (k: keyof Row) => Math.max(k.length, ...table.map((r) => r[k].length));
  const line = (r: Row) => `| ${r.benchmark.padEnd(w("benchmark"))} | ${r.measure.padEnd(w("measure"))} | ${r.value.padEnd(w("value"))} | ${r.goal.padEnd(w("goal"))} |`;
  console.log(header);
  console.log(line({ benchmark: "benchmark", measure: "measure", value: "value", goal: "goal" }));
  console.log(`|${["benchmark", "measure", "value", "goal"].map((k) => "-".repeat(w(k as keyof Row) + 2)).join("|")}|`);
  for (const r of table) console.log(line(r));
}

main();
