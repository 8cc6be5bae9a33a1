// Integration: the worker loop with real engine threads — the hard time limit (thread terminated,
// stage recorded, next run carries on), a thread crash (retried with back-off, then given up),
// the memory limit, and bad input (failed at once, never retried). Test-only stage hooks in
// lib/queue/engine-thread.ts make one chosen variant hang, crash or hoard memory.
import { describe, it, expect, beforeAll, afterEach } from "vitest";
import { createMigratedDatabase } from "../helpers/db";
import { usersByRole, kdvSweep, storeYaml } from "../queue/helpers";
import type { CurrentUser } from "@/lib/auth/current-user";

createMigratedDatabase({ seed: true });
process.env.SMTP_URL = "json";

let researcher: CurrentUser;
beforeAll(async () => {
  researcher = (await usersByRole()).researcher;
});

const HOOKS = ["WAVESIEVE_TEST_SLOW_STAGE", "WAVESIEVE_TEST_EXIT_STAGE", "WAVESIEVE_TEST_ALLOC_STAGE"];
afterEach(() => {
  for (const k of HOOKS) delete process.env[k];
});

async function runWorkerUntilIdle(options: { timeLimitMs?: number; memoryMb?: number; retryBaseMs?: number } = {}) {
  const { startWorker } = await import("@/lib/queue/worker");
  const lines: string[] = [];
  const worker = startWorker({ threads: 1, leaseMs: 5_000, pollMs: 50, stopWhenIdle: true, drainMail: false, log: (l) => lines.push(l), ...options });
  const stats = await worker.done;
  return { stats, lines };
}

async function runsByIndex(batchId: string) {
  const { ScreeningRun, FamilyVariant } = await import("@/models");
  const runs = await ScreeningRun.findAll({ where: { batchId } });
  const variants = await FamilyVariant.findAll({ where: { id: runs.map((r) => r.variantId) } });
  const index = new Map(variants.map((v) => [v.id, v.variantIndex]));
  return runs.sort((a, b) => (index.get(a.variantId) ?? 0) - (index.get(b.variantId) ?? 0));
}

describe("engine threads under limits", () => {
  it("terminates a run that exceeds SCREEN_TIME_LIMIT_MS, records timed-out with its stage, and screens the next run", async () => {
    process.env.WAVESIEVE_TEST_SLOW_STAGE = "painleve@1"; // variant 1 hangs in the Painlevé stage
    const stored = await storeYaml(researcher, "slow.yaml", kdvSweep("limit-slow", 3));
    const started = Date.now();
    const { stats } = await runWorkerUntilIdle({ timeLimitMs: 3_000 });
    const [r0, r1, r2] = await runsByIndex(stored.id);
    expect([r0.state, r1.state, r2.state]).toEqual(["done", "timed-out", "done"]);
    expect(r1.stage).toBe("painleve");
    expect(r1.error).toBe("exceeded the time limit of 3.0 s in stage painleve");
    expect(r1.attempts).toBe(1); // a time-out is not retried
    const spent = r1.finishedAt!.getTime() - r1.startedAt!.getTime();
    expect(spent).toBeGreaterThanOrEqual(3_000);
    expect(spent).toBeLessThan(3_000 + 2_500); // stopped by the limit, not by anything later
    expect(r2.finishedAt!.getTime()).toBeGreaterThan(r1.finishedAt!.getTime()); // the next run went on after
    expect(JSON.parse(r2.reportJson!).reducibility.verdict).toMatch(/^(reducible|not-reducible|undecided)$/);
    expect(stats.finished).toMatchObject({ done: 2, "timed-out": 1 });
    const { Batch, OutgoingMail } = await import("@/models");
    expect((await Batch.findByPk(stored.id))?.state).toBe("done");
    expect((await OutgoingMail.findOne({ where: { dedupeKey: `batch-done:${stored.id}` } }))?.textBody).toMatch(/timed out:\s+1/);
    expect(Date.now() - started).toBeLessThan(60_000);
  });

  it("retries a thread crash with exponential back-off and gives up after max_attempts", async () => {
    process.env.WAVESIEVE_TEST_EXIT_STAGE = "reducibility@0"; // the thread dies in variant 0, every time
    const stored = await storeYaml(researcher, "crash.yaml", kdvSweep("limit-crash", 2, 5));
    const { lines } = await runWorkerUntilIdle({ retryBaseMs: 200 });
    const [r0, r1] = await runsByIndex(stored.id);
    expect(r0.state).toBe("failed");
    expect(r0.attempts).toBe(3);
    expect(r0.error).toMatch(/^gave up after 3 attempts: the engine thread exited with code 3/);
    expect(r1.state).toBe("done");
    expect(lines.filter((l) => l.includes(`run ${r0.id} retry`))).toHaveLength(2);
  });

  it("records a run over SCREEN_MEMORY_MB as failed (memory limit), without retrying", async () => {
    process.env.WAVESIEVE_TEST_ALLOC_STAGE = "reducibility@0";
    const stored = await storeYaml(researcher, "memory.yaml", kdvSweep("limit-memory", 2, 9));
    await runWorkerUntilIdle({ memoryMb: 96 });
    const [r0, r1] = await runsByIndex(stored.id);
    expect(r0.state).toBe("failed");
    expect(r0.attempts).toBe(1);
    expect(r0.error).toBe("exceeded the memory limit of 96 MB in stage reducibility");
    expect(r1.state).toBe("done");
  });

  it("fails a stored variant the engine cannot take (input error) at once, without retrying", async () => {
    const stored = await storeYaml(researcher, "bad.yaml", kdvSweep("limit-bad", 1, 13));
    const { FamilyVariant, ScreeningRun } = await import("@/models");
    const [run] = await ScreeningRun.findAll({ where: { batchId: stored.id } });
    const variant = await FamilyVariant.findByPk(run.variantId);
    const broken = { ...JSON.parse(variant!.variantJson), window: [2, 1] };
    await variant!.update({ variantJson: JSON.stringify(broken) });
    await runWorkerUntilIdle();
    await run.reload();
    expect(run.state).toBe("failed");
    expect(run.attempts).toBe(1);
    expect(run.error).toBe("input error: the window must be two finite numbers [t0, t1] with t0 < t1");
  });
});

describe("retry back-off", () => {
  it("schedules the next attempt base·2^(n−1) later, ±25 % jitter, capped", async () => {
    const { backoffMs } = await import("@/lib/queue");
    const mid = () => 0.5; // no jitter
    expect([1, 2, 3, 4].map((n) => backoffMs(n, 1000, 60_000, mid))).toEqual([1000, 2000, 4000, 8000]);
    expect(backoffMs(20, 1000, 60_000, mid)).toBe(60_000);
    expect(backoffMs(1, 1000, 60_000, () => 0)).toBe(750);
    expect(backoffMs(1, 1000, 60_000, () => 0.9999)).toBeLessThanOrEqual(1250);
  });

  it("puts a crashed run back in the queue with available_at in the future", async () => {
    const stored = await storeYaml(researcher, "backoff.yaml", kdvSweep("limit-backoff", 1, 17));
    const { claimRuns, finishRun } = await import("@/lib/queue");
    const now = new Date();
    const [claim] = await claimRuns({ workerId: "t", limit: 1, leaseMs: 1000, now });
    expect(claim.batchId).toBe(stored.id);
    expect(await finishRun(claim, { kind: "crash", message: "SQLITE_BUSY: database is locked" }, { retryBaseMs: 4000, now })).toBe("retry");
    const { ScreeningRun } = await import("@/models");
    const row = await ScreeningRun.findByPk(claim.id);
    expect(row?.state).toBe("queued");
    expect(row?.error).toBe("attempt 1 failed: SQLITE_BUSY: database is locked");
    const delay = row!.availableAt.getTime() - now.getTime();
    expect(delay).toBeGreaterThanOrEqual(3000);
    expect(delay).toBeLessThan(5000);
    await ScreeningRun.destroy({ where: { id: claim.id } });
  });
});
