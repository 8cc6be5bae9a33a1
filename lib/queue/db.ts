/** Transaction and dialect helpers shared by the queue services. */
import { Transaction } from "sequelize";
import { sequelize } from "@/models";

export function isPostgres(): boolean {
  return sequelize.getDialect() === "postgres";
}

/**
 * A write transaction. On SQLite it is BEGIN IMMEDIATE: the write lock is taken at once, so two
 * processes never both read and then fail to upgrade (SQLITE_BUSY); busy_timeout makes the
 * second one wait. On PostgreSQL rows are locked explicitly (FOR UPDATE [SKIP LOCKED]).
 */
export function writeTransaction<T>(work: (t: Transaction) => Promise<T>): Promise<T> {
  return sequelize.transaction({ type: Transaction.TYPES.IMMEDIATE }, work);
}

/** Row lock for a read inside a write transaction (ignored by SQLite, where the whole DB is locked). */
export function rowLock(t: Transaction) {
  return isPostgres() ? { lock: t.LOCK.UPDATE } : {};
}

export function addMs(date: Date, ms: number): Date {
  return new Date(date.getTime() + ms);
}
