import NextAuth from "next-auth";
import type { NextRequest } from "next/server";
import { authOptions } from "@/lib/auth/options";
import { jsonError } from "@/lib/auth/api";
import { allow, clientKey } from "@/lib/rate-limit";

/** Sign-in attempts per client address per minute (besides the per-account lock-out). */
export const SIGN_IN_ATTEMPTS_PER_MINUTE = 20;

const handler = NextAuth(authOptions);

type Ctx = { params: Promise<{ nextauth: string[] }> };

export async function GET(req: NextRequest, ctx: Ctx) {
  return handler(req, ctx);
}

export async function POST(req: NextRequest, ctx: Ctx) {
  const { nextauth } = await ctx.params;
  if (nextauth.join("/") === "callback/credentials" && !allow(`signin:${clientKey(req.headers)}`, SIGN_IN_ATTEMPTS_PER_MINUTE, 60_000)) {
    return jsonError(429, "too many sign-in attempts; wait a minute");
  }
  return handler(req, ctx);
}
