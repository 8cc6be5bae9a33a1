/**
 * Benchmark of the split-step Fourier stage (lib/screening/verify): N = 1024 grid points ×
 * 2000 time steps on the vc-NLS member (a) of ../shared/math/nls.md §11 (a = 1/2, h = 1, bright
 * soliton η = 1, V = 1/2), for the Strang (order 2) and Yoshida (order 4) schemes.
 * Goal: ≤ 0.5 s for the split-step stage. Prints one JSON line.
 * Run: npx tsx bench/verify.ts
 */
import { parseExpression, num, type Expr } from "../lib/screening/expr";
import { CLASS_COEFFICIENTS, type Variant } from "../lib/screening/spec/types";
import { buildTransformation, coefficientSet } from "../lib/screening/transform";
import { buildSolutions, evaluateSolution } from "../lib/screening/solutions";
import { runSplitStep } from "../lib/screening/verify";
import { loadavg } from "node:os";

function member(): Variant {
  const text: Record<string, string> = { a: "1/2", h: "1" };
  const coefficients: Record<string, Expr> = {};
  for (const n of CLASS_COEFFICIENTS.nls) {
    const r = text[n] ? parseExpression(text[n], { symbols: new Set(["t"]) }) : null;
    coefficients[n] = r && r.ok ? r.expr : num(0);
  }
  return { familyId: "bench-a", index: 0, class: "nls", parameters: {}, free: [], coefficients, window: [0, 2] };
}

const N = 1024;
const STEPS = 2000;
const v = member();
const tr = buildTransformation(v);
const set = buildSolutions(v, tr);
if (!tr.ok || !set.ok) throw new Error("bench member did not transform");
const spec = set.solutions[0];
const coefs = coefficientSet(v);
const [t0, t1] = tr.mapWindow;
const xMin = -30;
const xMax = 31;
const dx = (xMax - xMin) / N;
const initial = new Float64Array(2 * N);
for (let j = 0; j < N; j++) {
  const u = evaluateSolution(spec, tr.table, {}, xMin + j * dx, t0);
  initial[2 * j] = u.re;
  initial[2 * j + 1] = u.im;
}
const times = Array.from({ length: STEPS + 1 }, (_, i) => t0 + ((t1 - t0) * i) / STEPS);

function run(order: 2 | 4): { ms: number; cpuMs: number; relError: number } {
  let relError = NaN;
  const start = performance.now();
  const cpu0 = process.cpuUsage();
  runSplitStep({
    coefficients: (t) => coefs.values(t), times, xMin, xMax, N, initial, order,
    observeAt: [STEPS],
    observe(_n, t, u) {
      let e = 0;
      let r = 0;
      for (let j = 0; j < N; j++) {
        const ex = evaluateSolution(spec, tr.ok ? tr.table : (undefined as never), {}, xMin + j * dx, t);
        e = Math.max(e, Math.hypot(u[2 * j] - ex.re, u[2 * j + 1] - ex.im));
        r = Math.max(r, Math.hypot(ex.re, ex.im));
      }
      relError = e / r;
    },
  });
  const cpu = process.cpuUsage(cpu0);
  return { ms: performance.now() - start, cpuMs: (cpu.user + cpu.system) / 1000, relError };
}

run(2); // warm-up
const strang = [run(2), run(2), run(2)];
const yoshida = [run(4), run(4), run(4)];
const median = (xs: number[]) => Number([...xs].sort((a, b) => a - b)[1].toFixed(1));
console.log(JSON.stringify({
  bench: "split-step", N, steps: STEPS, window: [t0, t1],
  strang: { wallMs: median(strang.map((r) => r.ms)), cpuMs: median(strang.map((r) => r.cpuMs)), relError: strang[0].relError },
  yoshida4: { wallMs: median(yoshida.map((r) => r.ms)), cpuMs: median(yoshida.map((r) => r.cpuMs)), relError: yoshida[0].relError },
  goalMs: 500, loadAverage1m: loadavg()[0],
  note: "median of 3 runs; wall and process CPU time; includes one final comparison with the exact solution (N evaluations)",
}));
