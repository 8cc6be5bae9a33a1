// Integration: one entry's page data (visibility, members, the stored report read defensively),
// the review queue, duplicate keys, the safety rule and the normal-form LaTeX.
import { describe, it, expect, beforeAll } from "vitest";
import katex from "katex";
import { createMigratedDatabase } from "../helpers/db";
import type { TestUser } from "../helpers/requests";
import { familyYaml, screenAll, upload, verdictReport } from "../helpers/registry";

createMigratedDatabase({ seed: true });

let users: Record<string, TestUser & { name: string }>;
const ids: Record<string, string> = {};

beforeAll(async () => {
  const { User, Family, FamilyVariant, RegistryEntry } = await import("@/models");
  users = Object.fromEntries((await User.findAll()).map((u) => [u.role, { id: u.id, email: u.email, role: u.role, name: u.name }]));
  const values = Array.from({ length: 60 }, (_, i) => (0.01 * (i + 1)).toFixed(2)).join(", ");
  await upload(users.researcher, "e.yaml", familyYaml([
    { id: "amp-balanced", title: "Fibre amplifier with balanced gain", coefficients: { a: "1/2", h: "exp(-0.2*t)", k: "-0.1" }, tags: ["fibre-amplifier"] },
    { id: "big-sweep", title: "A sweep of sixty members", coefficients: { a: "1/2", h: "-1", b: "-w*t" }, parameters: `w: { values: [${values}] }` },
    { id: "conflicted", title: "Judges disagree", coefficients: { a: "1", h: "2", k: "0.3" } },
    { id: "unscreened", title: "Still queued", coefficients: { a: "1", h: "3" } },
  ]));
  // A real engine report for the amplifier (the engine's public surface, as the worker calls it).
  const { screenVariant } = await import("@/lib/screening");
  const { recordReport } = await import("@/lib/registry");
  const fam = await Family.findOne({ where: { slug: "amp-balanced" } });
  const variant = await FamilyVariant.findOne({ where: { familyId: fam!.id } });
  const report = await screenVariant(JSON.parse(variant!.variantJson), { seed: 3 });
  expect((await recordReport(variant!.id, report)).ok).toBe(true);
  ids.amp = (await RegistryEntry.findOne({ where: { familyId: fam!.id } }))!.id;
  ids.sweep = (await screenAll("big-sweep", users.researcher.id, { reducibility: "not-reducible", painleve: "fails", agreement: "agree" })).id;
  ids.conflict = (await screenAll("conflicted", users.researcher.id, { reducibility: "reducible", painleve: "fails", agreement: "conflict" })).id;
  const unscreened = await Family.findOne({ where: { slug: "unscreened" } });
  ids.unscreened = (await RegistryEntry.findOne({ where: { familyId: unscreened!.id } }))!.id;
});

describe("entry detail", () => {
  it("is hidden from a viewer until published; the researcher who submitted it sees it", async () => {
    const { getEntryDetail } = await import("@/lib/registry");
    expect(await getEntryDetail(users.viewer, ids.amp)).toBeNull();
    const mine = await getEntryDetail(users.researcher, ids.amp);
    expect(mine?.entry.slug).toBe("amp-balanced");
    expect(await getEntryDetail(users.viewer, "not-a-uuid")).toBeNull();
  });

  it("reads a real engine report: verdicts with evidence; stages the engine did not compute are 'absent'", async () => {
    const { getEntryDetail } = await import("@/lib/registry");
    const d = await getEntryDetail(users.curator, ids.amp);
    const r = d!.selected!.report!;
    expect(r.reducibility.state).toBe("present");
    if (r.reducibility.state === "present") {
      // W = a'/a − h'/h + 2(k − c) = 0.2 − 0.2 = 0, so R ≡ 0: reducible (derived in ../shared/math/nls.md §3, the W form of R).
      expect(r.reducibility.value.verdict).toBe("reducible");
      expect(r.reducibility.value.evidence.windows[0].samples.length).toBeGreaterThanOrEqual(3);
    }
    expect(r.painleve.state).toBe("present");
    expect(r.engine).toMatch(/^\d+\.\d+\.\d+/);
    for (const stage of [r.transformation, r.solutions, r.verification]) expect(["present", "absent"]).toContain(stage.state);
    expect(d!.family.spec.coefficients).toEqual({ a: "1/2", h: "exp(-0.2*t)", k: "-0.1" });
    expect(d!.selected!.variant?.class).toBe("nls");
  });

  it("pages through many members and shows the one asked for", async () => {
    const { getEntryDetail, VARIANTS_PER_PAGE } = await import("@/lib/registry");
    const first = await getEntryDetail(users.curator, ids.sweep);
    expect(first!.variantsPage).toMatchObject({ total: 60, pages: 2, page: 1 });
    expect(first!.variantsPage.rows).toHaveLength(VARIANTS_PER_PAGE);
    const chosen = await getEntryDetail(users.curator, ids.sweep, { variant: 55 });
    expect(chosen!.variantsPage.page).toBe(2);
    expect(chosen!.selected!.summary).toMatchObject({ index: 55, parameters: { w: 0.56 }, reducibility: "not-reducible" });
  });
});

describe("stored reports are read defensively", () => {
  it("an old report (no agreement, no transformation) is readable; junk is not", async () => {
    const { readReport } = await import("@/lib/registry");
    const old = readReport(JSON.stringify(verdictReport({ reducibility: "reducible", painleve: "passes" })));
    expect(old?.agreement.state).toBe("absent");
    expect(old?.transformation.state).toBe("absent");
    const broken = readReport(JSON.stringify({ ...verdictReport({ reducibility: "reducible", painleve: "passes" }), transformation: { ok: true } }));
    expect(broken?.transformation).toEqual({ state: "invalid", problem: "no map table" });
    expect(readReport("{not json")).toBeNull();
    expect(readReport(null)).toBeNull();
  });
});

describe("review queue", () => {
  it("lists unresolved conflicts first, then screened candidates, and counts the unscreened", async () => {
    const { reviewQueue } = await import("@/lib/registry");
    const q = await reviewQueue();
    expect(q.conflicts.rows.map((r) => r.id)).toEqual([ids.conflict]);
    expect(q.candidates.rows.map((r) => r.id).sort()).toEqual([ids.amp, ids.sweep].sort());
    expect(q.unscreened).toBe(1);
  });
});

describe("canonical coefficient key", () => {
  it("ignores how numbers are written and the variable's name, not what the coefficients are", async () => {
    const { coefficientsKey } = await import("@/lib/registry");
    const k1 = coefficientsKey("nls", { coefficients: { a: "1/2", h: "exp(-0.2*t)", k: "-0.1" } });
    const k2 = coefficientsKey("nls", { coefficients: { a: "0.50", h: "exp(-(0.2)*z)", k: "-0.10", b: "0" }, variables: { evolution: "z", space: "x" } });
    const k3 = coefficientsKey("nls", { coefficients: { a: "1/2", h: "exp(-0.2*t)", k: "-0.3" } });
    expect(k1).toMatch(/^[0-9a-f]{64}$/);
    expect(k2).toBe(k1);
    expect(k3).not.toBe(k1);
    expect(coefficientsKey("kdv", { coefficients: { a: "1/2", h: "exp(-0.2*t)", k: "-0.1" } })).not.toBe(k1);
    expect(coefficientsKey("nls", { coefficients: { a: "1/2", h: "unknownfn(t)" } })).toBeNull();
  });

  it("inlines helper functions, so a helper and its body give the same key", async () => {
    const { coefficientsKey } = await import("@/lib/registry");
    const inline = coefficientsKey("nls", { coefficients: { a: "1/2", h: "exp(-0.2*t)" } });
    const helper = coefficientsKey("nls", { coefficients: { a: "1/2", h: "decay(t)" }, functions: { decay: "exp(-0.2*t)" } });
    expect(helper).toBe(inline);
  });
});

describe("safety rule", () => {
  it("flags lasers, fibre amplifiers and high power in tags, title or notes — and nothing else", async () => {
    const { hardwareConcern } = await import("@/lib/registry");
    expect(hardwareConcern({ title: "Pulse in a span", tags: ["fibre-amplifier"] })?.matched).toContain("fibre amplifier");
    expect(hardwareConcern({ title: "Mode-locked laser cavity", tags: [] })?.matched).toContain("laser");
    expect(hardwareConcern({ title: "Span", notes: "EDFA stage pumped at 2 W", tags: [] })?.matched).toEqual(expect.arrayContaining(["doped-fibre amplifier", "pump power"]));
    expect(hardwareConcern({ title: "High-power ytterbium stage", tags: [] })?.matched).toContain("high power");
    expect(hardwareConcern({ title: "Long wave entering a narrowing harbour channel", tags: ["shallow-water"] })).toBeNull();
    expect(hardwareConcern({ title: "Amplitude of a condensate", notes: "the lasagne plot", tags: ["power-law"] })).toBeNull();
  });
});

describe("normal-form LaTeX", () => {
  it("writes the member's coefficients into the class's normal form, zero terms left away, signs folded", async () => {
    const { equationLatex } = await import("@/lib/registry");
    const { parseExpression } = await import("@/lib/screening/expr");
    const e = (text: string) => {
      const r = parseExpression(text, { symbols: new Set(["t"]) });
      if (!r.ok) throw new Error(r.error.message);
      return r.expr;
    };
    const nls = equationLatex("nls", { a: e("1/2"), h: e("-exp(-0.2*t)"), k: e("-0.1"), b: e("0") });
    expect(nls.startsWith("i u_{t} + ")).toBe(true);
    expect(nls).toContain("u_{xx}");
    expect(nls).toContain(" - ");
    expect(nls).toContain("|u|^{2} u");
    expect(nls).not.toContain("x^{2} u");
    expect(nls.endsWith("= 0")).toBe(true);
    const kdv = equationLatex("kdv", { p: e("6"), q: e("1"), r: e("1/(2*(t+1))"), l: e("0.5"), m: e("-1") });
    expect(kdv).toContain("u_{xxx}");
    expect(kdv).toMatch(/= 0\.5 - x$/);
    const mkdv = equationLatex("mkdv", { p: e("-6"), q: e("1") });
    expect(mkdv).toBe("u_{t} - 6\\,u^{2} u_{x} + u_{xxx} = 0");
    for (const tex of [nls, kdv, mkdv]) expect(() => katex.renderToString(tex, { throwOnError: true })).not.toThrow();
  });
});
