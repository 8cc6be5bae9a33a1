import { NextResponse } from "next/server";
import { withAnyone, readJson, jsonError } from "@/lib/auth/api";
import { acceptInvite } from "@/lib/users";
import { allow, clientKey } from "@/lib/rate-limit";

export const POST = withAnyone(async (req) => {
  if (!allow(`invite:${clientKey(req.headers)}`, 20, 60_000)) return jsonError(429, "too many attempts; wait a minute");
  const body = await readJson(req);
  if (!body) return jsonError(400, "expected a JSON object");
  const result = await acceptInvite(body.token, body.password);
  return result.ok ? NextResponse.json(result.value) : jsonError(result.status, result.error);
});
