import { NextResponse } from "next/server";
import { withRole, jsonError, readJson } from "@/lib/auth/api";
import { curateEntry, registryRow, CURATION_ACTIONS, type CurationAction } from "@/lib/registry";

type Ctx = { params: Promise<{ id: string }> };

/** Accept, reject or send back an entry: { action: "accept" | "reject" | "return", note }. */
export const POST = withRole("curator", async (req, ctx: Ctx, user) => {
  const body = await readJson(req);
  if (!body) return jsonError(400, "send a JSON object");
  const action = body.action;
  if (typeof action !== "string" || !(CURATION_ACTIONS as readonly string[]).includes(action)) return jsonError(400, `action must be one of ${CURATION_ACTIONS.join(", ")}`);
  const result = await curateEntry(user, (await ctx.params).id, action as CurationAction, body.note);
  return result.ok ? NextResponse.json({ entry: registryRow(result.entry) }) : jsonError(result.status, result.error);
});
