import { NextResponse } from "next/server";
import { withRole, jsonError } from "@/lib/auth/api";
import { revokeApiToken } from "@/lib/auth/api-tokens";

type Ctx = { params: Promise<{ id: string }> };

export const DELETE = withRole("researcher", async (_req, ctx: Ctx, user) =>
  (await revokeApiToken(user.id, (await ctx.params).id)) ? NextResponse.json({ revoked: true }) : jsonError(404, "no such active token"),
);
