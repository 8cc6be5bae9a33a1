/**
 * The zero test itself: statistic, precision scaling, rounding-noise detection and the
 * high-precision confirmation, on sources with known answers.
 */
import { describe, it, expect } from "vitest";
import { DoubleField, decimalField } from "../../../lib/screening/expr";
import type { Field } from "../../../lib/screening/expr";
import {
  SingularPointError,
  rhoOf,
  scaledThresholds,
  significantDigits,
  sumAndScale,
  trackedField,
  unitRoundoff,
  zeroTest,
} from "../../../lib/screening/zero";
import type { TermSource } from "../../../lib/screening/zero";
import { INVARIANTS, invariantSource } from "../../../lib/screening/reducibility";
import { buildVariant } from "../reducibility/build-variant";

/** Terms given as functions of t in any field: one row (order 0). */
function source(terms: (<T>(t: T, F: Field<T>) => T)[]): TermSource {
  return { terms: <T>(t: string, F: Field<T>) => [terms.map((f) => f(F.fromText(t), F))] };
}

const nlsSource = (c: Record<string, string>) =>
  invariantSource(INVARIANTS.nls, buildVariant("nls", c, [0, 2]).coefficients, {}, 3);

describe("statistic", () => {
  it("rho = |Σ m|/Σ|m|, and an order whose scale is 0 counts as 0 (nls.md §3)", () => {
    // Source: nls.md §3 "Numerical decision" (definition of rho_inv).
    const [s] = sumAndScale([[3, -1, -1]], DoubleField);
    expect(s.value).toBe(1);
    expect(s.scale).toBe(5);
    expect(rhoOf(s, DoubleField)).toBeCloseTo(0.2, 15);
    const [zero] = sumAndScale([[0, 0]], DoubleField);
    expect(rhoOf(zero, DoubleField)).toBe(0);
  });

  it("scales the thresholds by u_ext/u_double (painleve.md §7)", () => {
    // Source: painleve.md §7 "Extended precision": thresholds × u_ext/u_double, u_double = 1.1e-16.
    expect(unitRoundoff(40)).toBeCloseTo(5e-40, 52);
    const th = scaledThresholds({ pass: 1e-12, fail: 1e-9 }, 40);
    expect(th.pass / (1e-12 * (5e-40 / 1.1e-16))).toBeCloseTo(1, 12);
    expect(th.fail / th.pass).toBeCloseTo(1000, 9);
  });
});

describe("rounding-error tracking", () => {
  it("flags cosh(3t)² − sinh(3t)² − 1 as rounding noise in double (ENGINE-NOTES §4 case A6)", () => {
    // Source: ENGINE-NOTES §4, A6: double leaves noise ~1e-8 relative in cosh²−sinh²−1 at large arguments.
    const F = trackedField(DoubleField, 16);
    const t = F.fromText("4.3");
    const x = F.mul(F.fromNumber(3), t);
    const v = F.sub(F.sub(F.mul(F.cosh(x), F.cosh(x)), F.mul(F.sinh(x), F.sinh(x))), F.one);
    expect(Math.abs(v.v)).toBeLessThanOrEqual(4 * v.e * 1.1e-16);
    expect(v.e).toBeGreaterThan(1e10); // the bound is of the size of cosh² (≈ 1e11)
  });

  it("reads short decimal literals as exact in 40 digits but not in double", () => {
    expect(significantDigits("0.0025")).toBe(2);
    expect(significantDigits("-1.2300e-7")).toBe(3);
    expect(trackedField(decimalField(40), 40).fromText("0.3").e).toBe(0);
    expect(trackedField(DoubleField, 16).fromText("0.3").e).toBeGreaterThan(0);
  });
});

describe("zeroTest", () => {
  it("passing member (nls.md §11 c2): zero in double, confirmed zero at 40 and 80 digits", () => {
    // Source: nls.md §11 (c2), R ≡ 0.
    const r = zeroTest(nlsSource({ a: "1/2", k: "0.1", h: "exp(t/5)" }), [0.3, 0.9, 1.7]);
    expect(r.outcome).toBe("zero");
    expect(r.doubleOutcome).toBe("zero");
    expect(r.confirmation).toHaveLength(9);
    expect(r.rhoMax).toBeLessThan(1e-15);
  });

  it("a defect below double resolution: double says zero, 40/80 digits say nonzero (ENGINE-NOTES §4 case A1)", () => {
    // Source: nls.md §10, constant k passes iff b = k²/a; here b = k² + 1e-18 (a = h = 1), so
    // R = -4e-18 (derived in ../shared/math nls.md §3, constant coefficients R = 4(k² - ck - ab)).
    const r = zeroTest(nlsSource({ a: "1", k: "0.3", b: "0.09 + 1e-18", h: "1" }), [0.3, 0.9, 1.7]);
    expect(r.doubleOutcome).toBe("zero");
    expect(r.outcome).toBe("nonzero");
    const c = r.confirmation.find((x) => x.outcome === "nonzero");
    // -a²h²R = 4a³bh² - 4a²k²h² = 4e-18 exactly, in both precisions.
    expect(Number(c?.valueLow)).toBeCloseTo(4e-18, 30);
    expect(Number(c?.valueHigh)).toBeCloseTo(4e-18, 30);
  });

  it("a coefficient that is 0 through cancellation: double nonzero-looking, confirmed zero (ENGINE-NOTES §4 A5/A6)", () => {
    // Source: ENGINE-NOTES §4 cases A5 (sin²+cos²−1) and A6 (cosh²−sinh²−1); nls.md §11 (k2) otherwise.
    const r = zeroTest(nlsSource({ a: "1/2", k: "0.1", b: "0.02 + cosh(3*t)^2 - sinh(3*t)^2 + sin(t)^2 + cos(t)^2 - 2", h: "1" }), [0.3, 0.9, 1.7]);
    expect(r.outcome).toBe("zero");
  });

  it("a coefficient that underflows in double is still seen at 40/80 digits (ENGINE-NOTES §4 case A4)", () => {
    // Source: ENGINE-NOTES §4, A4: b = exp(-(t-40)²) on t ∈ [0.1, 3] underflows in double (false zero);
    // R = -4ab ≠ 0 (derived from nls.md §3 with a = h = 1, c = k = 0).
    const r = zeroTest(nlsSource({ a: "1", b: "exp(-(t - 40)^2)", h: "1" }), [0.3, 0.9, 1.7]);
    expect(r.doubleOutcome).toBe("zero");
    expect(r.outcome).toBe("nonzero");
  });

  it("failing member (nls.md §11 c1): nonzero, settled at the worst point", () => {
    // Source: nls.md §11 (c1), R = 1/25.
    const r = zeroTest(nlsSource({ a: "1/2", k: "0.1", h: "1" }), [0.3, 0.9, 1.7]);
    expect(r.outcome).toBe("nonzero");
    expect(r.doubleOutcome).toBe("nonzero");
    expect(r.confirmation.length).toBe(3); // one point, three orders
  });

  it("redraws a singular sample point, and reports one that stays singular", () => {
    let draws = 0;
    const singularAt = (bad: (t: number) => boolean): TermSource => ({
      terms: <T>(t: string, F: Field<T>) => {
        if (bad(Number(t))) throw new SingularPointError(`singular at ${t}`);
        return [[F.fromText(t), F.neg(F.fromText(t))]];
      },
    });
    const ok = zeroTest(singularAt((t) => t === 0.5), [0.5, 0.7], { redraw: () => 0.6 + 0.01 * ++draws });
    expect(ok.outcome).toBe("zero");
    expect(ok.points[0]).not.toBe(0.5);
    const bad = zeroTest(singularAt(() => true), [0.5], { redraw: () => 0.6 });
    expect(bad.outcome).toBe("failed");
    if (bad.outcome === "failed") expect(bad.reason).toBe("singular-point");
    const broken = zeroTest({ terms: () => { throw new Error("boom"); } }, [0.5]);
    expect(broken.outcome === "failed" && broken.reason).toBe("evaluation-failure");
  });

  it("a genuinely tiny residual far below both precisions stays borderline, never zero by accident", () => {
    // Design check: 1 - (1 + 1e-60) is 1e-60 relative: invisible at 40 digits, visible at 80.
    const s = source([<T>(t: T, F: Field<T>) => F.one, <T>(t: T, F: Field<T>) => F.neg(F.fromText("1.000000000000000000000000000000000000000000000000000000000001"))]);
    const r = zeroTest(s, [0.5]);
    expect(r.outcome).toBe("borderline");
  });
});
