import NextAuth from "next-auth";
import type { NextRequest } from "next/server";
import { authOptions } from "@/lib/auth/options";
import { jsonError } from "@/lib/auth/api";
import { allow, peek, clientKey } from "@/lib/rate-limit";

/**
 * Failed sign-ins per client address per minute (besides the per-account lock-out). Only failures
 * count, so a lab behind one address can still sign in many people (common practice: throttle
 * failures, not successes).
 */
export const FAILED_SIGN_INS_PER_MINUTE = 20;

const handler = NextAuth(authOptions);

type Ctx = { params: Promise<{ nextauth: string[] }> };

export async function GET(req: NextRequest, ctx: Ctx) {
  return handler(req, ctx);
}

export async function POST(req: NextRequest, ctx: Ctx) {
  const { nextauth } = await ctx.params;
  if (nextauth.join("/") !== "callback/credentials") return handler(req, ctx);
  const key = `signin-failures:${clientKey(req.headers)}`;
  if (peek(key, 60_000) >= FAILED_SIGN_INS_PER_MINUTE) return jsonError(429, "too many failed sign-in attempts; wait a minute");
  const res: Response = await handler(req, ctx);
  // A successful sign-in sets the session cookie; anything else is a failure.
  if (!(res.headers.get("set-cookie") ?? "").includes("session-token=")) allow(key, Number.MAX_SAFE_INTEGER, 60_000);
  return res;
}
