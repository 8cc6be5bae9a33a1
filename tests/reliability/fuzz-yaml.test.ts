// Property tests of parseFamilies on hostile and damaged family files: it never throws, never hangs,
// every error is located, and every family it does accept is complete (has variants).
import { describe, it, expect } from "vitest";
import { readFileSync } from "node:fs";
import path from "node:path";
import { performance } from "node:perf_hooks";
import fc from "fast-check";
import { dump } from "js-yaml";
import { parseFamilies } from "@/lib/screening/spec";
import type { ParseFamiliesResult } from "@/lib/screening/spec/types";

const VALID = readFileSync(path.resolve("examples/plasma-mkdv.yaml"), "utf8");

// A hang guard, not a speed target: one parse of a file this small taking 5 s means a runaway loop
// (catastrophic backtracking, alias expansion). Deliberately generous so a slow CI machine never trips it.
const HANG_LIMIT_MS = 5000;

function checkedParse(text: string): ParseFamiliesResult {
  const started = performance.now();
  let result: ParseFamiliesResult | undefined;
  expect(() => { result = parseFamilies(text, { file: "fuzz.yaml" }); }).not.toThrow();
  expect(performance.now() - started).toBeLessThan(HANG_LIMIT_MS);
  const r = result!;
  expect(Array.isArray(r.families)).toBe(true);
  expect(Array.isArray(r.errors)).toBe(true);
  const lineCount = text.split(/\r\n|\r|\n/).length;
  for (const e of r.errors) {
    expect(typeof e.code).toBe("string");
    expect(e.code.length).toBeGreaterThan(0);
    expect(typeof e.message).toBe("string");
    expect(e.message.length).toBeGreaterThan(0);
    expect(typeof e.path).toBe("string");
    expect(e.file).toBe("fuzz.yaml");
    // Every input here is under the 2 MiB file limit, so every error can be placed on a line.
    expect(Number.isInteger(e.line), `${e.code} without a line: ${e.message}`).toBe(true);
    expect(e.line!).toBeGreaterThanOrEqual(1);
    expect(e.line!).toBeLessThanOrEqual(lineCount + 1);
  }
  for (const f of r.families) {
    expect(f.variants.length).toBeGreaterThan(0);
    expect(f.hash).toMatch(/^[0-9a-f]{64}$/);
    for (const v of f.variants) expect(v.familyId).toBe(f.id);
  }
  return r;
}

describe("parseFamilies on arbitrary text", () => {
  it("the unmodified example parses cleanly (the base of the mutation properties)", () => {
    const r = checkedParse(VALID);
    expect(r.errors).toEqual([]);
    expect(r.families.length).toBe(7);
  });

  // 1000 runs each: parsing is milliseconds, and this covers many short garbage shapes.
  it("arbitrary strings, UTF-16 and full Unicode, up to 2000 characters (1000 + 1000 runs)", () => {
    fc.assert(fc.property(fc.string({ maxLength: 2000 }), (s) => { checkedParse(s); }), { numRuns: 1000 });
    fc.assert(fc.property(fc.string({ unit: "binary", maxLength: 2000 }), (s) => { checkedParse(s); }), { numRuns: 1000 });
  });

  it("YAML-ish token soup: indentation, anchors, aliases, tags, flow collections (1000 runs)", () => {
    const tokens = ["\n", "  ", "    ", "- ", ": ", "wavesieve: 1", "families:", "id: a", "class: kdv", "p: \"6\"", "&x ", "*x", "!!str ", "!foo ", "[", "]", "{", "}", ",", "'", "\"", "#", "? ", "|", ">", "---", "...", "<<: *x", "~", "null", "1e999", "__proto__"];
    fc.assert(fc.property(fc.array(fc.constantFrom(...tokens), { maxLength: 200 }), (ts) => { checkedParse(ts.join("")); }), { numRuns: 1000 });
  });
});

type Mutation = (lines: string[]) => string[];
const lineMutation: fc.Arbitrary<Mutation> = fc.oneof(
  // insert, delete or replace one character somewhere in the file
  fc.tuple(fc.nat(), fc.string({ unit: "binary", minLength: 1, maxLength: 3 })).map(([at, ch]): Mutation => (ls) => {
    const text = ls.join("\n"); const i = at % (text.length + 1);
    return (text.slice(0, i) + ch + text.slice(i)).split("\n");
  }),
  fc.nat().map((at): Mutation => (ls) => {
    const text = ls.join("\n"); const i = at % Math.max(text.length, 1);
    return (text.slice(0, i) + text.slice(i + 1)).split("\n");
  }),
  fc.tuple(fc.nat(), fc.constantFrom(":", "-", " ", "\t", "\"", "'", "[", "{", "&", "*", "!", "#", "0", "x")).map(([at, ch]): Mutation => (ls) => {
    const text = ls.join("\n"); const i = at % Math.max(text.length, 1);
    return (text.slice(0, i) + ch + text.slice(i + 1)).split("\n");
  }),
  // duplicate a line (duplicate keys, duplicate families)
  fc.nat().map((at): Mutation => (ls) => { const i = at % ls.length; return [...ls.slice(0, i + 1), ls[i], ...ls.slice(i + 1)]; }),
  // change a line's indentation
  fc.tuple(fc.nat(), fc.integer({ min: -6, max: 6 })).map(([at, d]): Mutation => (ls) => {
    const i = at % ls.length;
    const out = [...ls];
    out[i] = d >= 0 ? " ".repeat(d) + ls[i] : ls[i].replace(new RegExp(`^ {0,${-d}}`), "");
    return out;
  }),
);

describe("parseFamilies on damaged copies of a valid family file", () => {
  // 1 to 5 mutations per file, 2000 files: each mutation kind is applied ~2000 times in total.
  it("never throws, locates every error, accepts only complete families (2000 runs)", () => {
    let withErrors = 0;
    let stillValid = 0;
    fc.assert(
      fc.property(fc.array(lineMutation, { minLength: 1, maxLength: 5 }), (ms) => {
        const text = ms.reduce((ls, m) => m(ls), VALID.split("\n")).join("\n");
        const r = checkedParse(text);
        if (r.errors.length > 0) withErrors++;
        if (r.errors.length === 0) stillValid++;
      }),
      { numRuns: 2000 },
    );
    expect(withErrors).toBeGreaterThan(0);
    expect(stillValid).toBeGreaterThan(0); // some mutations are harmless (a comment character, a space)
  });
});

describe("parseFamilies on random YAML structures", () => {
  it("js-yaml dumps of random JSON values, bare and wrapped as a version-1 file (1000 + 1000 runs)", () => {
    fc.assert(fc.property(fc.jsonValue({ maxDepth: 6 }), (v) => { checkedParse(dump(v)); }), { numRuns: 1000 });
    const family = fc.record({
      id: fc.oneof(fc.string({ maxLength: 40 }), fc.integer(), fc.constant(null)),
      title: fc.oneof(fc.string({ maxLength: 40 }), fc.jsonValue({ maxDepth: 2 })),
      class: fc.constantFrom("nls", "kdv", "mkdv", "KdV", "", 3),
      coefficients: fc.dictionary(fc.constantFrom("a", "b", "h", "p", "q", "r", "s", "zz"), fc.oneof(fc.constantFrom("6", "1", "t", "sin(t)", "1/(t+1)", "sec(t)", "", "t^"), fc.jsonValue({ maxDepth: 2 }))),
      parameters: fc.option(fc.dictionary(fc.string({ minLength: 1, maxLength: 6 }), fc.jsonValue({ maxDepth: 3 }))),
      window: fc.oneof(fc.tuple(fc.double(), fc.double()), fc.jsonValue({ maxDepth: 2 })),
    }, { requiredKeys: ["id", "class", "coefficients"] });
    fc.assert(
      fc.property(fc.array(family, { maxLength: 6 }), (fams) => { checkedParse(dump({ wavesieve: 1, families: fams })); }),
      { numRuns: 1000 },
    );
  });
});
