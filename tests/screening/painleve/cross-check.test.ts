/**
 * Cross-check with the reducibility stage on random members (random-families.ts): for the product
 * classes the nontrivial compatibility condition and the reducibility residual have the same zero
 * set (../shared/math/README.md; painleve.md §2–§4), so the two verdicts must agree.
 */
import { describe, expect, it } from "vitest";
import { agreement, runPainleve } from "../../../lib/screening/painleve";
import { runReducibility } from "../../../lib/screening/reducibility";
import type { EquationClass } from "../../../lib/screening/spec/types";
import { randomFamilies } from "./random-families";

// 3 × 68 = 204 members in all (issue: ≥ 200 random families).
describe("agreement with the reducibility stage", () => {
  for (const cls of ["nls", "kdv", "mkdv"] as EquationClass[]) {
    it(`${cls}: 68 random members (half reducible by construction, half perturbed) agree`, async () => {
      const disagreements: string[] = [];
      for (const fam of randomFamilies(cls, 68, 2024)) {
        const red = await runReducibility(fam.variant);
        const p = runPainleve(fam.variant);
        const a = agreement(red.verdict === "reducible" || red.verdict === "not-reducible" ? red.verdict : "undecided", p.verdict);
        if (a !== "agree") disagreements.push(`#${fam.variant.index}: reducibility ${red.verdict}, Painlevé ${p.verdict} (${p.reason})`);
      }
      expect(disagreements).toEqual([]);
    });
  }
});
