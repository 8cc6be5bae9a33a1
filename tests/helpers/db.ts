/**
 * A real SQLite database file for one test file, built by the project's migrations (no mocks).
 * Call before importing anything that loads "@/models".
 */
import { execFileSync } from "node:child_process";
import { mkdtempSync } from "node:fs";
import os from "node:os";
import path from "node:path";

export function createMigratedDatabase(options: { seed?: boolean } = {}): string {
  const dir = mkdtempSync(path.join(os.tmpdir(), "wavesieve-test-"));
  const file = path.join(dir, "test.sqlite");
  const env = { ...process.env, DATABASE_PATH: file, DATABASE_URL: "", DEMO_SCENARIO: "0" };
  const cli = path.resolve("node_modules/sequelize-cli/lib/sequelize");
  execFileSync(process.execPath, [cli, "db:migrate"], { env, stdio: "pipe" });
  if (options.seed) execFileSync(process.execPath, [cli, "db:seed:all"], { env, stdio: "pipe" });
  process.env.DATABASE_PATH = file;
  delete process.env.DATABASE_URL;
  return file;
}
