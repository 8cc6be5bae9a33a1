// Integration: another process holds the SQLite write lock for ~3 s. Uploads and queue claims in
// this process must wait (busy_timeout 10 s, lib/db.ts) and then succeed, storing everything once.
import { describe, it, expect, beforeAll } from "vitest";
import { spawn, type ChildProcess } from "node:child_process";
import { createMigratedDatabase, onPostgres } from "../helpers/db";
import { request, noParams, type TestUser } from "../helpers/requests";

const DB_FILE = createMigratedDatabase({ seed: true });
const HOLD_MS = 3000;

// The lock holder: BEGIN EXCLUSIVE, a real write inside the held transaction (so the database
// changes while we wait, as when a worker commits), hold, COMMIT. Reports each step on stdout.
const HOLDER = `
const sqlite3 = require("sqlite3");
const db = new sqlite3.Database(process.argv[1]);
const say = (s) => process.stdout.write(s + " " + Date.now() + "\\n");
db.serialize(() => {
  db.run("PRAGMA busy_timeout = 10000");
  db.run("BEGIN EXCLUSIVE", (e) => { if (e) { console.error(e); process.exit(2); } });
  db.run("UPDATE users SET updated_at = updated_at", (e) => {
    if (e) { console.error(e); process.exit(3); }
    say("locked");
    setTimeout(() => db.run("COMMIT", (e2) => { if (e2) { console.error(e2); process.exit(4); } say("committed"); db.close(() => process.exit(0)); }), Number(process.argv[2]));
  });
});
`;

interface Holder {
  child: ChildProcess;
  lockedAt: Promise<number>;
  committedAt: Promise<number>;
  exited: Promise<number | null>;
}

function holdLock(ms: number): Holder {
  const child = spawn(process.execPath, ["-e", HOLDER, DB_FILE, String(ms)], { cwd: process.cwd(), stdio: ["ignore", "pipe", "pipe"] });
  let out = "";
  let err = "";
  const waiters: Record<string, (t: number) => void> = {};
  const event = (name: string) => new Promise<number>((resolve, reject) => {
    waiters[name] = resolve;
    child.once("exit", (code) => reject(new Error(`lock holder exited (${code}) before '${name}': ${err}`)));
  });
  const lockedAt = event("locked");
  const committedAt = event("committed");
  child.stderr!.on("data", (d) => { err += String(d); });
  child.stdout!.on("data", (d) => {
    out += String(d);
    for (const line of out.split("\n")) {
      const [name, t] = line.split(" ");
      if (name && t && waiters[name]) { waiters[name](Number(t)); delete waiters[name]; }
    }
  });
  const exited = new Promise<number | null>((resolve) => child.once("exit", resolve));
  return { child, lockedAt, committedAt, exited };
}

// u_t + 6 u u_x + u_xxx + w/(2(t+1)) u = 0, swept over three w: three variants.
const KDV = `wavesieve: 1
families:
  - id: shelf-under-lock
    title: Shelf wave stored while another process holds the lock
    class: kdv
    parameters:
      w: { values: [0.5, 1, 1.5] }
    coefficients:
      p: "6"
      q: "1"
      r: "w/(2*(t + 1))"
    window: [0, 3]
`;

let researcher: TestUser;

beforeAll(async () => {
  const { User } = await import("@/models");
  const u = await User.findOne({ where: { role: "researcher" } });
  researcher = { id: u!.id, email: u!.email, role: u!.role };
  // Open this process's connection first (WAL mode, busy_timeout) so the holder meets a WAL database.
  await User.count();
});

// SQLite locking and PRAGMAs: nothing to check on PostgreSQL.
describe.skipIf(onPostgres)("the database is locked by another process for a few seconds", () => {
  it("POST /api/batches waits for the lock, then stores the batch exactly once", async () => {
    const { POST } = await import("@/app/api/batches/route");
    const holder = holdLock(HOLD_MS);
    const lockedAt = await holder.lockedAt;
    const res = await POST(await request("POST", "/api/batches", { user: researcher, body: { files: [{ name: "shelf.yaml", text: KDV }] } }), noParams);
    const answeredAt = Date.now();
    const committedAt = await holder.committedAt;
    expect(await holder.exited).toBe(0);

    expect(res.status).toBe(201);
    const body = await res.json();
    expect(body.batch).toMatchObject({ families: 1, variants: 3, errors: 0, queuedRuns: 3 });
    // It really waited: the answer came after the other process let go, and not before the hold.
    expect(answeredAt).toBeGreaterThanOrEqual(committedAt);
    expect(answeredAt - lockedAt).toBeGreaterThanOrEqual(HOLD_MS - 200);

    const { Batch, Family, FamilyVariant, BatchFamily, ScreeningRun } = await import("@/models");
    expect(await Batch.count()).toBe(1);
    expect(await Family.count()).toBe(1);
    expect(await FamilyVariant.count()).toBe(3);
    expect(await BatchFamily.count()).toBe(1);
    expect(await ScreeningRun.count()).toBe(3);
  });

  it("a queue claim during the lock succeeds once the lock is released, claiming each run once", async () => {
    const { claimRuns } = await import("@/lib/queue");
    const holder = holdLock(HOLD_MS);
    await holder.lockedAt;
    const claimed = await claimRuns({ workerId: "lock-test", limit: 10, leaseMs: 60_000 });
    const answeredAt = Date.now();
    const committedAt = await holder.committedAt;
    expect(await holder.exited).toBe(0);
    expect(answeredAt).toBeGreaterThanOrEqual(committedAt);

    expect(claimed).toHaveLength(3);
    expect(new Set(claimed.map((c) => c.variantId)).size).toBe(3);
    for (const c of claimed) expect(c.variantJson).toContain("shelf-under-lock");
    const { ScreeningRun } = await import("@/models");
    expect(await ScreeningRun.count({ where: { state: "running", claimedBy: "lock-test" } })).toBe(3);
    // Nothing left to claim: a second claim finds no work (no double claim).
    expect(await claimRuns({ workerId: "lock-test-2", limit: 10, leaseMs: 60_000 })).toHaveLength(0);
  });
});
