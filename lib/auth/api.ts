/**
 * The authorization door of every route handler: `withRole(role, handler)`.
 * Answers 401 JSON when nobody is signed in, 403 JSON when the role is too low.
 * State-changing requests from a browser session must come from our own origin (CSRF guard).
 */
import { NextResponse, type NextRequest } from "next/server";
import { getToken } from "next-auth/jwt";
import { hasRole, type Role } from "./roles";
import { loadActiveUser, type CurrentUser } from "./current-user";
import { userFromApiToken } from "./api-tokens";

export type Access = Role | "anyone";

export function jsonError(status: number, error: string, extra?: Record<string, unknown>) {
  return NextResponse.json({ error, ...extra }, { status });
}

async function userFromRequest(req: NextRequest): Promise<{ user: CurrentUser | null; viaToken: boolean }> {
  const auth = req.headers.get("authorization");
  if (auth?.startsWith("Bearer ws_")) return { user: await userFromApiToken(auth.slice(7)), viaToken: true };
  const token = await getToken({ req, secret: process.env.NEXTAUTH_SECRET });
  return { user: await loadActiveUser(token?.uid), viaToken: false };
}

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

/** A cross-site form post carries another Origin; reject it for cookie-authenticated writes. */
function crossSite(req: NextRequest): boolean {
  if (SAFE_METHODS.has(req.method)) return false;
  const origin = req.headers.get("origin");
  if (!origin) return false; // non-browser clients (curl, scripts) send none
  const host = req.headers.get("x-forwarded-host") ?? req.headers.get("host");
  try {
    return new URL(origin).host !== host;
  } catch {
    return true;
  }
}

type Handler<C> = (req: NextRequest, ctx: C, user: CurrentUser) => Promise<Response> | Response;
type PublicHandler<C> = (req: NextRequest, ctx: C, user: CurrentUser | null) => Promise<Response> | Response;

/** Guarded handlers carry the access they need, so tests can check every route against its policy. */
export type GuardedHandler<C> = ((req: NextRequest, ctx: C) => Promise<Response>) & { access: Access };

function mark<C>(fn: (req: NextRequest, ctx: C) => Promise<Response>, access: Access): GuardedHandler<C> {
  return Object.assign(fn, { access });
}

export function withRole<C>(needed: Role, handler: Handler<C>): GuardedHandler<C> {
  return mark(async (req: NextRequest, ctx: C): Promise<Response> => {
    try {
      const { user, viaToken } = await userFromRequest(req);
      if (!user) return jsonError(401, "not signed in");
      if (!viaToken && crossSite(req)) return jsonError(403, "cross-site request refused");
      if (!hasRole(user.role, needed)) return jsonError(403, `this needs the ${needed} role`);
      return await handler(req, ctx, user);
    } catch (err) {
      return internalError(err);
    }
  }, needed);
}

/** For the few routes anyone may call (e.g. accepting an invite). */
export function withAnyone<C>(handler: PublicHandler<C>): GuardedHandler<C> {
  return mark(async (req: NextRequest, ctx: C): Promise<Response> => {
    try {
      if (crossSite(req)) return jsonError(403, "cross-site request refused");
      const { user } = await userFromRequest(req);
      return await handler(req, ctx, user);
    } catch (err) {
      return internalError(err);
    }
  }, "anyone");
}

/** Never send a stack trace to the client; log it on the server. */
export function internalError(err: unknown): Response {
  console.error("[api]", err);
  return jsonError(500, "internal error");
}

export async function readJson(req: NextRequest, maxBytes = 64 * 1024): Promise<Record<string, unknown> | null> {
  const text = await req.text();
  if (text.length > maxBytes) return null;
  try {
    const value: unknown = JSON.parse(text);
    return value && typeof value === "object" && !Array.isArray(value) ? (value as Record<string, unknown>) : null;
  } catch {
    return null;
  }
}
