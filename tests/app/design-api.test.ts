// Integration: design mode through POST /api/design and POST /api/design/submit against a
// migrated SQLite file (the submit path stores a batch through lib/batches, like an upload).
import { describe, it, expect, beforeAll } from "vitest";
import { createMigratedDatabase } from "../helpers/db";
import { request, noParams, type TestUser } from "../helpers/requests";

createMigratedDatabase({ seed: true });

let users: Record<string, TestUser>;

beforeAll(async () => {
  const { User } = await import("@/models");
  users = Object.fromEntries((await User.findAll()).map((u) => [u.role, { id: u.id, email: u.email, role: u.role }]));
});

// A fibre with a tapered dispersion and a constant loss; the nonlinearity is solved for
// (nls.md §10 fibre form: gnl = gnl0 (beta2/beta2_0) e^{∫alphaL}/(1 + Kf ∫beta2)).
const FIBRE = { class: "nls", solve: "h", set: { a: "(1 + 0.2*t)/2", k: "0.025" }, window: [0, 5] };

describe("POST /api/design", () => {
  it("refuses anonymous callers (401) and viewers (403)", async () => {
    const { POST } = await import("@/app/api/design/route");
    expect((await POST(await request("POST", "/api/design", { body: FIBRE }), noParams)).status).toBe(401);
    expect((await POST(await request("POST", "/api/design", { user: users.viewer, body: FIBRE }), noParams)).status).toBe(403);
  });

  it("returns the design: closed form, constants, the pipeline's verdicts, plot data and YAML", async () => {
    const { POST } = await import("@/app/api/design/route");
    const res = await POST(await request("POST", "/api/design", { user: users.researcher, body: FIBRE }), noParams);
    expect(res.status).toBe(200);
    const { result } = await res.json();
    expect(result.solution.form).toBe("closed");
    expect(result.solution.text).toContain("h0");
    expect(result.constants.map((c: { name: string }) => c.name)).toEqual(["h0", "alpha0"]);
    expect(result.screening).toMatchObject({ kind: "pipeline", reducibility: "reducible", painleve: "passes", invariant: "R" });
    expect(result.plot.map((c: { name: string; role: string }) => `${c.name}:${c.role}`)).toEqual(["h:solved", "a:fixed", "k:fixed"]);
    expect(result.yaml).toMatch(/^wavesieve: 1\n/);
    expect(result.submittable).toBe(true);
    expect(result.transformation.sigma).toBe(1);
  });

  it("answers 422 with located errors for a bad request", async () => {
    const { POST } = await import("@/app/api/design/route");
    const res = await POST(await request("POST", "/api/design", { user: users.researcher, body: { ...FIBRE, set: { a: "cos(t)", k: "0" }, window: [0, 3] } }), noParams);
    expect(res.status).toBe(422);
    const body = await res.json();
    expect(body.errors[0]).toMatchObject({ code: "vanishes", field: "set.a" });
    expect(body.error).toMatch(/a vanishes at t = 1\.5708/);
    const none = await POST(await request("POST", "/api/design", { user: users.researcher, body: { ...FIBRE, set: {} } }), noParams);
    expect((await none.json()).errors[0].code).toBe("none-fixed");
    const junk = await POST(await request("POST", "/api/design", { user: users.researcher, body: "not json", headers: { "content-type": "application/json" } }), noParams);
    expect(junk.status).toBe(400);
  });
});

describe("POST /api/design/submit", () => {
  it("creates a batch with the designed family through lib/batches and returns its id", async () => {
    const { POST } = await import("@/app/api/design/submit/route");
    const { Batch, Family, BatchFamily } = await import("@/models");
    const before = await Batch.count();
    const res = await POST(await request("POST", "/api/design/submit", { user: users.researcher, body: { ...FIBRE, constants: { alpha0: -0.1 } } }), noParams);
    expect(res.status).toBe(201);
    const body = await res.json();
    expect(body.batch).toMatchObject({ families: 1, variants: 1, errors: 0 });
    expect(await Batch.count()).toBe(before + 1);
    const batch = await Batch.findByPk(body.batch.id);
    expect(batch?.ownerId).toBe(users.researcher.id);
    const link = await BatchFamily.findOne({ where: { batchId: body.batch.id } });
    const family = await Family.findByPk(link!.familyId);
    expect(family?.slug).toBe("designed-nls-h");
    expect(family?.sourceYaml).toContain("alpha0: -0.1");
    expect(family?.sourceYaml).toContain("# designed");
  });

  it("refuses a tabulated design (the family format has no tables) and stores nothing", async () => {
    const { POST } = await import("@/app/api/design/submit/route");
    const { Batch } = await import("@/models");
    const before = await Batch.count();
    const body = { class: "nls", solve: "h", set: { a: "1/2", b: "-1/(8*(1 + t)^2)" }, window: [0, 2] };
    const res = await POST(await request("POST", "/api/design/submit", { user: users.researcher, body }), noParams);
    expect(res.status).toBe(422);
    expect((await res.json()).error).toMatch(/cannot be submitted/);
    expect(await Batch.count()).toBe(before);
  });

  it("refuses viewers", async () => {
    const { POST } = await import("@/app/api/design/submit/route");
    expect((await POST(await request("POST", "/api/design/submit", { user: users.viewer, body: FIBRE }), noParams)).status).toBe(403);
  });
});
