/**
 * Invariant check values at t = 1 (../shared/math/painleve.md §8 "Invariant check values",
 * computed there by scripts/spec_invariant_values.py; derived in ../shared/math). Two
 * independent routes are checked against the table: the monomial (polynomial) forms used for
 * rho_inv, and the explicit closed forms used by the oracle for C_pred.
 */
import { describe, expect, it } from "vitest";
import type { EquationClass } from "../../../lib/screening/spec/types";
import { invariantValue } from "../../../lib/screening/painleve/invariants";
import { predictedCondition } from "../../../lib/screening/painleve/oracle";
import { coefficients } from "./helpers";

const B_STAR =
  "(1330*sin(t) + 75*sin(2*t) - 90*sin(3*t) + 109*cos(t) - (2409/2)*cos(2*t) - 9*cos(3*t) + 809/2)/(40*(3*sin(t) + 10)^3)";
const N2 = { a: "1+0.3*sin(t)", h: "2/(1+t^2)", b: "0.1", k: "0.05", c: "0.2", f: "0.4", e: "t" };
const N4 = { a: "1+0.3*sin(t)", k: "0.1", c: "0.2*cos(t)", h: "2*exp(0.3*t)", f: "0.4*t", e: "t^2", g: "0.5", b: B_STAR };
const K3 = {
  p: "1 + 0.3*cos(t)",
  q: "((1 + 0.3*cos(t))/1.3)*exp(0.1*t + 0.46*sin(t))",
  r: "0.1",
  s: "0.2*cos(t)",
  g: "0.5*sin(t)",
  l: "0.1*cos(t) + 0.13*sin(t) + 0.006*sin(t)*cos(t)",
  m: "0.06 + 0.052*cos(t)",
};
const M2 = { p: "(6 + 3*sin(t))*exp(0.4*t)", q: "1 + 0.5*sin(t)", r: "0.2 + 0.1*cos(t)", s: "0.1*cos(t)", g: "0.3*t" };

// [class, member, invariant at t = 1, predicted condition at t = 1 (u0 = 1 for NLS, +i for mKdV) or null]
const TABLE: [EquationClass, Record<string, string>, number, [number, number] | null][] = [
  ["nls", { a: "1", h: "2", k: "0.1" }, 0.04, [-0.04, 0]],
  ["nls", N2, 0.193076386785166, [-0.483633679969091, 0]],
  ["nls", N4, 0, [0, 0]],
  ["nls", { ...N4, b: `${B_STAR} + 0.01` }, -0.0500976518176948, [0.0464821710159798, 0]],
  ["nls", { a: "1", h: "2/(1+t^2)" }, 1, [-2, 0]],
  ["nls", { a: "1/2", b: "-1/2", h: "1" }, 1, [-1, 0]],
  ["nls", { a: "1", k: "0.1", h: "2*exp(-0.2*t)" }, 0.16, [-0.195424441305627, 0]],
  ["kdv", { p: "1", q: "1", r: "0.1" }, 0.02, null],
  ["kdv", { p: "t", q: "t^2" }, -1, null],
  ["kdv", K3, 0, null],
  ["kdv", { ...K3, m: "0.07 + 0.052*cos(t)" }, -0.0116209069176044, [-0.01, 0]],
  ["kdv", { p: "1", q: "1", r: "1/(2*t)" }, 0, null],
  ["kdv", { p: "1", q: "1", m: "0.1" }, -0.1, null],
  ["mkdv", { p: "6", q: "1", r: "0.1" }, 0.2, [0, 0.1]],
  ["mkdv", M2, 0, null],
  ["mkdv", { p: "6", q: "1", r: "1/(2*t)" }, 1, null],
  ["mkdv", { p: "6", q: "1", r: "1/(2*t)", s: "1/(2*t)" }, 0, null],
];

describe("invariant check values at t = 1 (painleve.md §8)", () => {
  TABLE.forEach(([cls, given, value, condition], i) => {
    it(`${cls} #${i}: invariant ${value}`, () => {
      const co = coefficients(cls, given);
      expect(invariantValue(cls, co, "1")).toBeCloseTo(value, 12);
      if (condition) {
        const u0 = cls === "mkdv" ? { re: 0, im: 1 } : { re: 1, im: 0 };
        const j = cls === "nls" ? 4 : cls === "kdv" ? 6 : 3;
        const pred = predictedCondition(cls, co, 1, u0, j)!;
        expect(pred.re).toBeCloseTo(condition[0], 12);
        expect(pred.im).toBeCloseTo(condition[1], 12);
      }
    });
  });
});
