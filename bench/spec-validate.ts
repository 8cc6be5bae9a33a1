/**
 * Benchmark: parseFamilies on a generated 1000-family file (goal: median < 2 s).
 * Run: npx tsx bench/spec-validate.ts   — prints one JSON line.
 */
import { parseFamilies } from "../lib/screening/spec";

const FAMILIES = 1000;
const RUNS = 7;

/** Four kinds of family in turn: fibre with sweeps and helpers, trap equation, KdV, mKdV. */
function family(i: number): string {
  switch (i % 4) {
    case 0:
      return `  - id: taper-${i}
    title: Tapered amplifier ${i}
    class: nls
    variables: { evolution: z, space: T }
    parameters:
      g0: ${(0.1 + (i % 7) * 0.01).toFixed(2)}
      L: { values: [1, 2, 5] }
      h0: free
    functions:
      beta2: "-1/(1 + z/L)"
    coefficients:
      a: "-beta2(z)/2"
      h: "h0*exp(g0*z)"
      k: "-g0/2"
    window: [0, 10]
    tags: [fibre, gain]
`;
    case 1:
      return `  - id: trap-${i}
    class: nls
    parameters: { w0: ${(0.5 + (i % 5) * 0.1).toFixed(1)}, eps: 0.1, g0: 1 }
    functions:
      w: "w0*(1 + eps*cos(2*t))"
    equation: "i*u_t + 1/2*u_xx - w(t)^2/2*x^2*u - g0*exp(-t)*|u|^2*u = 0"
    window: [0, 5]
`;
    case 2:
      return `  - id: channel-${i}
    class: kdv
    parameters:
      r0: { range: [0, 1], steps: 3 }
    coefficients: { p: 6, q: "1 + 0.1*sin(t)", r: "r0/(2*t)" }
    window: [1, 5]
`;
    default:
      return `  - id: kink-${i}
    class: mkdv
    equation: "u_t + 6*exp(-0.1*t)*u^2*u_x + u_xxx + 0.05*u = 0"
    window: [0, 3]
`;
  }
}

function generate(): string {
  let text = "wavesieve: 1\nfamilies:\n";
  for (let i = 0; i < FAMILIES; i++) text += family(i);
  return text;
}

function main(): void {
  const text = generate();
  const times: number[] = [];
  let result = parseFamilies(text, { file: "bench.yaml" });
  for (let run = 0; run < RUNS; run++) {
    const t0 = performance.now();
    result = parseFamilies(text, { file: "bench.yaml" });
    times.push(performance.now() - t0);
  }
  if (result.errors.length > 0 || result.families.length !== FAMILIES) {
    throw new Error(`benchmark input is not valid: ${JSON.stringify(result.errors.slice(0, 3))}`);
  }
  times.sort((a, b) => a - b);
  const median = times[Math.floor(times.length / 2)];
  const variants = result.families.reduce((n, f) => n + f.variants.length, 0);
  console.log(
    JSON.stringify({
      bench: "spec-validate",
      families: FAMILIES,
      variants,
      bytes: text.length,
      runs: RUNS,
      median_ms: Number(median.toFixed(1)),
      min_ms: Number(times[0].toFixed(1)),
      max_ms: Number(times[times.length - 1].toFixed(1)),
      goal_ms: 2000,
      pass: median < 2000,
    }),
  );
}

main();
