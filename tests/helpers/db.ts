/**
 * A real database for one test file, built by the project's migrations (no mocks): a fresh SQLite
 * file, or — when WAVESIEVE_TEST_POSTGRES holds a PostgreSQL URL of a role that may create
 * databases — a fresh PostgreSQL database on that server (`npm run test:postgres`).
 * Call before importing anything that loads "@/models". Returns the SQLite file or the database URL.
 */
import { execFileSync } from "node:child_process";
import { randomUUID } from "node:crypto";
import { mkdtempSync } from "node:fs";
import os from "node:os";
import path from "node:path";

/** True when this run is against PostgreSQL (tests of SQLite-only behaviour skip themselves). */
export const onPostgres = Boolean(process.env.WAVESIEVE_TEST_POSTGRES);

function createPostgresDatabase(): string {
  const admin = new URL(process.env.WAVESIEVE_TEST_POSTGRES!);
  const name = `wavesieve_test_${randomUUID().replace(/-/g, "").slice(0, 12)}`;
  // A child process, so this stays synchronous like the SQLite path (pg is asynchronous).
  const script = `const { Client } = require("pg"); const c = new Client({ connectionString: process.argv[1] });
    c.connect().then(() => c.query('CREATE DATABASE "${name}"')).then(() => c.end()).catch((e) => { console.error(e.message); process.exit(1); });`;
  execFileSync(process.execPath, ["-e", script, admin.toString()], { stdio: "pipe" });
  const url = new URL(admin.toString());
  url.pathname = `/${name}`;
  return url.toString();
}

export function createMigratedDatabase(options: { seed?: boolean } = {}): string {
  const cli = path.resolve("node_modules/sequelize-cli/lib/sequelize");
  let env: NodeJS.ProcessEnv;
  let target: string;
  if (onPostgres) {
    target = createPostgresDatabase();
    env = { ...process.env, DATABASE_URL: target, DEMO_SCENARIO: "0" };
  } else {
    const dir = mkdtempSync(path.join(os.tmpdir(), "wavesieve-test-"));
    target = path.join(dir, "test.sqlite");
    env = { ...process.env, DATABASE_PATH: target, DATABASE_URL: "", DEMO_SCENARIO: "0" };
  }
  execFileSync(process.execPath, [cli, "db:migrate"], { env, stdio: "pipe" });
  if (options.seed) execFileSync(process.execPath, [cli, "db:seed:all"], { env, stdio: "pipe" });
  if (onPostgres) {
    process.env.DATABASE_URL = target;
  } else {
    process.env.DATABASE_PATH = target;
    delete process.env.DATABASE_URL;
  }
  return target;
}

/** The environment a child process needs to open the same database as this test file. */
export function databaseEnv(target: string): { DATABASE_PATH: string; DATABASE_URL: string } {
  return onPostgres ? { DATABASE_PATH: "", DATABASE_URL: target } : { DATABASE_PATH: target, DATABASE_URL: "" };
}
