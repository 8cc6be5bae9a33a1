/**
 * Equations outside the three classes, handled by the same term-driven code.
 * - Kuramoto–Sivashinsky u_t + u u_x + u_xx + u_xxxx = 0: α = -3, u0 = 120 and
 *   M(j) = (j - 6)[(j-3)(j-4)(j-5) + 120] = (j - 6)(j + 1)(j² - 13j + 60), so r = -1, 6,
 *   (13 ± i√71)/2 (derived by hand from the dominant terms; the complex pair is the classical
 *   result, e.g. R. Conte, M. Musette, "The Painlevé Handbook", Springer 2008 [from memory]).
 * - Burgers u_t + u u_x - u_xx = 0: α = -1; leading order -u0² - 2u0 = 0 → u0 = -2;
 *   M(j) = u0(j - 2) - (j - 1)(j - 2) = -(j - 2)(j + 1), so r = -1, 2 (derived by hand), and the
 *   condition at r = 2 holds (Burgers is linearisable by Cole–Hopf and passes the test:
 *   J. Weiss, M. Tabor, G. Carnevale, J. Math. Phys. 24 (1983) 522 [from memory]).
 */
import { describe, expect, it } from "vitest";
import { factor, runPainleveOnTerms, term, type EquationTemplate } from "../../../lib/screening/painleve";
import { expr } from "./helpers";

const one = { "1": expr("1") };

describe("Kuramoto–Sivashinsky (non-integer resonances)", () => {
  const ks: EquationTemplate = {
    id: "ks",
    title: "Kuramoto–Sivashinsky",
    variables: ["u"],
    equations: [[term(1, "1", 0, [factor("u", 0, 1)]), term(1, "1", 0, [factor("u"), factor("u", 1)]), term(1, "1", 0, [factor("u", 2)]), term(1, "1", 0, [factor("u", 4)])]],
    conjugatePair: false,
    defaultJetLength: 8,
    nonvanishing: [],
  };
  it("fails with a complex resonance (13 ± i√71)/2", () => {
    const r = runPainleveOnTerms(ks, one, [0, 1]);
    expect(r.verdict).toBe("fails");
    expect(r.reason).toMatch(/^non-integer resonance \(r = 6\.5[+-]4\.21\d*i\)$/);
    expect(r.evidence.exponents).toEqual({ u: "-3" });
    expect(r.evidence.lowest).toBe(-7);
  });
});

describe("Burgers (passes)", () => {
  const burgers: EquationTemplate = {
    id: "burgers",
    title: "Burgers",
    variables: ["u"],
    equations: [[term(1, "1", 0, [factor("u", 0, 1)]), term(1, "1", 0, [factor("u"), factor("u", 1)]), term(-1, "1", 0, [factor("u", 2)])]],
    conjugatePair: false,
    defaultJetLength: 8,
    nonvanishing: [],
  };
  it("has resonances -1, 2 and its condition at 2 holds identically", () => {
    const r = runPainleveOnTerms(burgers, one, [0, 1]);
    expect(r.evidence.resonances).toEqual([-1, 2]);
    const lead = r.evidence.jet!.points[0].branches[0].leading.u;
    expect(lead.re).toBeCloseTo(-2, 12);
    expect(r.evidence.conditions).toEqual([{ resonance: 2, holdsIdentically: true, worstRho: r.evidence.conditions[0].worstRho }]);
    expect(r.verdict).toBe("passes");
  });
});
