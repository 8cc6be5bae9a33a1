// Integration: curation routes (accept / reject / send back, tags, duplicates, publish) — roles,
// state rules, and the audit rows that make the entry's history.
import { describe, it, expect, beforeAll } from "vitest";
import { createMigratedDatabase } from "../helpers/db";
import { request, withParams, type TestUser } from "../helpers/requests";
import { familyYaml, makeUser, screenAll, upload } from "../helpers/registry";

createMigratedDatabase({ seed: true });

let users: Record<string, TestUser>;
let other: TestUser;
const ids: Record<string, string> = {};

const BALANCED = { id: "amp-balanced", title: "Amplifier with balanced gain", coefficients: { a: "1/2", h: "-exp(-0.2*t)", k: "-0.1" }, tags: ["gain"] };

beforeAll(async () => {
  const { User, RegistryEntry, Family } = await import("@/models");
  users = Object.fromEntries((await User.findAll()).map((u) => [u.role, { id: u.id, email: u.email, role: u.role }]));
  other = await makeUser("second.researcher@wavesieve.test", "researcher");
  await upload(users.researcher, "a.yaml", familyYaml([
    BALANCED,
    { id: "trap-ramp", title: "Condensate in a ramped trap", coefficients: { a: "1/2", h: "-1", b: "-0.01*t" } },
    { id: "not-screened", title: "Waiting for the queue", coefficients: { a: "1", h: "1" } },
  ]));
  // The same family from another owner (same normalised hash), and the same coefficients written
  // differently with another window (same canonical coefficients, different hash).
  await upload(other, "b.yaml", familyYaml([BALANCED]));
  await upload(other, "c.yaml", familyYaml([{ ...BALANCED, id: "amp-rewritten", title: "Same amplifier, rewritten", coefficients: { a: "0.5", h: "-exp(-(0.2)*t)", k: "-0.10" } }]).replace("window: [0, 2]", "window: [0, 5]"));
  ids.balanced = (await screenAll("amp-balanced", users.researcher.id, { reducibility: "reducible", painleve: "passes", agreement: "agree" })).id;
  ids.trap = (await screenAll("trap-ramp", users.researcher.id, { reducibility: "reducible", painleve: "fails", agreement: "conflict" })).id;
  ids.copy = (await screenAll("amp-balanced", other.id, { reducibility: "reducible", painleve: "passes", agreement: "agree" })).id;
  ids.rewritten = (await screenAll("amp-rewritten", other.id, { reducibility: "reducible", painleve: "passes", agreement: "agree" })).id;
  const pending = await Family.findOne({ where: { slug: "not-screened" } });
  ids.pending = (await RegistryEntry.findOne({ where: { familyId: pending!.id } }))!.id;
});

async function call(route: "curate" | "tags" | "duplicate" | "publish", id: string, user: TestUser | undefined, body: unknown, headers?: Record<string, string>) {
  const routes = {
    curate: async () => (await import("@/app/api/entries/[id]/curate/route")).POST,
    tags: async () => (await import("@/app/api/entries/[id]/tags/route")).PATCH,
    duplicate: async () => (await import("@/app/api/entries/[id]/duplicate/route")).POST,
    publish: async () => (await import("@/app/api/entries/[id]/publish/route")).POST,
  };
  const method = route === "tags" ? "PATCH" : "POST";
  const handler = await routes[route]();
  const res = await handler(await request(method, `/api/entries/${id}/${route}`, { user, body, headers }), withParams({ id }));
  return { status: res.status, body: await res.json() };
}

async function history(id: string) {
  const { entryHistory } = await import("@/lib/registry");
  return entryHistory(id);
}

describe("who may curate", () => {
  it("viewers and researchers get 403 on every curation action, anonymous callers 401; nothing changes", async () => {
    const actions: ["curate" | "tags" | "duplicate" | "publish", unknown][] = [
      ["curate", { action: "accept" }], ["tags", { tags: ["x"] }], ["duplicate", { duplicateOf: ids.copy }], ["publish", { published: true }],
    ];
    for (const [route, body] of actions) {
      expect((await call(route, ids.balanced, users.viewer, body)).status).toBe(403);
      expect((await call(route, ids.balanced, users.researcher, body)).status).toBe(403);
      expect((await call(route, ids.balanced, undefined, body)).status).toBe(401);
    }
    const { GET } = await import("@/app/api/entries/[id]/duplicates/route");
    expect((await GET(await request("GET", `/api/entries/${ids.balanced}/duplicates`, { user: users.viewer }), withParams({ id: ids.balanced }))).status).toBe(403);
    expect(await history(ids.balanced)).toEqual([]);
  });

  it("refuses a cross-site form post carrying a curator's cookie", async () => {
    const res = await call("curate", ids.balanced, users.curator, { action: "accept" }, { origin: "https://elsewhere.example" });
    expect(res.status).toBe(403);
  });
});

describe("accept, reject, send back", () => {
  it("a curator accepts a candidate; the history says who, when and why", async () => {
    const before = Date.now();
    const res = await call("curate", ids.balanced, users.curator, { action: "accept", note: "Checked the gain balance by hand." });
    expect(res.status).toBe(200);
    expect(res.body.entry.curationState).toBe("accepted");
    const h = await history(ids.balanced);
    expect(h).toHaveLength(1);
    expect(h[0]).toMatchObject({ action: "entry.accepted", actor: users.curator.email, detail: "candidate → accepted: Checked the gain balance by hand." });
    expect(Date.parse(h[0].at)).toBeGreaterThanOrEqual(before - 1000);
    expect((await call("curate", ids.balanced, users.curator, { action: "accept" })).status).toBe(409);
  });

  it("reject and send back need a note; an entry nobody screened cannot be accepted", async () => {
    expect((await call("curate", ids.trap, users.curator, { action: "reject" })).status).toBe(400);
    expect((await call("curate", ids.trap, users.curator, { action: "return", note: "   " })).status).toBe(400);
    expect((await call("curate", ids.trap, users.curator, { action: "archive" })).status).toBe(400);
    const pending = await call("curate", ids.pending, users.curator, { action: "accept" });
    expect(pending.status).toBe(409);
    expect(pending.body.error).toMatch(/not been screened/);
    expect((await call("curate", "00000000-0000-4000-8000-000000000000", users.curator, { action: "accept" })).status).toBe(404);
    expect((await call("curate", "not-a-uuid", users.curator, { action: "accept" })).status).toBe(404);
  });

  it("accepting an entry whose verdicts conflict needs a note on how it was resolved", async () => {
    const bare = await call("curate", ids.trap, users.curator, { action: "accept" });
    expect(bare.status).toBe(400);
    expect(bare.body.error).toMatch(/conflict/);
    const sent = await call("curate", ids.trap, users.curator, { action: "return", note: "Re-run with a longer window: the Painlevé draws hit a zero of h." });
    expect(sent.status).toBe(200);
    expect(sent.body.entry.curationState).toBe("returned");
    expect((await history(ids.trap)).map((e) => e.action)).toEqual(["entry.returned"]);
  });

  it("admins can curate too", async () => {
    const res = await call("curate", ids.trap, users.admin, { action: "reject", note: "Superseded by a corrected upload." });
    expect(res.status).toBe(200);
    expect((await history(ids.trap)).at(-1)).toMatchObject({ action: "entry.rejected", actor: users.admin.email });
  });
});

describe("publishing", () => {
  it("only accepted entries are published; publishing twice is a conflict; rejecting unpublishes", async () => {
    const notAccepted = await call("publish", ids.copy, users.curator, { published: true });
    expect(notAccepted.status).toBe(409);
    expect((await call("publish", ids.balanced, users.curator, { published: "yes" })).status).toBe(400);
    const ok = await call("publish", ids.balanced, users.curator, { published: true, note: "First accepted amplifier model." });
    expect(ok.status).toBe(200);
    expect(ok.body.entry.published).toBe(true);
    expect(ok.body.entry.publishedAt).toBeTruthy();
    expect((await call("publish", ids.balanced, users.curator, { published: true })).status).toBe(409);

    const rejected = await call("curate", ids.balanced, users.curator, { action: "reject", note: "Wrong sign of the gain in the source." });
    expect(rejected.body.entry).toMatchObject({ curationState: "rejected", published: false, publishedAt: null });
    expect((await history(ids.balanced)).map((e) => e.action)).toEqual(["entry.accepted", "entry.published", "entry.rejected", "entry.unpublished"]);
  });
});

describe("tags", () => {
  it("normalises and replaces tags, keeps them on the family, and records what changed", async () => {
    const res = await call("tags", ids.copy, users.curator, { tags: ["Fibre Amplifier", "gain", "gain", "erbium"], note: "house style" });
    expect(res.status).toBe(200);
    expect(res.body.entry.tags).toEqual(["fibre-amplifier", "gain", "erbium"]);
    expect((await history(ids.copy)).at(-1)).toMatchObject({ action: "entry.tags", detail: "added fibre-amplifier, erbium: house style" });
    // A later refresh (e.g. a finished run) keeps the curated tags.
    const { RegistryEntry } = await import("@/models");
    const { refreshRegistryEntry } = await import("@/lib/registry");
    const entry = await RegistryEntry.findByPk(ids.copy);
    await refreshRegistryEntry(entry!.familyId);
    expect((await RegistryEntry.findByPk(ids.copy))!.tagsText).toBe(",fibre-amplifier,gain,erbium,");
    expect((await call("tags", ids.copy, users.curator, { tags: ["bad,tag"] })).status).toBe(400);
    expect((await call("tags", ids.copy, users.curator, { tags: "gain" })).status).toBe(400);
  });
});

describe("duplicates", () => {
  it("suggests the same family from another owner and the same coefficients written differently", async () => {
    const { GET } = await import("@/app/api/entries/[id]/duplicates/route");
    const res = await GET(await request("GET", `/api/entries/${ids.balanced}/duplicates`, { user: users.curator }), withParams({ id: ids.balanced }));
    expect(res.status).toBe(200);
    const { candidates } = (await res.json()) as { candidates: { id: string; match: string }[] };
    const byId = Object.fromEntries(candidates.map((c) => [c.id, c.match]));
    expect(byId).toEqual({ [ids.copy]: "same family", [ids.rewritten]: "same coefficients" });
  });

  it("marks, refuses self and cycles, and clears the mark", async () => {
    expect((await call("duplicate", ids.copy, users.curator, { duplicateOf: ids.copy })).status).toBe(400);
    const marked = await call("duplicate", ids.copy, users.curator, { duplicateOf: ids.balanced, note: "same upload by a colleague" });
    expect(marked.status).toBe(200);
    expect(marked.body.entry.duplicateOfId).toBe(ids.balanced);
    const cycle = await call("duplicate", ids.balanced, users.curator, { duplicateOf: ids.copy });
    expect(cycle.status).toBe(409);
    expect((await call("duplicate", ids.copy, users.curator, { duplicateOf: "00000000-0000-4000-8000-000000000000" })).status).toBe(404);
    const cleared = await call("duplicate", ids.copy, users.curator, { duplicateOf: null });
    expect(cleared.body.entry.duplicateOfId).toBeNull();
    expect((await call("duplicate", ids.copy, users.curator, { duplicateOf: null })).status).toBe(409);
    const actions = (await history(ids.copy)).map((e) => [e.action, e.detail]);
    expect(actions.slice(-2)).toEqual([
      ["entry.duplicate", `duplicate of amp-balanced (${ids.balanced}): same upload by a colleague`],
      ["entry.not-duplicate", "duplicate mark removed"],
    ]);
  });
});
