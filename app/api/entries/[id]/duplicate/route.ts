import { NextResponse } from "next/server";
import { withRole, jsonError, readJson } from "@/lib/auth/api";
import { markDuplicate, registryRow } from "@/lib/registry";

type Ctx = { params: Promise<{ id: string }> };

/** Mark an entry as a duplicate of another ({ duplicateOf: id, note? }) or clear it ({ duplicateOf: null }). */
export const POST = withRole("curator", async (req, ctx: Ctx, user) => {
  const body = await readJson(req);
  if (!body || !("duplicateOf" in body)) return jsonError(400, "send { duplicateOf: <entry id> | null, note? }");
  const result = await markDuplicate(user, (await ctx.params).id, body.duplicateOf, body.note);
  return result.ok ? NextResponse.json({ entry: registryRow(result.entry) }) : jsonError(result.status, result.error);
});
