// Every route handler × every role (and anonymous), generated from the files under app/api.
import { describe, it, expect, beforeAll } from "vitest";
import { readdirSync } from "node:fs";
import path from "node:path";
import { createMigratedDatabase } from "../helpers/db";
import { request, type TestUser } from "../helpers/requests";
import { ROUTE_POLICY } from "./route-policy";
import { ROLES, hasRole, type Role } from "@/lib/auth/roles";

createMigratedDatabase({ seed: true });

const METHODS = ["GET", "POST", "PUT", "PATCH", "DELETE"] as const;
const API_DIR = path.resolve("app/api");

function routeFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) =>
    e.isDirectory() ? routeFiles(path.join(dir, e.name)) : e.name === "route.ts" ? [path.join(dir, e.name)] : [],
  );
}

const routes = routeFiles(API_DIR).map((file) => ({
  file,
  route: "/api/" + path.relative(API_DIR, path.dirname(file)).split(path.sep).join("/"),
}));

/** Fill dynamic segments with harmless values (a random UUID matches no row). */
function concrete(route: string) {
  const params: Record<string, string | string[]> = {};
  const url = route.replace(/\[(\.\.\.)?([^\]]+)\]/g, (_m, rest: string | undefined, name: string) => {
    params[name] = rest ? ["x"] : "00000000-0000-4000-8000-000000000000";
    return rest ? "x" : String(params[name]);
  });
  return { url, ctx: { params: Promise.resolve(params) } };
}

type Guarded = ((req: unknown, ctx: unknown) => Promise<Response>) & { access?: string };

let users: Record<Role, TestUser>;
beforeAll(async () => {
  const { User } = await import("@/models");
  users = Object.fromEntries((await User.findAll()).map((u) => [u.role, { id: u.id, email: u.email, role: u.role }])) as Record<Role, TestUser>;
});

describe("authorization matrix", () => {
  it("finds the route files", () => {
    expect(routes.length).toBeGreaterThanOrEqual(10);
  });

  for (const { file, route } of routes) {
    it(`${route}: every method is in the policy table and guarded as it says; 401/403/allowed per role`, async () => {
      const mod = (await import(file)) as Record<string, unknown>;
      const methods = METHODS.filter((m) => typeof mod[m] === "function");
      expect(methods.length, `${route} exports no handler`).toBeGreaterThan(0);
      for (const method of methods) {
        const key = `${method} ${route}`;
        const policy = ROUTE_POLICY[key];
        expect(policy, `add "${key}" to tests/app/route-policy.ts`).toBeDefined();
        if (policy === "next-auth") continue;
        const handler = mod[method] as Guarded;
        expect(handler.access, `${key} is not wrapped in withRole/withAnyone`).toBe(policy);
        const { url, ctx } = concrete(route);
        const body = method === "GET" || method === "DELETE" ? undefined : {};

        const anon = await handler(await request(method, url, { body }), ctx);
        if (policy === "anyone") expect([401, 403], `${key} anonymous`).not.toContain(anon.status);
        else expect(anon.status, `${key} anonymous`).toBe(401);

        for (const role of ROLES) {
          const res = await handler(await request(method, url, { user: users[role], body }), ctx);
          const allowed = policy === "anyone" || hasRole(role, policy);
          if (allowed) {
            expect([401, 403], `${key} as ${role}`).not.toContain(res.status);
            expect(res.status, `${key} as ${role} must not crash`).toBeLessThan(500);
          } else {
            expect(res.status, `${key} as ${role}`).toBe(403);
            expect((await res.json()).error, `${key} as ${role}: JSON error`).toBeTypeOf("string");
          }
        }
      }
    });
  }
});
