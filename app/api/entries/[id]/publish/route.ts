import { NextResponse } from "next/server";
import { withRole, jsonError, readJson } from "@/lib/auth/api";
import { setPublished, registryRow } from "@/lib/registry";

type Ctx = { params: Promise<{ id: string }> };

/** Publish or unpublish: { published: boolean, note? }. Only accepted entries can be published. */
export const POST = withRole("curator", async (req, ctx: Ctx, user) => {
  const body = await readJson(req);
  if (!body) return jsonError(400, "send a JSON object");
  const result = await setPublished(user, (await ctx.params).id, body.published, body.note);
  return result.ok ? NextResponse.json({ entry: registryRow(result.entry) }) : jsonError(result.status, result.error);
});
