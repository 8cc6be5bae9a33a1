/**
 * Queue throughput: variants screened per second by one worker process with 1 and with 2 engine
 * threads, end to end (claim → engine thread → report stored → registry refreshed), on a fresh
 * migrated SQLite file. Prints one JSON object.
 *
 *   npm run bench:queue                 # 40 variants (4 families × 10) per thread count, threads 1 and 2
 *   BENCH_VARIANTS=80 BENCH_PER_FAMILY=20 BENCH_THREADS=1,2,4 npm run bench:queue
 *
 * "wall" includes starting the threads (loading the engine, several seconds); "steady" counts the
 * results after the first one over the time from the first result to the last, which is what a
 * long-running worker sees. medianRunMs is claim → stored result of one run; medianEngineMs is the
 * engine's own stage time from the report (the rest is thread hand-off and database work).
 */
import { execFileSync } from "node:child_process";
import { mkdtempSync } from "node:fs";
import os from "node:os";
import path from "node:path";

/** `families` KdV families, each swept over `perFamily` values of w. */
function sweeps(prefix: string, families: number, perFamily: number, offset: number): string {
  const docs = Array.from({ length: families }, (_, f) => {
    const values = Array.from({ length: perFamily }, (_, i) => (0.1 * (i + 1) + offset + 100 * f).toFixed(3));
    return `  - id: ${prefix}-${f}
    title: Benchmark shelf wave ${prefix} ${f}
    class: kdv
    parameters:
      w: { values: [${values.join(", ")}] }
    coefficients:
      p: "6"
      q: "1"
      r: "w/(2*(t + 1))"
    window: [0, 4]
`;
  });
  return `wavesieve: 1\nfamilies:\n${docs.join("")}`;
}

function median(xs: number[]): number {
  const sorted = [...xs].sort((a, b) => a - b);
  return Math.round(sorted[Math.floor(sorted.length / 2)] ?? 0);
}

async function main(): Promise<void> {
  const variants = Number(process.env.BENCH_VARIANTS || 40);
  const perFamily = Math.min(variants, Number(process.env.BENCH_PER_FAMILY || 10));
  const familyCount = Math.ceil(variants / perFamily);
  const threadCounts = (process.env.BENCH_THREADS || "1,2").split(",").map(Number);
  const dir = mkdtempSync(path.join(os.tmpdir(), "wavesieve-bench-"));
  process.env.DATABASE_PATH = path.join(dir, "bench.sqlite");
  delete process.env.DATABASE_URL;
  process.env.SMTP_URL = "json";
  process.env.DEMO_SCENARIO = "0"; // demo users only; the benchmark makes its own families
  const cli = path.resolve("node_modules/sequelize-cli/lib/sequelize");
  for (const cmd of ["db:migrate", "db:seed:all"]) execFileSync(process.execPath, [cli, cmd], { env: process.env, stdio: "pipe" });

  const { User, ScreeningRun } = await import("@/models");
  const { validateFiles, storeBatch } = await import("@/lib/batches");
  const { startWorker } = await import("@/lib/queue/worker");
  const owner = await User.findOne({ where: { role: "researcher" } });
  if (!owner) throw new Error("seed user missing");
  const user = { id: owner.id, email: owner.email, name: owner.name, role: owner.role };

  const results = [];
  for (const [k, threads] of threadCounts.entries()) {
    const stored = await storeBatch(user, validateFiles([{ name: `bench-${threads}.yaml`, text: sweeps(`bench-t${threads}`, familyCount, perFamily, 10 * (k + 1)) }]));
    const started = Date.now();
    const stats = await startWorker({ threads, stopWhenIdle: true, drainMail: false, pollMs: 20, log: () => undefined }).done;
    const wallMs = Date.now() - started;
    const runs = await ScreeningRun.findAll({ where: { batchId: stored.id } });
    const finishes = runs.map((r) => r.finishedAt!.getTime()).sort((a, b) => a - b);
    // Steady state: from the first result to the last (thread start-up is before the first result).
    const steadyMs = finishes[finishes.length - 1] - finishes[0];
    const runMs = runs.map((r) => r.finishedAt!.getTime() - r.startedAt!.getTime()).sort((a, b) => a - b);
    results.push({
      threads,
      variants: runs.length,
      done: stats.finished.done,
      wallMs,
      firstResultMs: finishes[0] - started,
      steadyMs,
      variantsPerSecondWall: +(runs.length / (wallMs / 1000)).toFixed(3),
      variantsPerSecondSteady: +((runs.length - 1) / (steadyMs / 1000)).toFixed(3),
      medianRunMs: runMs[Math.floor(runMs.length / 2)],
      medianEngineMs: median(runs.map((r) => Object.values((JSON.parse(r.reportJson ?? "{}") as { timings?: Record<string, number> }).timings ?? {}).reduce((a, b) => a + b, 0))),
    });
  }
  const machine = { cpus: os.cpus().length, cpuModel: os.cpus()[0]?.model ?? "", node: process.version, loadavg: os.loadavg().map((x) => +x.toFixed(2)) };
  process.stdout.write(JSON.stringify({ benchmark: "queue-throughput", machine, workload: `${familyCount} KdV families × ${perFamily} swept variants per configuration`, results }, null, 2) + "\n");
}

main().then(
  () => process.exit(0),
  (err) => {
    console.error(err);
    process.exit(1);
  },
);
