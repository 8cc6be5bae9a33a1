// Integration: atomic claims with leases on a migrated SQLite file — limits, lease expiry and
// re-claim, refusal of a stale worker's late result, and two processes claiming concurrently.
import { describe, it, expect, beforeAll } from "vitest";
import { spawn } from "node:child_process";
import path from "node:path";
import { createMigratedDatabase, databaseEnv } from "../helpers/db";
import { usersByRole, kdvSweep, storeYaml, verdictReport } from "./helpers";
import type { CurrentUser } from "@/lib/auth/current-user";

const dbFile = createMigratedDatabase({ seed: true });
process.env.SMTP_URL = "json";

let researcher: CurrentUser;
beforeAll(async () => {
  researcher = (await usersByRole()).researcher;
});

async function clearRuns() {
  const { ScreeningRun } = await import("@/models");
  await ScreeningRun.destroy({ where: {} });
}

describe("claimRuns", () => {
  it("claims at most `limit` due runs, oldest first, with one token, a lease and attempts + 1", async () => {
    const { claimRuns } = await import("@/lib/queue");
    const stored = await storeYaml(researcher, "a.yaml", kdvSweep("claim-a", 5));
    const now = new Date();
    const first = await claimRuns({ workerId: "w1", limit: 2, leaseMs: 10_000, now });
    expect(first).toHaveLength(2);
    expect(new Set(first.map((r) => r.token)).size).toBe(1);
    expect(first.every((r) => r.attempts === 1 && r.batchId === stored.id && r.variantJson.includes('"class":"kdv"'))).toBe(true);
    const { ScreeningRun, Batch } = await import("@/models");
    const row = await ScreeningRun.findByPk(first[0].id);
    expect(row?.state).toBe("running");
    expect(row?.claimedBy).toBe("w1");
    expect(row?.leaseExpiresAt?.getTime()).toBe(now.getTime() + 10_000);
    expect((await Batch.findByPk(stored.id))?.state).toBe("running");
    const rest = await claimRuns({ workerId: "w2", limit: 10, leaseMs: 10_000, now });
    expect(rest).toHaveLength(3);
    expect(rest.some((r) => first.some((f) => f.id === r.id))).toBe(false);
    expect(await claimRuns({ workerId: "w3", limit: 10, leaseMs: 10_000, now })).toHaveLength(0);
    await clearRuns();
  });

  it("does not hand out a run before its available_at (retry back-off)", async () => {
    const { claimRuns } = await import("@/lib/queue");
    const { ScreeningRun } = await import("@/models");
    await storeYaml(researcher, "b.yaml", kdvSweep("claim-b", 1));
    const later = new Date(Date.now() + 60_000);
    await ScreeningRun.update({ availableAt: later }, { where: {} });
    expect(await claimRuns({ workerId: "w", limit: 5, leaseMs: 1000 })).toHaveLength(0);
    expect(await claimRuns({ workerId: "w", limit: 5, leaseMs: 1000, now: new Date(later.getTime() + 1) })).toHaveLength(1);
    await clearRuns();
  });

  it("re-claims a run whose lease expired and refuses the first worker's late result", async () => {
    const { claimRuns, finishRun, reportProgress } = await import("@/lib/queue");
    const { ScreeningRun } = await import("@/models");
    await storeYaml(researcher, "c.yaml", kdvSweep("claim-c", 1));
    const t0 = new Date();
    const [stale] = await claimRuns({ workerId: "slow", limit: 1, leaseMs: 1000, now: t0 });
    expect(await claimRuns({ workerId: "other", limit: 1, leaseMs: 1000, now: new Date(t0.getTime() + 500) })).toHaveLength(0);
    const [fresh] = await claimRuns({ workerId: "other", limit: 1, leaseMs: 1000, now: new Date(t0.getTime() + 1500) });
    expect(fresh.id).toBe(stale.id);
    expect(fresh.token).not.toBe(stale.token);
    expect(fresh.attempts).toBe(2);
    // The slow worker wakes up: its renewal and its result are refused.
    expect(await reportProgress(stale, 1000, "painleve")).toBe("lost");
    const report = verdictReport("0.1.0", "reducible", "passes");
    expect(await finishRun(stale, { kind: "done", reportJson: report, engine: "0.1.0" }, { retryBaseMs: 0 })).toBe("lost");
    expect((await ScreeningRun.findByPk(stale.id))?.state).toBe("running");
    expect(await finishRun(fresh, { kind: "done", reportJson: report, engine: "0.1.0" }, { retryBaseMs: 0 })).toBe("done");
    const row = await ScreeningRun.findByPk(stale.id);
    expect(row?.state).toBe("done");
    expect(row?.claimToken).toBeNull();
    await clearRuns();
  });

  it("ends a run whose worker died once too often (attempts used up) as failed instead of claiming it again", async () => {
    const { claimRuns } = await import("@/lib/queue");
    const { ScreeningRun, Batch } = await import("@/models");
    const stored = await storeYaml(researcher, "d.yaml", kdvSweep("claim-d", 1));
    let now = Date.now();
    for (let attempt = 1; attempt <= 3; attempt++) {
      const got = await claimRuns({ workerId: `w${attempt}`, limit: 1, leaseMs: 100, now: new Date(now) });
      expect(got).toHaveLength(1);
      now += 200; // the worker dies; its lease runs out
    }
    expect(await claimRuns({ workerId: "w4", limit: 1, leaseMs: 100, now: new Date(now) })).toHaveLength(0);
    const run = await ScreeningRun.findOne({ where: { batchId: stored.id } });
    expect(run?.state).toBe("failed");
    expect(run?.error).toMatch(/gave up after 3 attempts/);
    expect((await Batch.findByPk(stored.id))?.state).toBe("done");
    await clearRuns();
  });
});

function runClaimer(id: string, startAt: number): Promise<{ id: string; claimed: string[]; results: Record<string, number> }> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, ["--import", "tsx", path.resolve("tests/queue/claimer.ts")], {
      env: { ...process.env, ...databaseEnv(dbFile), CLAIMER_ID: id, CLAIM_START_AT: String(startAt), CLAIM_LIMIT: "2" },
      stdio: ["ignore", "pipe", "pipe"],
    });
    let out = "";
    let err = "";
    child.stdout.on("data", (d) => (out += String(d)));
    child.stderr.on("data", (d) => (err += String(d)));
    child.on("exit", (code) => {
      if (code !== 0) return reject(new Error(`claimer ${id} exited ${code}: ${err}`));
      resolve(JSON.parse(out.trim().split("\n").pop() ?? "{}"));
    });
  });
}

describe("two worker processes on one SQLite file", () => {
  it("share 60 runs without claiming any run twice; every run is done exactly once", async () => {
    for (let f = 0; f < 3; f++) await storeYaml(researcher, `many-${f}.yaml`, kdvSweep(`contention-${f}`, 20, f * 10));
    const { ScreeningRun } = await import("@/models");
    const all = (await ScreeningRun.findAll({ attributes: ["id"] })).map((r) => r.id).sort();
    expect(all).toHaveLength(60);
    const startAt = Date.now() + 4000; // both processes load, then claim at the same moment
    const [a, b] = await Promise.all([runClaimer("A", startAt), runClaimer("B", startAt)]);
    const overlap = a.claimed.filter((id) => b.claimed.includes(id));
    expect(overlap).toEqual([]);
    expect([...a.claimed, ...b.claimed].sort()).toEqual(all);
    expect(a.claimed.length).toBeGreaterThan(0); // both really took part
    expect(b.claimed.length).toBeGreaterThan(0);
    expect((a.results.done ?? 0) + (b.results.done ?? 0)).toBe(60);
    expect(a.results.lost ?? 0).toBe(0);
    expect(b.results.lost ?? 0).toBe(0);
    const rows = await ScreeningRun.findAll();
    expect(rows.every((r) => r.state === "done" && r.attempts === 1)).toBe(true);
  }, 120_000);
});
