// Integration: cancelling a batch while a real worker screens it — queued runs end at once, the
// running one is stopped when it next reports (lease renewal), the batch ends cancelled.
import { describe, it, expect, beforeAll } from "vitest";
import { createMigratedDatabase } from "../helpers/db";
import { request, withParams } from "../helpers/requests";
import { usersByRole, kdvSweep, storeYaml, waitFor } from "../queue/helpers";
import type { CurrentUser } from "@/lib/auth/current-user";
import type { Role } from "@/lib/auth/roles";

createMigratedDatabase({ seed: true });
process.env.SMTP_URL = "json";
process.env.WAVESIEVE_TEST_STAGE_DELAY_MS = "2500"; // every variant waits 2.5 s before screening

let users: Record<Role, CurrentUser>;
beforeAll(async () => {
  users = await usersByRole();
});

describe("POST /api/batches/{id}/cancel with a worker running", () => {
  it("cancels queued runs now and the running one at its next report; the batch ends cancelled, no finish mail", async () => {
    const stored = await storeYaml(users.researcher, "cancel.yaml", kdvSweep("cancel-me", 4));
    const { startWorker } = await import("@/lib/queue/worker");
    const worker = startWorker({ threads: 1, leaseMs: 900, pollMs: 50, drainMail: false, log: () => undefined });
    try {
      const { ScreeningRun, Batch, OutgoingMail } = await import("@/models");
      const running = await waitFor(() => ScreeningRun.findOne({ where: { batchId: stored.id, state: "running", stage: "prepare" } }), 60_000, "a running run");
      const { POST } = await import("@/app/api/batches/[id]/cancel/route");
      const call = async (user: CurrentUser) => POST(await request("POST", `/api/batches/${stored.id}/cancel`, { user, body: {} }), withParams({ id: stored.id }));

      const other = await (await import("@/models")).User.create({ email: "someone@wavesieve.test", name: "Someone", role: "researcher" });
      expect((await call({ id: other.id, email: other.email, name: other.name, role: "researcher" })).status).toBe(404);
      expect((await call(users.curator)).status).toBe(403);

      const res = await call(users.researcher);
      expect(res.status).toBe(200);
      expect(await res.json()).toEqual({ cancelledQueued: 3, stopping: 1, state: "running" });
      expect(await ScreeningRun.count({ where: { batchId: stored.id, state: "cancelled" } })).toBe(3);

      await waitFor(async () => (await running.reload()).state === "cancelled", 5_000, "the running run to stop");
      expect(running.error).toBe("cancelled by the batch owner");
      expect(running.reportJson).toBeNull();
      const batch = await Batch.findByPk(stored.id);
      expect(batch?.state).toBe("cancelled");
      expect(batch?.finishedAt).toBeInstanceOf(Date);
      expect(await OutgoingMail.count({ where: { dedupeKey: `batch-done:${stored.id}` } })).toBe(0);
      expect((await call(users.researcher)).status).toBe(409);

      const { GET } = await import("@/app/api/batches/[id]/progress/route");
      const progress = (await (await GET(await request("GET", `/api/batches/${stored.id}/progress`, { user: users.researcher }), withParams({ id: stored.id }))).json()).progress;
      expect(progress).toMatchObject({ state: "cancelled", complete: true, total: 4, finished: 4, percent: 100, cancelRequested: true });
      expect(progress.counts.cancelled).toBe(4);
    } finally {
      await worker.stop();
    }
  }, 120_000);

  it("a graceful worker stop hands its running run back to the queue without counting the attempt", async () => {
    const stored = await storeYaml(users.researcher, "stop.yaml", kdvSweep("stop-me", 2, 3));
    const { startWorker } = await import("@/lib/queue/worker");
    const { ScreeningRun } = await import("@/models");
    const worker = startWorker({ threads: 1, leaseMs: 5_000, pollMs: 50, drainMail: false, log: () => undefined });
    const running = await waitFor(() => ScreeningRun.findOne({ where: { batchId: stored.id, state: "running" } }), 60_000, "a running run");
    const stats = await worker.stop();
    expect(stats.released).toBe(1);
    await running.reload();
    expect(running).toMatchObject({ state: "queued", attempts: 0, claimToken: null, leaseExpiresAt: null });
    expect(await ScreeningRun.count({ where: { batchId: stored.id, state: "queued" } })).toBe(2);
  }, 120_000);
});
