/**
 * The intended access of every API route and method. The authorization-matrix test fails when a
 * route file exports a method that is missing here, or whose guard disagrees with this table.
 */
import type { Access } from "@/lib/auth/api";

export const ROUTE_POLICY: Record<string, Access | "next-auth"> = {
  "GET /api/auth/[...nextauth]": "next-auth",
  "POST /api/auth/[...nextauth]": "next-auth",
  "GET /api/health": "anyone",
  "POST /api/invites/accept": "anyone",
  "GET /api/account": "viewer",
  "PATCH /api/account": "viewer",
  "POST /api/account/password": "viewer",
  "GET /api/users": "admin",
  "POST /api/users": "admin",
  "PATCH /api/users/[id]": "admin",
  "GET /api/outbox": "admin",
  "GET /api/tokens": "researcher",
  "POST /api/tokens": "researcher",
  "DELETE /api/tokens/[id]": "researcher",
  "GET /api/batches": "researcher",
  "POST /api/batches": "researcher",
  "POST /api/batches/validate": "researcher",
  "GET /api/batches/[id]": "researcher",
  "GET /api/batches/[id]/progress": "researcher",
  "POST /api/batches/[id]/cancel": "researcher",
  "POST /api/design": "researcher",
  "POST /api/design/submit": "researcher",
  "GET /api/registry/changes": "curator",
  "GET /api/registry": "viewer",
  "GET /api/registry/export": "viewer",
  "GET /api/entries/[id]/export": "viewer",
  "GET /api/entries/[id]/duplicates": "curator",
  "POST /api/entries/[id]/curate": "curator",
  "PATCH /api/entries/[id]/tags": "curator",
  "POST /api/entries/[id]/duplicate": "curator",
  "POST /api/entries/[id]/publish": "curator",
};
