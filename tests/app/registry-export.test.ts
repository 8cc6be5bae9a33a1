// Integration: registry exports (CSV / JSON, filtered, capped, visibility kept) and entry exports
// (JSON with every member's report, the family YAML that uploads again, a LaTeX fragment KaTeX parses).
import { describe, it, expect, beforeAll } from "vitest";
import katex from "katex";
import { createMigratedDatabase } from "../helpers/db";
import { request, noParams, withParams, type TestUser } from "../helpers/requests";
import { familyYaml, screenAll, upload } from "../helpers/registry";

createMigratedDatabase({ seed: true });

let users: Record<string, TestUser>;
const ids: Record<string, string> = {};

beforeAll(async () => {
  const { User } = await import("@/models");
  users = Object.fromEntries((await User.findAll()).map((u) => [u.role, { id: u.id, email: u.email, role: u.role }]));
  await upload(users.researcher, "families.yaml", familyYaml([
    { id: "amp-balanced", title: "Amplifier, \"balanced\", gain", coefficients: { a: "1/2", h: "-exp(-0.2*t)", k: "-0.1" }, tags: ["gain"] },
    { id: "formula-title", title: "=HYPERLINK(\"x\") looks like a formula", coefficients: { a: "1", h: "2" } },
    { id: "swept", title: "Swept trap", coefficients: { a: "1/2", h: "-1", b: "-w*t" }, parameters: "w: { values: [0.01, 0.02, 0.03] }" },
  ]));
  const { curateEntry, setPublished } = await import("@/lib/registry");
  const curator = { id: users.curator.id, email: users.curator.email };
  ids.balanced = (await screenAll("amp-balanced", users.researcher.id, { reducibility: "reducible", painleve: "passes", agreement: "agree" })).id;
  ids.formula = (await screenAll("formula-title", users.researcher.id, { reducibility: "not-reducible", painleve: "fails", agreement: "agree" })).id;
  ids.swept = (await screenAll("swept", users.researcher.id, { reducibility: "not-reducible", painleve: "fails" })).id;
  await curateEntry(curator, ids.balanced, "accept", "");
  await setPublished(curator, ids.balanced, true);
});

async function registryExport(user: TestUser, qs: string) {
  const { GET } = await import("@/app/api/registry/export/route");
  return GET(await request("GET", `/api/registry/export${qs}`, { user }), noParams);
}

describe("registry export", () => {
  it("CSV: one header, one line per visible entry, RFC 4180 quoting, formulas defused", async () => {
    const res = await registryExport(users.curator, "?format=csv&sort=title&dir=asc");
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toMatch(/text\/csv/);
    expect(res.headers.get("x-export-truncated")).toBe("false");
    expect(res.headers.get("x-total-count")).toBe("3");
    const lines = (await res.text()).trim().split("\r\n");
    expect(lines[0].split(",").slice(0, 5)).toEqual(["id", "slug", "title", "class", "reducibility"]);
    expect(lines).toHaveLength(4);
    // Titles sort by code point: "=" before "A".
    expect(lines[1]).toContain(`,formula-title,"'=HYPERLINK(""x"") looks like a formula",`);
    expect(lines[2]).toContain(`${ids.balanced},amp-balanced,"Amplifier, ""balanced"", gain",nls,reducible`);
  });

  it("keeps the viewer's visibility and the filters", async () => {
    const viewer = (await (await registryExport(users.viewer, "?format=csv")).text()).trim().split("\r\n");
    expect(viewer).toHaveLength(2);
    expect(viewer[1]).toContain("amp-balanced");
    const filtered = await (await registryExport(users.curator, "?format=json&reducibility=not-reducible")).json();
    expect(filtered.entries.map((e: { slug: string }) => e.slug).sort()).toEqual(["formula-title", "swept"]);
    expect(filtered).toMatchObject({ total: 2, exported: 2, truncated: false });
    expect((await registryExport(users.viewer, "?format=xml")).status).toBe(400);
    const { GET } = await import("@/app/api/registry/export/route");
    expect((await GET(await request("GET", "/api/registry/export?format=csv"), noParams)).status).toBe(401);
  });

  it("stops at the cap, in order, and says so", async () => {
    const { exportRegistry, parseRegistryQuery } = await import("@/lib/registry");
    const user = { ...users.curator, name: "c" };
    const out = await exportRegistry(user, parseRegistryQuery(new URLSearchParams("sort=title&dir=asc")), "json", 2);
    expect(out).toMatchObject({ total: 3, exported: 2, truncated: true });
    const body = JSON.parse(await new Response(out.stream).text());
    expect(body).toMatchObject({ total: 3, exported: 2, cap: 2, truncated: true });
    expect(body.entries.map((e: { slug: string }) => e.slug)).toEqual(["formula-title", "amp-balanced"]);
  });
});

async function entryExport(user: TestUser, id: string, qs: string) {
  const { GET } = await import("@/app/api/entries/[id]/export/route");
  return GET(await request("GET", `/api/entries/${id}/export${qs}`, { user }), withParams({ id }));
}

describe("entry export", () => {
  it("YAML: a complete family file that parses back to the same family (same content hash)", async () => {
    const res = await entryExport(users.viewer, ids.balanced, "?format=yaml");
    expect(res.status).toBe(200);
    const text = await res.text();
    expect(text).toMatch(/^# Family amp-balanced/);
    const { parseFamilies } = await import("@/lib/screening");
    const parsed = parseFamilies(text, { file: "export.yaml" });
    expect(parsed.errors).toEqual([]);
    const { Family, RegistryEntry } = await import("@/models");
    const entry = await RegistryEntry.findByPk(ids.balanced);
    const family = await Family.findByPk(entry!.familyId);
    expect(parsed.families[0].hash).toBe(family!.contentHash);
  });

  it("JSON: entry, family and every member's latest report, streamed", async () => {
    const res = await entryExport(users.curator, ids.swept, "?format=json");
    const body = await res.json();
    expect(body.entry.slug).toBe("swept");
    expect(body.family.sourceYaml).toContain("Swept trap");
    expect(body.variants.map((v: { index: number; parameters: Record<string, number> }) => [v.index, v.parameters.w])).toEqual([[0, 0.01], [1, 0.02], [2, 0.03]]);
    expect(body.variants.every((v: { report: { reducibility: { verdict: string } } }) => v.report.reducibility.verdict === "not-reducible")).toBe(true);
  });

  it("LaTeX: the equation of the chosen member in its normal form, parseable by KaTeX", async () => {
    const res = await entryExport(users.curator, ids.swept, "?format=latex&variant=1");
    const tex = await res.text();
    expect(tex).toContain("\\begin{equation}");
    expect(tex).toContain("variant 1");
    const equation = /\\begin\{equation\}\n\s*(.*)\n\\end\{equation\}/.exec(tex)?.[1] ?? "";
    expect(equation).toContain("0.02"); // w = 0.02 substituted into b = -w t
    expect(() => katex.renderToString(equation, { throwOnError: true })).not.toThrow();
    expect(tex).toContain("\\paragraph{Swept trap}");
  });

  it("an entry the user may not see is a 404, as is an unknown id", async () => {
    expect((await entryExport(users.viewer, ids.swept, "?format=json")).status).toBe(404);
    expect((await entryExport(users.viewer, "00000000-0000-4000-8000-000000000000", "?format=yaml")).status).toBe(404);
    expect((await entryExport(users.viewer, ids.balanced, "?format=docx")).status).toBe(400);
  });
});
