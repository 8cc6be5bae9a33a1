// The bad-input corpus (tests/fixtures/bad-inputs, 69 files) through POST /api/batches: each file gets
// its located error, only its valid families are stored, and a file with no valid family stores nothing.
import { describe, it, expect } from "vitest";
import { readFileSync, readdirSync } from "node:fs";
import path from "node:path";
import { createMigratedDatabase } from "../helpers/db";
import { request, noParams, type TestUser } from "../helpers/requests";
import { parseFamilies } from "@/lib/screening/spec";

createMigratedDatabase({ seed: true });

const DIR = path.resolve("tests/fixtures/bad-inputs");
const FILES = readdirSync(DIR).filter((f) => f.endsWith(".yaml")).sort();

/** A researcher per file: the upload rate limit (30 a minute per user) must not decide these cases. */
async function uploaderFor(file: string): Promise<TestUser> {
  const { User } = await import("@/models");
  const u = await User.create({ email: `${file.replace(/[^a-z0-9]/g, "-")}@wavesieve.test`, name: file, role: "researcher" });
  return { id: u.id, email: u.email, role: "researcher" };
}

async function counts() {
  const { Batch, Family, FamilyVariant, ScreeningRun } = await import("@/models");
  return { batches: await Batch.count(), families: await Family.count(), variants: await FamilyVariant.count(), runs: await ScreeningRun.count() };
}

describe("bad-input corpus through the upload API", () => {
  it("has at least 40 cases", () => expect(FILES.length).toBeGreaterThanOrEqual(40));

  for (const file of FILES) {
    it(`${file}: located error, nothing of the bad family stored`, async () => {
      const text = readFileSync(path.join(DIR, file), "utf8");
      const expected = parseFamilies(text, { file });
      const before = await counts();
      const { POST } = await import("@/app/api/batches/route");
      const res = await POST(await request("POST", "/api/batches", { user: await uploaderFor(file), body: { files: [{ name: file, text }] } }), noParams);
      const body = await res.json();
      const errors = body.files?.[0]?.errors ?? [];
      expect(errors.length, `${file}: no error reported`).toBeGreaterThan(0);
      for (const e of errors) {
        expect(e.file).toBe(file);
        expect(typeof e.path).toBe("string");
        expect(e.message.length).toBeGreaterThan(0);
      }
      expect(errors.some((e: { line?: number }) => typeof e.line === "number" && e.line >= 1), `${file}: no line`).toBe(true);
      const after = await counts();
      if (expected.families.length === 0) {
        expect(res.status).toBe(422);
        expect(after).toEqual(before);
      } else {
        expect(res.status).toBe(201);
        const { Family } = await import("@/models");
        const stored = await Family.findAll({ where: { firstBatchId: body.batch.id } });
        // Exactly the valid families (a family known from an earlier file is linked, not stored again).
        expect(stored.map((f) => f.slug).every((s) => expected.families.some((v) => v.id === s))).toBe(true);
        expect(after.batches).toBe(before.batches + 1);
        expect(after.families - before.families).toBeLessThanOrEqual(expected.families.length);
      }
    });
  }
});
