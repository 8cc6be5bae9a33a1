/**
 * The seeded generator of lib/screening/random.ts (kept here with the pipeline, its user).
 */
import { describe, it, expect } from "vitest";
import { createRng, hashSeed } from "../../../lib/screening/random";

describe("seeded random numbers", () => {
  it("mulberry32 is reproducible and uniform in [0, 1) (mean 1/2, variance 1/12)", () => {
    const a = createRng(42);
    const b = createRng(42);
    const xs = Array.from({ length: 20000 }, () => a.next());
    expect(xs.slice(0, 5)).toEqual(Array.from({ length: 5 }, () => b.next()));
    expect(Math.min(...xs)).toBeGreaterThanOrEqual(0);
    expect(Math.max(...xs)).toBeLessThan(1);
    const mean = xs.reduce((s, x) => s + x, 0) / xs.length;
    const variance = xs.reduce((s, x) => s + (x - mean) ** 2, 0) / xs.length;
    // Uniform(0,1): mean 1/2, variance 1/12 (from memory: elementary); 20000 draws → se ≈ 0.002.
    expect(Math.abs(mean - 0.5)).toBeLessThan(0.01);
    expect(Math.abs(variance - 1 / 12)).toBeLessThan(0.005);
  });

  it("Box–Muller normals have mean 0 and variance 1 (Box & Muller, Ann. Math. Stat. 29 (1958) 610)", () => {
    const r = createRng(7);
    const xs = Array.from({ length: 20000 }, () => r.normal());
    const mean = xs.reduce((s, x) => s + x, 0) / xs.length;
    const variance = xs.reduce((s, x) => s + (x - mean) ** 2, 0) / xs.length;
    expect(Math.abs(mean)).toBeLessThan(0.03);
    expect(Math.abs(variance - 1)).toBeLessThan(0.04);
  });

  it("derives different seeds from different variant identities", () => {
    expect(hashSeed(1, "fam", 0)).toBe(hashSeed(1, "fam", 0));
    expect(hashSeed(1, "fam", 0)).not.toBe(hashSeed(1, "fam", 1));
    expect(hashSeed(1, "fam", 0)).not.toBe(hashSeed(2, "fam", 0));
  });
});
