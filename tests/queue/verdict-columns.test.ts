// Integration: a run's verdict columns follow its stored report on every write path, the migration
// fills them for reports stored before it, and the registry summary is built from them (the
// summary no longer reads whole reports after each finished run).
import { describe, it, expect, beforeAll } from "vitest";
import { execFileSync } from "node:child_process";
import { mkdtempSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import sqlite3 from "sqlite3";
import { createMigratedDatabase, onPostgres } from "../helpers/db";
import { usersByRole, kdvSweep, storeYaml, verdictReport } from "./helpers";
import type { CurrentUser } from "@/lib/auth/current-user";

createMigratedDatabase({ seed: true });

let researcher: CurrentUser;
beforeAll(async () => {
  researcher = (await usersByRole()).researcher;
});

const columns = (r: { reducibilityVerdict: string | null; painleveVerdict: string | null; agreementVerdict: string | null }) => [r.reducibilityVerdict, r.painleveVerdict, r.agreementVerdict];

describe("verdict columns of screening runs", () => {
  it("follow the report through instance update, static update and create; null without a report", async () => {
    const stored = await storeYaml(researcher, "columns.yaml", kdvSweep("columns-a", 3));
    const { ScreeningRun } = await import("@/models");
    const runs = await ScreeningRun.findAll({ where: { batchId: stored.id }, order: [["createdAt", "ASC"]] });
    expect(runs.map(columns)).toEqual([[null, null, null], [null, null, null], [null, null, null]]);

    await runs[0].update({ state: "done", reportJson: verdictReport("0.1.0", "reducible", "passes", "agree") });
    await ScreeningRun.update({ state: "done", reportJson: verdictReport("0.1.0", "not-reducible", "fails", "agree") }, { where: { id: runs[1].id } });
    const copy = await ScreeningRun.create({ variantId: runs[2].variantId, familyId: runs[2].familyId, state: "done", reportJson: verdictReport("0.1.0", "undecided", "mixed") });
    const [a, b] = await Promise.all([runs[0].reload(), runs[1].reload()]);
    expect(columns(a)).toEqual(["reducible", "passes", "agree"]);
    expect(columns(b)).toEqual(["not-reducible", "fails", "agree"]);
    expect(columns(await copy.reload())).toEqual(["undecided", "mixed", "inconclusive"]); // the report's defaults
    await runs[0].update({ reportJson: null });
    expect(columns(await runs[0].reload())).toEqual([null, null, null]);
    await copy.destroy();
  });

  it("the registry summary is built from them", async () => {
    const stored = await storeYaml(researcher, "summary.yaml", kdvSweep("columns-b", 2));
    const { ScreeningRun, RegistryEntry } = await import("@/models");
    const { refreshRegistryEntry } = await import("@/lib/registry");
    const runs = await ScreeningRun.findAll({ where: { batchId: stored.id } });
    for (const run of runs) await run.update({ state: "done", finishedAt: new Date(), reportJson: verdictReport("0.1.0", "reducible", "passes", "agree") });
    await refreshRegistryEntry(runs[0].familyId);
    let entry = await RegistryEntry.findOne({ where: { familyId: runs[0].familyId } });
    expect([entry?.reducibility, entry?.painleve, entry?.agreement, entry?.variantsReducible]).toEqual(["reducible", "passes", "agree", 2]);
    // One variant re-screened later with another verdict: the newest run counts.
    await ScreeningRun.create({ variantId: runs[1].variantId, familyId: runs[1].familyId, state: "done", finishedAt: new Date(Date.now() + 1000), reportJson: verdictReport("0.1.0", "not-reducible", "fails", "agree") });
    await refreshRegistryEntry(runs[0].familyId);
    entry = await RegistryEntry.findOne({ where: { familyId: runs[0].familyId } });
    expect([entry?.reducibility, entry?.painleve, entry?.variantsReducible, entry?.variantsScreened]).toEqual(["mixed", "mixed", 1, 2]);
  });

  // Builds an old-schema SQLite file of its own (the backfill SQL is the same on PostgreSQL).
  it.skipIf(onPostgres)("the migration fills them from reports stored before it", async () => {
    const dir = mkdtempSync(path.join(os.tmpdir(), "wavesieve-columns-"));
    const file = path.join(dir, "old.sqlite");
    const env = { ...process.env, DATABASE_PATH: file, DATABASE_URL: "", DEMO_SCENARIO: "0" };
    const cli = path.resolve("node_modules/sequelize-cli/lib/sequelize");
    execFileSync(process.execPath, [cli, "db:migrate", "--to", "20261202000020-background-jobs.js"], { env, stdio: "pipe" });
    const db = new sqlite3.Database(file);
    const run = (sql: string, params: unknown[] = []) => new Promise<void>((resolve, reject) => db.run(sql, params, (e) => (e ? reject(e) : resolve())));
    const now = new Date().toISOString();
    const reports = [verdictReport("0.0.9", "reducible", "passes", "agree"), verdictReport("0.0.9", "not-reducible", "fails", "conflict"), null];
    // More rows than one backfill chunk (200), so the paging is exercised.
    for (let i = 0; i < 450; i++) {
      await run("INSERT INTO screening_runs (id, variant_id, family_id, state, attempts, max_attempts, available_at, report_json, created_at, updated_at) VALUES (?, ?, ?, 'done', 1, 3, ?, ?, ?, ?)",
        [`run-${String(i).padStart(4, "0")}`, `v-${i}`, "f-1", now, reports[i % 3], now, now]);
    }
    await new Promise<void>((resolve) => db.close(() => resolve()));
    execFileSync(process.execPath, [cli, "db:migrate"], { env, stdio: "pipe" });
    const check = new sqlite3.Database(file);
    const rows = await new Promise<Record<string, unknown>[]>((resolve, reject) => check.all("SELECT reducibility_verdict AS r, painleve_verdict AS p, agreement_verdict AS a, count(*) AS n FROM screening_runs GROUP BY 1, 2, 3 ORDER BY n DESC, r", (e, r) => (e ? reject(e) : resolve(r as Record<string, unknown>[]))));
    await new Promise<void>((resolve) => check.close(() => resolve()));
    expect(rows).toEqual([
      { r: null, p: null, a: null, n: 150 },
      { r: "not-reducible", p: "fails", a: "conflict", n: 150 },
      { r: "reducible", p: "passes", a: "agree", n: 150 },
    ]);
  });
});
