import { NextResponse } from "next/server";
import { withRole, readJson, jsonError } from "@/lib/auth/api";
import { updateUser } from "@/lib/users";

type Ctx = { params: Promise<{ id: string }> };

export const PATCH = withRole("admin", async (req, ctx: Ctx, user) => {
  const body = await readJson(req);
  if (!body) return jsonError(400, "expected a JSON object");
  const result = await updateUser(user, (await ctx.params).id, body);
  return result.ok ? NextResponse.json({ user: result.value }) : jsonError(result.status, result.error);
});
