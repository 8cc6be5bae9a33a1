// Integration: the users admin API against a migrated SQLite file, with the fake SMTP server running.
import { describe, it, expect, beforeAll, afterAll } from "vitest";
import { createMigratedDatabase } from "../helpers/db";
import { request, noParams, withParams, type TestUser } from "../helpers/requests";
import type { SMTPServer } from "smtp-server";

createMigratedDatabase({ seed: true });

let smtp: SMTPServer;
let users: Record<string, TestUser>;

beforeAll(async () => {
  const { startFakeSmtp } = await import("@/lib/mail/fake-smtp-server");
  const started = await startFakeSmtp(0);
  smtp = started.server;
  process.env.SMTP_URL = `smtp://127.0.0.1:${started.port}`;
  const { User } = await import("@/models");
  const rows = await User.findAll();
  users = Object.fromEntries(rows.map((u) => [u.role, { id: u.id, email: u.email, role: u.role }]));
});

afterAll(() => new Promise<void>((resolve) => smtp.close(() => resolve())));

describe("users API", () => {
  it("answers 401 JSON without a session", async () => {
    const { GET } = await import("@/app/api/users/route");
    const res = await GET(await request("GET", "/api/users"), noParams);
    expect(res.status).toBe(401);
    expect(await res.json()).toEqual({ error: "not signed in" });
  });

  it("answers 403 JSON to a viewer", async () => {
    const { GET } = await import("@/app/api/users/route");
    const res = await GET(await request("GET", "/api/users", { user: users.viewer }), noParams);
    expect(res.status).toBe(403);
    expect((await res.json()).error).toMatch(/admin/);
  });

  it("lists the demo users for an admin", async () => {
    const { GET } = await import("@/app/api/users/route");
    const res = await GET(await request("GET", "/api/users", { user: users.admin }), noParams);
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body.users.map((u: { role: string }) => u.role).sort()).toEqual(["admin", "curator", "researcher", "viewer"]);
    expect(JSON.stringify(body)).not.toMatch(/password/i);
  });

  it("invites by e-mail: the mail lands in the outbox, the link sets a password once, sign-in works", async () => {
    const { POST } = await import("@/app/api/users/route");
    const res = await POST(await request("POST", "/api/users", { user: users.admin, body: { email: "New.Person@wavesieve.test", name: "New Person", role: "researcher" } }), noParams);
    expect(res.status).toBe(201);
    expect((await res.json()).mailed).toBe(true);

    const { MailMessage, AuditEvent } = await import("@/models");
    const mail = await MailMessage.findOne({ where: { toAddresses: "new.person@wavesieve.test" } });
    expect(mail?.subject).toBe("You are invited to Wavesieve");
    const token = /\/welcome\/([A-Za-z0-9_-]+)/.exec(mail!.textBody)?.[1];
    expect(token).toBeTruthy();
    expect(await AuditEvent.count({ where: { action: "user.invited" } })).toBe(1);

    const accept = (await import("@/app/api/invites/accept/route")).POST;
    const ok = await accept(await request("POST", "/api/invites/accept", { body: { token, password: "a-long-password-1" } }), noParams);
    expect(ok.status).toBe(200);
    const again = await accept(await request("POST", "/api/invites/accept", { body: { token, password: "a-long-password-2" } }), noParams);
    expect(again.status).toBe(410);

    const { verifyCredentials } = await import("@/lib/auth/sign-in");
    const signIn = await verifyCredentials("new.person@wavesieve.test", "a-long-password-1");
    expect(signIn.ok && signIn.user.role).toBe("researcher");
  });

  it("refuses a duplicate e-mail and a bad role", async () => {
    const { POST } = await import("@/app/api/users/route");
    const dup = await POST(await request("POST", "/api/users", { user: users.admin, body: { email: "viewer@wavesieve.test", name: "X", role: "viewer" } }), noParams);
    expect(dup.status).toBe(409);
    const bad = await POST(await request("POST", "/api/users", { user: users.admin, body: { email: "z@wavesieve.test", name: "Z", role: "owner" } }), noParams);
    expect(bad.status).toBe(400);
  });

  it("changes a role and disables an account; a disabled account's session stops working", async () => {
    const { PATCH } = await import("@/app/api/users/[id]/route");
    const res = await PATCH(await request("PATCH", `/api/users/${users.viewer.id}`, { user: users.admin, body: { role: "researcher" } }), withParams({ id: users.viewer.id }));
    expect(res.status).toBe(200);
    expect((await res.json()).user.role).toBe("researcher");

    const off = await PATCH(await request("PATCH", `/api/users/${users.curator.id}`, { user: users.admin, body: { disabled: true } }), withParams({ id: users.curator.id }));
    expect(off.status).toBe(200);
    const { GET } = await import("@/app/api/account/route");
    const me = await GET(await request("GET", "/api/account", { user: users.curator }), noParams);
    expect(me.status).toBe(401);

    const self = await PATCH(await request("PATCH", `/api/users/${users.admin.id}`, { user: users.admin, body: { disabled: true } }), withParams({ id: users.admin.id }));
    expect(self.status).toBe(400);
  });

  it("refuses a cross-site write made with a session cookie", async () => {
    const { POST } = await import("@/app/api/users/route");
    const res = await POST(
      await request("POST", "/api/users", { user: users.admin, body: { email: "csrf@wavesieve.test", name: "C", role: "viewer" }, headers: { origin: "http://evil.example" } }),
      noParams,
    );
    expect(res.status).toBe(403);
  });
});

describe("sign-in lock-out", () => {
  it("locks an account after 5 wrong passwords, even for the right one", async () => {
    const { verifyCredentials, MAX_FAILURES } = await import("@/lib/auth/sign-in");
    for (let i = 0; i < MAX_FAILURES - 1; i++) expect(await verifyCredentials("researcher@wavesieve.test", "wrong")).toEqual({ ok: false, reason: "invalid" });
    expect(await verifyCredentials("researcher@wavesieve.test", "wrong")).toEqual({ ok: false, reason: "locked" });
    expect(await verifyCredentials("researcher@wavesieve.test", "wavesieve-demo")).toEqual({ ok: false, reason: "locked" });
  });
});

describe("my account", () => {
  it("changes the password only with the current one", async () => {
    const { POST } = await import("@/app/api/account/password/route");
    const wrong = await POST(await request("POST", "/api/account/password", { user: users.admin, body: { currentPassword: "nope", newPassword: "another-long-pass" } }), noParams);
    expect(wrong.status).toBe(400);
    const ok = await POST(await request("POST", "/api/account/password", { user: users.admin, body: { currentPassword: "wavesieve-demo", newPassword: "another-long-pass" } }), noParams);
    expect(ok.status).toBe(200);
  });
});
