/**
 * The engine's public surface: parse → screen → JSON-serialisable reports, sweeps and progress.
 */
import { describe, it, expect } from "vitest";
import { readFileSync } from "node:fs";
import { ENGINE_VERSION, parseFamilies, screenFamily, screenVariant } from "../../../lib/screening";
import type { ScreeningStage } from "../../../lib/screening";

const FIXTURE = readFileSync(new URL("../../fixtures/screen/classic.yaml", import.meta.url), "utf8");

describe("screenFamily", () => {
  it("screens every sweep variant and says which pass (nls.md §10 expulsive trap with e^{λt} interaction)", async () => {
    // Source: nls.md §10 (GP form): b = λ²/2 with h = e^{λt} passes for each λ; the damped member
    // with constant h fails (nls.md §11 c1); cylindrical KdV passes (kdv.md §2).
    const { families, errors } = parseFamilies(FIXTURE, { file: "classic.yaml" });
    expect(errors).toEqual([]);
    const reports = await Promise.all(families.map((f) => screenFamily(f, { painleve: false })));
    const [trap, damped, ring] = reports;
    expect(trap.variants.map((v) => v.reducibility.verdict)).toEqual(["reducible", "reducible"]);
    expect(trap.summary.reducible).toEqual([0, 1]);
    expect(trap.summary.text).toBe("all 2 variants are reducible");
    expect(damped.variants[0].reducibility.verdict).toBe("not-reducible");
    expect(ring.variants[0].reducibility.verdict).toBe("reducible");
    for (const r of reports) {
      expect(r.engine).toBe(ENGINE_VERSION);
      // Plain JSON: survives a round trip unchanged (no class instances, no Decimal objects).
      expect(JSON.parse(JSON.stringify(r))).toEqual(r);
    }
  });

  it("a sweep where only some variants pass lists them", async () => {
    // Constant damping k: passes iff b = k²/a (nls.md §10); with a = 1, b = 0.09 only k = ±0.3 passes.
    const text = `wavesieve: 1
families:
  - id: damping-sweep
    title: Damping sweep at fixed expulsive potential
    class: nls
    window: [0, 2]
    parameters:
      kk: { values: [0.1, 0.3, 0.5] }
    coefficients:
      a: "1"
      b: "0.09"
      k: "kk"
      h: "1"
`;
    const { families, errors } = parseFamilies(text);
    expect(errors).toEqual([]);
    const r = await screenFamily(families[0], { painleve: false });
    expect(r.summary.reducible).toEqual([1]);
    expect(r.summary.notReducible).toEqual([0, 2]);
    expect(r.summary.text).toBe("1 of 3 variants are reducible: #1 (kk = 0.3)");
  });
});

describe("screenVariant", () => {
  it("reports the stages in order, runs the Painlevé stage and agrees with it on a classic member", async () => {
    // Source: README: reducible ⟺ invariant ≡ 0 ⟺ the Painlevé test passes (nls.md §11 c2).
    const { families } = parseFamilies(FIXTURE);
    const stages: ScreeningStage[] = [];
    const r = await screenVariant(families[0].variants[0], { onStage: (s) => stages.push(s), seed: 3 });
    expect(stages).toEqual(["reducibility", "painleve", "transformation", "solutions", "verification", "done"]);
    expect(r.reducibility.verdict).toBe("reducible");
    expect(r.painleve.verdict).toBe("passes");
    expect(r.agreement).toBe("agree");
    expect(r.timings.reducibility).toBeGreaterThan(0);
    // An accepted member carries its map, solutions mapped back, and the numerical check.
    expect(r.transformation.ok).toBe(true);
    expect(r.solutions?.ok).toBe(true);
    expect(r.verification?.passed).toBe(true);
  });

  it("a not-reducible member gets no transformation and says why", async () => {
    // Source: nls.md §11 (c1): a = 1/2, k = 0.1, h = 1 has R = 1/25, not reducible.
    const text = `wavesieve: 1
families:
  - id: damped-constant
    class: nls
    window: [0, 2]
    coefficients: { a: "1/2", k: "0.1", h: "1" }
`;
    const r = await screenVariant(parseFamilies(text).families[0].variants[0], { seed: 2 });
    expect(r.reducibility.verdict).toBe("not-reducible");
    expect(r.agreement).toBe("agree");
    expect(r.transformation).toMatchObject({ ok: false, code: "not-reducible" });
    expect(r.transformation.ok === false && r.transformation.reason).toMatch(/not-reducible/);
    expect(r.solutions).toBeUndefined();
  });

  it("with free parameters that no value fixes, the Painlevé test still judges the member at a random value", async () => {
    // Derived in ../shared/math (nls.md §3): a = 1/2, h = h0, k = 0.1 gives R = 4k² for every h0.
    const text = `wavesieve: 1
families:
  - id: free-scale
    class: nls
    window: [0, 2]
    parameters: { h0: free }
    coefficients: { a: "1/2", k: "0.1", h: "h0" }
`;
    const r = await screenVariant(parseFamilies(text).families[0].variants[0], { seed: 4 });
    expect(r.reducibility.verdict).toBe("not-reducible");
    expect(r.painleve.verdict).toBe("fails");
    expect(r.painleve.reason).toMatch(/random value h0 = /);
    expect(r.agreement).toBe("agree");
  });

  it("judges each piece of a window split at a pole in the Painlevé stage too", async () => {
    // nls.md §11 (d2): a = 1/2, b = -1/2, h = 1/cos t is reducible; h has a pole at π/2 inside [0, 3].
    const text = `wavesieve: 1
families:
  - id: pole-inside
    class: nls
    window: [0, 3]
    coefficients: { a: "1/2", b: "-1/2", h: "1/cos(t)" }
`;
    const r = await screenVariant(parseFamilies(text).families[0].variants[0], { seed: 6, accepted: false });
    expect(r.reducibility.verdict).toBe("reducible");
    expect(r.painleve.verdict).toBe("passes");
    const pieces = (r.painleve as { subWindows?: { window: number[]; verdict: string }[] }).subWindows ?? [];
    expect(pieces.map((p) => p.verdict)).toEqual(["passes", "passes"]);
    expect(pieces[0].window[1]).toBeLessThan(Math.PI / 2);
    expect(pieces[1].window[0]).toBeGreaterThan(Math.PI / 2);
    expect(r.agreement).toBe("agree");
  });

  it("is reproducible for a seed", async () => {
    const { families } = parseFamilies(FIXTURE);
    const v = families[1].variants[0];
    const a = await screenVariant(v, { seed: 11, painleve: false });
    const b = await screenVariant(v, { seed: 11, painleve: false });
    const c = await screenVariant(v, { seed: 12, painleve: false });
    const points = (x: typeof a): number[] => x.reducibility.evidence.windows[0].samples.map((s) => s.t);
    expect(points(a)).toEqual(points(b));
    expect(points(a)).not.toEqual(points(c));
  });

  it("a free-parameter report (high-precision values inside) is plain JSON too", async () => {
    // Source: nls.md §10, constant damping passes iff b = k²/a: a = 1, k = 0.3 → b0 = 0.09.
    const text = `wavesieve: 1
families:
  - id: free-trap
    class: nls
    window: [0, 2]
    parameters:
      b0: free
    coefficients:
      a: "1"
      b: "b0"
      k: "0.3"
      h: "1"
`;
    const { families, errors } = parseFamilies(text);
    expect(errors).toEqual([]);
    const r = await screenVariant(families[0].variants[0], { seed: 5 });
    expect(r.reducibility.constraints.map((c) => [c.parameter, c.exact])).toEqual([["b0", "0.09"]]);
    // The Painlevé stage runs with the value found (painleve.md: free parameters fixed by options.values).
    expect(r.painleve.verdict).toBe("passes");
    expect(JSON.parse(JSON.stringify(r))).toEqual(r);
  });

  it("stops when the signal is aborted", async () => {
    const { families } = parseFamilies(FIXTURE);
    const controller = new AbortController();
    controller.abort(new Error("cancelled by the user"));
    await expect(screenVariant(families[0].variants[0], { signal: controller.signal })).rejects.toThrow("cancelled by the user");
  });
});
