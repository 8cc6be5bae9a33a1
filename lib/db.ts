/**
 * The one Sequelize connection of this process (a module singleton).
 * SQLite file by default (WAL mode); DATABASE_URL may point to PostgreSQL.
 */
import { AsyncLocalStorage } from "node:async_hooks";
import path from "node:path";
import { Sequelize, Transaction } from "sequelize";

declare global {
  // Survives Next's module reloading in development, so there is still one connection.
  var __wavesieveSequelize: Sequelize | undefined;
}

export function databaseStorage(): string {
  const url = process.env.DATABASE_URL;
  if (url && url.startsWith("sqlite:")) return url.replace(/^sqlite:(\/\/)?/, "");
  return process.env.DATABASE_PATH || path.resolve("data", "wavesieve.sqlite");
}

function connect(): Sequelize {
  const url = process.env.DATABASE_URL;
  if (url && !url.startsWith("sqlite:")) {
    return new Sequelize(url, { logging: false });
  }
  const sequelize = new Sequelize({
    dialect: "sqlite",
    storage: databaseStorage(),
    logging: false,
    // SQLite allows one writer: serialise through a small pool and wait on a busy database.
    pool: { max: 1, min: 0, idle: 10_000 },
    retry: { max: 5 },
  });
  sequelize.addHook("afterConnect", async (connection: unknown) => {
    const db = connection as { run(sql: string, cb: (err: Error | null) => void): void };
    const run = (sql: string) => new Promise<void>((resolve, reject) => db.run(sql, (e) => (e ? reject(e) : resolve())));
    await run("PRAGMA journal_mode = WAL");
    await run("PRAGMA busy_timeout = 10000");
    await run("PRAGMA foreign_keys = ON");
  });
  return sequelize;
}

export function getSequelize(): Sequelize {
  if (!globalThis.__wavesieveSequelize) globalThis.__wavesieveSequelize = connect();
  return globalThis.__wavesieveSequelize;
}

/**
 * One write transaction at a time per process on SQLite, then BEGIN IMMEDIATE.
 *
 * Why: Sequelize's SQLite dialect opens a separate connection per transaction and ignores the
 * pool, and a connection waiting on SQLite's write lock spins inside node-sqlite3's small thread
 * pool. Twenty concurrent uploads therefore starved the one connection holding the lock until
 * busy_timeout expired (SQLITE_BUSY, 503). Queuing writers in the process keeps at most one
 * waiter per process on the lock; BEGIN IMMEDIATE takes the lock at the start, so a read-then-write
 * never fails to upgrade when another process (a worker) writes too. PostgreSQL needs neither.
 */

const insideWrite = new AsyncLocalStorage<true>();
let writeChain: Promise<unknown> = Promise.resolve();

export function writeTransaction<T>(work: (t: Transaction) => Promise<T>): Promise<T> {
  const sequelize = getSequelize();
  const run = () => sequelize.transaction({ type: Transaction.TYPES.IMMEDIATE }, work);
  if (sequelize.getDialect() !== "sqlite" || insideWrite.getStore()) return run();
  const result = writeChain.then(() => insideWrite.run(true, run));
  writeChain = result.catch(() => undefined);
  return result;
}
