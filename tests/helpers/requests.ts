/** Build NextRequests carrying a real next-auth session cookie, to call route handlers directly. */
import { NextRequest } from "next/server";
import { encode } from "next-auth/jwt";
import type { Role } from "@/lib/auth/roles";

export const TEST_SECRET = "test-secret-for-vitest-only-0123456789";
process.env.NEXTAUTH_SECRET = TEST_SECRET;

export interface TestUser {
  id: string;
  email: string;
  role: Role;
}

export async function sessionCookie(user: TestUser): Promise<string> {
  const jwt = await encode({ token: { uid: user.id, role: user.role, email: user.email, sub: user.id }, secret: TEST_SECRET });
  return `next-auth.session-token=${jwt}`;
}

export async function request(
  method: string,
  url: string,
  options: { user?: TestUser; body?: unknown; headers?: Record<string, string> } = {},
): Promise<NextRequest> {
  const headers: Record<string, string> = { host: "localhost:3000", ...options.headers };
  if (options.user) headers.cookie = await sessionCookie(options.user);
  let body: string | undefined;
  if (options.body !== undefined) {
    body = typeof options.body === "string" ? options.body : JSON.stringify(options.body);
    headers["content-type"] ??= "application/json";
  }
  return new NextRequest(new URL(url, "http://localhost:3000"), { method, headers, body });
}

export const noParams = { params: Promise.resolve({}) };
export const withParams = <T extends Record<string, string | string[]>>(p: T) => ({ params: Promise.resolve(p) });
