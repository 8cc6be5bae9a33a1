import { NextResponse } from "next/server";
import { withRole, jsonError, readJson } from "@/lib/auth/api";
import { setEntryTags, registryRow } from "@/lib/registry";

type Ctx = { params: Promise<{ id: string }> };

/** Replace an entry's tags: { tags: string[], note? }. */
export const PATCH = withRole("curator", async (req, ctx: Ctx, user) => {
  const body = await readJson(req);
  if (!body) return jsonError(400, "send a JSON object");
  const result = await setEntryTags(user, (await ctx.params).id, body.tags, body.note);
  return result.ok ? NextResponse.json({ entry: registryRow(result.entry) }) : jsonError(result.status, result.error);
});
