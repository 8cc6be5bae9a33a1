// Integration: storing a batch puts its variants on the queue in the same transaction, and the
// reuse rule for a family uploaded again (lib/queue/enqueue.ts) — against a migrated SQLite file.
import { describe, it, expect, beforeAll } from "vitest";
import { createMigratedDatabase } from "../helpers/db";
import { usersByRole, kdvSweep, storeYaml, verdictReport } from "./helpers";
import type { CurrentUser } from "@/lib/auth/current-user";

createMigratedDatabase({ seed: true });
process.env.SMTP_URL = "json";

let researcher: CurrentUser;
beforeAll(async () => {
  researcher = (await usersByRole()).researcher;
});

async function runsOfBatch(batchId: string) {
  const { BatchRun, ScreeningRun } = await import("@/models");
  const links = await BatchRun.findAll({ where: { batchId } });
  const runs = await ScreeningRun.findAll({ where: { id: links.map((l) => l.runId) } });
  return { links, runs };
}

describe("enqueue on upload", () => {
  it("queues one run per variant of a new family, linked to the batch, in state queued", async () => {
    const stored = await storeYaml(researcher, "shelf.yaml", kdvSweep("enq-shelf", 3));
    expect(stored).toMatchObject({ variants: 3, queuedRuns: 3, linkedRuns: 0 });
    const { links, runs } = await runsOfBatch(stored.id);
    expect(links.every((l) => l.linked === false)).toBe(true);
    expect(runs.map((r) => [r.state, r.purpose, r.attempts, r.batchId])).toEqual(Array(3).fill(["queued", "upload", 0, stored.id]));
    const { Batch } = await import("@/models");
    expect((await Batch.findByPk(stored.id))?.state).toBe("queued");
  });

  it("links the still-queued runs when the same family is uploaded again (no duplicate work)", async () => {
    const again = await storeYaml(researcher, "shelf-again.yaml", kdvSweep("enq-shelf", 3));
    expect(again).toMatchObject({ reusedFamilies: 1, queuedRuns: 0, linkedRuns: 3 });
    const { ScreeningRun } = await import("@/models");
    expect(await ScreeningRun.count()).toBe(3);
  });

  it("links done results of the current engine, and the batch is done at once with its mail queued", async () => {
    const { ScreeningRun, Batch, OutgoingMail } = await import("@/models");
    const { ENGINE_VERSION } = await import("@/lib/screening/version");
    await ScreeningRun.update({ state: "done", engineVersion: ENGINE_VERSION, reportJson: verdictReport(ENGINE_VERSION, "reducible", "passes"), finishedAt: new Date() }, { where: {} });
    const third = await storeYaml(researcher, "shelf-third.yaml", kdvSweep("enq-shelf", 3));
    expect(third).toMatchObject({ queuedRuns: 0, linkedRuns: 3 });
    const batch = await Batch.findByPk(third.id);
    expect(batch?.state).toBe("done");
    expect(batch?.finishedAt).toBeInstanceOf(Date);
    const mail = await OutgoingMail.findOne({ where: { dedupeKey: `batch-done:${third.id}` } });
    expect(mail?.toAddress).toBe(researcher.email);
    expect(mail?.textBody).toMatch(/reducible:\s+3/);
    expect(mail?.textBody).toContain(`/batches/${third.id}`);
  });

  it("queues new runs when the only done results come from an older engine", async () => {
    const { ScreeningRun } = await import("@/models");
    await ScreeningRun.update({ engineVersion: "0.0.1", reportJson: verdictReport("0.0.1", "reducible", "passes") }, { where: {} });
    const fourth = await storeYaml(researcher, "shelf-fourth.yaml", kdvSweep("enq-shelf", 3));
    expect(fourth).toMatchObject({ queuedRuns: 3, linkedRuns: 0 });
    expect(await ScreeningRun.count({ where: { state: "queued" } })).toBe(3);
  });

  it("rolls back the runs with the batch when storing fails (nothing queued without its batch)", async () => {
    const { ScreeningRun, Batch, BatchRun } = await import("@/models");
    const before = { runs: await ScreeningRun.count(), batches: await Batch.count(), links: await BatchRun.count() };
    const original = BatchRun.bulkCreate;
    BatchRun.bulkCreate = (async () => {
      throw new Error("SQLITE_FULL: database or disk is full");
    }) as unknown as typeof BatchRun.bulkCreate;
    try {
      await expect(storeYaml(researcher, "other.yaml", kdvSweep("enq-other", 2))).rejects.toThrow(/SQLITE_FULL/);
    } finally {
      BatchRun.bulkCreate = original;
    }
    expect({ runs: await ScreeningRun.count(), batches: await Batch.count(), links: await BatchRun.count() }).toEqual(before);
  });
});
