import { NextResponse } from "next/server";
import { withRole, jsonError } from "@/lib/auth/api";
import { batchProgress } from "@/lib/queue";

type Ctx = { params: Promise<{ id: string }> };

/** The batch page polls this about once a second until `complete` is true. */
export const GET = withRole("researcher", async (_req, ctx: Ctx, user) => {
  const progress = await batchProgress(user, (await ctx.params).id);
  return progress ? NextResponse.json({ progress }, { headers: { "cache-control": "no-store" } }) : jsonError(404, "no such batch");
});
