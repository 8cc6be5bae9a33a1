/**
 * Design mode from the command line: solve for the coefficient that makes a model integrable.
 *
 *   npm run design -- --class nls --solve b --set a="1/2" --set h="exp(t/5)" --window 0,5 [--json]
 *        [--param g0=0.2]... [--const alpha0=0.1]... [--seed N] [--symbolic] [--timeout MS] [--yaml FILE]
 *
 * --json prints one JSON object { engine, ok, result | errors }: result.solution (text, latex or
 * the table), result.constants, result.screening (verdicts and rho_inv), result.yaml.
 * Exit status: 0 for a design, 2 when the request has errors, 1 on a usage error.
 */
import { writeFile } from "node:fs/promises";
import { ENGINE_VERSION } from "../lib/screening";
import { designModel } from "../lib/screening/design";
import type { DesignOptions, DesignRequest, DesignResult } from "../lib/screening/design";
import { createSymbolicWorker } from "../lib/symbolic-worker";
import type { SymbolicWorker } from "../lib/symbolic-worker";

const USAGE =
  "usage: npm run design -- --class nls|kdv|mkdv --solve <coefficient> --set name=expr [--set …] --window t0,t1 [--param name=value]… [--const name=value]… [--json] [--seed N] [--symbolic] [--timeout MS] [--yaml FILE]";

interface CliOptions {
  request: DesignRequest;
  json: boolean;
  seed: number;
  symbolic: boolean;
  timeoutMs: number;
  yamlFile: string | null;
}

function pair(text: string | undefined, what: string): [string, string] | string {
  const i = text?.indexOf("=") ?? -1;
  if (!text || i <= 0) return `${what} needs name=value, got '${text ?? ""}'`;
  return [text.slice(0, i).trim(), text.slice(i + 1).trim()];
}

function parseArgs(argv: string[]): CliOptions | string {
  const request: DesignRequest = { class: "", solve: "", set: {}, window: [NaN, NaN] };
  const parameters: Record<string, string> = {};
  const constants: Record<string, number> = {};
  const o: CliOptions = { request, json: false, seed: 1, symbolic: false, timeoutMs: 3000, yamlFile: null };
  let windowSeen = false;
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    const next = (): string | undefined => argv[++i];
    if (a === "--json") o.json = true;
    else if (a === "--symbolic") o.symbolic = true;
    else if (a === "--class") request.class = next() ?? "";
    else if (a === "--solve") request.solve = next() ?? "";
    else if (a === "--set" || a === "--param" || a === "--const") {
      const p = pair(next(), a);
      if (typeof p === "string") return p;
      if (a === "--set") request.set[p[0]] = p[1];
      else if (a === "--param") parameters[p[0]] = p[1];
      else {
        const v = Number(p[1]);
        if (!Number.isFinite(v)) return `--const ${p[0]} needs a number`;
        constants[p[0]] = v;
      }
    } else if (a === "--window") {
      const parts = (next() ?? "").split(",").map((x) => Number(x.trim()));
      if (parts.length !== 2 || !parts.every(Number.isFinite)) return "--window needs t0,t1 (two numbers)";
      request.window = [parts[0], parts[1]];
      windowSeen = true;
    } else if (a === "--seed") {
      const v = Number(next());
      if (!Number.isInteger(v)) return "--seed needs an integer";
      o.seed = v;
    } else if (a === "--timeout") {
      const v = Number(next());
      if (!(v > 0)) return "--timeout needs a positive number of milliseconds";
      o.timeoutMs = v;
    } else if (a === "--yaml") o.yamlFile = next() ?? null;
    else if (a === "--help" || a === "-h") return USAGE;
    else return `unknown argument ${a}`;
  }
  if (!request.class) return "--class is required";
  if (!windowSeen) return "--window is required";
  if (Object.keys(parameters).length) request.parameters = parameters;
  if (Object.keys(constants).length) request.constants = constants;
  return o;
}

const fmt = (x: number): string => (Math.abs(x) >= 1e4 || (Math.abs(x) < 1e-3 && x !== 0) ? x.toExponential(3) : String(Number(x.toPrecision(6))));

function printResult(r: DesignResult): void {
  const lines: string[] = [`wavesieve engine ${ENGINE_VERSION} — design mode`, "", `${r.class}: solve for ${r.solve} on [${r.window.join(", ")}]`];
  for (const f of r.fixed) lines.push(`  fixed ${f.name} = ${f.text}`);
  lines.push("", `condition (${r.condition.kind}): ${r.condition.method}`);
  if (r.solution.form === "closed") lines.push("", `${r.solve}(t) = ${r.solution.text}`, `LaTeX: ${r.solution.latex}`);
  else {
    const s = r.solution;
    lines.push("", `${r.solve}(t): no closed form (${s.reason}); tabulated on [${s.reached.join(", ")}], ${s.t.length} nodes`, `accuracy: ${s.accuracy.text}`);
    const step = Math.max(1, Math.floor(s.t.length / 10));
    for (let i = 0; i < s.t.length; i += step) lines.push(`  t = ${fmt(s.t[i]).padEnd(10)} ${r.solve} = ${s.values[i] === null ? "—" : fmt(s.values[i] as number)}`);
  }
  if (r.constants.length) {
    lines.push("", "integration constants:");
    for (const c of r.constants) lines.push(`  ${c.name} = ${c.value}${c.value === c.defaultValue ? " (default)" : ` (default ${c.defaultValue})`}: ${c.meaning}`);
  }
  for (const p of r.poles) lines.push(`${p.kind} at t = ${fmt(p.t)}: ${p.detail}`);
  const s = r.screening;
  lines.push("", s.kind === "pipeline" ? `screen (pipeline): reducibility ${s.reducibility}, Painlevé ${s.painleve}; rho_inv ≤ ${s.rhoMax.toExponential(2)} (${s.precision})` : `screen (numerical design): ${s.reducibility}; ${s.summary}`);
  for (const n of r.notes) lines.push(`note: ${n}`);
  lines.push("", r.submitNote);
  if (r.yaml) lines.push("", r.yaml);
  process.stdout.write(lines.join("\n") + "\n");
}

async function main(): Promise<number> {
  const parsed = parseArgs(process.argv.slice(2));
  if (typeof parsed === "string") {
    process.stderr.write(`${parsed}\n${parsed === USAGE ? "" : USAGE + "\n"}`);
    return parsed === USAGE ? 0 : 1;
  }
  let worker: SymbolicWorker | null = null;
  const options: DesignOptions = { seed: parsed.seed, symbolicTimeoutMs: parsed.timeoutMs };
  if (parsed.symbolic) {
    worker = createSymbolicWorker();
    options.symbolic = worker.hook;
  }
  try {
    const out = await designModel(parsed.request, options);
    if (parsed.json) process.stdout.write(JSON.stringify({ engine: ENGINE_VERSION, ...out }) + "\n");
    else if (out.ok) printResult(out.result);
    else for (const e of out.errors) process.stderr.write(`error${e.field ? ` (${e.field})` : ""}: ${e.message}\n`);
    if (out.ok && parsed.yamlFile && out.result.yaml) await writeFile(parsed.yamlFile, out.result.yaml, "utf8");
    return out.ok ? 0 : 2;
  } finally {
    await worker?.close();
  }
}

main().then(
  (code) => {
    process.exitCode = code;
  },
  (err: unknown) => {
    process.stderr.write(`design: ${err instanceof Error ? err.stack ?? err.message : String(err)}\n`);
    process.exitCode = 1;
  },
);
