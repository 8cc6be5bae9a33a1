import { describe, it, expect } from "vitest";
import { readFileSync, readdirSync } from "node:fs";
import path from "node:path";
import { parseFamilies, MAX_FILE_BYTES, DEFAULT_VARIANT_CAP, MAX_YAML_DEPTH, MAX_ALIASES, MAX_EXPANDED_NODES } from "../../../lib/screening/spec";

const ROOT = path.resolve(__dirname, "../../..");
const DOC = readFileSync(path.join(ROOT, "docs/family-format.md"), "utf8");

/** The YAML blocks of the documentation that are whole files. */
function wholeFileBlocks(): string[] {
  return [...DOC.matchAll(/```yaml\n([\s\S]*?)```/g)].map((m) => m[1]).filter((b) => b.startsWith("wavesieve: 1"));
}

describe("docs/family-format.md", () => {
  it("has examples that parse without errors, with the variant counts the text states", () => {
    const blocks = wholeFileBlocks();
    expect(blocks.length).toBeGreaterThanOrEqual(4);
    const counts = new Map<string, number>();
    for (const block of blocks) {
      const r = parseFamilies(block);
      expect(r.errors, block.slice(0, 80)).toEqual([]);
      for (const f of r.families) counts.set(f.id, f.variants.length);
    }
    // "This family has 3 × 5 = 15 variants", "with 5 variants", "27 variants (3 × 9)".
    expect(counts.get("tapered-amplifier-a")).toBe(15);
    expect(counts.get("trap-ramp-linear")).toBe(5);
    expect(counts.get("taper-gain-scan")).toBe(27);
  });

  it("documents every error code the parser can produce", () => {
    const dir = path.join(ROOT, "lib/screening/spec");
    const codes = new Set<string>();
    for (const file of readdirSync(dir).filter((f) => f.endsWith(".ts"))) {
      const text = readFileSync(path.join(dir, file), "utf8");
      for (const m of text.matchAll(/(?:code: |error\(\s*|fail\(|problem\(|fileError\()"([a-z]+(?:-[a-z]+)*)"/g)) codes.add(m[1]);
      for (const m of text.matchAll(/\? "(yaml-depth)" : "(yaml-syntax)"/g)) codes.add(m[1]).add(m[2]);
    }
    expect(codes.size).toBeGreaterThan(30);
    for (const code of codes) expect(DOC, code).toContain(`\`${code}\``);
  });

  it("states the limits the code enforces", () => {
    expect(MAX_FILE_BYTES).toBe(2 * 1024 * 1024);
    expect(DOC).toContain("2 MiB");
    expect(DOC).toContain(`${DEFAULT_VARIANT_CAP} variants`);
    expect(DOC).toContain(`${MAX_YAML_DEPTH} levels`);
    expect(DOC).toContain(`| aliases per document | ${MAX_ALIASES} |`);
    expect(DOC).toContain(MAX_EXPANDED_NODES.toLocaleString("en-US").replace(",", " "));
  });
});
