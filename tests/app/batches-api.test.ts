// Integration: uploads through POST /api/batches against a migrated SQLite file.
import { describe, it, expect, beforeAll, vi } from "vitest";
import { createMigratedDatabase } from "../helpers/db";
import { request, noParams, withParams, type TestUser } from "../helpers/requests";

createMigratedDatabase({ seed: true });

const GOOD = `wavesieve: 1
families:
  - id: ring-trap-ramp
    title: Ring trap with a slow interaction ramp
    class: nls
    parameters:
      g1: { values: [0.1, 0.2] }
    coefficients:
      a: "1/2"
      h: "-exp(g1*t)"
      b: "0"
    window: [0, 4]
  - id: broken-gain
    title: Gain written with an unknown function
    class: nls
    coefficients:
      a: "1/2"
      h: "sec(t)"
    window: [0, 1]
`;

const KDV = `wavesieve: 1
families:
  - id: shelf-wave
    title: Wave over a shelf
    class: kdv
    coefficients:
      p: "6"
      q: "1"
      r: "1/(2*(t+1))"
    window: [0, 3]
`;

let users: Record<string, TestUser>;

beforeAll(async () => {
  const { User } = await import("@/models");
  users = Object.fromEntries((await User.findAll()).map((u) => [u.role, { id: u.id, email: u.email, role: u.role }]));
});

async function tableCounts() {
  const { Batch, Family, FamilyVariant, BatchFamily } = await import("@/models");
  return { batches: await Batch.count(), families: await Family.count(), variants: await FamilyVariant.count(), links: await BatchFamily.count() };
}

describe("POST /api/batches", () => {
  it("refuses a viewer (403) and anonymous callers (401)", async () => {
    const { POST } = await import("@/app/api/batches/route");
    expect((await POST(await request("POST", "/api/batches", { body: { files: [] } }), noParams)).status).toBe(401);
    expect((await POST(await request("POST", "/api/batches", { user: users.viewer, body: { files: [] } }), noParams)).status).toBe(403);
  });

  it("stores the valid families of a file, reports the located error of the invalid one", async () => {
    const { POST } = await import("@/app/api/batches/route");
    const res = await POST(await request("POST", "/api/batches", { user: users.researcher, body: { files: [{ name: "ramps.yaml", text: GOOD }, { name: "shelf.yaml", text: KDV }] } }), noParams);
    expect(res.status).toBe(201);
    const body = await res.json();
    expect(body.batch).toMatchObject({ families: 2, variants: 3, errors: 1, reusedFamilies: 0 });
    const err = body.files[0].errors[0];
    expect(err).toMatchObject({ file: "ramps.yaml", familyId: "broken-gain", path: "families[1].coefficients.h", line: 18 });
    expect(err.message).toMatch(/sec/);
    expect(await tableCounts()).toEqual({ batches: 1, families: 2, variants: 3, links: 2 });

    const { Family } = await import("@/models");
    const fam = await Family.findOne({ where: { slug: "ring-trap-ramp" } });
    expect(fam?.sourceYaml).toContain("Ring trap with a slow interaction ramp");
  });

  it("links a family uploaded again by the same user instead of copying it", async () => {
    const { POST } = await import("@/app/api/batches/route");
    const res = await POST(await request("POST", "/api/batches?name=shelf-again.yaml", { user: users.researcher, body: KDV, headers: { "content-type": "application/yaml" } }), noParams);
    expect(res.status).toBe(201);
    expect((await res.json()).batch).toMatchObject({ families: 1, reusedFamilies: 1 });
    expect(await tableCounts()).toEqual({ batches: 2, families: 2, variants: 3, links: 3 });
  });

  it("stores nothing when no family is valid (422) and nothing when the body is too large (413)", async () => {
    const before = await tableCounts();
    const { POST } = await import("@/app/api/batches/route");
    const bad = await POST(await request("POST", "/api/batches", { user: users.researcher, body: { files: [{ name: "x.yaml", text: "wavesieve: 2\nfamilies: []\n" }] } }), noParams);
    expect(bad.status).toBe(422);
    expect((await bad.json()).files[0].errors.length).toBeGreaterThan(0);
    const huge = await POST(await request("POST", "/api/batches", { user: users.researcher, body: "#".repeat(9 * 1024 * 1024), headers: { "content-type": "application/yaml" } }), noParams);
    expect(huge.status).toBe(413);
    expect(await tableCounts()).toEqual(before);
  });

  it("accepts multipart uploads, as the Submit page sends them", async () => {
    const { POST } = await import("@/app/api/batches/validate/route");
    const form = new FormData();
    form.append("files", new Blob([GOOD], { type: "application/yaml" }), "ramps.yaml");
    const { NextRequest } = await import("next/server");
    const { sessionCookie } = await import("../helpers/requests");
    const req = new NextRequest("http://localhost:3000/api/batches/validate", { method: "POST", body: form, headers: { cookie: await sessionCookie(users.researcher), host: "localhost:3000" } });
    const res = await POST(req, noParams);
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body.files[0].families.map((f: { id: string }) => f.id)).toEqual(["ring-trap-ramp"]);
  });

  it("rolls the whole batch back when a write fails midway (nothing half-stored)", async () => {
    const before = await tableCounts();
    const { FamilyVariant } = await import("@/models");
    // Simulate a full disk on the first variant write.
    const spy = vi.spyOn(FamilyVariant, "bulkCreate").mockRejectedValueOnce(Object.assign(new Error("SQLITE_FULL: database or disk is full"), { code: "SQLITE_FULL" }));
    try {
      const { POST } = await import("@/app/api/batches/route");
      const text = GOOD.replaceAll("ring-trap-ramp", "ring-trap-ramp-2").replace("0.1, 0.2", "0.3, 0.4");
      const res = await POST(await request("POST", "/api/batches", { user: users.researcher, body: { files: [{ name: "r.yaml", text }] } }), noParams);
      expect(res.status).toBe(503);
      expect((await res.json()).error).toMatch(/nothing was stored/);
      expect(spy).toHaveBeenCalledTimes(1);
    } finally {
      spy.mockRestore();
    }
    expect(await tableCounts()).toEqual(before);
  });
});

describe("GET /api/batches", () => {
  it("shows researchers their own batches and curators everyone's", async () => {
    const { GET } = await import("@/app/api/batches/route");
    const mine = await (await GET(await request("GET", "/api/batches", { user: users.researcher }), noParams)).json();
    expect(mine.batches).toHaveLength(2);
    const { User } = await import("@/models");
    const other = await User.create({ email: "other@wavesieve.test", name: "Other", role: "researcher" });
    const theirs = await (await GET(await request("GET", "/api/batches", { user: { id: other.id, email: other.email, role: "researcher" } }), noParams)).json();
    expect(theirs.batches).toHaveLength(0);
    const all = await (await GET(await request("GET", "/api/batches", { user: users.curator }), noParams)).json();
    expect(all.batches).toHaveLength(2);

    const { GET: one } = await import("@/app/api/batches/[id]/route");
    const id = mine.batches[0].id;
    const detail = await one(await request("GET", `/api/batches/${id}`, { user: users.researcher }), withParams({ id }));
    expect(detail.status).toBe(200);
    const hidden = await one(await request("GET", `/api/batches/${id}`, { user: { id: other.id, email: other.email, role: "researcher" } }), withParams({ id }));
    expect(hidden.status).toBe(404);
  });
});

describe("personal API tokens", () => {
  it("a researcher creates a token, uploads with it, revokes it, and the token stops working", async () => {
    const tokens = await import("@/app/api/tokens/route");
    const created = await tokens.POST(await request("POST", "/api/tokens", { user: users.researcher, body: { name: "sweep script" } }), noParams);
    expect(created.status).toBe(201);
    const { token } = await created.json();
    expect(token.secret).toMatch(/^ws_[A-Za-z0-9_-]{40,}$/);
    const { ApiToken } = await import("@/models");
    const row = await ApiToken.findByPk(token.id);
    expect(row?.tokenHash).toMatch(/^[0-9a-f]{64}$/);
    expect(row?.tokenHash).not.toContain(token.secret);

    const { POST } = await import("@/app/api/batches/route");
    const upload = () => request("POST", "/api/batches?name=token.yaml", { body: KDV.replace("shelf-wave", "shelf-wave-token").replace('"6"', '"5"'), headers: { "content-type": "application/yaml", authorization: `Bearer ${token.secret}` } });
    const res = await POST(await upload(), noParams);
    expect(res.status).toBe(201);

    const { DELETE } = await import("@/app/api/tokens/[id]/route");
    expect((await DELETE(await request("DELETE", `/api/tokens/${token.id}`, { user: users.researcher }), withParams({ id: token.id }))).status).toBe(200);
    expect((await POST(await upload(), noParams)).status).toBe(401);
  });
});

describe("upload rate limit", () => {
  it("refuses the 31st upload of one user within a minute (429), before reading the body", async () => {
    const { POST, UPLOADS_PER_MINUTE } = await import("@/app/api/batches/route");
    const { User } = await import("@/models");
    const u = await User.create({ email: "busy@wavesieve.test", name: "Busy", role: "researcher" });
    const busy = { id: u.id, email: u.email, role: "researcher" as const };
    for (let i = 0; i < UPLOADS_PER_MINUTE; i++) {
      const res = await POST(await request("POST", "/api/batches", { user: busy, body: { files: [] } }), noParams);
      expect(res.status).toBe(400);
    }
    const limited = await POST(await request("POST", "/api/batches", { user: busy, body: { files: [] } }), noParams);
    expect(limited.status).toBe(429);
    expect((await limited.json()).error).toMatch(/too many uploads/);
  });
});
