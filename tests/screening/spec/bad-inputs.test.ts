import { describe, it, expect } from "vitest";
import { readFileSync, readdirSync } from "node:fs";
import path from "node:path";
import { parseFamilies, MAX_FILE_BYTES, type SpecError } from "../../../lib/screening/spec";

/**
 * The bad-input corpus: one case per file in tests/fixtures/bad-inputs. Where a case can sit
 * beside valid families (most of them), the file also holds a valid family — "reference-soliton",
 * the canonical NLS i u_t + u_xx + 2|u|^2 u = 0 of ../shared/math/README.md — which must still be
 * returned. Cases that spoil a whole document (YAML syntax, version, resource limits) put the
 * valid family in another document of the same file where that is possible.
 */
interface Row {
  file: string;
  code: string;
  path: string;
  line: number;
  /** Document index of the error (default 0). */
  document?: number;
  /** Ids of the families that must still be returned. */
  valid: string[];
}

const DIR = path.resolve(__dirname, "../../fixtures/bad-inputs");

const TABLE: Row[] = [
  { file: "alias-bomb.yaml", code: "yaml-alias", path: "", line: 1, valid: [] },
  { file: "alias-too-many.yaml", code: "yaml-alias", path: "families[1].parameters.w101", line: 111, valid: [] },
  { file: "alias-unknown-anchor.yaml", code: "yaml-alias", path: "families[1].coefficients.h", line: 9, valid: ["reference-soliton"] },
  { file: "class-missing.yaml", code: "required", path: "families[1]", line: 7, valid: ["reference-soliton"] },
  { file: "class-unknown.yaml", code: "class-unknown", path: "families[1].class", line: 8, valid: ["reference-soliton"] },
  { file: "class-upper-case.yaml", code: "class-unknown", path: "families[1].class", line: 8, valid: ["reference-soliton"] },
  { file: "coefficient-boolean.yaml", code: "type", path: "families[1].coefficients.a", line: 10, valid: ["reference-soliton"] },
  { file: "coefficient-depends-on-renamed-space.yaml", code: "coefficient-space-dependence", path: "families[1].coefficients.h", line: 12, valid: ["reference-soliton"] },
  { file: "coefficient-depends-on-x.yaml", code: "coefficient-space-dependence", path: "families[1].coefficients.h", line: 11, valid: ["reference-soliton"] },
  { file: "coefficient-missing.yaml", code: "coefficient-missing", path: "families[1].coefficients", line: 10, valid: ["reference-soliton"] },
  { file: "coefficient-wrong-class.yaml", code: "coefficient-unknown", path: "families[1].coefficients.p", line: 12, valid: ["reference-soliton"] },
  { file: "document-not-mapping.yaml", code: "document-not-mapping", path: "", line: 1, valid: [] },
  { file: "duplicate-key-in-coefficients.yaml", code: "yaml-duplicate-key", path: "families[1].coefficients.h", line: 12, valid: ["reference-soliton"] },
  { file: "duplicate-key-in-family.yaml", code: "yaml-duplicate-key", path: "families[1].class", line: 9, valid: ["reference-soliton"] },
  { file: "duplicate-key-root.yaml", code: "yaml-duplicate-key", path: "wavesieve", line: 2, valid: [] },
  { file: "equation-and-coefficients.yaml", code: "coefficients-and-equation", path: "families[1].equation", line: 10, valid: ["reference-soliton"] },
  { file: "equation-imaginary-dispersion.yaml", code: "equation-term", path: "families[1].equation", line: 9, valid: ["reference-soliton"] },
  { file: "equation-no-time-derivative.yaml", code: "equation-no-time-derivative", path: "families[1].equation", line: 9, valid: ["reference-soliton"] },
  { file: "equation-term-outside-class.yaml", code: "equation-term", path: "families[1].equation", line: 9, valid: ["reference-soliton"] },
  { file: "equation-two-equals.yaml", code: "equation-syntax", path: "families[1].equation", line: 9, valid: ["reference-soliton"] },
  { file: "expression-evaluate.yaml", code: "unknown-function", path: "families[1].coefficients.a", line: 10, valid: ["reference-soliton"] },
  { file: "expression-import.yaml", code: "unknown-function", path: "families[1].coefficients.h", line: 11, valid: ["reference-soliton"] },
  { file: "expression-syntax.yaml", code: "expression-syntax", path: "families[1].coefficients.h", line: 11, valid: ["reference-soliton"] },
  { file: "expression-units.yaml", code: "expression-syntax", path: "families[1].coefficients.h", line: 9, valid: ["reference-soliton"] },
  { file: "expression-unknown-function.yaml", code: "unknown-function", path: "families[1].coefficients.h", line: 11, valid: ["reference-soliton"] },
  { file: "expression-unknown-symbol.yaml", code: "unknown-symbol", path: "families[1].coefficients.h", line: 11, valid: ["reference-soliton"] },
  { file: "families-empty.yaml", code: "families-empty", path: "families", line: 2, valid: [] },
  { file: "families-not-a-list.yaml", code: "type", path: "families", line: 3, valid: [] },
  { file: "file-empty.yaml", code: "file-empty", path: "", line: 1, valid: [] },
  { file: "helper-cycle.yaml", code: "helper-cycle", path: "families[1].functions.f", line: 10, valid: ["reference-soliton"] },
  { file: "helper-depends-on-x.yaml", code: "coefficient-space-dependence", path: "families[1].functions.w", line: 10, valid: ["reference-soliton"] },
  { file: "helper-recursion.yaml", code: "helper-cycle", path: "families[1].functions.w", line: 10, valid: ["reference-soliton"] },
  { file: "id-bad-slug.yaml", code: "id-invalid", path: "families[1].id", line: 7, valid: ["reference-soliton"] },
  { file: "id-duplicate.yaml", code: "id-duplicate", path: "families[1].id", line: 7, valid: ["reference-soliton"] },
  { file: "id-missing.yaml", code: "required", path: "families[1]", line: 7, valid: ["reference-soliton"] },
  { file: "key-constructor.yaml", code: "forbidden-key", path: "families[1].coefficients.constructor", line: 12, valid: ["reference-soliton"] },
  { file: "key-proto.yaml", code: "forbidden-key", path: "families[1].parameters.__proto__", line: 10, valid: ["reference-soliton"] },
  { file: "key-prototype.yaml", code: "forbidden-key", path: "families[1].prototype", line: 9, valid: ["reference-soliton"] },
  { file: "number-decimal-comma.yaml", code: "number-invalid", path: "families[1].parameters.g0", line: 10, valid: ["reference-soliton"] },
  { file: "number-inf-window.yaml", code: "window-invalid", path: "families[1].window[1]", line: 10, valid: ["reference-soliton"] },
  { file: "number-nan.yaml", code: "number-invalid", path: "families[1].parameters.g0", line: 10, valid: ["reference-soliton"] },
  { file: "number-overflow.yaml", code: "number-invalid", path: "families[1].parameters.g0", line: 10, valid: ["reference-soliton"] },
  { file: "parameter-bare-list.yaml", code: "parameter-invalid", path: "families[1].parameters.L", line: 10, valid: ["reference-soliton"] },
  { file: "parameter-free-misspelt.yaml", code: "number-invalid", path: "families[1].parameters.h0", line: 10, valid: ["reference-soliton"] },
  { file: "parameter-range-reversed.yaml", code: "parameter-invalid", path: "families[1].parameters.g0.range", line: 10, valid: ["reference-soliton"] },
  { file: "parameter-reserved-name.yaml", code: "name-invalid", path: "families[1].parameters.exp", line: 10, valid: ["reference-soliton"] },
  { file: "parameter-steps-one.yaml", code: "parameter-invalid", path: "families[1].parameters.g0.steps", line: 10, valid: ["reference-soliton"] },
  { file: "parameter-units.yaml", code: "number-invalid", path: "families[1].parameters.L", line: 10, valid: ["reference-soliton"] },
  { file: "parameter-values-empty.yaml", code: "parameter-invalid", path: "families[1].parameters.g0.values", line: 10, valid: ["reference-soliton"] },
  { file: "tags-not-a-list.yaml", code: "tags-invalid", path: "families[1].tags", line: 11, valid: ["reference-soliton"] },
  { file: "unknown-key-family.yaml", code: "unknown-key", path: "families[1].tgas", line: 11, valid: ["reference-soliton"] },
  { file: "unknown-key-root.yaml", code: "unknown-key", path: "famillies", line: 2, valid: [] },
  { file: "unknown-key-sweep.yaml", code: "unknown-key", path: "families[1].parameters.g0.step", line: 10, valid: ["reference-soliton"] },
  { file: "variables-clash.yaml", code: "name-clash", path: "families[1].variables.space", line: 9, valid: ["reference-soliton"] },
  { file: "variables-identical.yaml", code: "variables-invalid", path: "families[1].variables", line: 9, valid: ["reference-soliton"] },
  { file: "variant-cap-file-total.yaml", code: "variant-cap", path: "families[2].parameters", line: 16, valid: ["reference-soliton", "first-half"] },
  { file: "variant-cap-one-family.yaml", code: "variant-cap", path: "families[1].parameters", line: 9, valid: ["reference-soliton"] },
  { file: "version-2.yaml", code: "version-unsupported", path: "wavesieve", line: 1, valid: [] },
  { file: "version-in-second-document.yaml", code: "version-unsupported", path: "wavesieve", line: 8, document: 1, valid: ["reference-soliton"] },
  { file: "version-missing.yaml", code: "version-missing", path: "", line: 1, valid: [] },
  { file: "window-missing.yaml", code: "required", path: "families[1]", line: 7, valid: ["reference-soliton"] },
  { file: "window-reversed.yaml", code: "window-invalid", path: "families[1].window", line: 10, valid: ["reference-soliton"] },
  { file: "window-three-numbers.yaml", code: "window-invalid", path: "families[1].window", line: 10, valid: ["reference-soliton"] },
  { file: "yaml-bad-indentation.yaml", code: "yaml-syntax", path: "", line: 12, document: 1, valid: ["reference-soliton"] },
  { file: "yaml-complex-key.yaml", code: "yaml-complex-key", path: "families[1].coefficients", line: 10, valid: ["reference-soliton"] },
  { file: "yaml-tab-indentation.yaml", code: "yaml-syntax", path: "", line: 13, document: 1, valid: ["reference-soliton"] },
  { file: "yaml-tag.yaml", code: "yaml-tag", path: "families[1].coefficients.a", line: 9, valid: ["reference-soliton"] },
  { file: "yaml-unclosed-bracket.yaml", code: "yaml-syntax", path: "", line: 14, document: 1, valid: ["reference-soliton"] },
  { file: "yaml-unclosed-quote.yaml", code: "yaml-syntax", path: "", line: 13, document: 1, valid: ["reference-soliton"] },
];

function check(errors: SpecError[], row: Pick<Row, "code" | "path" | "line" | "document">, file?: string): SpecError {
  const hit = errors.find((e) => e.code === row.code && e.path === row.path && e.line === row.line);
  expect(hit, `expected ${row.code} at ${row.path} line ${row.line}; got ${JSON.stringify(errors, null, 1)}`).toBeDefined();
  const err = hit!;
  expect(err.message.length).toBeGreaterThan(10);
  expect(err.column).toBeGreaterThanOrEqual(1);
  if (row.document !== undefined) expect(err.document).toBe(row.document);
  if (file !== undefined) expect(err.file).toBe(file);
  return err;
}

describe("bad-input corpus (tests/fixtures/bad-inputs)", () => {
  it("has one table row per fixture file, and at least 40 of them", () => {
    const files = readdirSync(DIR).filter((f) => f.endsWith(".yaml")).sort();
    expect(files.length).toBeGreaterThanOrEqual(40);
    expect(TABLE.map((r) => r.file).sort()).toEqual(files);
  });

  for (const row of TABLE) {
    it(`${row.file}: ${row.code} at ${row.path || "(document)"} line ${row.line}`, () => {
      const text = readFileSync(path.join(DIR, row.file), "utf8");
      const result = parseFamilies(text, { file: row.file });
      check(result.errors, { ...row, document: row.document ?? (row.code === "file-empty" ? undefined : 0) }, row.file);
      expect(result.families.map((f) => f.id)).toEqual(row.valid);
      // Every error is located; an invalid family never comes back.
      for (const e of result.errors) {
        expect(e.line).toBeGreaterThanOrEqual(1);
        expect(e.column).toBeGreaterThanOrEqual(1);
        expect(typeof e.path).toBe("string");
        expect(e.file).toBe(row.file);
        if (e.familyId !== undefined) expect(result.families.some((f) => f.id === e.familyId && f.location.path === e.path.replace(/^(families\[\d+\]).*$/, "$1"))).toBe(false);
      }
      // Deterministic: the same text gives the same result.
      expect(JSON.stringify(parseFamilies(text, { file: row.file }))).toBe(JSON.stringify(result));
    });
  }
});

describe("generated bad inputs (too big to commit)", () => {
  it("refuses a 20 MB file before parsing it", () => {
    const text = "wavesieve: 1\nfamilies:\n" + "# padding padding padding padding padding padding padding padding\n".repeat(310_000);
    expect(text.length).toBeGreaterThan(20_000_000);
    const r = parseFamilies(text, { file: "huge.yaml" });
    expect(r.families).toEqual([]);
    expect(r.errors).toHaveLength(1);
    expect(r.errors[0].code).toBe("file-too-large");
    expect(r.errors[0].message).toMatch(/^file too large \(19\.\d MB; limit 2 MB\)$/);
    expect(r.errors[0]).toMatchObject({ file: "huge.yaml", line: 1, column: 1, path: "" });
  });

  it("accepts exactly MAX_FILE_BYTES and refuses one byte more (counted in UTF-8)", () => {
    const head = "wavesieve: 1\nfamilies:\n  - id: reference-soliton\n    class: nls\n    coefficients: { a: 1, h: 2 }\n    window: [0, 1]\n";
    const pad = (n: number) => head + "#" + "x".repeat(n - head.length - 2) + "\n";
    expect(parseFamilies(pad(MAX_FILE_BYTES)).families).toHaveLength(1);
    expect(parseFamilies(pad(MAX_FILE_BYTES + 1)).errors[0].code).toBe("file-too-large");
    // 'é' is two bytes in UTF-8: half a million of them are 1 MB of characters but 2 MB of bytes.
    const wide = head + "# " + "é".repeat(MAX_FILE_BYTES / 2) + "\n";
    expect(parseFamilies(wide).errors[0].code).toBe("file-too-large");
  });

  it("refuses 10 000-deep nesting (sequences and mappings) with a located error", () => {
    const deepSeq = "wavesieve: 1\nfamilies:\n  - id: deep\n    notes: " + "[".repeat(10_000) + "]".repeat(10_000) + "\n";
    const deepMap = "wavesieve: 1\nfamilies:\n  - id: deep\n    notes: " + "{a: ".repeat(10_000) + "1" + "}".repeat(10_000) + "\n";
    for (const text of [deepSeq, deepMap]) {
      const r = parseFamilies(text, { file: "deep.yaml" });
      expect(r.families).toEqual([]);
      const err = r.errors.find((e) => e.code === "yaml-depth");
      expect(err).toBeDefined();
      expect(err!.line).toBe(4);
      expect(err!.message).toMatch(/nested more than \d+ levels/);
    }
  });

  it("refuses 10 000-deep parentheses in a coefficient, keeping the other family", () => {
    const good = "  - id: reference-soliton\n    class: nls\n    coefficients: { a: 1, h: 2 }\n    window: [0, 1]\n";
    const nested = "(".repeat(300) + "t" + ")".repeat(300);
    const text = `wavesieve: 1\nfamilies:\n${good}  - id: nested\n    class: nls\n    coefficients:\n      a: 1\n      h: "${nested}"\n    window: [0, 1]\n`;
    const r = parseFamilies(text);
    expect(r.families.map((f) => f.id)).toEqual(["reference-soliton"]);
    check(r.errors, { code: "expression-syntax", path: "families[1].coefficients.h", line: 11 });
    expect(r.errors[0].message).toMatch(/too deeply nested/);
    const longer = text.replace(nested, "(".repeat(10_000) + "t" + ")".repeat(10_000));
    const r2 = parseFamilies(longer);
    expect(r2.families.map((f) => f.id)).toEqual(["reference-soliton"]);
    check(r2.errors, { code: "expression-syntax", path: "families[1].coefficients.h", line: 11 });
  });

  it("caps a sweep at the variantCap option", () => {
    const text = `wavesieve: 1
families:
  - id: reference-soliton
    class: nls
    coefficients: { a: 1, h: 2 }
    window: [0, 1]
  - id: sweep
    class: nls
    parameters:
      g0: { range: [0, 1], steps: 11 }
    coefficients: { a: 1, h: "exp(g0*t)" }
    window: [0, 1]
`;
    expect(parseFamilies(text).families.map((f) => f.variants.length)).toEqual([1, 11]);
    const capped = parseFamilies(text, { variantCap: 10 });
    expect(capped.families.map((f) => f.id)).toEqual(["reference-soliton"]);
    check(capped.errors, { code: "variant-cap", path: "families[1].parameters.g0.steps", line: 10 });
  });
});
