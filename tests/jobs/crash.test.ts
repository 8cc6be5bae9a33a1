// Crash safety, for real: a worker process (the same entry as `npm run worker`) is SIGKILLed in
// the middle of a batch and started again. Every run must end done exactly once — nothing lost,
// nothing screened twice to completion, one done report per variant.
import { describe, it, expect, beforeAll } from "vitest";
import { spawn, type ChildProcess } from "node:child_process";
import path from "node:path";
import { Op } from "sequelize";
import { createMigratedDatabase, databaseEnv } from "../helpers/db";
import { usersByRole, kdvSweep, storeYaml, waitFor } from "../queue/helpers";
import type { CurrentUser } from "@/lib/auth/current-user";

const dbFile = createMigratedDatabase({ seed: true });

let researcher: CurrentUser;
beforeAll(async () => {
  researcher = (await usersByRole()).researcher;
});

function startWorkerProcess(extra: Record<string, string> = {}): { child: ChildProcess; output: () => string; exited: Promise<number | null> } {
  const child = spawn(process.execPath, ["--import", "tsx", path.resolve("jobs/worker.ts")], {
    env: {
      ...process.env, NODE_ENV: "test", ...databaseEnv(dbFile), SMTP_URL: "json",
      WORKER_THREADS: "2", SCREEN_LEASE_MS: "1500", SCREEN_POLL_MS: "100", WAVESIEVE_TEST_STAGE_DELAY_MS: "400", ...extra,
    },
    stdio: ["ignore", "pipe", "pipe"],
  });
  let out = "";
  child.stdout?.on("data", (d) => (out += String(d)));
  child.stderr?.on("data", (d) => (out += String(d)));
  const exited = new Promise<number | null>((resolve) => child.on("exit", (code) => resolve(code)));
  return { child, output: () => out, exited };
}

const doneLines = (log: string) => [...log.matchAll(/run ([0-9a-f-]{36}) done\b/g)].map((m) => m[1]);

describe("SIGKILL a worker mid-batch, then restart it", () => {
  it("ends with every run done exactly once and one done report per variant", async () => {
    const stored = await storeYaml(researcher, "crash.yaml", kdvSweep("crash-batch", 12));
    const { ScreeningRun, FamilyVariant, Batch, RegistryEntry, OutgoingMail } = await import("@/models");
    const count = (state: string) => ScreeningRun.count({ where: { batchId: stored.id, state } });

    const first = startWorkerProcess();
    await waitFor(async () => (await count("done")) >= 3 && (await count("running")) >= 1, 90_000, "a batch half done", 25);
    first.child.kill("SIGKILL");
    expect(await first.exited).toBeNull(); // killed by the signal, no clean exit
    const orphaned = await ScreeningRun.findAll({ where: { batchId: stored.id, state: "running" } });
    const doneBefore = await count("done");
    expect(orphaned.length).toBeGreaterThanOrEqual(1);
    expect(doneBefore).toBeLessThan(12);

    const second = startWorkerProcess({ WORKER_EXIT_WHEN_IDLE: "1" });
    expect(await Promise.race([second.exited, new Promise((r) => setTimeout(() => r("timeout"), 120_000))])).toBe(0);

    const runs = await ScreeningRun.findAll({ where: { batchId: stored.id } });
    expect(runs).toHaveLength(12); // no run was duplicated
    expect(runs.every((r) => r.state === "done" && r.reportJson && r.claimToken === null)).toBe(true);
    // The orphaned runs were taken again after their leases expired: two attempts each.
    for (const o of orphaned) expect(runs.find((r) => r.id === o.id)?.attempts).toBe(2);
    // Each run was recorded done by exactly one of the two processes.
    const finished = [...doneLines(first.output()), ...doneLines(second.output())].sort();
    expect(finished).toEqual(runs.map((r) => r.id).sort());
    // Exactly one done report per variant.
    const variants = await FamilyVariant.findAll({ where: { familyId: runs[0].familyId } });
    expect(variants).toHaveLength(12);
    for (const v of variants) expect(await ScreeningRun.count({ where: { variantId: v.id, state: "done", reportJson: { [Op.ne]: null } } })).toBe(1);
    expect((await Batch.findByPk(stored.id))?.state).toBe("done");
    const entry = await RegistryEntry.findOne({ where: { familyId: runs[0].familyId } });
    expect(entry?.variantsScreened).toBe(12);
    expect(await OutgoingMail.count({ where: { dedupeKey: `batch-done:${stored.id}` } })).toBe(1);
  }, 240_000);
});
