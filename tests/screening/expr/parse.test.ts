import { describe, it, expect } from "vitest";
import { parseExpression, exprEquals, num, sym, add, mul, neg, pow, call, div, sub, PI_TEXT, E_TEXT } from "../../../lib/screening/expr";
import type { Expr } from "../../../lib/screening/expr";
import { SYMBOLS, parseOk } from "./helpers";

function parseError(text: string, symbols: ReadonlySet<string> = SYMBOLS, extra: object = {}) {
  const r = parseExpression(text, { symbols, ...extra });
  if (r.ok) throw new Error(`expected a parse error for ${text}`);
  return r.error;
}

describe("parseExpression accepts valid coefficient text", () => {
  it("builds the expected tree (mathjs precedence: unary minus binds looser than ^)", () => {
    const cases: [string, Expr][] = [
      ["a0*(1 + eps*cos(w*t))", mul(sym("a0"), add(num(1), mul(sym("eps"), call("cos", mul(sym("w"), sym("t"))))))],
      ["-t^2", neg(pow(sym("t"), num(2)))],
      ["2^-3", pow(num(2), neg(num(3)))],
      ["+t - 1/L", sub(sym("t"), div(num(1), sym("L")))],
      ["sech(t)^2", pow(call("sech", sym("t")), num(2))],
      ["  t  ", sym("t")],
    ];
    for (const [text, tree] of cases) expect(exprEquals(parseOk(text), tree), text).toBe(true);
  });

  it("keeps decimal literals as written (for the decimal field)", () => {
    const e = parseOk("0.12345678901234567890123456789 * t");
    expect(e.kind === "mul" && e.left.kind === "num" && e.left.text).toBe("0.12345678901234567890123456789");
    const f = parseOk("1.5e-3 + .25 + 2.");
    const texts: string[] = [];
    const collect = (x: Expr): void => {
      if (x.kind === "num") texts.push(x.text);
      else if (x.kind === "neg" || x.kind === "call") collect(x.arg);
      else if (x.kind !== "sym") {
        collect(x.left);
        collect(x.right);
      }
    };
    collect(f);
    expect(texts).toEqual(["1.5e-3", ".25", "2."]);
  });

  it("maps pi and e to literals with 60+ digits; a declared symbol named e wins", () => {
    const p = parseOk("pi");
    expect(p.kind === "num" && p.text).toBe(PI_TEXT);
    const e = parseOk("e");
    expect(e.kind === "num" && e.text).toBe(E_TEXT);
    expect(PI_TEXT.replace(".", "").length).toBeGreaterThanOrEqual(60);
    expect(exprEquals(parseOk("e*t", new Set(["t", "e"])), mul(sym("e"), sym("t")))).toBe(true);
  });

  it("inlines declared helpers by substitution", () => {
    const helpers = new Map([["beta2", { variable: "z", body: parseOk("1 + z^2", new Set(["z"])) }]]);
    const r = parseExpression("3*beta2(2*t)", { symbols: SYMBOLS, helpers });
    expect(r.ok).toBe(true);
    if (r.ok) expect(exprEquals(r.expr, mul(num(3), add(num(1), pow(mul(num(2), sym("t")), num(2)))))).toBe(true);
  });
});

describe("parseExpression rejects everything outside the whitelist, with message and position", () => {
  // [text, message fragment, 1-based char (undefined: no position expected)]
  const cases: [string, string, number | undefined][] = [
    ["2t", "missing operator: write '*' for multiplication", 2],
    ["5 cm", "missing operator: write '*' for multiplication", 3],
    // mathjs reads a name followed by "(" as a call, so this is reported as a call of a parameter.
    ["t (t + 1)", "write t*(…) to multiply", 1],
    ["0.5 + a0.b", "property access", 9],
    ["sin t", "'sin' needs parentheses", 1],
    ["1e400", "number out of range", 1],
    ["t + 1e-400", "number out of range", 5],
    ["NaN", "NaN is not allowed", 1],
    ["2*Infinity", "Infinity is not allowed", 3],
    ["0x1F", "decimal notation", 1],
    ["a.b", "property access", 2],
    ["t[1]", "indexing", 2],
    ["x=1", "assignments", 2],
    ["f(x) = x^2", "function definitions", 6],
    ['"s"', "text in quotes", 1],
    ["[1,2]", "lists and matrices", 1],
    ["{a: 1}", "objects", 1],
    ["1:3", "ranges", 2],
    ["t==1", "comparisons", 2],
    ["t < 1", "comparisons", 3],
    ["t ? 1 : 2", "conditionals", 3],
    ["t and 1", "logical operators", 3],
    ["not t", "logical operators", 1],
    ["t!", "factorial", 2],
    ["t'", "quote", 2],
    ["t mod 2", "'mod'", 3],
    ["t; 1", "single expression", 2],
    ["t & 1", "bitwise", 3],
    ["t .* 2", "element-wise", 3],
    ["constructor(t)", "unknown function 'constructor'", 1],
    ["t + __proto__", "unknown symbol '__proto__'", 5],
    ["toString", "unknown symbol 'toString'", 1],
    ["hasOwnProperty(t)", "unknown function 'hasOwnProperty'", 1],
    ["import(t)", "unknown function 'import'", 1],
    ["evaluate(t)", "unknown function 'evaluate'", 1],
    ["sec(t)", "did you mean 1/cos", 1],
    ["t*ln(t)", "did you mean log?", 3],
    ["arctan(t)", "inverse trigonometric", 1],
    ["atan(t)", "inverse trigonometric", 1],
    ["pow(t, 2)", "write a^b", 1],
    ["floor(t)", "smooth", 1],
    ["foo(t)", "unknown function 'foo' (allowed: sin, cos", 1],
    ["sin(t, 2)", "exactly one argument", 1],
    ["sin()", "exactly one argument", 1],
    ["log(t, 10)", "log(x)/log(b)", 1],
    ["a0(t)", "'a0' is a parameter, not a function", 1],
    ["t + x", "unknown symbol 'x' (allowed here: t, a0, g0", 5],
    ["exp", "'exp' is a function", 1],
    ["PI*t", "did you mean pi?", 1],
    ["2 + 3i", "missing operator", 6],
    ["t +", "Unexpected end of expression", 4],
    ["(t + 1", "Parenthesis ) expected", 7],
    ["", "empty expression", undefined],
  ];
  for (const [text, fragment, char] of cases) {
    it(`${JSON.stringify(text)} → ${fragment}`, () => {
      const err = parseError(text);
      expect(err.message).toContain(fragment);
      expect(err.char).toBe(char);
    });
  }

  it("word-boundary positions: the symbol is found as a whole word, not inside another name", () => {
    expect(parseError("a0*xx + x").char).toBe(4);
    expect(parseError("eps + epsx").char).toBe(7);
  });

  it("rejects over-long text before parsing", () => {
    const err = parseError("t+".repeat(1001) + "t");
    expect(err.message).toContain("too long");
    expect(parseError("t + t", SYMBOLS, { maxLength: 4 }).message).toContain("at most 4");
  });

  it("1000-deep nesting gives a clean error, not a crash (ENGINE-NOTES §3: mathjs overflows near 1000)", () => {
    const deep = "(".repeat(1000) + "t" + ")".repeat(1000);
    const err = parseError(deep, SYMBOLS, { maxLength: 5000 });
    expect(err.message).toContain("too deeply nested");
    expect(err.char).toBe(201);
    // With the depth pre-scan lifted, mathjs' own stack overflow is still caught.
    const raw = parseExpression("(".repeat(20000) + "t" + ")".repeat(20000), { symbols: SYMBOLS, maxLength: 1e6, maxDepth: 1e6 });
    expect(raw.ok).toBe(false);
    if (!raw.ok) expect(raw.error.message).toContain("too deeply nested");
  });

  it("accepts nesting up to the limit", () => {
    const ok = parseExpression("(".repeat(200) + "t" + ")".repeat(200), { symbols: SYMBOLS, maxLength: 5000 });
    expect(ok.ok).toBe(true);
  });

  it("bounds the depth of the expression tree too, which parentheses alone do not (limit 500)", () => {
    const chain = (n: number) => Array(n).fill("t").join("^"); // n − 1 powers: a tree n levels deep
    expect(parseExpression(chain(500), { symbols: SYMBOLS }).ok).toBe(true);
    expect(parseError(chain(501)).message).toBe("too deeply nested (the expression tree is 501 levels deep; at most 500)");
    expect(parseError(Array(600).fill("t").join("+")).message).toContain("600 levels deep");
    // The deepest parenthesised input allowed (200 levels) stays well inside the tree limit.
    expect(parseExpression("(1 + ".repeat(200) + "t" + ")".repeat(200), { symbols: SYMBOLS, maxLength: 5000 }).ok).toBe(true);
  });

  it("never treats Object.prototype names as functions or symbols", () => {
    for (const name of ["constructor", "__proto__", "toString", "valueOf", "prototype", "__defineGetter__"]) {
      expect(parseExpression(`${name}(t)`, { symbols: SYMBOLS }).ok, name).toBe(false);
      expect(parseExpression(`${name}`, { symbols: SYMBOLS }).ok, name).toBe(false);
    }
    expect(parseExpression("cos.constructor(t)", { symbols: SYMBOLS }).ok).toBe(false);
  });
});
