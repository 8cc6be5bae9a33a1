// Load: 20 concurrent uploads of 50 families each against the built app (`next start` on loopback),
// fired with autocannon. Afterwards the database must hold every batch and family exactly once and
// exactly one queued screening run per variant. Needs a production build (.next/BUILD_ID).
import { describe, it, expect, beforeAll, afterAll } from "vitest";
import { spawn, execFileSync, type ChildProcess } from "node:child_process";
import { createRequire } from "node:module";
import { existsSync, mkdtempSync } from "node:fs";
import net from "node:net";
import os from "node:os";
import path from "node:path";
import sqlite3 from "sqlite3";
import { encode } from "next-auth/jwt";
import type { Role } from "@/lib/auth/roles";

const ROOT = process.cwd();
const BUILT = existsSync(path.join(ROOT, ".next", "BUILD_ID"));
const SECRET = "load-test-secret-0123456789abcdef0123456789";
const UPLOADS = 20;
const FAMILIES_PER_FILE = 50;

// autocannon ships no type declarations; only the parts used here are typed.
interface AutocannonRequest { method: string; path: string; headers: Record<string, string>; body?: string; setupRequest?: (req: AutocannonRequest) => AutocannonRequest }
interface AutocannonResult {
  requests: { sent: number; total: number };
  latency: { p50: number; p99: number; max: number; mean: number };
  errors: number; timeouts: number; non2xx: number; "2xx": number;
  statusCodeStats: Record<string, { count: number }>;
  duration: number;
}
type Autocannon = (opts: Record<string, unknown>, cb: (err: Error | null, res: AutocannonResult) => void) => unknown;
const autocannon = createRequire(import.meta.url)("autocannon") as Autocannon;

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.once("error", reject);
    srv.listen(0, "127.0.0.1", () => {
      const addr = srv.address();
      const port = typeof addr === "object" && addr ? addr.port : 0;
      srv.close(() => resolve(port));
    });
  });
}

function query<T>(file: string, sql: string): Promise<T[]> {
  return new Promise((resolve, reject) => {
    const db = new sqlite3.Database(file, sqlite3.OPEN_READONLY, (e) => { if (e) reject(e); });
    db.all(sql, (err, rows) => { db.close(); if (err) reject(err); else resolve(rows as T[]); });
  });
}

/** File i: 50 KdV families u_t + 6 u u_x + u_xxx + k/(t+1) u = 0 with a distinct k each (nothing dedupes). */
function familyFile(i: number): string {
  const entries = Array.from({ length: FAMILIES_PER_FILE }, (_, j) => {
    const k = i * FAMILIES_PER_FILE + j + 1;
    return `  - id: load-${i}-${j}
    title: Load family ${k}
    class: kdv
    coefficients:
      p: "6"
      q: "1"
      r: "${k}/(t+1)"
    window: [0, 3]
`;
  });
  return `wavesieve: 1\nfamilies:\n${entries.join("")}`;
}

let server: ChildProcess | undefined;
const logs: string[] = [];
let baseUrl = "";
let dbFile = "";

beforeAll(async () => {
  if (!BUILT) return;
  const dir = mkdtempSync(path.join(os.tmpdir(), "wavesieve-load-"));
  dbFile = path.join(dir, "load.sqlite");
  const port = await freePort();
  baseUrl = `http://127.0.0.1:${port}`;
  const env: NodeJS.ProcessEnv = {
    ...process.env, NODE_ENV: "production" as const, NEXT_TELEMETRY_DISABLED: "1", DATABASE_PATH: dbFile, DATABASE_URL: "",
    NEXTAUTH_SECRET: SECRET, NEXTAUTH_URL: baseUrl, DEMO_SCENARIO: "0",
  };
  const cli = path.join(ROOT, "node_modules/sequelize-cli/lib/sequelize");
  execFileSync(process.execPath, [cli, "db:migrate"], { cwd: ROOT, env, stdio: "pipe" });
  execFileSync(process.execPath, [cli, "db:seed:all"], { cwd: ROOT, env, stdio: "pipe" });
  const child = spawn(path.join(ROOT, "node_modules/.bin/next"), ["start", "-p", String(port), "-H", "127.0.0.1"], { cwd: ROOT, env, stdio: ["ignore", "pipe", "pipe"] });
  server = child;
  child.stdout!.on("data", (d) => logs.push(String(d)));
  child.stderr!.on("data", (d) => logs.push(String(d)));
  const deadline = Date.now() + 60_000;
  for (;;) {
    try {
      if ((await fetch(`${baseUrl}/api/health`)).ok) break;
    } catch { /* not listening yet */ }
    if (Date.now() > deadline) throw new Error(`server did not start:\n${logs.join("")}`);
    await new Promise((r) => setTimeout(r, 250));
  }
}, 90_000);

afterAll(async () => {
  const child = server;
  if (!child || child.exitCode !== null) return;
  const exited = new Promise((r) => child.once("exit", r));
  child.kill("SIGTERM");
  await Promise.race([exited, new Promise((r) => setTimeout(r, 5000))]);
  if (child.exitCode === null) child.kill("SIGKILL");
});

describe("20 concurrent uploads of 50 families each", () => {
  it.skipIf(!BUILT)("are all stored once, with exactly one queued run per variant (autocannon)", async () => {
    const [user] = await query<{ id: string; email: string; role: Role }>(dbFile, "SELECT id, email, role FROM users WHERE role = 'researcher'");
    const jwt = await encode({ token: { uid: user.id, role: user.role, email: user.email, sub: user.id }, secret: SECRET });
    const bodies = Array.from({ length: UPLOADS }, (_, i) => JSON.stringify({ title: `load ${i}`, files: [{ name: `load-${i}.yaml`, text: familyFile(i) }] }));
    let next = 0;

    const result = await new Promise<AutocannonResult>((resolve, reject) => {
      autocannon(
        {
          url: baseUrl,
          connections: UPLOADS,
          amount: UPLOADS, // exactly one request per connection, each with its own file
          timeout: 120, // seconds per request: a bound, not a target
          requests: [{
            method: "POST",
            path: "/api/batches",
            headers: { "content-type": "application/json", cookie: `next-auth.session-token=${jwt}` },
            setupRequest: (req: AutocannonRequest) => ({ ...req, body: bodies[next++ % UPLOADS] }),
          }],
        },
        (err, res) => (err ? reject(err) : resolve(res)),
      );
    });
    console.log(`[load] requests ${result.requests.sent} sent / ${result.requests.total} done; status ${JSON.stringify(result.statusCodeStats)}; ` +
      `errors ${result.errors}, timeouts ${result.timeouts}; latency p50 ${result.latency.p50} ms, p99 ${result.latency.p99} ms, max ${result.latency.max} ms; wall ${result.duration} s`);

    const failures = logs.join("").split("\n").filter((l) => /store failed|SQLITE|Error/.test(l));
    if (failures.length) console.log(`[load] server log (${failures.length} error lines, first 8):\n${failures.slice(0, 8).join("\n")}`);

    const one = async (sql: string) => Object.values((await query<Record<string, number>>(dbFile, sql))[0])[0];
    const counts = {
      batches: await one("SELECT COUNT(*) FROM batches"),
      families: await one("SELECT COUNT(*) FROM families"),
      distinctHashes: await one("SELECT COUNT(DISTINCT content_hash) FROM families"),
      distinctSlugs: await one("SELECT COUNT(DISTINCT slug) FROM families"),
      links: await one("SELECT COUNT(*) FROM batch_families"),
      variants: await one("SELECT COUNT(*) FROM variants"),
      runs: await one("SELECT COUNT(*) FROM screening_runs"),
      queuedRuns: await one("SELECT COUNT(*) FROM screening_runs WHERE state = 'queued'"),
      variantsWithOneRun: await one("SELECT COUNT(*) FROM (SELECT v.id FROM variants v JOIN screening_runs r ON r.variant_id = v.id GROUP BY v.id HAVING COUNT(r.id) = 1)"),
      batchesWith50: await one("SELECT COUNT(*) FROM batches WHERE family_count = 50 AND variant_count = 50"),
    };
    console.log(`[load] database: ${JSON.stringify(counts)}`);
    // Whatever the status codes, nothing is half-stored: each 201 is one whole batch of 50 families
    // with one queued run per variant, and a refused upload left no trace.
    const created = result.statusCodeStats["201"]?.count ?? 0;
    const stored = created * FAMILIES_PER_FILE;
    expect(counts).toEqual({
      batches: created, families: stored, distinctHashes: stored, distinctSlugs: stored, links: stored,
      variants: stored, runs: stored, queuedRuns: stored, variantsWithOneRun: stored, batchesWith50: created,
    });
    // And every upload was accepted.
    expect(next).toBe(UPLOADS);
    expect(result.errors).toBe(0);
    expect(result.timeouts).toBe(0);
    expect(result["2xx"]).toBe(UPLOADS);
    expect(result.statusCodeStats["201"]?.count).toBe(UPLOADS);
  }, 240_000);
});
