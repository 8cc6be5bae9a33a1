/**
 * Seeded pseudo-random numbers for the engine: every random sample point is reproducible from
 * (seed, family id, variant index), so a report can be recomputed exactly.
 *
 * - mulberry32: a 32-bit generator (T. Ettinger, public-domain design), period 2^32.
 * - cyrb53-style string hash to derive sub-seeds (public-domain design).
 * - Box–Muller transform for normal deviates (G. E. P. Box, M. E. Muller, Ann. Math. Stat. 29
 *   (1958) 610–611).
 */

export interface Rng {
  /** Uniform in [0, 1). */
  next(): number;
  /** Uniform in [lo, hi). */
  uniform(lo: number, hi: number): number;
  /** Standard normal deviate. */
  normal(): number;
}

/** A 32-bit seed from any text (cyrb53 mixing, folded to 32 bits). */
export function hashSeed(...parts: (string | number)[]): number {
  const text = parts.map(String).join("\u0001");
  let h1 = 0xdeadbeef;
  let h2 = 0x41c6ce57;
  for (let i = 0; i < text.length; i++) {
    const ch = text.charCodeAt(i);
    h1 = Math.imul(h1 ^ ch, 2654435761);
    h2 = Math.imul(h2 ^ ch, 1597334677);
  }
  h1 = Math.imul(h1 ^ (h1 >>> 16), 2246822507) ^ Math.imul(h2 ^ (h2 >>> 13), 3266489909);
  h2 = Math.imul(h2 ^ (h2 >>> 16), 2246822507) ^ Math.imul(h1 ^ (h1 >>> 13), 3266489909);
  return (h1 ^ h2) >>> 0;
}

/** mulberry32 generator seeded with a 32-bit integer. */
export function createRng(seed: number): Rng {
  let state = seed >>> 0;
  const next = (): number => {
    state = (state + 0x6d2b79f5) >>> 0;
    let z = state;
    z = Math.imul(z ^ (z >>> 15), z | 1);
    z ^= z + Math.imul(z ^ (z >>> 7), z | 61);
    return ((z ^ (z >>> 14)) >>> 0) / 4294967296;
  };
  let spare: number | null = null;
  return {
    next,
    uniform: (lo, hi) => lo + (hi - lo) * next(),
    normal: () => {
      if (spare !== null) {
        const s = spare;
        spare = null;
        return s;
      }
      // Box–Muller: two uniforms → two independent standard normals.
      let u = next();
      while (u <= 0) u = next();
      const v = next();
      const radius = Math.sqrt(-2 * Math.log(u));
      spare = radius * Math.sin(2 * Math.PI * v);
      return radius * Math.cos(2 * Math.PI * v);
    },
  };
}
