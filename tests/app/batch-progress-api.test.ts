// Integration: GET /api/batches/{id}/progress and the queue snapshot, as the batch page and the
// Overview panel use them — counts move with the runs; who may see what. Route handlers called
// directly against a migrated SQLite file.
import { describe, it, expect, beforeAll } from "vitest";
import { createMigratedDatabase } from "../helpers/db";
import { request, withParams } from "../helpers/requests";
import { usersByRole, kdvSweep, storeYaml, verdictReport } from "../queue/helpers";
import type { CurrentUser } from "@/lib/auth/current-user";
import type { Role } from "@/lib/auth/roles";

createMigratedDatabase({ seed: true });
process.env.SMTP_URL = "json";

let users: Record<Role, CurrentUser>;
let batchId = "";
beforeAll(async () => {
  users = await usersByRole();
  batchId = (await storeYaml(users.researcher, "progress.yaml", kdvSweep("progress-family", 4))).id;
});

async function progressAs(user: CurrentUser) {
  const { GET } = await import("@/app/api/batches/[id]/progress/route");
  return GET(await request("GET", `/api/batches/${batchId}/progress`, { user }), withParams({ id: batchId }));
}

describe("GET /api/batches/{id}/progress", () => {
  it("starts at 0 % with every variant queued", async () => {
    const res = await progressAs(users.researcher);
    expect(res.status).toBe(200);
    expect(res.headers.get("cache-control")).toBe("no-store");
    const { progress } = await res.json();
    expect(progress).toMatchObject({ state: "queued", total: 4, finished: 0, percent: 0, complete: false, isOwner: true, cancelRequested: false });
    expect(progress.counts).toEqual({ queued: 4, running: 0, done: 0, failed: 0, cancelled: 0, "timed-out": 0 });
    expect(progress.variants.map((v: { variantIndex: number; state: string }) => [v.variantIndex, v.state])).toEqual([[0, "queued"], [1, "queued"], [2, "queued"], [3, "queued"]]);
  });

  it("follows claims and results: running, stage, verdicts, elapsed time, then 100 % and done", async () => {
    const { claimRuns, finishRun, reportProgress } = await import("@/lib/queue");
    const claims = await claimRuns({ workerId: "t", limit: 2, leaseMs: 30_000 });
    await reportProgress(claims[0], 30_000, "painleve");
    await finishRun(claims[1], { kind: "done", reportJson: verdictReport("0.1.0", "reducible", "passes"), engine: "0.1.0" }, { retryBaseMs: 0 });
    let { progress } = await (await progressAs(users.researcher)).json();
    expect(progress).toMatchObject({ state: "running", finished: 1, percent: 25 });
    expect(progress.counts).toMatchObject({ queued: 2, running: 1, done: 1 });
    const running = progress.variants.find((v: { runId: string }) => v.runId === claims[0].id);
    expect(running).toMatchObject({ state: "running", stage: "painleve", attempts: 1 });
    expect(running.elapsedMs).toBeGreaterThanOrEqual(0);
    expect(progress.variants.find((v: { runId: string }) => v.runId === claims[1].id)).toMatchObject({ state: "done", reducibility: "reducible", painleve: "passes" });

    await finishRun(claims[0], { kind: "timed-out", limitMs: 60_000, stage: "painleve" }, { retryBaseMs: 0 });
    for (const c of await claimRuns({ workerId: "t", limit: 5, leaseMs: 30_000 }))
      await finishRun(c, { kind: "done", reportJson: verdictReport("0.1.0", "not-reducible", "fails"), engine: "0.1.0" }, { retryBaseMs: 0 });
    ({ progress } = await (await progressAs(users.researcher)).json());
    expect(progress).toMatchObject({ state: "done", finished: 4, percent: 100, complete: true });
    expect(progress.counts).toMatchObject({ done: 3, "timed-out": 1 });
    expect(progress.finishedAt).not.toBeNull();
  });

  it("shows the batch to curators but not to other researchers (404)", async () => {
    expect((await progressAs(users.curator)).status).toBe(200);
    expect((await (await progressAs(users.curator)).json()).progress.isOwner).toBe(false);
    const { User } = await import("@/models");
    const other = await User.create({ email: "peer@wavesieve.test", name: "Peer", role: "researcher" });
    expect((await progressAs({ id: other.id, email: other.email, name: other.name, role: "researcher" })).status).toBe(404);
    expect((await progressAs(users.viewer)).status).toBe(403);
  });
});

describe("queueSnapshot", () => {
  it("counts runs by state and lists the latest runs, each user's own only for researchers", async () => {
    const { queueSnapshot } = await import("@/lib/queue");
    const snap = await queueSnapshot(users.curator);
    expect(snap.counts).toMatchObject({ done: 3, "timed-out": 1, queued: 0 });
    expect(snap.depth).toBe(0);
    expect(snap.recent).toHaveLength(4);
    expect(snap.recent.every((r) => r.familySlug === "progress-family" && r.batchId === batchId)).toBe(true);
    expect((await queueSnapshot(users.researcher)).recent).toHaveLength(4);
    const { User } = await import("@/models");
    const peer = await User.findOne({ where: { email: "peer@wavesieve.test" } });
    const theirs = await queueSnapshot({ id: peer!.id, email: peer!.email, name: peer!.name, role: "researcher" });
    expect(theirs.counts.done).toBe(3); // the counts are for everyone
    expect(theirs.recent).toEqual([]); // but not other people's family names
  });
});
