// Integration: the registry query service and GET /api/registry — filters, sorting, paging and
// visibility per role — against a migrated SQLite file with families stored through the upload route.
import { describe, it, expect, beforeAll } from "vitest";
import { createMigratedDatabase, onPostgres } from "../helpers/db";
import { request, noParams, type TestUser } from "../helpers/requests";
import { familyYaml, makeUser, screenAll, upload } from "../helpers/registry";

createMigratedDatabase({ seed: true });

let users: Record<string, TestUser>;
let other: TestUser;
let batchA: string;
const ids: Record<string, string> = {};

beforeAll(async () => {
  const { User } = await import("@/models");
  users = Object.fromEntries((await User.findAll()).map((u) => [u.role, { id: u.id, email: u.email, role: u.role }]));
  other = await makeUser("second.researcher@wavesieve.test", "researcher");

  batchA = await upload(users.researcher, "amplifiers.yaml", familyYaml([
    { id: "amp-balanced", title: "Amplifier with balanced gain", coefficients: { a: "1/2", h: "-exp(-0.2*t)", k: "-0.1" }, tags: ["fibre-amplifier", "gain"], notes: "Gain balances the nonlinearity decay." },
    { id: "amp-unbalanced", title: "Amplifier with too much gain", coefficients: { a: "1/2", h: "-exp(-0.2*t)", k: "-0.3" }, tags: ["fibre-amplifier"] },
    { id: "trap-ramp", title: "Condensate in a ramped trap", coefficients: { a: "1/2", h: "-1", b: "-0.01*t" }, tags: ["condensate", "gain"], notes: "100% ramp over the window" },
  ]));
  await upload(users.researcher, "shelf.yaml", familyYaml([
    { id: "shelf-wave", title: "Long wave over a shelf", cls: "kdv", coefficients: { p: "6", q: "1", r: "1/(2*(t+1))" }, tags: ["shallow-water"] },
  ]));
  await upload(other, "other.yaml", familyYaml([
    { id: "other-draft", title: "Someone else's draft", coefficients: { a: "1", h: "2" }, tags: ["gain"] },
  ]));

  const { curateEntry, setPublished } = await import("@/lib/registry");
  const curator = { id: users.curator.id, email: users.curator.email };
  const e1 = await screenAll("amp-balanced", users.researcher.id, { reducibility: "reducible", painleve: "passes", agreement: "agree" });
  const e2 = await screenAll("amp-unbalanced", users.researcher.id, { reducibility: "not-reducible", painleve: "fails", agreement: "agree", engine: "0.0.9" });
  const e3 = await screenAll("trap-ramp", users.researcher.id, { reducibility: "reducible", painleve: "fails", agreement: "conflict" });
  const e4 = await screenAll("shelf-wave", users.researcher.id, { reducibility: "reducible", painleve: "passes", agreement: "agree" });
  const e5 = await screenAll("other-draft", other.id, { reducibility: "reducible", painleve: "passes", agreement: "agree" });
  Object.assign(ids, { balanced: e1.id, unbalanced: e2.id, trap: e3.id, shelf: e4.id, other: e5.id });
  for (const id of [e1.id, e2.id, e4.id]) {
    expect((await curateEntry(curator, id, "accept", "")).ok).toBe(true);
    expect((await setPublished(curator, id, true)).ok).toBe(true);
  }
});

async function list(user: TestUser, qs = "") {
  const { GET } = await import("@/app/api/registry/route");
  const res = await GET(await request("GET", `/api/registry${qs}`, { user }), noParams);
  expect(res.status).toBe(200);
  return (await res.json()) as { rows: { id: string; slug: string; tags: string[]; createdAt: string }[]; total: number; pages: number; page: number };
}
const slugs = (body: { rows: { slug: string }[] }) => body.rows.map((r) => r.slug).sort();

describe("visibility per role (enforced in the query service)", () => {
  it("answers 401 without a session", async () => {
    const { GET } = await import("@/app/api/registry/route");
    expect((await GET(await request("GET", "/api/registry"), noParams)).status).toBe(401);
  });

  it("a viewer sees only published entries", async () => {
    expect(slugs(await list(users.viewer))).toEqual(["amp-balanced", "amp-unbalanced", "shelf-wave"]);
  });

  it("a researcher sees published entries and their own unpublished ones, not others' drafts", async () => {
    expect(slugs(await list(users.researcher))).toEqual(["amp-balanced", "amp-unbalanced", "shelf-wave", "trap-ramp"]);
    expect(slugs(await list(other))).toEqual(["amp-balanced", "amp-unbalanced", "other-draft", "shelf-wave"]);
  });

  it("curators and admins see everything", async () => {
    const all = ["amp-balanced", "amp-unbalanced", "other-draft", "shelf-wave", "trap-ramp"];
    expect(slugs(await list(users.curator))).toEqual(all);
    expect(slugs(await list(users.admin))).toEqual(all);
  });

  it("a filter cannot widen visibility (published=no for a viewer is empty)", async () => {
    expect((await list(users.viewer, "?published=no")).total).toBe(0);
    expect(slugs(await list(users.curator, "?published=no"))).toEqual(["other-draft", "trap-ramp"]);
  });
});

describe("filters", () => {
  it("class + reducibility verdict", async () => {
    expect(slugs(await list(users.curator, "?class=nls&reducibility=reducible"))).toEqual(["amp-balanced", "other-draft", "trap-ramp"]);
    expect(slugs(await list(users.curator, "?class=kdv,mkdv"))).toEqual(["shelf-wave"]);
  });

  it("Painlevé verdict, agreement and curation state", async () => {
    expect(slugs(await list(users.curator, "?painleve=fails"))).toEqual(["amp-unbalanced", "trap-ramp"]);
    expect(slugs(await list(users.curator, "?agreement=conflict"))).toEqual(["trap-ramp"]);
    expect(slugs(await list(users.curator, "?state=candidate"))).toEqual(["other-draft", "trap-ramp"]);
  });

  it("tags: every listed tag must be present, whole tags only", async () => {
    expect(slugs(await list(users.curator, "?tags=gain"))).toEqual(["amp-balanced", "other-draft", "trap-ramp"]);
    expect(slugs(await list(users.curator, "?tags=gain,fibre-amplifier"))).toEqual(["amp-balanced"]);
    expect((await list(users.curator, "?tags=fibre")).total).toBe(0); // part of a tag is not a tag
  });

  it("text search over title and notes: each word begins a word of the text; punctuation alone is literal", async () => {
    expect(slugs(await list(users.curator, "?q=BALANCES"))).toEqual(["amp-balanced"]);
    expect(slugs(await list(users.curator, "?q=amplifier"))).toEqual(["amp-balanced", "amp-unbalanced"]);
    expect(slugs(await list(users.curator, "?q=ampl%20unbal"))).toEqual(["amp-unbalanced"]);
    expect(slugs(await list(users.curator, "?q=ramped%20condensate"))).toEqual(["trap-ramp"]); // any order
    expect((await list(users.curator, "?q=plifier")).total).toBe(0); // inside a word is not a word start
    expect(slugs(await list(users.curator, "?q=100%25"))).toEqual(["trap-ramp"]);
    expect((await list(users.curator, "?q=%25%25")).total).toBe(0);
    expect((await list(users.curator, "?q=_")).total).toBe(0);
  });

  it("submitter, batch and engine version", async () => {
    expect(slugs(await list(users.curator, `?submitter=${encodeURIComponent("SECOND.researcher@wavesieve.test")}`))).toEqual(["other-draft"]);
    expect(slugs(await list(users.curator, `?batch=${batchA}`))).toEqual(["amp-balanced", "amp-unbalanced", "trap-ramp"]);
    expect(slugs(await list(users.curator, "?engine=0.0.9"))).toEqual(["amp-unbalanced"]);
  });

  it("dates (UTC days, inclusive) and malformed values ignored rather than guessed", async () => {
    const today = new Date().toISOString().slice(0, 10);
    expect((await list(users.curator, `?createdFrom=${today}&createdTo=${today}`)).total).toBe(5);
    expect((await list(users.curator, "?createdTo=2000-01-01")).total).toBe(0);
    expect((await list(users.curator, `?screenedFrom=${today}`)).total).toBe(5);
    expect((await list(users.curator, "?class=schrodinger&reducibility=maybe&createdFrom=yesterday&batch=1")).total).toBe(5);
  });
});

describe("sorting and paging", () => {
  it("sorts by title both ways, with a stable tie-break", async () => {
    const asc = (await list(users.curator, "?sort=title&dir=asc")).rows.map((r) => r.slug);
    expect(asc).toEqual(["amp-balanced", "amp-unbalanced", "trap-ramp", "shelf-wave", "other-draft"]);
    const desc = (await list(users.curator, "?sort=title&dir=desc")).rows.map((r) => r.slug);
    expect(desc).toEqual([...asc].reverse());
  });

  it("sorts by creation date, newest first by default", async () => {
    const rows = (await list(users.curator)).rows;
    const times = rows.map((r) => Date.parse(r.createdAt));
    expect(times).toEqual([...times].sort((a, b) => b - a));
    expect(rows[0].slug).toBe("other-draft"); // uploaded last
  });

  it("pages: size, page number, total and page count; an out-of-range page shows the last", async () => {
    const p1 = await list(users.curator, "?sort=title&dir=asc&size=2");
    expect(p1).toMatchObject({ total: 5, pages: 3, page: 1 });
    expect(p1.rows.map((r) => r.slug)).toEqual(["amp-balanced", "amp-unbalanced"]);
    const p3 = await list(users.curator, "?sort=title&dir=asc&size=2&page=3");
    expect(p3.rows.map((r) => r.slug)).toEqual(["other-draft"]);
    const beyond = await list(users.curator, "?sort=title&dir=asc&size=2&page=99");
    expect(beyond.page).toBe(3);
    expect((await list(users.curator, "?size=100000")).rows.length).toBe(5); // size capped at 100, not refused
  });
});

describe("indexes agree with the plain scan", () => {
  it("the word search (SQLite: its index) finds exactly what a plain word-prefix scan finds", async () => {
    const { hasSearchIndex } = await import("@/lib/registry/tags");
    expect(await hasSearchIndex()).toBe(!onPostgres); // PostgreSQL: the same rule by regular expression
    const { RegistryEntry } = await import("@/models");
    // Reference: split the stored text into words (letters and digits, accents removed) and test prefixes.
    const words = (text: string) => text.normalize("NFKD").replace(/\p{M}+/gu, "").toLowerCase().split(/[^\p{L}\p{N}]+/u).filter(Boolean);
    const entries = (await RegistryEntry.findAll({ attributes: ["slug", "searchText"] })).map((e) => ({ slug: e.slug, words: words(e.searchText) }));
    for (const q of ["gain", "amplifier with", "ramp over", "nonlin", "100", "Condensate", "draft else", "shelf wave", "zzz"]) {
      const qw = words(q);
      const expected = entries.filter((e) => qw.every((w) => e.words.some((x) => x.startsWith(w)))).map((e) => e.slug).sort();
      expect(slugs(await list(users.curator, `?q=${encodeURIComponent(q)}`)), q).toEqual(expected);
    }
  });

  it("a tag a curator adds is found by the tag filter at once (the tag index follows)", async () => {
    const { setEntryTags } = await import("@/lib/registry");
    const r = await setEntryTags({ id: users.curator.id, email: users.curator.email }, ids.shelf, ["shallow-water", "Tsunami Model"]);
    expect(r.ok).toBe(true);
    expect(slugs(await list(users.viewer, "?tags=tsunami-model"))).toEqual(["shelf-wave"]);
    await setEntryTags({ id: users.curator.id, email: users.curator.email }, ids.shelf, ["shallow-water"]);
    expect((await list(users.viewer, "?tags=tsunami-model")).total).toBe(0);
  });

  it("a researcher's pages (published + own, merged) are the same as one ordered list", async () => {
    const all = (await list(users.researcher, "?sort=title&dir=asc&size=100")).rows.map((r) => r.slug);
    const paged: string[] = [];
    for (let page = 1; page <= 2; page++) paged.push(...(await list(users.researcher, `?sort=title&dir=asc&size=2&page=${page}`)).rows.map((r) => r.slug));
    expect(paged).toEqual(all);
    expect((await list(users.researcher, "?size=2")).pages).toBe(2);
  });
});

describe("the two plans of a tag or word filter", () => {
  // listRegistry reads a page of a large set by walking the sort index (the set's terms written as
  // SQLite's `+column IN (…)`, which the planner may not use as an index) and of a small one by
  // reading the set and sorting it. Both must list the same rows in the same order.
  const queries = ["tags=gain", "tags=fibre-amplifier&tags=gain", "q=amplifier", "q=ramp&tags=gain", "tags=gain&class=nls"];
  it("walking the sort index and sorting the set give the same pages, for every sort and direction", async () => {
    const { registryWhere, registryOrder, parseRegistryQuery } = await import("@/lib/registry");
    const { RegistryEntry } = await import("@/models");
    for (const qs of queries) {
      for (const sort of ["title", "created", "screened", "painleve", "class"] as const) {
        for (const dir of ["asc", "desc"] as const) {
          const q = parseRegistryQuery(new URLSearchParams(qs));
          for (const role of ["viewer", "researcher", "curator"]) {
            const user = { ...users[role], name: role };
            const page = async (walkSortIndex: boolean, offset: number) => (await RegistryEntry.findAll({
              where: await registryWhere(user, q.filters, undefined, { walkSortIndex }), order: registryOrder(sort, dir), limit: 2, offset, attributes: ["slug"],
            })).map((e) => e.slug);
            for (const offset of [0, 2]) expect(await page(true, offset), `${qs} ${sort} ${dir} ${role} @${offset}`).toEqual(await page(false, offset));
          }
        }
      }
    }
  });

  it.skipIf(onPostgres)("in the walking plan SQLite reads the sort index and only tests membership in the set", async () => {
    const { registryWhere, registryOrder, parseRegistryQuery } = await import("@/lib/registry");
    const { RegistryEntry, sequelize } = await import("@/models");
    const plan = async (walkSortIndex: boolean, qs: string) => {
      const q = parseRegistryQuery(new URLSearchParams(qs));
      let sql = "";
      await RegistryEntry.findAll({
        where: await registryWhere({ ...users.curator, name: "c" }, q.filters, undefined, { walkSortIndex }), order: registryOrder("created", "desc"), limit: 25,
        logging: (s: string) => { sql = s.replace(/^Executing \([^)]*\): /, ""); },
      });
      const [rows] = await sequelize.query(`EXPLAIN QUERY PLAN ${sql}`);
      return (rows as { detail: string }[]).map((r) => r.detail).join("\n");
    };
    for (const qs of ["tags=gain", "q=amplifier"]) {
      const walking = await plan(true, qs);
      expect(walking, qs).toMatch(/SCAN \w+ USING INDEX registry_entries_created_at\b/);
      expect(walking, qs).not.toMatch(/USE TEMP B-TREE FOR ORDER BY/);
      expect(await plan(false, qs), qs).toMatch(/USE TEMP B-TREE FOR ORDER BY/);
    }
  });
});

describe("the URL form of a query round-trips", () => {
  it("parse(toParams(q)) = q", async () => {
    const { parseRegistryQuery, registryQueryToParams } = await import("@/lib/registry/filters");
    const qs = new URLSearchParams("q=ramp&class=nls&reducibility=reducible,undecided&tags=gain,fibre-amplifier&published=yes&createdFrom=2026-01-01&sort=screened&dir=asc&page=2&size=50");
    const q = parseRegistryQuery(qs);
    expect(parseRegistryQuery(registryQueryToParams(q))).toEqual(q);
    expect(registryQueryToParams(parseRegistryQuery(new URLSearchParams(""))).toString()).toBe("");
  });
});
