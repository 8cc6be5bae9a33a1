/**
 * Registry latency at scale: seeds 100 000 synthetic entries into a separate benchmark SQLite file
 * (never the demo database), then times GET /api/registry (the route handler, called directly with a
 * session cookie) and the query service for the common queries. Goal: p95 ≤ 50 ms.
 *
 *   tsx bench/registry-latency.ts [--entries 100000] [--runs 60] [--file path] [--keep]
 *
 * Prints one JSON object: { entries, seedMs, goalP95Ms, worstP95Ms, met, results: [{ query, role, via, p50Ms, p95Ms, maxMs, rows, total }] }.
 */
import { execFileSync } from "node:child_process";
import { randomUUID } from "node:crypto";
import { existsSync, mkdtempSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";

interface Args {
  entries: number;
  runs: number;
  file: string | null;
  keep: boolean;
}

function parseArgs(argv: string[]): Args {
  const a: Args = { entries: 100_000, runs: 60, file: null, keep: false };
  for (let i = 0; i < argv.length; i++) {
    if (argv[i] === "--entries") a.entries = Number(argv[++i]);
    else if (argv[i] === "--runs") a.runs = Number(argv[++i]);
    else if (argv[i] === "--file") a.file = argv[++i];
    else if (argv[i] === "--keep") a.keep = true;
    else throw new Error(`unknown argument ${argv[i]}`);
  }
  return a;
}

/** Deterministic pseudo-random numbers (mulberry32), so every run seeds the same data. */
function rng(seed: number) {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const TAGS = ["fibre", "fibre-amplifier", "gain", "loss", "dispersion-managed", "condensate", "trap", "ramp", "shallow-water", "shelf", "plasma", "ion-acoustic", "dark-pulse", "bright-pulse", "chirp", "soliton", "breather", "cnoidal", "periodic", "damping",
  "forcing", "tapered", "graded-index", "waveguide", "erbium", "ytterbium", "thulium", "raman", "kerr", "saturable", "optical", "acoustic", "internal-wave", "tsunami", "rogue", "lattice", "feshbach", "quench", "resonance", "test"];
const WORDS = ["Pulse", "Wave", "Soliton", "Front", "Packet", "Beam", "Mode", "Condensate", "Shelf", "Channel", "Span", "Stage", "Cavity", "Trap", "Ramp", "Taper", "Gain", "Loss", "Chirp", "Drift"];
const PLACES = ["in a tapered fibre", "over a sloping shelf", "in a ramped trap", "through an amplifier chain", "in a plasma column", "along a graded waveguide", "under periodic forcing", "with slow damping", "in a narrowing channel", "across a dispersion map"];

function pick<T>(r: () => number, items: readonly T[]): T {
  return items[Math.floor(r() * items.length)];
}

function weighted(r: () => number, table: [string, number][]): string {
  let x = r();
  for (const [v, w] of table) {
    if ((x -= w) <= 0) return v;
  }
  return table[table.length - 1][0];
}

function percentile(sorted: number[], p: number): number {
  const i = Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1));
  return Math.round(sorted[i] * 100) / 100;
}

async function main() {
  const args = parseArgs(process.argv.slice(2));
  const dir = args.file ? path.dirname(args.file) : mkdtempSync(path.join(os.tmpdir(), "wavesieve-bench-"));
  const file = args.file ?? path.join(dir, "registry-bench.sqlite");
  const fresh = !existsSync(file);
  process.env.DATABASE_PATH = file;
  delete process.env.DATABASE_URL;
  process.env.NEXTAUTH_SECRET ??= "bench-secret-0123456789abcdef0123456789";
  const cli = path.resolve("node_modules/sequelize-cli/lib/sequelize");
  execFileSync(process.execPath, [cli, "db:migrate"], { env: { ...process.env }, stdio: "pipe" });

  const { sequelize, User, RegistryEntry } = await import("@/models");
  const { listRegistry, parseRegistryQuery } = await import("@/lib/registry");
  const { GET } = await import("@/app/api/registry/route");
  const { encode } = await import("next-auth/jwt");
  const { NextRequest } = await import("next/server");
  const qi = sequelize.getQueryInterface();

  const now = Date.now();
  let seedMs = 0;
  const existing = fresh ? 0 : await RegistryEntry.count();
  if (existing < args.entries) {
    const t0 = performance.now();
    const r = rng(20261202);
    const stamp = new Date(now);
    const roles = ["viewer", "researcher", "curator", "admin"] as const;
    const people = [
      ...roles.map((role) => ({ id: randomUUID(), email: `bench-${role}@wavesieve.test`, name: `Bench ${role}`, role })),
      ...Array.from({ length: 20 }, (_, i) => ({ id: randomUUID(), email: `bench-researcher-${i}@wavesieve.test`, name: `Researcher ${i}`, role: "researcher" as const })),
    ];
    await qi.bulkInsert("users", people.map((p) => ({ ...p, password_hash: null, disabled: false, failed_sign_ins: 0, notify_batch_done: true, notify_digest: true, created_at: stamp, updated_at: stamp })));
    const submitters = people.filter((p) => p.role === "researcher");
    const batches = Array.from({ length: 200 }, (_, i) => ({ id: randomUUID(), owner_id: submitters[i % submitters.length].id, title: `bench batch ${i}`, state: "done", files_json: "[]", family_count: 0, variant_count: 0, error_count: 0, created_at: stamp, updated_at: stamp }));
    await qi.bulkInsert("batches", batches);
    const CHUNK = 500;
    for (let start = existing; start < args.entries; start += CHUNK) {
      const families: Record<string, unknown>[] = [];
      const entries: Record<string, unknown>[] = [];
      const tagRows: Record<string, unknown>[] = [];
      for (let i = start; i < Math.min(args.entries, start + CHUNK); i++) {
        const batch = batches[Math.floor(r() * batches.length)];
        const owner = submitters.find((s) => s.id === batch.owner_id)!;
        const cls = weighted(r, [["nls", 0.6], ["kdv", 0.25], ["mkdv", 0.15]]);
        const reducibility = weighted(r, [["reducible", 0.2], ["not-reducible", 0.7], ["undecided", 0.05], ["mixed", 0.05]]);
        const painleve = reducibility === "reducible" ? weighted(r, [["passes", 0.97], ["fails", 0.03]]) : reducibility === "not-reducible" ? weighted(r, [["fails", 0.98], ["passes", 0.02]]) : weighted(r, [["undecided", 0.6], ["mixed", 0.4]]);
        const agreement = (reducibility === "reducible" && painleve === "fails") || (reducibility === "not-reducible" && painleve === "passes") ? "conflict" : reducibility === "undecided" || reducibility === "mixed" ? "inconclusive" : "agree";
        const state = weighted(r, [["accepted", 0.5], ["candidate", 0.35], ["rejected", 0.1], ["returned", 0.05]]);
        const published = state === "accepted" && r() < 0.8;
        const tags = [...new Set(Array.from({ length: Math.floor(r() * 5) }, () => pick(r, TAGS)))];
        const title = `${pick(r, WORDS)} ${pick(r, WORDS).toLowerCase()} ${pick(r, PLACES)} #${i}`;
        const notes = r() < 0.5 ? `Synthetic benchmark family ${i}; ${pick(r, PLACES)}; campaign k${Math.floor(r() * 500)}.` : "";
        const created = new Date(now - Math.floor(r() * 730 * 86_400_000));
        const screened = new Date(created.getTime() + Math.floor(r() * 3_600_000));
        const familyId = randomUUID();
        const slug = `bench-${i}`;
        const hash = randomUUID().replace(/-/g, "") + randomUUID().replace(/-/g, "");
        families.push({ id: familyId, owner_id: owner.id, first_batch_id: batch.id, slug, title, equation_class: cls, content_hash: hash, spec_json: "{}", source_yaml: `id: ${slug}\n`, file_name: "bench.yaml", document_index: 0, tags_json: JSON.stringify(tags), notes, variant_count: 1, created_at: created, updated_at: created });
        const entryId = randomUUID();
        for (const tag of tags) tagRows.push({ tag, entry_id: entryId });
        entries.push({
          id: entryId, family_id: familyId, slug, title, equation_class: cls, reducibility, painleve, agreement,
          variants_total: 1, variants_screened: 1, variants_reducible: reducibility === "reducible" ? 1 : 0,
          curation_state: state, published, published_at: published ? screened : null, duplicate_of_id: null,
          tags_text: tags.length ? `,${tags.join(",")},` : "", submitter_id: owner.id, submitter_email: owner.email, batch_id: batch.id,
          engine_version: weighted(r, [["0.1.0", 0.7], ["0.0.9", 0.2], ["0.0.8", 0.1]]), normalised_key: hash, coefficients_key: hash,
          search_text: `${title}\n${notes}\n${slug}`.toLowerCase(), screened_at: screened, created_at: created, updated_at: screened,
        });
      }
      await sequelize.transaction(async (transaction) => {
        await qi.bulkInsert("families", families, { transaction });
        await qi.bulkInsert("registry_entries", entries, { transaction });
        if (tagRows.length) await qi.bulkInsert("registry_entry_tags", tagRows, { transaction });
      });
    }
    await sequelize.query("ANALYZE");
    seedMs = Math.round(performance.now() - t0);
  }

  const userOf = async (role: string) => {
    const u = (await User.findOne({ where: { email: `bench-${role}@wavesieve.test` } }))!;
    return { id: u.id, email: u.email, name: u.name, role: u.role };
  };
  const researcher = await User.findOne({ where: { email: "bench-researcher-3@wavesieve.test" } });
  const users = {
    viewer: await userOf("viewer"),
    curator: await userOf("curator"),
    researcher: { id: researcher!.id, email: researcher!.email, name: researcher!.name, role: researcher!.role },
  };
  const cookies = Object.fromEntries(await Promise.all(Object.entries(users).map(async ([k, u]) => [k, `next-auth.session-token=${await encode({ token: { uid: u.id, sub: u.id, role: u.role, email: u.email }, secret: process.env.NEXTAUTH_SECRET! })}`])));

  const queries: { query: string; qs: string; role: keyof typeof users }[] = [
    { query: "default page", qs: "", role: "viewer" },
    { query: "default page", qs: "", role: "curator" },
    { query: "default page", qs: "", role: "researcher" },
    { query: "filter class + verdict", qs: "class=nls&reducibility=reducible", role: "viewer" },
    { query: "filter class + verdict", qs: "class=nls&reducibility=reducible", role: "curator" },
    { query: "tag filter", qs: "tags=fibre-amplifier", role: "viewer" },
    { query: "tag filter", qs: "tags=fibre-amplifier", role: "curator" },
    { query: "text search (selective: ~1% match)", qs: "q=campaign%20k17", role: "viewer" },
    { query: "text search (selective: ~1% match)", qs: "q=campaign%20k17", role: "curator" },
    { query: "text search (broad: 15% match)", qs: "q=amplifier%20chain", role: "viewer" },
    { query: "text search (broad: 15% match)", qs: "q=amplifier%20chain", role: "curator" },
    { query: "text search (broad: 15% match)", qs: "q=amplifier%20chain", role: "researcher" },
    { query: "tag filter", qs: "tags=fibre-amplifier", role: "researcher" },
    { query: "sort by date (screened, oldest first)", qs: "sort=screened&dir=asc", role: "viewer" },
    { query: "sort by date (screened, oldest first)", qs: "sort=screened&dir=asc", role: "curator" },
    { query: "class + verdict + tag, sorted by title", qs: "class=nls&reducibility=reducible&tags=gain&sort=title&dir=asc", role: "viewer" },
    { query: "page 100", qs: "page=100", role: "curator" },
    { query: "text search (broad), page 40", qs: "q=amplifier%20chain&page=40", role: "viewer" },
    { query: "tag filter sorted by Painlevé verdict (no walkable index)", qs: "tags=fibre-amplifier&sort=painleve&dir=asc", role: "viewer" },
  ];

  const results: Record<string, unknown>[] = [];
  for (const q of queries) {
    for (const via of ["route", "service"] as const) {
      const times: number[] = [];
      let rows = 0;
      let total = 0;
      for (let i = 0; i < args.runs + 5; i++) {
        const t = performance.now();
        if (via === "route") {
          const req = new NextRequest(new URL(`/api/registry${q.qs ? `?${q.qs}` : ""}`, "http://localhost:3000"), { headers: { cookie: cookies[q.role], host: "localhost:3000" } });
          const res = await GET(req, { params: Promise.resolve({}) });
          const body = (await res.json()) as { rows: unknown[]; total: number };
          rows = body.rows.length;
          total = body.total;
        } else {
          const page = await listRegistry(users[q.role], parseRegistryQuery(new URLSearchParams(q.qs)));
          rows = page.rows.length;
          total = page.total;
        }
        if (i >= 5) times.push(performance.now() - t); // the first 5 warm the caches
      }
      times.sort((a, b) => a - b);
      results.push({ query: `${q.query} — ${q.role}, ${via === "route" ? "GET /api/registry" : "query service"}`, role: q.role, via, p50Ms: percentile(times, 50), p95Ms: percentile(times, 95), maxMs: percentile(times, 100), rows, total });
    }
  }
  const entries = await RegistryEntry.count();
  await sequelize.close();
  const worstP95 = Math.max(...results.map((r) => r.p95Ms as number));
  console.log(JSON.stringify({ entries, file: args.keep || args.file ? file : "(deleted)", seedMs, runs: args.runs, goalP95Ms: 50, worstP95Ms: worstP95, met: worstP95 <= 50, results }, null, 1));
  if (!args.keep && !args.file) rmSync(dir, { recursive: true, force: true });
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
