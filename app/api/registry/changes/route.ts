import { NextResponse } from "next/server";
import { withRole, jsonError } from "@/lib/auth/api";
import { listVerdictChanges } from "@/lib/queue";

/** Verdicts that changed when a newer engine re-screened an entry (newest first). ?since=ISO&limit=n */
export const GET = withRole("curator", async (req) => {
  const sinceText = req.nextUrl.searchParams.get("since");
  const since = sinceText ? new Date(sinceText) : undefined;
  if (since && Number.isNaN(since.getTime())) return jsonError(400, "since must be an ISO-8601 date");
  const limit = Number(req.nextUrl.searchParams.get("limit") ?? 100);
  if (!Number.isInteger(limit) || limit < 1 || limit > 500) return jsonError(400, "limit must be an integer from 1 to 500");
  return NextResponse.json({ changes: await listVerdictChanges({ since, limit }) });
});
