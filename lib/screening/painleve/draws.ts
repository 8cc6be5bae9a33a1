/**
 * The random inputs of one sample point (../shared/math/painleve.md §6 Steps 1–2): the time t_s,
 * ψ (real, order n ~ N(0,1)/n!), the free leading jet u0 of systems and the free functions at
 * resonances (complex, order n ~ (N(0,1) + i N(0,1))/n!). The 1/n! decay keeps high orders from
 * inflating rounding. Draws are recorded, so a recheck in higher precision replays them exactly.
 */
import { createRng, hashSeed, type Rng } from "../random";
import { SAMPLE_MARGIN } from "../tolerances";
import { pointText } from "../zero";
import type { Complex } from "./jet-algebra";
import type { FixedDraws } from "./types";

export interface PointDraws {
  /** Sample time as exact decimal text (shared with the invariant's zero test). */
  tText: string;
  psi: number[];
  u0: Complex[] | null;
  /** Free functions handed out so far (a replay pre-fills this list). */
  free: Complex[][];
  /** Hands out the next free function (replays the list first, then draws). */
  nextFree(): Complex[];
}

const factorials = (N: number): number[] => {
  const out = [1];
  for (let n = 1; n < N; n++) out.push(out[n - 1] * n);
  return out;
};

function complexJet(rng: Rng, N: number): Complex[] {
  const fact = factorials(N);
  return fact.map((fn) => ({ re: rng.normal() / fn, im: rng.normal() / fn }));
}

function withFreeList(base: Omit<PointDraws, "nextFree" | "free">, preset: Complex[][], draw: (() => Complex[]) | null): PointDraws {
  let used = 0;
  const d: PointDraws = {
    ...base,
    free: preset.map((c) => [...c]),
    nextFree() {
      if (used < d.free.length) return d.free[used++];
      if (!draw) throw new Error("fixed draws: no free function left");
      const c = draw();
      d.free.push(c);
      used++;
      return c;
    },
  };
  return d;
}

/** Random draws for point `index`, attempt `attempt` (a sub-seed per pair, so runs are reproducible). */
export function randomDraws(
  seed: number,
  index: number,
  attempt: number,
  window: [number, number],
  N: number,
  system: boolean,
): PointDraws {
  const rng = createRng(hashSeed("painleve", seed, index, attempt));
  const [t0, t1] = window;
  const margin = SAMPLE_MARGIN * (t1 - t0);
  const t = t1 > t0 ? rng.uniform(t0 + margin, t1 - margin) : t0;
  const fact = factorials(N);
  const psi = fact.map((fn) => rng.normal() / fn);
  const u0 = system ? complexJet(rng, N) : null;
  return withFreeList({ tText: pointText(t), psi, u0 }, [], () => complexJet(rng, N));
}

/** Deterministic draws for point `index` (test vectors of painleve.md §8). */
export function fixedDraws(fixed: FixedDraws, index: number, system: boolean): PointDraws {
  const pick = <X>(list: X[] | undefined): X | undefined => (list ? list[index] ?? list[0] : undefined);
  const u0 = pick(fixed.u0);
  return withFreeList(
    { tText: String(fixed.points[index]), psi: [...(pick(fixed.psi) ?? [0])], u0: system ? u0 ?? [{ re: 1, im: 0 }] : null },
    pick(fixed.free) ?? [],
    null,
  );
}

/** The same draws again (extended-precision recheck): every list is kept; the jet length truncates. */
export function replayDraws(recorded: PointDraws): PointDraws {
  return withFreeList({ tText: recorded.tText, psi: [...recorded.psi], u0: recorded.u0 ? [...recorded.u0] : null }, recorded.free, null);
}
