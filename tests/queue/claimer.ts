/**
 * A stand-alone claimer process for the contention test (tests/queue/claim.test.ts): claims runs
 * in small groups from the shared SQLite file and finishes each with a verdict-only report, until
 * the queue is empty. Prints one JSON line: which runs it claimed and how each finish went.
 */
import { claimRuns, finishRun } from "@/lib/queue";
import { ScreeningRun } from "@/models";
import { ENGINE_VERSION } from "@/lib/screening/version";
import { Op } from "sequelize";

async function main(): Promise<void> {
  const id = process.env.CLAIMER_ID ?? "claimer";
  const startAt = Number(process.env.CLAIM_START_AT ?? 0);
  while (Date.now() < startAt) await new Promise((r) => setTimeout(r, 5)); // start together with the other claimer
  const claimed: string[] = [];
  const results: Record<string, number> = {};
  for (;;) {
    const runs = await claimRuns({ workerId: id, limit: Number(process.env.CLAIM_LIMIT ?? 2), leaseMs: 60_000 });
    if (runs.length === 0) {
      if ((await ScreeningRun.count({ where: { state: { [Op.in]: ["queued", "running"] } } })) === 0) break;
      await new Promise((r) => setTimeout(r, 10));
      continue;
    }
    for (const run of runs) {
      claimed.push(run.id);
      await new Promise((r) => setTimeout(r, 3)); // "work"
      const report = JSON.stringify({ engine: ENGINE_VERSION, reducibility: { verdict: "undecided" }, painleve: { verdict: "not-run" }, claimer: id });
      const result = await finishRun(run, { kind: "done", reportJson: report, engine: ENGINE_VERSION }, { retryBaseMs: 0 });
      results[result] = (results[result] ?? 0) + 1;
    }
  }
  process.stdout.write(JSON.stringify({ id, claimed, results }) + "\n");
}

main().then(
  () => process.exit(0),
  (err) => {
    console.error(err);
    process.exit(1);
  },
);
