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

function megabytes(variable: string, fallback: number): number {
  const value = Number(process.env[variable] ?? fallback);
  if (!Number.isInteger(value) || value < 0 || value > 65_536) throw new Error(`${variable} must be a whole number of megabytes from 0 to 65536 (got "${process.env[variable]}")`);
  return value;
}

interface SqliteHandle {
  run(sql: string, cb: (err: Error | null) => void): void;
}

/**
 * Run `setup` once on every SQLite connection Sequelize opens (it opens one per transaction).
 * Why not the "afterConnect" hook: Sequelize 6's SQLite connection manager opens its databases in
 * its own getConnection and never runs that hook, so PRAGMAs given there are silently skipped
 * (tests/app/database-settings.test.ts reads them back).
 */
function configureEachConnection(sequelize: Sequelize, setup: (db: SqliteHandle) => Promise<void>): void {
  const manager = sequelize.connectionManager as unknown as { getConnection(options?: unknown): Promise<SqliteHandle> };
  const open = manager.getConnection.bind(manager);
  const configured = new WeakMap<SqliteHandle, Promise<void>>();
  manager.getConnection = async (options?: unknown) => {
    const db = await open(options);
    if (!configured.has(db)) configured.set(db, setup(db));
    await configured.get(db);
    return db;
  };
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
  configureEachConnection(sequelize, async (db) => {
    const run = (sql: string) => new Promise<void>((resolve, reject) => db.run(sql, (e) => (e ? reject(e) : resolve())));
    await run("PRAGMA journal_mode = WAL");
    await run("PRAGMA busy_timeout = 10000");
    await run("PRAGMA foreign_keys = ON");
    // Reads of a large registry: a bigger page cache and memory-mapped reads (SQLite's own
    // defaults are 2 MB and none). SQLITE_CACHE_MB / SQLITE_MMAP_MB override; 0 turns mmap off.
    await run(`PRAGMA cache_size = ${-1024 * megabytes("SQLITE_CACHE_MB", 32)}`);
    await run(`PRAGMA mmap_size = ${1024 * 1024 * megabytes("SQLITE_MMAP_MB", 256)}`);
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
