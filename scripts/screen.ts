/**
 * Screen family files from the command line, without the web app or the database.
 *
 *   npm run screen -- <file.yaml>... [--json] [--seed N] [--no-symbolic] [--no-painleve] [--timeout MS]
 *
 * --json prints one JSON object { engine, families: [{ id, class, errors, variants: [{ parameters,
 * reducibility: { verdict, constraints, evidence }, painleve: { verdict } }] }], errors, files };
 * otherwise a readable table. Exit status: 0 when every file parsed, 2 when any had errors,
 * 1 on a usage error.
 */
import { readFile } from "node:fs/promises";
import { ENGINE_VERSION, parseFamilies, screenFamily } from "../lib/screening";
import type { FamilyReport, ScreeningOptions, SpecError } from "../lib/screening";
import { createSymbolicWorker } from "../lib/symbolic-worker";
import type { SymbolicWorker } from "../lib/symbolic-worker";

interface CliOptions {
  files: string[];
  json: boolean;
  seed: number;
  symbolic: boolean;
  painleve: boolean;
  timeoutMs: number;
}

const USAGE = "usage: npm run screen -- <file.yaml>... [--json] [--seed N] [--no-symbolic] [--no-painleve] [--timeout MS]";

function parseArgs(argv: string[]): CliOptions | string {
  const o: CliOptions = { files: [], json: false, seed: 1, symbolic: true, painleve: true, timeoutMs: 3000 };
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    const numberArg = (): number | null => {
      const v = Number(argv[++i]);
      return Number.isFinite(v) ? v : null;
    };
    if (a === "--json") o.json = true;
    else if (a === "--no-symbolic") o.symbolic = false;
    else if (a === "--no-painleve") o.painleve = false;
    else if (a === "--seed") {
      const v = numberArg();
      if (v === null || !Number.isInteger(v)) return "--seed needs an integer";
      o.seed = v;
    } else if (a === "--timeout") {
      const v = numberArg();
      if (v === null || v <= 0) return "--timeout needs a positive number of milliseconds";
      o.timeoutMs = v;
    } else if (a === "--help" || a === "-h") return USAGE;
    else if (a.startsWith("--")) return `unknown option ${a}`;
    else o.files.push(a);
  }
  if (o.files.length === 0) return "no input files";
  return o;
}

interface FamilyOutput {
  id: string;
  class: string | null;
  file: string;
  errors: SpecError[];
  variants: FamilyReport["variants"];
  summary?: FamilyReport["summary"];
  title?: string;
}

const pad = (s: string, n: number): string => (s.length >= n ? s : s + " ".repeat(n - s.length));

function printTable(families: FamilyOutput[], errors: SpecError[]): void {
  const lines: string[] = [`wavesieve engine ${ENGINE_VERSION}`];
  for (const f of families) {
    lines.push("", `${f.id} (${f.class ?? "?"})${f.title ? ` — ${f.title}` : ""}   [${f.file}]`);
    for (const e of f.errors) lines.push(`  error ${e.line ?? "?"}:${e.column ?? "?"} ${e.path}: ${e.message}`);
    if (f.variants.length > 0) {
      lines.push(`  ${pad("#", 4)}${pad("parameters", 28)}${pad("reducibility", 16)}${pad("painleve", 12)}detail`);
    }
    for (const v of f.variants) {
      const params = Object.entries(v.parameters).map(([k, x]) => `${k}=${x}`).join(" ") || "—";
      const r = v.reducibility;
      const detail = r.verdict === "undecided" ? `${r.reason}: ${r.message}` : r.summary;
      lines.push(`  ${pad(String(v.index), 4)}${pad(params, 28)}${pad(r.verdict, 16)}${pad(v.painleve.verdict, 12)}${detail}`);
    }
    if (f.summary && f.variants.length > 1) lines.push(`  summary: ${f.summary.text}`);
  }
  for (const e of errors) lines.push("", `error ${e.file ?? ""}:${e.line ?? "?"}:${e.column ?? "?"} ${e.message}`);
  process.stdout.write(lines.join("\n") + "\n");
}

async function main(): Promise<number> {
  const parsed = parseArgs(process.argv.slice(2));
  if (typeof parsed === "string") {
    process.stderr.write(`${parsed}\n${parsed === USAGE ? "" : USAGE + "\n"}`);
    return parsed === USAGE ? 0 : 1;
  }
  let worker: SymbolicWorker | null = null;
  const options: ScreeningOptions = { seed: parsed.seed, painleve: parsed.painleve, symbolicTimeoutMs: parsed.timeoutMs };
  if (parsed.symbolic) {
    worker = createSymbolicWorker();
    options.symbolic = worker.hook;
  }
  const families: FamilyOutput[] = [];
  const fileErrors: SpecError[] = [];
  const files: { file: string; families: number; errors: number }[] = [];
  try {
    for (const file of parsed.files) {
      let text: string;
      try {
        text = await readFile(file, "utf8");
      } catch (err) {
        const message = err instanceof Error ? err.message : String(err);
        fileErrors.push({ code: "file-read", message: `cannot read the file: ${message}`, path: "", file });
        files.push({ file, families: 0, errors: 1 });
        continue;
      }
      const result = parseFamilies(text, { file });
      files.push({ file, families: result.families.length, errors: result.errors.length });
      const byFamily = new Map<string, SpecError[]>();
      for (const e of result.errors) {
        if (e.familyId === undefined) fileErrors.push(e);
        else byFamily.set(e.familyId, [...(byFamily.get(e.familyId) ?? []), e]);
      }
      for (const spec of result.families) {
        const report = await screenFamily(spec, options);
        const errors = byFamily.get(spec.id) ?? [];
        byFamily.delete(spec.id);
        families.push({ id: report.id, title: report.title, class: report.class, file, errors, variants: report.variants, summary: report.summary });
      }
      // Families that did not parse: their errors, no variants.
      for (const [id, errors] of byFamily) families.push({ id, class: null, file, errors, variants: [] });
    }
  } finally {
    await worker?.close();
  }
  const anyErrors = fileErrors.length > 0 || families.some((f) => f.errors.length > 0);
  if (parsed.json) {
    process.stdout.write(JSON.stringify({ engine: ENGINE_VERSION, families, errors: fileErrors, files }) + "\n");
  } else {
    printTable(families, fileErrors);
  }
  return anyErrors ? 2 : 0;
}

main().then(
  (code) => {
    process.exitCode = code;
  },
  (err: unknown) => {
    process.stderr.write(`screen: ${err instanceof Error ? err.stack ?? err.message : String(err)}\n`);
    process.exitCode = 1;
  },
);
