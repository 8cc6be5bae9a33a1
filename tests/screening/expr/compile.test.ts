import { describe, it, expect } from "vitest";
import * as math from "mathjs";
import {
  DoubleField,
  compileExpression,
  compileExpressionClosure,
  evalJetAt,
  evalNumber,
  JetEvaluationError,
} from "../../../lib/screening/expr";
import type { Expr } from "../../../lib/screening/expr";
import { CORPUS, PARAMS, parseOk } from "./helpers";

const VARIABLES = ["t", ...Object.keys(PARAMS)];

describe("compileExpression", () => {
  for (const text of CORPUS) {
    it(`${text}: codegen and closure agree with evalJet order 0 and with mathjs evaluate`, () => {
      const e = parseOk(text);
      const fast = compileExpression(e, VARIABLES);
      const slow = compileExpressionClosure(e, VARIABLES);
      for (const t of [0.35, 0.8, 1.45]) {
        const args = [t, ...Object.values(PARAMS)];
        const ref = evalJetAt(e, "t", t, PARAMS, 0, DoubleField)[0];
        // Reference library: mathjs compiled evaluation of the same text.
        const mj = Number(math.evaluate(text, { ...PARAMS, t }));
        expect(Math.abs(fast(...args) - ref)).toBeLessThanOrEqual(1e-14 * Math.max(1, Math.abs(ref)));
        expect(Math.abs(slow(...args) - ref)).toBeLessThanOrEqual(1e-14 * Math.max(1, Math.abs(ref)));
        expect(Math.abs(mj - ref)).toBeLessThanOrEqual(1e-13 * Math.max(1, Math.abs(ref)));
        expect(evalNumber(e, { ...PARAMS, t })).toBe(fast(...args));
      }
    });
  }

  it("maps symbols to argument positions, never to their names", () => {
    const e = parseOk("a0 - t");
    expect(compileExpression(e, ["t", "a0"])(1, 5)).toBe(4);
    expect(compileExpression(e, ["a0", "t"])(1, 5)).toBe(-4);
    expect(() => compileExpression(e, ["t"])).toThrow(/not among the variables/);
    expect(() => compileExpression(e, ["t", "t", "a0"])).toThrow(/twice/);
  });

  it("follows IEEE semantics where the jet evaluator refuses (1/0 → Infinity)", () => {
    const e = parseOk("1/(t - 1)");
    expect(compileExpression(e, ["t"])(1)).toBe(Infinity);
    expect(() => evalJetAt(e, "t", 1, {}, 0, DoubleField)).toThrow(JetEvaluationError);
  });

  it("evalNumber reports a missing symbol", () => {
    expect(() => evalNumber(parseOk("t + a0"), { t: 1 })).toThrow(/a0/);
  });

  it("refuses forged trees (e.g. read back from storage) instead of emitting them", () => {
    const forgedCall = JSON.parse('{"kind":"call","fn":"constructor","arg":{"kind":"sym","name":"t"}}') as Expr;
    const forgedNum = JSON.parse('{"kind":"num","value":"process.exit()","text":"1"}') as Expr;
    const forgedKind = JSON.parse('{"kind":"eval","arg":{"kind":"sym","name":"t"}}') as Expr;
    for (const e of [forgedCall, forgedNum, forgedKind]) {
      expect(() => compileExpression(e, ["t"])).toThrow();
    }
    expect(() => compileExpressionClosure(forgedCall, ["t"])).toThrow();
    expect(() => compileExpressionClosure(forgedKind, ["t"])).toThrow();
    expect(() => evalJetAt(forgedCall, "t", 1, {}, 1, DoubleField)).toThrow(/not an allowed function/);
    expect(() => evalJetAt(forgedKind, "t", 1, {}, 1, DoubleField)).toThrow(/unknown node kind/);
  });
});
