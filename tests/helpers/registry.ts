/**
 * Registry test data: families stored through the real upload route, and stored reports.
 * `verdictReport` builds a report carrying only the verdict fields the registry summarises; the
 * engine's own tests check real reports — here the subject is storage, queries and curation.
 */
import type { VariantReport } from "@/lib/screening/report";
import { request, noParams, type TestUser } from "./requests";

export async function upload(user: TestUser, name: string, text: string): Promise<string> {
  const { POST } = await import("@/app/api/batches/route");
  const res = await POST(await request("POST", "/api/batches", { user, body: { files: [{ name, text }] } }), noParams);
  if (res.status !== 201) throw new Error(`upload ${name} failed: ${res.status} ${await res.text()}`);
  return (await res.json()).batch.id as string;
}

export interface Verdicts {
  reducibility: "reducible" | "not-reducible" | "undecided";
  painleve: "passes" | "fails" | "undecided" | "not-run";
  agreement?: "agree" | "conflict" | "inconclusive";
  engine?: string;
}

export function verdictReport(v: Verdicts, extra: Record<string, unknown> = {}): VariantReport {
  const report = {
    familyId: "test",
    index: 0,
    class: "nls",
    parameters: {},
    free: [],
    window: [0, 1],
    engine: v.engine ?? "0.1.0",
    reducibility: { verdict: v.reducibility, constraints: [], summary: v.reducibility, ...(v.reducibility === "undecided" ? { reason: "borderline-after-confirmation", message: "test" } : {}) },
    painleve: { verdict: v.painleve, reason: "test" },
    ...(v.agreement ? { agreement: v.agreement } : {}),
    timings: {},
    ...extra,
  };
  return report as unknown as VariantReport;
}

/** Record a report for every variant of the family with this slug (and owner). */
export async function screenAll(slug: string, ownerId: string, v: Verdicts, extra: Record<string, unknown> = {}) {
  const { Family, FamilyVariant, RegistryEntry } = await import("@/models");
  const { recordReport } = await import("@/lib/registry");
  const family = await Family.findOne({ where: { slug, ownerId } });
  if (!family) throw new Error(`no family ${slug}`);
  for (const variant of await FamilyVariant.findAll({ where: { familyId: family.id } })) {
    const r = await recordReport(variant.id, verdictReport(v, extra));
    if (!r.ok) throw new Error(r.error);
  }
  const entry = await RegistryEntry.findOne({ where: { familyId: family.id } });
  if (!entry) throw new Error(`no entry for ${slug}`);
  return entry;
}

export async function makeUser(email: string, role: TestUser["role"]): Promise<TestUser> {
  const { User } = await import("@/models");
  const u = await User.create({ email, name: email.split("@")[0], role, passwordHash: null });
  return { id: u.id, email: u.email, role };
}

export function familyYaml(families: { id: string; title: string; cls?: string; coefficients: Record<string, string>; tags?: string[]; notes?: string; parameters?: string }[]): string {
  const lines = ["wavesieve: 1", "families:"];
  for (const f of families) {
    lines.push(`  - id: ${f.id}`, `    title: ${JSON.stringify(f.title)}`, `    class: ${f.cls ?? "nls"}`);
    if (f.parameters) lines.push("    parameters:", ...f.parameters.split("\n").map((l) => `      ${l}`));
    lines.push("    coefficients:", ...Object.entries(f.coefficients).map(([k, v]) => `      ${k}: ${JSON.stringify(v)}`));
    lines.push("    window: [0, 2]");
    if (f.tags?.length) lines.push(`    tags: [${f.tags.join(", ")}]`);
    if (f.notes) lines.push(`    notes: ${JSON.stringify(f.notes)}`);
  }
  return lines.join("\n") + "\n";
}
