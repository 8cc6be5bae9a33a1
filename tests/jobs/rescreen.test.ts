// Integration: the nightly re-screen on a changed engine version. Reports stored as if made by an
// older engine ("0.0.1") are re-screened by the bree job jobs/rescreen.ts (which runs
// jobs/tasks/rescreen.ts in a child process) and a real worker; the
// verdict that differs from the new engine's is recorded and listed for curators.
import { describe, it, expect, beforeAll } from "vitest";
import { readFileSync } from "node:fs";
import path from "node:path";
import Bree from "bree";
import { createMigratedDatabase } from "../helpers/db";
import { request, noParams } from "../helpers/requests";
import { usersByRole, storeYaml, verdictReport } from "../queue/helpers";
import type { CurrentUser } from "@/lib/auth/current-user";
import type { Role } from "@/lib/auth/roles";

createMigratedDatabase({ seed: true });
process.env.SMTP_URL = "json";

let users: Record<Role, CurrentUser>;
beforeAll(async () => {
  users = await usersByRole();
});

const FIXTURE = readFileSync(path.resolve("e2e/fixtures/harbour-channel.yaml"), "utf8");
const OLD = "0.0.1";

/** Run one job file the way the scheduler does (bree worker thread, tsx require hook). */
function runBreeJob(name: string): Promise<void> {
  const quiet = { info: () => undefined, warn: () => undefined, error: (...a: unknown[]) => console.error(...a) };
  const bree = new Bree({
    root: path.resolve("jobs"), logger: quiet, defaultExtension: "ts", acceptedExtensions: [".ts"],
    worker: { execArgv: ["--conditions=react-server", "--require", "tsx/cjs"] },
    jobs: [{ name, path: path.resolve("jobs", `${name}.ts`), timeout: false }],
  });
  return new Promise((resolve, reject) => {
    bree.on("worker deleted", () => resolve());
    bree.run(name).catch(reject);
  });
}

describe("nightly re-screen after an engine update", () => {
  it("queues re-screens for entries judged by an older engine, records the changed verdict, lists it for curators", async () => {
    const { parseFamilies, screenVariant, ENGINE_VERSION } = await import("@/lib/screening");
    expect(ENGINE_VERSION).not.toBe(OLD);
    // What the current engine says (the reference the worker must reproduce).
    const spec = parseFamilies(FIXTURE, { file: "harbour-channel.yaml" }).families[0];
    const current = await Promise.all(spec.variants.map((v) => screenVariant(v)));

    const stored = await storeYaml(users.researcher, "harbour-channel.yaml", FIXTURE);
    const { ScreeningRun, FamilyVariant, RegistryEntry, VerdictChange, Batch } = await import("@/models");
    const runs = await ScreeningRun.findAll({ where: { batchId: stored.id } });
    const index = new Map((await FamilyVariant.findAll()).map((v) => [v.id, v.variantIndex]));
    // Pretend engine 0.0.1 screened them last year: variant 0 got the other reducibility verdict, variant 1 the same.
    const flipped = current[0].reducibility.verdict === "reducible" ? "not-reducible" : "reducible";
    const yearAgo = new Date(Date.now() - 365 * 86_400_000);
    for (const run of runs) {
      const i = index.get(run.variantId)!;
      const verdict = i === 0 ? flipped : current[i].reducibility.verdict;
      await run.update({ state: "done", engineVersion: OLD, reportJson: verdictReport(OLD, verdict, current[i].painleve.verdict, current[i].agreement), attempts: 1, startedAt: yearAgo, finishedAt: yearAgo });
    }
    const { refreshRegistryEntry } = await import("@/lib/registry/refresh");
    const entry = await refreshRegistryEntry(runs[0].familyId);
    expect(entry?.engineVersion).toBe(OLD);
    await Batch.update({ state: "done" }, { where: { id: stored.id } });

    await runBreeJob("rescreen");
    const queued = await ScreeningRun.findAll({ where: { purpose: "rescreen" } });
    expect(queued).toHaveLength(2);
    expect(queued.every((r) => r.state === "queued" && r.batchId === null)).toBe(true);

    const { startWorker } = await import("@/lib/queue/worker");
    await startWorker({ threads: 1, stopWhenIdle: true, pollMs: 50, drainMail: false, log: () => undefined }).done;
    const rescreened = await ScreeningRun.findAll({ where: { purpose: "rescreen" } });
    expect(rescreened.map((r) => r.state)).toEqual(["done", "done"]);
    for (const r of rescreened) {
      const report = JSON.parse(r.reportJson!);
      expect(r.engineVersion).toBe(ENGINE_VERSION);
      expect(report.reducibility.verdict).toBe(current[index.get(r.variantId)!].reducibility.verdict);
    }

    const changes = await VerdictChange.findAll();
    expect(changes).toHaveLength(1); // only variant 0's verdict changed
    expect(index.get(changes[0].variantId)).toBe(0);
    expect(changes[0]).toMatchObject({ entryId: entry!.id, oldEngine: OLD, newEngine: ENGINE_VERSION });
    expect(JSON.parse(changes[0].oldVerdicts).reducibility).toBe(flipped);
    expect(JSON.parse(changes[0].newVerdicts).reducibility).toBe(current[0].reducibility.verdict);
    expect((await RegistryEntry.findByPk(entry!.id))?.engineVersion).toBe(ENGINE_VERSION);

    const { GET } = await import("@/app/api/registry/changes/route");
    const res = await GET(await request("GET", "/api/registry/changes", { user: users.curator }), noParams);
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body.changes).toHaveLength(1);
    expect(body.changes[0]).toMatchObject({ slug: "harbour-channel-narrowing", variantIndex: 0, parameters: { w: 0.5 }, changed: ["reducibility"], oldEngine: OLD });
    expect((await GET(await request("GET", "/api/registry/changes", { user: users.researcher }), noParams)).status).toBe(403);
    expect((await GET(await request("GET", "/api/registry/changes?since=yesterday", { user: users.curator }), noParams)).status).toBe(400);

    // Nothing left to re-screen: a second night queues nothing.
    const { enqueueRescreens } = await import("@/lib/queue");
    expect(await enqueueRescreens()).toEqual({ entries: 0, queued: 0 });
  }, 180_000);

  it("compares engine versions numerically", async () => {
    const { compareVersions, isOlderEngine } = await import("@/lib/queue");
    expect(compareVersions("0.10.0", "0.9.3")).toBe(1);
    expect(compareVersions("0.1.0", "0.1.0")).toBe(0);
    expect(compareVersions("0.0.1", "0.1.0")).toBe(-1);
    expect(isOlderEngine("0.0.1", "0.1.0")).toBe(true);
    expect(isOlderEngine("0.2.0", "0.1.0")).toBe(false); // a newer engine's report is not re-screened by an older worker
    expect(isOlderEngine(null, "0.1.0")).toBe(false);
  });
});
