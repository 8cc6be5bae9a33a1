/** Write transactions of the registry services. */
import { Transaction } from "sequelize";
import { sequelize } from "@/models";

/**
 * BEGIN IMMEDIATE on SQLite: the write lock is taken at the start, so a read-then-write never
 * fails to upgrade (SQLITE_BUSY) when the worker or another process writes at the same time; the
 * connection's busy_timeout makes it wait instead. Other databases ignore the type.
 */
export function writeTransaction<T>(work: (t: Transaction) => Promise<T>): Promise<T> {
  return sequelize.transaction({ type: Transaction.TYPES.IMMEDIATE }, work);
}
