import { describe, it, expect } from "vitest";
import Decimal from "decimal.js";
import {
  parseFamilies,
  DEFAULT_VARIANT_CAP,
  MAX_FILE_BYTES,
  type FamilySpec,
} from "../../../lib/screening/spec";
import { compileExpression, exprToString, freeSymbols, type Expr } from "../../../lib/screening/expr";

/** The example of the format description (docs/family-format.md), with 5 steps of s. */
const EXAMPLE = `wavesieve: 1                      # format version, required
families:                         # one or more; a file may also hold several YAML documents
  - id: tapered-amplifier-a       # slug, unique in the file
    title: Tapered amplifier, exponential gain
    class: nls                    # nls | kdv | mkdv
    variables: { evolution: z, space: T }   # optional renaming; default t and x
    parameters:
      g0: 0.2                     # fixed number
      L: { values: [1, 2, 5] }    # sweep: one variant per value
      s: { range: [0, 1], steps: 5 }
      h0: free                    # unknown constant
    coefficients:
      a: "-beta2(z)/2"
      h: "h0*exp(g0*z)"
      k: "-g0/2"
    functions:
      beta2: "-1/(1 + z/L)"
    window: [0, 10]
    tags: [fibre, gain]
    notes: free text
`;

function parseOne(text: string): FamilySpec {
  const r = parseFamilies(text);
  expect(r.errors).toEqual([]);
  expect(r.families).toHaveLength(1);
  return r.families[0];
}

function valueAt(e: Expr, t: number, free: Record<string, number> = {}): number {
  const names = ["t", ...Object.keys(free)];
  return compileExpression(e, names)(t, ...Object.values(free));
}

/** Every literal of a tree, for checking exact decimal texts. */
function literals(e: Expr, out: string[] = []): string[] {
  if (e.kind === "num") out.push(e.text);
  else if (e.kind === "neg" || e.kind === "call") literals(e.arg, out);
  else if (e.kind !== "sym") {
    literals(e.left, out);
    literals(e.right, out);
  }
  return out;
}

describe("parseFamilies on the format example", () => {
  const f = parseOne(EXAMPLE);

  it("reads the family's fields", () => {
    expect(f.id).toBe("tapered-amplifier-a");
    expect(f.title).toBe("Tapered amplifier, exponential gain");
    expect(f.class).toBe("nls");
    expect(f.variables).toEqual({ evolution: "z", space: "T" });
    expect(f.window).toEqual([0, 10]);
    expect(f.tags).toEqual(["fibre", "gain"]);
    expect(f.notes).toBe("free text");
    expect(f.functions).toEqual({ beta2: "-1/(1 + z/L)" });
    expect(f.coefficientText).toEqual({ a: "-beta2(z)/2", h: "h0*exp(g0*z)", k: "-g0/2" });
    expect(f.parameters).toEqual({
      g0: { kind: "fixed", value: 0.2, text: "0.2" },
      L: { kind: "values", values: [{ value: 1, text: "1" }, { value: 2, text: "2" }, { value: 5, text: "5" }] },
      s: { kind: "range", from: 0, to: 1, steps: 5, fromText: "0", toText: "1" },
      h0: { kind: "free" },
    });
    expect(f.location).toMatchObject({ path: "families[0]", line: 3, column: 5, document: 0, familyId: "tapered-amplifier-a" });
    expect(f.hash).toMatch(/^[0-9a-f]{64}$/);
  });

  it("expands the sweeps as a cartesian product, first parameter slowest", () => {
    expect(f.variants).toHaveLength(15);
    const grid = f.variants.map((v) => [v.parameters.L, v.parameters.s]);
    const expected: number[][] = [];
    for (const L of [1, 2, 5]) for (const s of [0, 0.25, 0.5, 0.75, 1]) expected.push([L, s]);
    expect(grid).toEqual(expected);
    f.variants.forEach((v, i) => {
      expect(v.index).toBe(i);
      expect(v.familyId).toBe(f.id);
      expect(v.class).toBe("nls");
      expect(v.free).toEqual(["h0"]);
      expect(v.window).toEqual([0, 10]);
      expect(v.parameters.g0).toBe(0.2);
    });
  });

  it("renames z to t, inlines the helper, substitutes parameters and keeps free ones as symbols", () => {
    for (const v of f.variants) {
      const L = v.parameters.L;
      expect(Object.keys(v.coefficients).sort()).toEqual(["a", "b", "c", "e", "f", "g", "h", "k"]);
      expect([...freeSymbols(v.coefficients.a)]).toEqual(["t"]);
      expect([...freeSymbols(v.coefficients.h)].sort()).toEqual(["h0", "t"]);
      expect([...freeSymbols(v.coefficients.k)]).toEqual([]);
      for (const t of [0, 1.5, 7, 10]) {
        // a = -beta2/2 with beta2 = -1/(1 + z/L): a = 1/(2 (1 + t/L)).
        expect(valueAt(v.coefficients.a, t)).toBeCloseTo(1 / (2 * (1 + t / L)), 14);
        expect(valueAt(v.coefficients.h, t, { h0: 1.3 })).toBeCloseTo(1.3 * Math.exp(0.2 * t), 12);
      }
      expect(valueAt(v.coefficients.k, 0)).toBeCloseTo(-0.1, 15);
      for (const name of ["b", "c", "e", "f", "g"]) expect(v.coefficients[name]).toEqual({ kind: "num", value: 0, text: "0" });
    }
  });

  it("keeps the exact decimal text of every substituted number", () => {
    const v = f.variants[1]; // L = 1, s = 0.25
    expect(literals(v.coefficients.h)).toContain("0.2");
    expect(literals(v.coefficients.k)).toEqual(["0.2", "2"]);
    expect(exprToString(v.coefficients.k)).toBe("-0.2 / 2");
  });

  it("uses null-prototype records for everything keyed by user names", () => {
    expect(Object.getPrototypeOf(f.parameters)).toBeNull();
    expect(Object.getPrototypeOf(f.coefficientText)).toBeNull();
    expect(Object.getPrototypeOf(f.functions)).toBeNull();
    expect(Object.getPrototypeOf(f.variants[0].coefficients)).toBeNull();
    expect(Object.getPrototypeOf(f.variants[0].parameters)).toBeNull();
  });

  it("gives the entry's own YAML as source, which parses back to the same family", () => {
    expect(f.source.startsWith("id: tapered-amplifier-a")).toBe(true);
    expect(f.source).toContain('beta2: "-1/(1 + z/L)"');
    expect(f.source).not.toContain("families:");
    const again = parseOne(`wavesieve: 1\nfamilies:\n  - ${f.source.trimEnd().split("\n").join("\n    ")}\n`);
    expect(again.hash).toBe(f.hash);
    expect(again.variants).toEqual(f.variants);
  });

  it("is deterministic", () => {
    expect(JSON.stringify(parseFamilies(EXAMPLE))).toBe(JSON.stringify(parseFamilies(EXAMPLE)));
  });
});

describe("sweep points are exact", () => {
  it("writes non-terminating range points as an exact quotient", () => {
    const f = parseOne(`wavesieve: 1
families:
  - id: thirds
    class: kdv
    parameters:
      s0: { range: [0.1, 1.1], steps: 4 }
    coefficients: { p: 6, q: 1, s: s0 }
    window: [0, 1]
`);
    // Points (a (n - j) + b j)/n with n = 3: 0.1, (0.2 + 1.1)/3, (0.1 + 2.2)/3, 1.1.
    const s = f.variants.map((v) => v.coefficients.s);
    expect(s[0]).toEqual({ kind: "num", value: 0.1, text: "0.1" });
    expect(s[3]).toEqual({ kind: "num", value: 1.1, text: "1.1" });
    expect(exprToString(s[1])).toBe("1.3 / 3");
    expect(exprToString(s[2])).toBe("2.3 / 3");
    // The quotient is exact at 60 digits, and the reported double is its rounding.
    const D = Decimal.clone({ precision: 60 });
    expect(new D("1.3").div(3).toNumber()).toBe(f.variants[1].parameters.s0);
    expect(f.variants[2].parameters.s0).toBe(new D("2.3").div(3).toNumber());
  });

  it("writes terminating range points as a single literal with exact text", () => {
    const f = parseOne(`wavesieve: 1
families:
  - id: quarters
    class: kdv
    parameters:
      s0: { range: [0.1, 0.2], steps: 5 }
    coefficients: { p: 6, q: 1, s: s0 }
    window: [0, 1]
`);
    expect(f.variants.map((v) => (v.coefficients.s as { text: string }).text)).toEqual(["0.1", "0.125", "0.15", "0.175", "0.2"]);
  });
});

describe("several documents and several families", () => {
  const text = `# a fibre group's file
wavesieve: 1
families:
  - id: uniform-fibre
    class: nls
    coefficients: { a: -0.5, h: 1 }
    window: [0, 1]
  - id: cylindrical-wave
    class: kdv
    coefficients: { p: 6, q: 1, r: "1/(2*t)" }
    window: [1, 5]
---
wavesieve: 1
families:
  - id: quadratic-trap
    class: nls
    parameters:
      w0: &w { values: [0.5, 1] }
      w1: *w
    coefficients: { a: 0.5, b: "-(w0 + w1*t)^2/2", h: -1 }
    window: [0, 2]
`;
  it("returns every family with its document index and location", () => {
    const r = parseFamilies(text, { file: "groups.yaml" });
    expect(r.errors).toEqual([]);
    expect(r.families.map((f) => [f.id, f.location.document, f.location.line, f.location.file])).toEqual([
      ["uniform-fibre", 0, 4, "groups.yaml"],
      ["cylindrical-wave", 0, 8, "groups.yaml"],
      ["quadratic-trap", 1, 15, "groups.yaml"],
    ]);
    // An anchor shared by two parameters gives a 2 × 2 product.
    expect(r.families[2].variants.map((v) => [v.parameters.w0, v.parameters.w1])).toEqual([[0.5, 0.5], [0.5, 1], [1, 0.5], [1, 1]]);
  });

  it("refuses an id used again in a later document", () => {
    const r = parseFamilies(`${text}---\nwavesieve: 1\nfamilies:\n  - id: uniform-fibre\n    class: nls\n    coefficients: { a: 1, h: 1 }\n    window: [0, 1]\n`);
    expect(r.families.map((f) => f.id)).toEqual(["uniform-fibre", "cylindrical-wave", "quadratic-trap"]);
    expect(r.errors).toEqual([
      expect.objectContaining({ code: "id-duplicate", document: 2, line: 25, path: "families[0].id", familyId: "uniform-fibre" }),
    ]);
    expect(r.errors[0].message).toMatch(/already used by the family at line 4/);
  });
});

describe("content hash", () => {
  const base = `wavesieve: 1
families:
  - id: tapered
    class: nls
    parameters: { g0: 0.2, L: { values: [1, 2] } }
    functions: { beta2: "-1/(1 + t/L)" }
    coefficients: { a: "-beta2(t)/2", h: "exp(g0*t)" }
    window: [0, 10]
`;
  const hashOf = (text: string) => parseOne(text).hash;

  it("is the same for the same family written differently", () => {
    const h = hashOf(base);
    // Block style, comments, a title and tags, another id.
    expect(
      hashOf(`wavesieve: 1
families:
  - id: tapered-copy   # uploaded again
    title: Same taper
    tags: [copy]
    class: nls
    parameters:
      g0: 0.20
      L:
        values: [1.0, 2]
    functions:
      beta2: "-1/(1 + t/L)"
    coefficients:
      h: "exp(g0*t)"
      a: "-beta2(t)/2"
      b: 0
    window: [0.0, 1e1]
`),
    ).toBe(h);
    // Other variable names, and the helper written out.
    expect(
      hashOf(`wavesieve: 1
families:
  - id: tapered-z
    class: nls
    variables: { evolution: z, space: T }
    parameters: { g0: 0.2, L: { values: [1, 2] } }
    coefficients: { a: "-(-1/(1 + z/L))/2", h: "exp(g0*z)" }
    window: [0, 10]
`),
    ).toBe(h);
  });

  it("changes when anything that matters changes", () => {
    const h = hashOf(base);
    expect(hashOf(base.replace("g0: 0.2", "g0: 0.3"))).not.toBe(h);
    expect(hashOf(base.replace("[1, 2]", "[1, 3]"))).not.toBe(h);
    expect(hashOf(base.replace("window: [0, 10]", "window: [0, 11]"))).not.toBe(h);
    expect(hashOf(base.replace('h: "exp(g0*t)"', 'h: "exp(g0*t)", k: 0.1'))).not.toBe(h);
    expect(hashOf(base.replace("g0: 0.2", "g0: free"))).not.toBe(h);
  });

  it("is the same for an equation and its coefficients written out", () => {
    const eq = hashOf(`wavesieve: 1\nfamilies:\n  - id: e\n    class: kdv\n    equation: "u_t + 6*u*u_x + u_xxx = 0"\n    window: [0, 1]\n`);
    const co = hashOf(`wavesieve: 1\nfamilies:\n  - id: c\n    class: kdv\n    coefficients: { p: 6, q: 1 }\n    window: [0, 1]\n`);
    expect(eq).toBe(co);
  });
});

describe("locations point at the character", () => {
  it("gives line, column and char of an unknown symbol inside a coefficient", () => {
    const text = `wavesieve: 1
families:
  - id: gp
    class: nls
    coefficients:
      a: 0.5
      h: "-g0*exp(-t/tau)"
    window: [0, 1]
`;
    const r = parseFamilies(text, { file: "gp.yaml" });
    expect(r.families).toEqual([]);
    expect(r.errors).toHaveLength(1);
    const e = r.errors[0];
    expect(e).toMatchObject({ file: "gp.yaml", document: 0, familyId: "gp", path: "families[0].coefficients.h", code: "unknown-symbol", line: 7, char: 2 });
    // Column of the 'g' of g0 on line 7.
    expect(e.column).toBe(text.split("\n")[6].indexOf("g0") + 1);
    expect(e.message).toMatch(/unknown symbol 'g0'/);
  });
});

describe("format details", () => {
  it("exports its limits", () => {
    expect(MAX_FILE_BYTES).toBe(2 * 1024 * 1024);
    expect(DEFAULT_VARIANT_CAP).toBe(5000);
  });

  it("accepts quoted numbers with their exact text, and number-valued coefficients", () => {
    const f = parseOne(`wavesieve: 1
families:
  - id: quoted
    class: mkdv
    parameters: { q0: "0.10" }
    coefficients: { p: -6, q: q0, r: 1e-3 }
    window: [0, 1]
`);
    expect(f.parameters.q0).toEqual({ kind: "fixed", value: 0.1, text: "0.10" });
    expect(f.variants[0].coefficients.q).toEqual({ kind: "num", value: 0.1, text: "0.10" });
    expect(valueAt(f.variants[0].coefficients.p, 0)).toBe(-6);
    expect(valueAt(f.variants[0].coefficients.r, 0)).toBe(1e-3);
  });

  it("reads the coefficients of an equation family and records the equation", () => {
    const f = parseOne(`wavesieve: 1
families:
  - id: channel
    class: kdv
    variables: { evolution: tau, space: xi, field: eta }
    parameters: { c0: 2 }
    equation: "eta_tau + c0*eta*eta_xi + eta_xixixi = 0"
    window: [0, 1]
`);
    expect(f.equation).toBe("eta_tau + c0*eta*eta_xi + eta_xixixi = 0");
    expect(f.variables).toEqual({ evolution: "tau", space: "xi", field: "eta" });
    expect(f.coefficientText).toEqual({ p: "c0", q: "1" });
    expect(f.variants[0].coefficients.p).toEqual({ kind: "num", value: 2, text: "2" });
  });

  it("lets helpers use other helpers declared in any order", () => {
    const f = parseOne(`wavesieve: 1
families:
  - id: helpers
    class: nls
    parameters: { w0: 1 }
    functions:
      trap: "-w(t)^2/2"
      w: "w0*(1 + 0.1*t)"
    coefficients: { a: 0.5, b: "trap(t)", h: 1 }
    window: [0, 1]
`);
    expect(valueAt(f.variants[0].coefficients.b, 0.5)).toBeCloseTo(-((1.05) ** 2) / 2, 15);
  });

  it("reads a file that starts with a directive and '---', and CRLF line ends", () => {
    const body = EXAMPLE.replace(/#.*$/gm, "");
    for (const text of [`%YAML 1.2\n---\n${body}`, `---\n${body}`, body.replace(/\n/g, "\r\n")]) {
      const r = parseFamilies(text);
      expect(r.errors).toEqual([]);
      expect(r.families.map((f) => [f.id, f.location.document, f.variants.length])).toEqual([["tapered-amplifier-a", 0, 15]]);
    }
  });

  it("ignores an empty trailing document", () => {
    const r = parseFamilies(`${EXAMPLE}---\n`);
    expect(r.errors).toEqual([]);
    expect(r.families).toHaveLength(1);
  });
});
