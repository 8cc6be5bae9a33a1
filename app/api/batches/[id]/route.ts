import { NextResponse } from "next/server";
import { withRole, jsonError } from "@/lib/auth/api";
import { getBatch } from "@/lib/batches";

type Ctx = { params: Promise<{ id: string }> };

export const GET = withRole("researcher", async (_req, ctx: Ctx, user) => {
  const batch = await getBatch(user, (await ctx.params).id);
  return batch ? NextResponse.json({ batch }) : jsonError(404, "no such batch");
});
