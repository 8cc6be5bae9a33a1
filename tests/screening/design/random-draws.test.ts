// Designed models satisfy their condition: on ≥ 50 random fixed-coefficient draws per class,
// the designed coefficient substituted back and screened by the ordinary pipeline gives
// `reducible` (and the Painlevé test `passes`), with the invariant statistic in the report.
// The condition is the class invariant of ../shared/math (nls.md §3 R, kdv.md §2 K, mkdv.md §2 Q);
// the screen decides it independently of the design algebra (README "Verdict vocabulary").
import { describe, it, expect } from "vitest";
import { designModel } from "@/lib/screening/design";
import type { DesignRequest } from "@/lib/screening/design";
import { createRng } from "@/lib/screening/random";
import type { Rng } from "@/lib/screening/random";

const DRAWS_PER_UNKNOWN = 13; // four unknowns per class → 52 draws per class

/** A decimal with two digits in [lo, hi], away from 0. */
function dec(rng: Rng, lo: number, hi: number): string {
  for (;;) {
    const v = Math.round(rng.uniform(lo, hi) * 100) / 100;
    if (Math.abs(v) >= 0.05) return String(v);
  }
}
const pick = <T,>(rng: Rng, xs: T[]): T => xs[Math.floor(rng.next() * xs.length)];

/** Nonzero on [0, 2]: the profiles a, h, p, q are drawn from. */
function profile(rng: Rng): string {
  const c = pick(rng, [dec(rng, 0.3, 2), dec(rng, -2, -0.3)]);
  return pick(rng, [
    () => c,
    () => `${c}*exp(${dec(rng, -0.5, 0.5)}*t)`,
    () => `${c}*(1 + ${dec(rng, 0.05, 0.8)}*t)`,
    () => `${c}*(1 + ${dec(rng, 0.05, 0.5)}*cos(${dec(rng, 0.5, 2)}*t))`,
    () => `${c}*(1 + ${dec(rng, 0.05, 0.8)}*t)^${pick(rng, ["2", "(-1)", "(1/2)"])}`,
    () => `${c}*sech(${dec(rng, 0.1, 1)}*t)`,
    () => `${c}/(1 + ${dec(rng, 0.05, 0.8)}*t^2)`,
  ])();
}

/** A profile whose products with exponentials integrate in closed form. */
function simpleProfile(rng: Rng): string {
  const c = pick(rng, [dec(rng, 0.3, 2), dec(rng, -2, -0.3)]);
  return pick(rng, [() => c, () => `${c}*exp(${dec(rng, -0.5, 0.5)}*t)`, () => `${c}*(1 + ${dec(rng, 0.05, 0.8)}*t)`])();
}

/** Any smooth function on [0, 2] with an elementary integral. */
function anyFunction(rng: Rng): string {
  const u = dec(rng, -1, 1);
  return pick(rng, [
    () => u,
    () => `${u}*t`,
    () => `${u}*sin(${dec(rng, 0.5, 2)}*t)`,
    () => `${u}*exp(${dec(rng, -0.5, 0.5)}*t)`,
    () => `${u}/(1 + ${dec(rng, 0.05, 0.8)}*t)`,
    () => `${u} + ${dec(rng, -1, 1)}*cos(${dec(rng, 0.5, 2)}*t)`,
  ])();
}

type Draw = (rng: Rng) => DesignRequest;

const W: [number, number] = [0, 2];

const NLS_DRAWS: Record<string, Draw> = {
  b: (rng) => ({ class: "nls", solve: "b", set: { a: profile(rng), h: profile(rng), c: anyFunction(rng), k: anyFunction(rng) }, window: W }),
  k: (rng) => ({ class: "nls", solve: "k", set: { a: dec(rng, 0.3, 2), h: profile(rng), b: dec(rng, -0.8, 0.8), c: dec(rng, -0.5, 0.5) }, window: W, constants: { k0: Number(dec(rng, -0.4, 0.4)) } }),
  h: (rng) => ({ class: "nls", solve: "h", set: { a: simpleProfile(rng), c: dec(rng, -0.4, 0.4), k: anyFunction(rng) }, window: W, constants: { alpha0: Number(dec(rng, -0.2, 0.2)) } }),
  a: (rng) => ({ class: "nls", solve: "a", set: { h: simpleProfile(rng), k: dec(rng, -0.3, 0.3), c: anyFunction(rng) }, window: W, constants: { alpha0: Number(dec(rng, -0.2, 0.2)) } }),
};

const KDV_DRAWS: Record<string, Draw> = {
  m: (rng) => ({ class: "kdv", solve: "m", set: { p: profile(rng), q: profile(rng), r: anyFunction(rng), s: anyFunction(rng) }, window: W }),
  q: (rng) => ({ class: "kdv", solve: "q", set: { p: simpleProfile(rng), r: dec(rng, -0.5, 0.5), s: dec(rng, -0.3, 0.3) }, window: W, constants: { B0: Number(dec(rng, -0.3, 0.3)) } }),
  r: (rng) => ({ class: "kdv", solve: "r", set: { p: profile(rng), q: simpleProfile(rng), s: dec(rng, -0.3, 0.3) }, window: W, constants: { r0: Number(dec(rng, -0.4, 0.4)) } }),
  p: (rng) => ({ class: "kdv", solve: "p", set: { q: simpleProfile(rng), r: anyFunction(rng), s: dec(rng, -0.3, 0.3) }, window: W }),
};

const MKDV_DRAWS: Record<string, Draw> = {
  r: (rng) => ({ class: "mkdv", solve: "r", set: { p: profile(rng), q: profile(rng), s: anyFunction(rng) }, window: W }),
  s: (rng) => ({ class: "mkdv", solve: "s", set: { p: profile(rng), q: profile(rng), r: anyFunction(rng) }, window: W }),
  p: (rng) => ({ class: "mkdv", solve: "p", set: { q: profile(rng), r: anyFunction(rng), s: anyFunction(rng) }, window: W }),
  q: (rng) => ({ class: "mkdv", solve: "q", set: { p: profile(rng), r: anyFunction(rng), s: anyFunction(rng) }, window: W }),
};

async function runDraws(name: string, draws: Record<string, Draw>, seed: number) {
  const rng = createRng(seed);
  let screened = 0;
  const problems: string[] = [];
  for (const [unknown, draw] of Object.entries(draws)) {
    for (let i = 0; i < DRAWS_PER_UNKNOWN; i++) {
      const request = draw(rng);
      const out = await designModel(request, { transformation: false, seed: i + 1 });
      if (!out.ok) {
        problems.push(`${unknown} ${JSON.stringify(request.set)}: ${out.errors.map((e) => e.message).join("; ")}`);
        continue;
      }
      const s = out.result.screening;
      if (s.kind !== "pipeline") {
        problems.push(`${unknown} ${JSON.stringify(request.set)}: not a closed form (${out.result.solution.form})`);
        continue;
      }
      screened++;
      expect(s.reducibility, `${name} ${unknown} ${JSON.stringify(request.set)}`).toBe("reducible");
      expect(s.painleve).toBe("passes");
      expect(s.samples.length).toBeGreaterThanOrEqual(3);
      expect(s.rhoMax).toBeLessThanOrEqual(1e-12);
    }
  }
  expect(problems, problems.join("\n")).toEqual([]);
  expect(screened).toBeGreaterThanOrEqual(50);
}

describe("random draws: designed models screen as reducible", () => {
  it("vc-NLS: 52 draws (b, k, h, a)", () => runDraws("nls", NLS_DRAWS, 101), 240_000);
  it("vc-KdV: 52 draws (m, q, r, p)", () => runDraws("kdv", KDV_DRAWS, 202), 240_000);
  it("vc-mKdV: 52 draws (r, s, p, q)", () => runDraws("mkdv", MKDV_DRAWS, 303), 240_000);
});
