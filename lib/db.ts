/**
 * The one Sequelize connection of this process (a module singleton).
 * SQLite file by default (WAL mode); DATABASE_URL may point to PostgreSQL.
 */
import path from "node:path";
import { Sequelize } from "sequelize";

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
