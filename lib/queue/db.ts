/** Transaction and dialect helpers shared by the queue services. */
import { Transaction } from "sequelize";
import { sequelize } from "@/models";

export function isPostgres(): boolean {
  return sequelize.getDialect() === "postgres";
}

/**
 * Write transactions (lib/db.ts): serialised per process and BEGIN IMMEDIATE on SQLite. On
 * PostgreSQL rows are locked explicitly (FOR UPDATE [SKIP LOCKED]).
 */
export { writeTransaction } from "@/lib/db";

/** Row lock for a read inside a write transaction (ignored by SQLite, where the whole DB is locked). */
export function rowLock(t: Transaction) {
  return isPostgres() ? { lock: t.LOCK.UPDATE } : {};
}

export function addMs(date: Date, ms: number): Date {
  return new Date(date.getTime() + ms);
}
