import { NextResponse } from "next/server";
import { withRole, readJson, jsonError } from "@/lib/auth/api";
import { changePassword } from "@/lib/users";

export const POST = withRole("viewer", async (req, _ctx, user) => {
  const body = await readJson(req);
  if (!body) return jsonError(400, "expected a JSON object");
  const result = await changePassword(user.id, body.currentPassword, body.newPassword);
  return result.ok ? NextResponse.json({ ok: true }) : jsonError(result.status, result.error);
});
