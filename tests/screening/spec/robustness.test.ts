import { describe, it, expect } from "vitest";
import fc from "fast-check";
import { parseFamilies } from "../../../lib/screening/spec";

const EXAMPLE = `wavesieve: 1
families:
  - id: tapered-amplifier-a
    title: Tapered amplifier, exponential gain
    class: nls
    variables: { evolution: z, space: T }
    parameters:
      g0: 0.2
      L: { values: [1, 2, 5] }
      h0: free
    coefficients:
      a: "-beta2(z)/2"
      h: "h0*exp(g0*z)"
      k: "-g0/2"
    functions:
      beta2: "-1/(1 + z/L)"
    window: [0, 10]
  - id: channel
    class: kdv
    equation: "u_t + 6*u*u_x + u_xxx + u/(2*t) = 0"
    window: [1, 5]
`;

/** Every error must be located; every returned family must be complete. */
function wellFormed(text: string): void {
  const r = parseFamilies(text, { file: "fuzz.yaml" });
  for (const e of r.errors) {
    expect(typeof e.code).toBe("string");
    expect(e.message.length).toBeGreaterThan(0);
    expect(e.line).toBeGreaterThanOrEqual(1);
    expect(e.column).toBeGreaterThanOrEqual(1);
    expect(e.file).toBe("fuzz.yaml");
  }
  for (const f of r.families) {
    expect(f.variants.length).toBeGreaterThan(0);
    expect(f.hash).toMatch(/^[0-9a-f]{64}$/);
  }
  expect(r.families.length > 0 || r.errors.length > 0).toBe(true);
}

describe("parseFamilies never throws and always locates its errors", () => {
  it("on arbitrary text", () => {
    fc.assert(fc.property(fc.string({ maxLength: 300 }), (s) => wellFormed(s)), { numRuns: 300 });
  });

  it("on the example with random edits (deletions, insertions, replacements)", () => {
    const edit = fc.record({
      at: fc.nat({ max: EXAMPLE.length - 1 }),
      cut: fc.nat({ max: 6 }),
      insert: fc.constantFrom("", ":", "-", " ", "\n", "\t", "[", "]", "{", "}", "*a", "&a", "#", "'", '"', "x", "1e400", "__proto__", "|u|", "=", "u_xx"),
    });
    fc.assert(
      fc.property(fc.array(edit, { minLength: 1, maxLength: 4 }), (edits) => {
        let text = EXAMPLE;
        for (const e of edits) {
          const at = Math.min(e.at, text.length);
          text = text.slice(0, at) + e.insert + text.slice(at + e.cut);
        }
        wellFormed(text);
      }),
      { numRuns: 400 },
    );
  });
});
