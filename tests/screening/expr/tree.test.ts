import { describe, it, expect } from "vitest";
import fc from "fast-check";
import * as math from "mathjs";
import {
  DoubleField,
  add,
  call,
  differentiate,
  eNum,
  evalJetAt,
  evalNumber,
  exprDepth,
  exprEquals,
  exprToString,
  freeSymbols,
  neg,
  num,
  parseExpression,
  piNum,
  simplifyConstants,
  substitute,
  sym,
  ALLOWED_FUNCTIONS,
  JetEvaluationError,
} from "../../../lib/screening/expr";
import type { Expr, UnaryFunction } from "../../../lib/screening/expr";
import { CORPUS, PARAMS, SYMBOLS, parseOk } from "./helpers";

function reparse(e: Expr): Expr {
  const text = exprToString(e);
  const r = parseExpression(text, { symbols: SYMBOLS });
  if (!r.ok) throw new Error(`canonical text did not parse: ${text}: ${r.error.message}`);
  return r.expr;
}

const LITERALS = ["0", "1", "2", "0.5", "3.25", "1e-7", "12", "0.1"];
const leaf: fc.Arbitrary<Expr> = fc.oneof(
  fc.constantFrom(...LITERALS).map((t) => num(Number(t), t)),
  fc.constantFrom("t", "a0", "eps").map((n) => sym(n)),
  fc.constantFrom(piNum(), eNum()),
);
/** Random trees of depth ≤ depth + 1; inner nodes are favoured so trees are deep. */
function arbTree(depth: number): fc.Arbitrary<Expr> {
  if (depth === 0) return leaf;
  const sub = arbTree(depth - 1);
  return fc.oneof(
    { arbitrary: leaf, weight: 1 },
    { arbitrary: sub.map((a) => neg(a)), weight: 2 },
    {
      arbitrary: fc.tuple(fc.constantFrom("add", "sub", "mul", "div", "pow"), sub, sub).map(
        ([kind, l, r]) => ({ kind, left: l, right: r }) as Expr,
      ),
      weight: 5,
    },
    { arbitrary: fc.tuple(fc.constantFrom<UnaryFunction>(...ALLOWED_FUNCTIONS), sub).map(([f, a]) => call(f, a)), weight: 2 },
  );
}
const arbExpr = arbTree(6);

describe("exprToString round-trips through parseExpression", () => {
  it("on the coefficient corpus", () => {
    for (const text of CORPUS) {
      const e = parseOk(text);
      expect(exprEquals(reparse(e), e), `${text} → ${exprToString(e)}`).toBe(true);
    }
  });

  it("on 2000 random trees (fast-check), including negations in every position", () => {
    fc.assert(
      fc.property(arbExpr, (e) => exprEquals(reparse(e), e)),
      { numRuns: 2000, seed: 20240611 },
    );
  });

  it("uses minimal parentheses", () => {
    expect(exprToString(parseOk("((a0)*((t)))"))).toBe("a0 * t");
    expect(exprToString(parseOk("a0 - (eps - t)"))).toBe("a0 - (eps - t)");
    expect(exprToString(parseOk("(a0 - eps) - t"))).toBe("a0 - eps - t");
    expect(exprToString(parseOk("a0/(eps*t)"))).toBe("a0 / (eps * t)");
    expect(exprToString(parseOk("(t^2)^3"))).toBe("(t^2)^3");
    expect(exprToString(parseOk("t^(2^3)"))).toBe("t^2^3");
    expect(exprToString(parseOk("-(t^2)"))).toBe("-t^2");
    expect(exprToString(parseOk("(-t)^2"))).toBe("(-t)^2");
    expect(exprToString(parseOk("-(a0*t)"))).toBe("-(a0 * t)");
    expect(exprToString(parseOk("t^(-2)"))).toBe("t^-2");
    expect(exprToString(parseOk("2*pi*t + e"))).toBe("2 * pi * t + e");
  });
});

describe("tree utilities", () => {
  it("freeSymbols and substitute", () => {
    const e = parseOk("a0*exp(g0*t) + eps");
    expect([...freeSymbols(e)].sort()).toEqual(["a0", "eps", "g0", "t"]);
    const s = substitute(e, { t: add(sym("t"), num(1)), eps: num(0) });
    expect(exprToString(s)).toBe("a0 * exp(g0 * (t + 1)) + 0");
    // Names that exist on Object.prototype are not substituted by accident.
    expect(exprEquals(substitute(sym("t"), {}), sym("t"))).toBe(true);
  });

  it("exprDepth counts nodes on the longest path", () => {
    expect(exprDepth(sym("t"))).toBe(1);
    expect(exprDepth(parseOk("sin(t)^2"))).toBe(3);
  });
});

describe("simplifyConstants", () => {
  it("folds literals exactly, and leaves folds that would round", () => {
    expect(exprToString(simplifyConstants(parseOk("0.1 + 0.2")))).toBe("0.3");
    expect(exprToString(simplifyConstants(parseOk("2*3*t")))).toBe("6 * t");
    expect(exprToString(simplifyConstants(parseOk("1/3 + t")))).toBe("1 / 3 + t");
    expect(exprToString(simplifyConstants(parseOk("1/4 + t")))).toBe("0.25 + t");
    expect(exprToString(simplifyConstants(parseOk("2^10")))).toBe("1024");
    expect(exprToString(simplifyConstants(parseOk("pi*1")))).toBe("pi");
    expect(exprToString(simplifyConstants(parseOk("1 - 3")))).toBe("-2");
    expect(exprToString(simplifyConstants(parseOk("1/7")))).toBe("1 / 7");
    expect(exprToString(simplifyConstants(parseOk("1/8")))).toBe("0.125");
    // Exact decimal arithmetic keeps every digit of long literals.
    expect(exprToString(simplifyConstants(parseOk("0.100000000000000000001 + 0.2")))).toBe("0.300000000000000000001");
    // A fold longer than 40 significant digits is not done.
    expect(exprToString(simplifyConstants(parseOk("0.123456789012345678901 * 0.123456789012345678901")))).toBe(
      "0.123456789012345678901 * 0.123456789012345678901",
    );
  });

  it("removes neutral elements and pulls signs out", () => {
    const cases: [string, string][] = [
      ["t*1 + 0", "t"],
      ["0*sin(t) + a0", "a0"],
      ["t^1 - 0", "t"],
      ["t^0", "1"],
      ["1^t", "1"],
      ["0 - t", "-t"],
      ["-(-t)", "t"],
      ["t + -a0", "t - a0"],
      ["t - -a0", "t + a0"],
      ["(-t)*a0", "-(t * a0)"],
      ["t/1", "t"],
      ["0/t", "0"],
    ];
    for (const [input, out] of cases) expect(exprToString(simplifyConstants(parseOk(input))), input).toBe(out);
  });

  it("preserves the value on the corpus", () => {
    for (const text of CORPUS) {
      const e = parseOk(text);
      const s = simplifyConstants(e);
      const env = { ...PARAMS, t: 0.8 };
      expect(evalNumber(s, env)).toBeCloseTo(evalNumber(e, env), 12);
    }
  });
});

describe("differentiate (symbolic) matches jets numerically", () => {
  for (const text of CORPUS) {
    it(`${text}: d/dt and d²/dt² at t = 0.8`, () => {
      const e = parseOk(text);
      const d1 = differentiate(e, "t");
      const d2 = differentiate(d1, "t");
      const jet = evalJetAt(e, "t", 0.8, PARAMS, 2, DoubleField);
      const env = { ...PARAMS, t: 0.8 };
      const v1 = evalNumber(d1, env);
      const v2 = evalNumber(d2, env);
      expect(Math.abs(v1 - jet[1])).toBeLessThanOrEqual(1e-12 * Math.max(1, Math.abs(v1)));
      expect(Math.abs(v2 - 2 * jet[2])).toBeLessThanOrEqual(1e-12 * Math.max(1, Math.abs(v2)));
      // The derivative is itself valid canonical text.
      expect(parseExpression(exprToString(d1), { symbols: SYMBOLS }).ok).toBe(true);
    });
  }

  it("agrees with mathjs derivative on a parameter variable (∂/∂g0 of a0 exp(g0 t))", () => {
    const e = parseOk("a0*exp(g0*t)");
    const mine = evalNumber(differentiate(e, "g0"), { ...PARAMS, t: 0.8 });
    const ref = Number(math.derivative("a0*exp(g0*t)", "g0").evaluate({ ...PARAMS, t: 0.8 }));
    expect(mine).toBeCloseTo(ref, 13);
  });

  it("d/dt of a constant simplifies to 0; d/dt of t is 1", () => {
    expect(exprToString(differentiate(parseOk("a0*eps^2"), "t"))).toBe("0");
    expect(exprToString(differentiate(parseOk("t"), "t"))).toBe("1");
    expect(exprToString(differentiate(parseOk("t^3"), "t"))).toBe("3 * t^2");
  });

  it("jet errors surface as JetEvaluationError where the derivative is singular", () => {
    const e = parseOk("sqrt(t)");
    expect(() => evalJetAt(e, "t", 0, {}, 1, DoubleField)).toThrow(JetEvaluationError);
  });
});
