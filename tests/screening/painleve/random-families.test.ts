/**
 * On random family members (≥ 200 in all, half reducible by construction — see random-families.ts
 * for the constructions, derived in ../shared/math nls.md §3, kdv.md §2, mkdv.md §2 — half
 * perturbed) the Painlevé verdict matches the construction: reducible ⟺ passes
 * (../shared/math/README.md).
 */
import { describe, expect, it } from "vitest";
import { runPainleve } from "../../../lib/screening/painleve";
import type { EquationClass } from "../../../lib/screening/spec/types";
import { randomFamilies } from "./random-families";

const PER_CLASS = 80;

describe("random families: verdict matches the construction", () => {
  const stats: string[] = [];
  for (const cls of ["nls", "kdv", "mkdv"] as EquationClass[]) {
    it(`${cls}: ${PER_CLASS} members (${PER_CLASS / 2} reducible, ${PER_CLASS / 2} perturbed)`, () => {
      let worstPass = 0;
      let bestFail = Infinity;
      const mismatches: string[] = [];
      for (const fam of randomFamilies(cls, PER_CLASS, 1000 + cls.length)) {
        const r = runPainleve(fam.variant, { seed: fam.variant.index + 1 });
        const expected = fam.reducible ? "passes" : "fails";
        if (r.verdict !== expected) mismatches.push(`#${fam.variant.index}: ${r.verdict} (${r.reason}), expected ${expected}`);
        const rho = (r.evidence.doubleJet ?? r.evidence.jet)?.rhoMax ?? NaN;
        if (fam.reducible) worstPass = Math.max(worstPass, rho);
        else bestFail = Math.min(bestFail, rho);
      }
      stats.push(`${cls}: worst pass rho_P = ${worstPass.toExponential(2)}, best fail rho_P = ${bestFail.toExponential(2)}`);
      console.log(stats[stats.length - 1]);
      expect(mismatches).toEqual([]);
      expect(worstPass).toBeLessThan(1e-10);
      expect(bestFail).toBeGreaterThan(1e-7);
    });
  }
});
