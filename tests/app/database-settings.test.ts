// Integration: the SQLite settings of lib/db.ts are really in force — on the main connection and
// on the separate connection Sequelize opens for each transaction. (Sequelize 6's SQLite dialect
// never runs the "afterConnect" hook, which once left every PRAGMA silently unset.)
// Expected values: SQLite's documentation of each PRAGMA (sqlite.org/pragma.html) — journal_mode
// answers "wal", a negative cache_size is KiB, mmap_size is bytes, busy_timeout is ms.
import { describe, it, expect } from "vitest";
import { QueryTypes } from "sequelize";
import { createMigratedDatabase, onPostgres } from "../helpers/db";

createMigratedDatabase();

async function pragmas(options: { transaction?: unknown } = {}) {
  const { getSequelize } = await import("@/lib/db");
  const sequelize = getSequelize();
  const read = async (name: string) => {
    const rows = await sequelize.query(`PRAGMA ${name}`, { ...options, type: QueryTypes.SELECT } as never);
    return Object.values((rows as unknown as Record<string, unknown>[])[0])[0];
  };
  return {
    journal: await read("journal_mode"),
    busy: await read("busy_timeout"),
    foreignKeys: await read("foreign_keys"),
    cache: await read("cache_size"),
    mmap: await read("mmap_size"),
  };
}

const EXPECTED = { journal: "wal", busy: 10000, foreignKeys: 1, cache: -32 * 1024, mmap: 256 * 1024 * 1024 };

// SQLite locking and PRAGMAs: nothing to check on PostgreSQL.
describe.skipIf(onPostgres)("SQLite connection settings", () => {
  it("hold on the main connection", async () => {
    expect(await pragmas()).toEqual(EXPECTED);
  });

  it("hold on a transaction's own connection too", async () => {
    const { getSequelize } = await import("@/lib/db");
    const inside = await getSequelize().transaction((transaction) => pragmas({ transaction }));
    expect(inside).toEqual(EXPECTED);
  });

  it("the write transaction helper gets them as well", async () => {
    const { writeTransaction } = await import("@/lib/db");
    expect(await writeTransaction((transaction) => pragmas({ transaction }))).toEqual(EXPECTED);
  });
});
