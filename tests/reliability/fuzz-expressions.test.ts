// Property tests of parseExpression: any text gives a result (never an exception), and the canonical
// text of any valid tree parses back to the same tree. Generated inputs (fast-check), no fixed cases.
import { describe, it, expect } from "vitest";
import fc from "fast-check";
import {
  parseExpression, exprToString, exprEquals, num, sym, add, sub, mul, div, pow, neg, call,
  ALLOWED_FUNCTIONS, type Expr, type ParseResult,
} from "@/lib/screening/expr";

const SYMBOLS = ["t", "a0", "g1", "w"];
const OPTIONS = { symbols: new Set(SYMBOLS) };

/** The result contract of ParseResult (lib/screening/expr/types.ts): char is 1-based, at most one past the end. */
function expectWellFormed(text: string, r: ParseResult): void {
  expect(typeof r.ok).toBe("boolean");
  if (r.ok) {
    expect(r.expr).toBeTypeOf("object");
    return;
  }
  expect(typeof r.error.message).toBe("string");
  expect(r.error.message.length).toBeGreaterThan(0);
  if (r.error.char !== undefined) {
    expect(Number.isInteger(r.error.char)).toBe(true);
    expect(r.error.char).toBeGreaterThanOrEqual(1);
    expect(r.error.char).toBeLessThanOrEqual(text.length + 1);
  }
}

function parseChecked(text: string): ParseResult {
  let r: ParseResult | undefined;
  expect(() => { r = parseExpression(text, OPTIONS); }).not.toThrow();
  expectWellFormed(text, r!);
  return r!;
}

// Tokens of the expression language and common near-misses (unknown functions, stray symbols,
// quotes, hex, huge exponents, implicit products), glued together at random.
const TOKENS = [
  "0", "1", "2.5", "0.1", "1e3", "1e400", "0x1F", ".5", "5.", "t", "a0", "g1", "w", "x", "zz", "pi", "e",
  "+", "-", "*", "/", "^", "(", ")", ",", " ", "  ", "sin(", "cos(", "exp(", "log(", "sqrt(", "sech(", "abs(",
  "sec(", "foo(", "'", "\"", "!", "=", "[", "]", "{", "}", ";", "&", "|", "?", ":", "true", "NaN", "Infinity",
  "\n", "\t", "\u00e9", "\u{1F600}", "t(", "2t", "--", "**",
];
const grammarish = fc.array(fc.constantFrom(...TOKENS), { maxLength: 80 }).map((ts) => ts.join(""));

describe("parseExpression never throws and always answers with a well-formed result", () => {
  // 2000 runs per arbitrary: enough to cover each token pair many times; each call is microseconds.
  it("arbitrary UTF-16 strings up to 300 characters (2000 runs)", () => {
    fc.assert(fc.property(fc.string({ maxLength: 300 }), (s) => { parseChecked(s); }), { numRuns: 2000 });
  });

  it("arbitrary full-Unicode strings (binary units, incl. astral code points) up to 300 (2000 runs)", () => {
    fc.assert(fc.property(fc.string({ unit: "binary", maxLength: 300 }), (s) => { parseChecked(s); }), { numRuns: 2000 });
  });

  it("token soup from the expression grammar and its near-misses (5000 runs)", () => {
    let accepted = 0;
    fc.assert(fc.property(grammarish, (s) => { if (parseChecked(s).ok) accepted++; }), { numRuns: 5000 });
    // The soup must reach the success branch too, or half of the contract went untested.
    expect(accepted).toBeGreaterThan(0);
  });

  it("deep nesting and over-long input end in a located error, not a stack overflow (200 runs)", () => {
    fc.assert(
      fc.property(fc.integer({ min: 150, max: 5000 }), fc.constantFrom("(", "sin(", "-", "t^"), (depth, opener) => {
        const closer = opener.endsWith("(") ? ")" : "";
        const text = opener.repeat(depth) + "t" + closer.repeat(depth);
        const r = parseChecked(text);
        // Defaults (lib/screening/tolerances.ts): at most 2000 characters, 200 levels of parentheses
        // and an expression tree at most 500 levels deep ("t^t^…" nests without parentheses).
        const parenthesised = opener.endsWith("(");
        if (text.length > 2000 || (parenthesised && depth > 200) || (opener === "t^" && depth + 1 > 500)) expect(r.ok).toBe(false);
      }),
      { numRuns: 200 },
    );
  });
});

// Valid trees: literals are non-negative decimals as the user writes them (a minus is a `neg` node).
const literal: fc.Arbitrary<Expr> = fc.oneof(
  fc.integer({ min: 0, max: 1000 }).map((n) => num(n)),
  fc.tuple(fc.integer({ min: 0, max: 99 }), fc.integer({ min: 1, max: 999 })).map(([a, b]) => {
    const text = `${a}.${String(b).padStart(3, "0")}`;
    return num(Number(text), text);
  }),
);
const { tree } = fc.letrec<{ tree: Expr }>((tie) => ({
  tree: fc.oneof(
    { depthSize: "small", withCrossShrink: true },
    literal,
    fc.constantFrom(...SYMBOLS).map((s) => sym(s)),
    tie("tree").map((a) => neg(a)),
    fc.tuple(fc.constantFrom(...ALLOWED_FUNCTIONS), tie("tree")).map(([f, a]) => call(f, a)),
    fc.tuple(fc.constantFrom(add, sub, mul, div, pow), tie("tree"), tie("tree")).map(([op, a, b]) => op(a, b)),
  ),
}));

describe("canonical text round-trips", () => {
  // 2000 random trees (depth limited by fast-check's "small" depth size, well under maxDepth 200).
  it("parseExpression(exprToString(e)) is e again (2000 runs)", () => {
    fc.assert(
      fc.property(tree, (e) => {
        const text = exprToString(e);
        const r = parseChecked(text);
        if (!r.ok) throw new Error(`canonical text did not parse: ${text} → ${r.error.message}`);
        if (!exprEquals(r.expr, e)) throw new Error(`round-trip changed the tree: ${text} → ${exprToString(r.expr)}`);
      }),
      { numRuns: 2000 },
    );
  });
});
