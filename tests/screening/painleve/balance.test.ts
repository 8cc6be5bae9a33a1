/**
 * Dominant balance from the terms (../shared/math/painleve.md §6 Step 0: "Values: NLS α = -1,
 * lowest = -3, leadDegree = 1, D = 4. KdV α = -2, lowest = -5, leadDegree = 2, D = 3. mKdV α = -1,
 * lowest = -4, leadDegree = 3, D = 3"; derived in ../shared/math) and the quintic / derivative
 * controls of §8 (α = -1/2 only).
 */
import { describe, expect, it } from "vitest";
import { KDV_TEMPLATE, MKDV_TEMPLATE, NLS_TEMPLATE, dominantBalances, factor, quinticTerm, term, withExtraTerms } from "../../../lib/screening/painleve";
import { determinantDegree, leadDegree, rationalText } from "../../../lib/screening/painleve/balance";

describe("dominant balance (painleve.md §6 Step 0)", () => {
  const cases: [string, typeof NLS_TEMPLATE, number, number, number, number][] = [
    ["NLS", NLS_TEMPLATE, -1, -3, 1, 4],
    ["KdV", KDV_TEMPLATE, -2, -5, 2, 3],
    ["mKdV", MKDV_TEMPLATE, -1, -4, 3, 3],
  ];
  for (const [name, tpl, alpha, lowest, deg, D] of cases) {
    it(`${name}: α = ${alpha}, lowest = ${lowest}, leadDegree = ${deg}, D = ${D}`, () => {
      const balances = dominantBalances(tpl.equations);
      const integer = balances.filter((b) => b.alpha.q === 1);
      expect(integer).toHaveLength(1);
      const b = integer[0];
      expect(b.alpha).toEqual({ p: alpha, q: 1 });
      expect(b.lowest).toEqual({ p: lowest, q: 1 });
      expect(leadDegree(tpl.equations, tpl.variables, b)).toBe(deg);
      expect(determinantDegree(tpl.equations, b)).toBe(D);
    });
  }
  it("quintic NLS: the only balance is α = -1/2 (u_xx with |u|⁴u)", () => {
    const tpl = withExtraTerms(NLS_TEMPLATE, [quinticTerm("1")]);
    expect(dominantBalances(tpl.equations).map((b) => rationalText(b.alpha))).toEqual(["-1/2"]);
  });
  it("NLS with i|u|²u_x: the only balance is α = -1/2", () => {
    const tpl = withExtraTerms(NLS_TEMPLATE, [term({ re: 0, im: 1 }, "1", 0, [factor("u"), factor("v"), factor("u", 1)])]);
    expect(dominantBalances(tpl.equations).map((b) => rationalText(b.alpha))).toEqual(["-1/2"]);
  });
  it("a linear equation has no balance", () => {
    const linear = [[term(1, "1", 0, [factor("u", 0, 1)]), term(1, "1", 0, [factor("u", 2)])]];
    expect(dominantBalances(linear)).toEqual([]);
  });
});
