/**
 * Benchmark of the reducibility stage: wall time per variant (scan, double pass and the 40/80-digit
 * confirmation; no symbolic hook, no free parameters), median and p95 per class. Prints one JSON
 * line. Goal (issue): median ≤ 20 ms per NLS variant.
 *
 *   npx tsx bench/reducibility.ts [--rounds N]
 */
import { parseExpression } from "../lib/screening/expr";
import type { Expr } from "../lib/screening/expr";
import { runReducibility } from "../lib/screening/reducibility";
import { CLASS_COEFFICIENTS } from "../lib/screening/spec/types";
import type { EquationClass, Variant } from "../lib/screening/spec/types";

type Member = { class: EquationClass; c: Record<string, string>; window: [number, number] };

/** Members from ../shared/math (nls.md §10–11, kdv.md §2 and §7, mkdv.md §2 and §6), passing and failing. */
const MEMBERS: Member[] = [
  { class: "nls", c: { a: "1/2", h: "1" }, window: [0, 2] },
  { class: "nls", c: { a: "1/2", f: "0.3", h: "1" }, window: [0, 2] },
  { class: "nls", c: { a: "1/2", k: "0.1", h: "1" }, window: [0, 2] },
  { class: "nls", c: { a: "1/2", k: "0.1", h: "exp(t/5)" }, window: [0, 2] },
  { class: "nls", c: { a: "1/2", b: "-1/(8*(1+t)^2)", h: "(1+t)^(-1/2)" }, window: [0, 2] },
  { class: "nls", c: { a: "1/2", b: "-1/2", h: "1/cos(t)" }, window: [0, 1.5] },
  { class: "nls", c: { a: "1", c: "1", k: "1/4", f: "1", g: "-1/2", h: "2*exp(t/2)" }, window: [0, 2] },
  { class: "nls", c: { a: "1", c: "1", k: "1/4", f: "1", g: "-1/2", h: "2" }, window: [0, 2] },
  { class: "nls", c: { a: "1/2", k: "1/(2*(1+t))", h: "1" }, window: [0, 2] },
  { class: "nls", c: { a: "1/2", k: "0.1", b: "0.02", h: "1" }, window: [0, 2] },
  { class: "nls", c: { a: "1/2", e: "cos(t)", f: "0.3*sin(t)", g: "0.2", h: "1" }, window: [0, 2] },
  { class: "nls", c: { a: "1 + 0.3*sin(t)", h: "2/(1+t^2)", b: "0.1", k: "0.05", c: "0.2", f: "0.4", e: "t" }, window: [0, 2] },
  { class: "kdv", c: { p: "6", q: "1", r: "1/(2*t)" }, window: [1, 10] },
  { class: "kdv", c: { p: "t", q: "t^3" }, window: [0.5, 3] },
  { class: "kdv", c: { p: "cos(t)", q: "sin(t)*cos(t)" }, window: [0.1, 1.4] },
  { class: "kdv", c: { p: "t", q: "t^2" }, window: [0.5, 3] },
  { class: "kdv", c: { p: "6", q: "1", r: "0.1" }, window: [0, 3] },
  {
    class: "kdv",
    c: { p: "1 + 0.3*cos(t)", q: "(1 + 0.3*cos(t))/1.3*exp(0.1*t + 0.46*sin(t))", r: "0.1", s: "0.2*cos(t)", g: "0.5*sin(t)", m: "0.06 + 0.052*cos(t)", l: "0.1*cos(t) + 0.13*sin(t) + 0.006*sin(t)*cos(t)" },
    window: [0, 3],
  },
  { class: "mkdv", c: { p: "6", q: "1", r: "0.1" }, window: [0, 3] },
  { class: "mkdv", c: { p: "6", q: "1", r: "1/(2*t)", s: "1/(2*t)" }, window: [1, 5] },
  { class: "mkdv", c: { p: "6", q: "1", r: "1/(2*t)" }, window: [1, 5] },
  { class: "mkdv", c: { q: "1 + 0.5*sin(t)", r: "0.2 + 0.1*cos(t)", s: "0.1*cos(t)", g: "0.3*t", p: "6*(1 + 0.5*sin(t))*exp(0.4*t)" }, window: [0, 3] },
];

function variant(m: Member, index: number): Variant {
  const coefficients: Record<string, Expr> = {};
  for (const name of CLASS_COEFFICIENTS[m.class]) {
    const r = parseExpression(m.c[name] ?? "0", { symbols: new Set(["t"]) });
    if (!r.ok) throw new Error(`${name}: ${r.error.message}`);
    coefficients[name] = r.expr;
  }
  return { familyId: `bench-${m.class}`, index, class: m.class, parameters: {}, free: [], coefficients, window: m.window };
}

function quantile(sorted: number[], q: number): number {
  const i = Math.min(sorted.length - 1, Math.max(0, Math.ceil(q * sorted.length) - 1));
  return sorted[i];
}

async function main(): Promise<void> {
  const roundsArg = process.argv.indexOf("--rounds");
  const rounds = roundsArg > 0 ? Number(process.argv[roundsArg + 1]) : 5;
  const variants = MEMBERS.map(variant);
  for (const v of variants) await runReducibility(v); // warm-up (JIT, decimal caches)
  const times: Record<EquationClass, number[]> = { nls: [], kdv: [], mkdv: [] };
  for (let r = 0; r < rounds; r++) {
    for (const v of variants) {
      const start = performance.now();
      await runReducibility({ ...v, index: v.index + 1000 * (r + 1) }); // new sample points each round
      times[v.class].push(performance.now() - start);
    }
  }
  const out: Record<string, unknown> = { bench: "reducibility", rounds, variants: variants.length };
  for (const cls of ["nls", "kdv", "mkdv"] as const) {
    const sorted = [...times[cls]].sort((a, b) => a - b);
    out[cls] = { n: sorted.length, medianMs: Number(quantile(sorted, 0.5).toFixed(2)), p95Ms: Number(quantile(sorted, 0.95).toFixed(2)) };
  }
  process.stdout.write(JSON.stringify(out) + "\n");
}

void main();
