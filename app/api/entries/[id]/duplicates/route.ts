import { NextResponse } from "next/server";
import { withRole, jsonError } from "@/lib/auth/api";
import { duplicateCandidates } from "@/lib/registry";

type Ctx = { params: Promise<{ id: string }> };

/** Entries that may be the same family (same normalised family, or same canonical coefficients). */
export const GET = withRole("curator", async (_req, ctx: Ctx) => {
  const candidates = await duplicateCandidates((await ctx.params).id);
  return candidates ? NextResponse.json({ candidates }) : jsonError(404, "no such entry");
});
