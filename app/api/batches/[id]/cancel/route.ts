import { NextResponse } from "next/server";
import { withRole, jsonError } from "@/lib/auth/api";
import { cancelBatch } from "@/lib/queue";

type Ctx = { params: Promise<{ id: string }> };

/** The owner cancels a batch: queued runs end now, running ones when they next report. */
export const POST = withRole("researcher", async (_req, ctx: Ctx, user) => {
  const result = await cancelBatch(user, (await ctx.params).id);
  return result.ok ? NextResponse.json(result.value) : jsonError(result.status, result.error);
});
