/**
 * The registry summary of one large sweep: after each finished run, its family's entry is rebuilt
 * from the latest run of every variant (lib/registry/refresh.ts). Stores one family of N variants
 * with N done runs carrying reports of realistic size (~100 KB, like a KdV report with its plot
 * data), then times refreshRegistryEntry. wholeSweepRefreshS ≈ median × N / 2: the summary time
 * a sweep of N variants spends in total (each refresh reads the runs finished so far). Prints one JSON object.
 *
 *   tsx bench/registry-refresh.ts [--variants 2000] [--report-kb 100] [--runs 15]
 */
import { execFileSync } from "node:child_process";
import { mkdtempSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";

function arg(name: string, fallback: number): number {
  const i = process.argv.indexOf(`--${name}`);
  return i >= 0 ? Number(process.argv[i + 1]) : fallback;
}

async function main(): Promise<void> {
  const variants = arg("variants", 2000);
  const reportKb = arg("report-kb", 100);
  const runs = arg("runs", 15);
  const dir = mkdtempSync(path.join(os.tmpdir(), "wavesieve-bench-"));
  process.env.DATABASE_PATH = path.join(dir, "refresh.sqlite");
  delete process.env.DATABASE_URL;
  process.env.DEMO_SCENARIO = "0";
  const cli = path.resolve("node_modules/sequelize-cli/lib/sequelize");
  for (const cmd of ["db:migrate", "db:seed:all"]) execFileSync(process.execPath, [cli, cmd], { env: process.env, stdio: "pipe" });

  const { User, ScreeningRun, sequelize } = await import("@/models");
  const { validateFiles, storeBatch } = await import("@/lib/batches");
  const { refreshRegistryEntry } = await import("@/lib/registry");
  const owner = (await User.findOne({ where: { role: "researcher" } }))!;
  const values = Array.from({ length: variants }, (_, i) => (0.001 * (i + 1)).toFixed(4));
  const yaml = `wavesieve: 1\nfamilies:\n  - id: refresh-sweep\n    title: Long sweep\n    class: kdv\n    parameters:\n      w: { values: [${values.join(", ")}] }\n    coefficients:\n      p: "6"\n      q: "1"\n      r: "w/(2*(t + 1))"\n    window: [0, 4]\n`;
  const validations = validateFiles([{ name: "sweep.yaml", text: yaml }]);
  if (validations.some((v) => v.errors.length)) throw new Error(JSON.stringify(validations.flatMap((v) => v.errors)));
  const batch = await storeBatch({ id: owner.id, email: owner.email, name: owner.name, role: owner.role }, validations);
  const padding = "x".repeat(reportKb * 1024);
  const report = (i: number) => JSON.stringify({ engine: "0.1.0", reducibility: { verdict: i % 3 ? "reducible" : "not-reducible" }, painleve: { verdict: "passes" }, agreement: "agree", plots: padding });
  const all = await ScreeningRun.findAll({ where: { batchId: batch.id }, attributes: ["id"] });
  const t0 = performance.now();
  for (let i = 0; i < all.length; i += 200) {
    await sequelize.transaction(async (transaction) => {
      for (const [k, run] of all.slice(i, i + 200).entries()) {
        await ScreeningRun.update({ state: "done", finishedAt: new Date(), reportJson: report(i + k) }, { where: { id: run.id }, transaction });
      }
    });
  }
  const storeMs = Math.round(performance.now() - t0);
  const familyId = (await ScreeningRun.findOne({ where: { batchId: batch.id } }))!.familyId;
  const times: number[] = [];
  let reducible = 0;
  for (let i = 0; i < runs + 2; i++) {
    const t = performance.now();
    const entry = await refreshRegistryEntry(familyId);
    if (i >= 2) times.push(performance.now() - t);
    reducible = entry?.variantsReducible ?? 0;
  }
  times.sort((a, b) => a - b);
  await sequelize.close();
  rmSync(dir, { recursive: true, force: true });
  const median = times[Math.floor(times.length / 2)];
  console.log(JSON.stringify({ variants, reportKb, storeMs, runs, medianMs: Math.round(median * 10) / 10, maxMs: Math.round(times[times.length - 1] * 10) / 10, variantsReducible: reducible, wholeSweepRefreshS: Math.round((median * variants) / 200) / 10 }, null, 1));
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
