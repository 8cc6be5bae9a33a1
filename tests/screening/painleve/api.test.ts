/**
 * Public API of the Painlevé stage: verdicts and reason strings (../shared/math/painleve.md §0),
 * evidence (§6 Step 8), free parameters, preconditions, determinism, the symbolic condition
 * (README.md: C4 = -2aR/(h u0), C6 = K/p, C3 = u0 Q/2) and agreement with reducibility.
 */
import { describe, expect, it } from "vitest";
import { evalNumber, parseExpression } from "../../../lib/screening/expr";
import { agreement, runPainleve, type PainleveResult } from "../../../lib/screening/painleve";
import { U0_CHIRPED, U0_ONE, vectorInputs, variant } from "./helpers";

const REASONS = [
  /^passes to relative accuracy 1e-10 \(jet\)/,
  /^non-integer leading exponent \(alpha = .+\)$/,
  /^inconsistent leading order$/,
  /^non-integer resonance \(r = .+\)$/,
  /^condition at resonance \d+ fails \(rho_P = .+\)$/,
  /^undecided: rho between thresholds$/,
  /^undecided: near-integrable \(jet test and class invariant disagree\)$/,
  /^undecided: evaluation failed \(.+\)$/,
];
const expectKnownReason = (r: PainleveResult) => expect(REASONS.some((re) => re.test(r.reason)), r.reason).toBe(true);

/** Evaluate the substituted symbolic condition's text at t and u0 (real). */
function evalCondition(text: string, t: number, u0: number): number {
  const p = parseExpression(text, { symbols: new Set(["t", "u0"]) });
  if (!p.ok) throw new Error(p.error.message);
  return evalNumber(p.expr, { t, u0 });
}

describe("results", () => {
  it("are JSON-serialisable (no NaN, Infinity or class instances) and carry a §0 reason", () => {
    for (const r of [
      runPainleve(variant("nls", { a: "1+0.3*sin(t)", h: "2/(1+t^2)", k: "0.05" })),
      runPainleve(variant("kdv", { p: "1", q: "1" })),
      runPainleve(variant("mkdv", { p: "6", q: "1", r: "0.1" })),
    ]) {
      expect(JSON.parse(JSON.stringify(r))).toEqual(r);
      expectKnownReason(r);
      expect(["passes", "fails", "undecided"]).toContain(r.verdict);
    }
  });
  it("record points, seed, jet length, resonances, per-resonance holds-identically and rho_P,max", () => {
    const r = runPainleve(variant("nls", { a: "1", h: "2", k: "0.1" }), { seed: 7 });
    const e = r.evidence;
    expect(e.seed).toBe(7);
    expect(e.jet!.jetLength).toBe(8);
    expect(e.jet!.precision).toBe("double");
    expect(e.jet!.points).toHaveLength(3);
    for (const p of e.jet!.points) expect(p.t).toBeGreaterThanOrEqual(0.5), expect(p.t).toBeLessThanOrEqual(1.5);
    expect(e.conditions.map((c) => [c.resonance, c.holdsIdentically])).toEqual([[3, true], [4, false]]);
    expect(e.jet!.rhoMaxAt!.resonance).toBe(4);
    expect(e.jet!.rhoMax).toBe(Math.max(...e.conditions.map((c) => c.worstRho)));
    expect(e.invariant!.name).toBe("R");
  });
  it("are deterministic for a seed and change with it", () => {
    const v = variant("nls", { a: "1+0.3*sin(t)", h: "2", k: "0.1" });
    expect(runPainleve(v, { seed: 3 })).toEqual(runPainleve(v, { seed: 3 }));
    expect(runPainleve(v, { seed: 3 }).evidence.jet!.points[0].t).not.toBe(runPainleve(v, { seed: 4 }).evidence.jet!.points[0].t);
  });
});

describe("free parameters", () => {
  // a = 1, h = 2, k = 0.1, b = b0: R = 4(k² - ab) = 0.04 - 4 b0 (nls.md §3, constant coefficients).
  const v = variant("nls", { a: "1", h: "2", k: "0.1", b: "b0" }, [0.5, 1.5], ["b0"]);
  it("unresolved free parameters give undecided with the reason", () => {
    const r = runPainleve(v);
    expect(r.verdict).toBe("undecided");
    expect(r.reason).toBe("undecided: evaluation failed (free parameters not fixed: b0)");
  });
  it("b0 = 0.01 (the value that makes R ≡ 0) passes; b0 = 0.02 fails", () => {
    const pass = runPainleve(v, { values: { b0: 0.01 } });
    expect(pass.verdict).toBe("passes");
    expect(pass.evidence.parameters).toEqual({ b0: 0.01 });
    expect(runPainleve(v, { values: { b0: 0.02 } }).verdict).toBe("fails");
  });
});

describe("preconditions", () => {
  it("h ≡ 0 (a h ≠ 0 fails) is undecided, not a verdict on the linear equation", () => {
    const r = runPainleve(variant("nls", { a: "1", h: "0" }));
    expect(r.verdict).toBe("undecided");
    expect(r.reason).toMatch(/^undecided: evaluation failed \(precondition/);
  });
  it("a coefficient singular across the window is undecided after the redraws", () => {
    const r = runPainleve(variant("kdv", { p: "1", q: "log(t - 10)" }));
    expect(r.verdict).toBe("undecided");
    expect(r.reason).toMatch(/^undecided: evaluation failed \(no regular sample point after 20 draws/);
  });
});

describe("symbolic nontrivial condition with the coefficients substituted", () => {
  it("NLS N2: C4 text evaluated at t = 1, u0 = 1 is -0.48363368 (painleve.md §8) and matches the jet C4", () => {
    const v = variant("nls", { a: "1+0.3*sin(t)", h: "2/(1+t^2)", b: "0.1", k: "0.05", c: "0.2", f: "0.4", e: "t" });
    const r = runPainleve(v, { fixed: vectorInputs(U0_ONE) });
    const sc = r.evidence.nontrivialCondition!;
    expect(sc.resonance).toBe(4);
    expect(sc.generic).toContain("\\frac{2 a R}{h u_{0}}");
    expect(sc.latex.startsWith("C_{4} = ")).toBe(true);
    expect(sc.latex).toContain("\\sin");
    expect(evalCondition(sc.text, 1, 1)).toBeCloseTo(-0.483633679969091, 12);
    const c4 = r.evidence.jet!.points[0].branches[0].conditions.find((c) => c.resonance === 4)!;
    expect(c4.value.re).toBeCloseTo(evalCondition(sc.text, 1, 1), 12);
  });
  it("NLS with chirped u0 = 1 + 0.5iτ: the τ^0 value still uses u0(t_s) = 1", () => {
    const r = runPainleve(variant("nls", { a: "1", h: "2", k: "0.1" }), { fixed: vectorInputs(U0_CHIRPED) });
    expect(evalCondition(r.evidence.nontrivialCondition!.text, 1, 1)).toBeCloseTo(-0.04, 14);
  });
  it("KdV K4: C6 = K/p = -0.01 at t = 1", () => {
    const K4 = {
      p: "1 + 0.3*cos(t)",
      q: "((1 + 0.3*cos(t))/1.3)*exp(0.1*t + 0.46*sin(t))",
      r: "0.1",
      s: "0.2*cos(t)",
      g: "0.5*sin(t)",
      l: "0.1*cos(t) + 0.13*sin(t) + 0.006*sin(t)*cos(t)",
      m: "0.07 + 0.052*cos(t)",
    };
    const sc = runPainleve(variant("kdv", K4)).evidence.nontrivialCondition!;
    expect(sc.resonance).toBe(6);
    expect(evalCondition(sc.text, 1, 1)).toBeCloseTo(-0.01, 12);
  });
  it("mKdV M1: C3 = u0 Q/2 with Q = 2r = 0.2", () => {
    const sc = runPainleve(variant("mkdv", { p: "6", q: "1", r: "0.1" })).evidence.nontrivialCondition!;
    expect(sc.resonance).toBe(3);
    expect(evalCondition(sc.text, 1, 1)).toBeCloseTo(0.1, 14);
  });
});

describe("agreement(reducibility, painlevé) (README.md: reducible ⟺ passes)", () => {
  it("follows the definition", () => {
    expect(agreement("reducible", "passes")).toBe("agree");
    expect(agreement("not-reducible", "fails")).toBe("agree");
    expect(agreement("reducible", "fails")).toBe("conflict");
    expect(agreement("not-reducible", "passes")).toBe("conflict");
    for (const p of ["passes", "fails", "undecided"] as const) expect(agreement("undecided", p)).toBe("inconclusive");
    expect(agreement("reducible", "undecided")).toBe("inconclusive");
    expect(agreement("not-reducible", "undecided")).toBe("inconclusive");
  });
});
