import { NextResponse } from "next/server";
import { withRole, readJson, jsonError } from "@/lib/auth/api";
import { createApiToken, listApiTokens } from "@/lib/auth/api-tokens";

export const GET = withRole("researcher", async (_req, _ctx, user) => NextResponse.json({ tokens: await listApiTokens(user.id) }));

export const POST = withRole("researcher", async (req, _ctx, user) => {
  const body = await readJson(req);
  const name = typeof body?.name === "string" ? body.name.trim() : "";
  if (!name || name.length > 80) return jsonError(400, "a token name of 1–80 characters is required");
  return NextResponse.json({ token: await createApiToken(user.id, name) }, { status: 201 });
});
