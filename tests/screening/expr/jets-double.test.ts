import { describe, it, expect } from "vitest";
import fc from "fast-check";
import {
  DoubleField,
  evalJetAt,
  jetAdd,
  jetCos,
  jetCosh,
  jetDiv,
  jetExp,
  jetLog,
  jetMul,
  jetPowConst,
  jetSin,
  jetSinh,
  jetSqrt,
  jetSub,
} from "../../../lib/screening/expr";
import type { Field } from "../../../lib/screening/expr";
import { CORPUS, PARAMS, parseOk } from "./helpers";

/**
 * The same double arithmetic as DoubleField but a different object, so the jet functions take
 * their generic path (Field method calls) instead of the specialised double copies. Both
 * implement painleve.md §5 with the same operation order, so results must be bit-identical.
 */
const GenericDouble: Field<number> = { ...DoubleField, name: "double-generic" };

const coefficient = fc.double({ min: -3, max: 3, noNaN: true, noDefaultInfinity: true });
const jet = (order: number) => fc.array(coefficient, { minLength: order + 1, maxLength: order + 1 });
const positiveLead = (order: number) =>
  fc.tuple(fc.double({ min: 0.1, max: 4, noNaN: true }), fc.array(coefficient, { minLength: order, maxLength: order })).map(
    ([a0, rest]) => [a0, ...rest],
  );

describe("double-specialised jets equal the generic jets bit for bit", () => {
  const order = 6;
  it("add, sub, mul", () => {
    fc.assert(
      fc.property(jet(order), jet(order), (a, b) => {
        expect(jetAdd(a, b, DoubleField)).toEqual(jetAdd(a, b, GenericDouble));
        expect(jetSub(a, b, DoubleField)).toEqual(jetSub(a, b, GenericDouble));
        expect(jetMul(a, b, DoubleField)).toEqual(jetMul(a, b, GenericDouble));
      }),
      { numRuns: 300, seed: 7 },
    );
  });
  it("div, log, sqrt, constant powers (positive leading coefficient)", () => {
    fc.assert(
      fc.property(jet(order), positiveLead(order), fc.double({ min: -3, max: 3, noNaN: true }), (a, b, p) => {
        expect(jetDiv(a, b, DoubleField)).toEqual(jetDiv(a, b, GenericDouble));
        expect(jetLog(b, DoubleField)).toEqual(jetLog(b, GenericDouble));
        expect(jetSqrt(b, DoubleField)).toEqual(jetSqrt(b, GenericDouble));
        expect(jetPowConst(b, p, DoubleField)).toEqual(jetPowConst(b, p, GenericDouble));
      }),
      { numRuns: 300, seed: 8 },
    );
  });
  it("exp, sin, cos, sinh, cosh", () => {
    fc.assert(
      fc.property(jet(order), (a) => {
        expect(jetExp(a, DoubleField)).toEqual(jetExp(a, GenericDouble));
        expect(jetSin(a, DoubleField)).toEqual(jetSin(a, GenericDouble));
        expect(jetCos(a, DoubleField)).toEqual(jetCos(a, GenericDouble));
        expect(jetSinh(a, DoubleField)).toEqual(jetSinh(a, GenericDouble));
        expect(jetCosh(a, DoubleField)).toEqual(jetCosh(a, GenericDouble));
      }),
      { numRuns: 300, seed: 9 },
    );
  });
  it("whole-expression jets on the corpus", () => {
    for (const text of CORPUS) {
      const e = parseOk(text);
      expect(evalJetAt(e, "t", 0.8, PARAMS, 5, DoubleField), text).toEqual(evalJetAt(e, "t", 0.8, PARAMS, 5, GenericDouble));
    }
  });
});
