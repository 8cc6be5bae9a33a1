/** Write transactions of the registry services: the shared one of lib/db.ts (serialised, BEGIN IMMEDIATE). */
export { writeTransaction } from "@/lib/db";
