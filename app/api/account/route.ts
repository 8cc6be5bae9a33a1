import { NextResponse } from "next/server";
import { withRole, readJson, jsonError } from "@/lib/auth/api";
import { updatePreferences } from "@/lib/users";

export const GET = withRole("viewer", async (_req, _ctx, user) => NextResponse.json({ user }));

export const PATCH = withRole("viewer", async (req, _ctx, user) => {
  const body = await readJson(req);
  if (!body) return jsonError(400, "expected a JSON object");
  const result = await updatePreferences(user.id, body);
  return result.ok ? NextResponse.json({ user: result.value }) : jsonError(result.status, result.error);
});
