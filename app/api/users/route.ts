import { NextResponse } from "next/server";
import { withRole, readJson, jsonError } from "@/lib/auth/api";
import { inviteUser, listUsers } from "@/lib/users";

export const GET = withRole("admin", async () => NextResponse.json({ users: await listUsers() }));

export const POST = withRole("admin", async (req, _ctx, user) => {
  const body = await readJson(req);
  if (!body) return jsonError(400, "expected a JSON object");
  const result = await inviteUser(user, body);
  return result.ok ? NextResponse.json(result.value, { status: 201 }) : jsonError(result.status, result.error);
});
