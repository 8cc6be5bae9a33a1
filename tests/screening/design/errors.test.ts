// Bad design requests give clear errors naming the field (issue 10: unknown coefficient, all
// fixed, none fixed, a fixed coefficient that vanishes on the window; and the other shapes).
// The precondition tested is README "Preconditions": a h ≠ 0 (NLS), p q ≠ 0 (KdV, mKdV).
import { describe, it, expect } from "vitest";
import { designModel } from "@/lib/screening/design";
import type { DesignError } from "@/lib/screening/design";

async function errorsOf(body: unknown): Promise<DesignError[]> {
  const out = await designModel(body, { transformation: false });
  if (out.ok) throw new Error("expected errors, got a design");
  return out.errors;
}

describe("design request errors", () => {
  it("an unknown coefficient to solve for", async () => {
    const [e] = await errorsOf({ class: "nls", solve: "p", set: { a: "1/2" }, window: [0, 1] });
    expect(e).toMatchObject({ code: "unknown-coefficient", field: "solve" });
    expect(e.message).toMatch(/'p' is not a coefficient of the nls class; its coefficients are a, b, c, e, f, g, h, k/);
  });

  it("an unknown coefficient among the fixed ones", async () => {
    const errors = await errorsOf({ class: "kdv", solve: "m", set: { p: "6", q: "1", w: "2" }, window: [0, 1] });
    expect(errors.find((x) => x.field === "set.w")).toMatchObject({ code: "unknown-coefficient" });
  });

  it("a coefficient that never enters the invariant", async () => {
    const [e] = await errorsOf({ class: "nls", solve: "f", set: { a: "1/2", h: "1" }, window: [0, 1] });
    expect(e.code).toBe("not-solvable");
    expect(e.message).toMatch(/never enters the invariant R/);
  });

  it("all fixed: the unknown is also given, or nothing is named", async () => {
    const [e] = await errorsOf({ class: "mkdv", solve: "p", set: { p: "6", q: "1" }, window: [0, 1] });
    expect(e).toMatchObject({ code: "all-fixed", field: "set.p" });
    const [f] = await errorsOf({ class: "mkdv", set: { p: "6", q: "1", r: "0", s: "0", g: "0" }, window: [0, 1] });
    expect(f).toMatchObject({ code: "all-fixed", field: "solve" });
  });

  it("none fixed", async () => {
    const errors = await errorsOf({ class: "nls", solve: "b", set: {}, window: [0, 1] });
    expect(errors[0]).toMatchObject({ code: "none-fixed", field: "set" });
    expect(errors[0].message).toMatch(/no coefficient is fixed/);
  });

  it("a required coefficient left out", async () => {
    const [e] = await errorsOf({ class: "nls", solve: "b", set: { a: "1/2" }, window: [0, 1] });
    expect(e).toMatchObject({ code: "missing-required", field: "set.h" });
  });

  it("a fixed coefficient that vanishes on the window", async () => {
    // a = cos t vanishes at π/2 inside [0, 3] (README "Preconditions": a h ≠ 0).
    const errors = await errorsOf({ class: "nls", solve: "b", set: { a: "cos(t)", h: "1" }, window: [0, 3] });
    const e = errors.find((x) => x.code === "vanishes");
    expect(e).toMatchObject({ field: "set.a" });
    expect(e!.message).toMatch(/a vanishes at t = 1\.5708/);
    // q ≡ 0 written as an expression that folds to zero.
    const [g] = await errorsOf({ class: "mkdv", solve: "p", set: { q: "t - t" }, window: [0, 1] });
    expect(g).toMatchObject({ code: "vanishes", field: "set.q" });
  });

  it("an expression error points at the character", async () => {
    const [e] = await errorsOf({ class: "kdv", solve: "q", set: { p: "6*exp(g0*t)" }, window: [0, 1] });
    expect(e).toMatchObject({ code: "expression", field: "set.p" });
    expect(e.message).toMatch(/unknown symbol 'g0'.*parameters/);
    expect(e.char).toBe(7);
  });

  it("parameters are allowed, with numeric values", async () => {
    const ok = await designModel({ class: "kdv", solve: "q", set: { p: "6*exp(g0*t)" }, window: [0, 1], parameters: { g0: 0.1 } }, { transformation: false });
    expect(ok.ok).toBe(true);
    const [e] = await errorsOf({ class: "kdv", solve: "q", set: { p: "6*exp(g0*t)" }, window: [0, 1], parameters: { g0: "fast" } });
    expect(e).toMatchObject({ code: "parameter", field: "parameters.g0" });
  });

  it("a bad window, class or constant", async () => {
    expect((await errorsOf({ class: "nls", solve: "b", set: { a: "1", h: "1" }, window: [2, 1] }))[0]).toMatchObject({ code: "window" });
    expect((await errorsOf({ class: "schrodinger", solve: "b", set: { a: "1" }, window: [0, 1] }))[0]).toMatchObject({ code: "unknown-class" });
    const [c] = await errorsOf({ class: "nls", solve: "h", set: { a: "1" }, window: [0, 1], constants: { beta0: 1 } });
    expect(c).toMatchObject({ code: "constant", field: "constants.beta0" });
    expect(c.message).toMatch(/its constants are h0, alpha0/);
    const [z] = await errorsOf({ class: "nls", solve: "h", set: { a: "1" }, window: [0, 1], constants: { h0: 0 } });
    expect(z).toMatchObject({ code: "constant", field: "constants.h0" });
    expect((await errorsOf("not an object"))[0]).toMatchObject({ code: "bad-request" });
  });
});
