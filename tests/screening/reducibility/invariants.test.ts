/**
 * The invariants as the engine evaluates them (polynomial forms over jets) against independent
 * references: the explicit forms differentiated by mathjs, and the published check values.
 */
import { describe, it, expect } from "vitest";
import { create, all } from "mathjs";
import type { MathNode } from "mathjs";
import { DoubleField } from "../../../lib/screening/expr";
import { INVARIANTS, invariantJet, polynomialFormLatex } from "../../../lib/screening/reducibility";
import { createRng } from "../../../lib/screening/random";
import type { EquationClass } from "../../../lib/screening/spec/types";
import { buildVariant } from "./build-variant";

const math = create(all);

/** Explicit forms: nls.md §3 (R), kdv.md §2 (K), mkdv.md §2 (Q), built with mathjs derivatives. */
function explicitInvariant(cls: EquationClass, c: Record<string, string>): MathNode {
  const P = (s: string): MathNode => math.parse(s);
  const D = (n: MathNode): MathNode => math.derivative(n, "t", { simplify: false });
  const get = (k: string): MathNode => P(c[k] ?? "0");
  const wrap = (n: MathNode): string => `(${n.toString()})`;
  if (cls === "nls") {
    const [a, b, cc, h, k] = ["a", "b", "c", "h", "k"].map(get);
    const W = P(`${wrap(D(a))}/${wrap(a)} - ${wrap(D(h))}/${wrap(h)} + 2*(${wrap(k)} - ${wrap(cc)})`);
    return P(`${wrap(D(W))} - ${wrap(D(a))}/${wrap(a)}*${wrap(W)} + ${wrap(W)}^2 + 2*${wrap(cc)}*${wrap(W)} - 4*${wrap(a)}*${wrap(b)}`);
  }
  if (cls === "kdv") {
    const [p, q, r, s, m] = ["p", "q", "r", "s", "m"].map(get);
    const Z = P(`${wrap(D(q))}/${wrap(q)} - ${wrap(D(p))}/${wrap(p)} + ${wrap(r)} - 2*${wrap(s)}`);
    return P(`${wrap(D(Z))} + ${wrap(Z)}*(${wrap(Z)} + ${wrap(r)} + ${wrap(s)} - ${wrap(D(p))}/${wrap(p)}) - ${wrap(p)}*${wrap(m)}`);
  }
  const [p, q, r, s] = ["p", "q", "r", "s"].map(get);
  return P(`${wrap(D(q))}/${wrap(q)} - ${wrap(D(p))}/${wrap(p)} + 2*(${wrap(r)} - ${wrap(s)})`);
}

const fmt = (x: number): string => x.toFixed(6);

/** Random smooth members with every coefficient entering the invariant nonzero. */
function randomMember(cls: EquationClass, seed: number): Record<string, string> {
  const rng = createRng(seed);
  const u = (lo: number, hi: number): string => fmt(rng.uniform(lo, hi));
  const smoothPositive = (): string => `${u(1, 2)} + ${u(-0.4, 0.4)}*sin(${u(0.5, 2)}*t)`;
  if (cls === "nls") {
    return {
      a: smoothPositive(),
      b: `${u(-1, 1)} + ${u(-0.5, 0.5)}*cos(t)`,
      c: `${u(-0.5, 0.5)}*cos(${u(0.5, 1.5)}*t)`,
      h: `${u(0.5, 2)}*exp(${u(-0.5, 0.5)}*t)/(1 + ${u(0.1, 0.5)}*t^2)`,
      k: `${u(-0.3, 0.3)} + ${u(-0.2, 0.2)}*t`,
      e: "t",
      f: "0.3",
      g: "0.1",
    };
  }
  const base = { p: smoothPositive(), q: `${u(0.5, 2)}*exp(${u(-0.3, 0.3)}*t)*(2 + cos(t))`, r: `${u(-0.5, 0.5)}*t`, s: `${u(-0.5, 0.5)}*sin(t)`, g: "t" };
  return cls === "kdv" ? { ...base, m: `${u(-1, 1)}/(1 + t)`, l: "1" } : base;
}

describe("invariant polynomial forms against the explicit forms (mathjs derivatives)", () => {
  // Reference: explicit forms of nls.md §3, kdv.md §2, mkdv.md §2 ("derived in ../shared/math"),
  // differentiated symbolically by mathjs 15 (a general reference library), evaluated in double.
  for (const cls of ["nls", "kdv", "mkdv"] as const) {
    it(`${cls}: order-0 and order-1 Taylor coefficients agree on 8 random members`, () => {
      for (let seed = 1; seed <= 8; seed++) {
        const c = randomMember(cls, 100 * seed + cls.length);
        const v = buildVariant(cls, c, [0, 2]);
        const reference = explicitInvariant(cls, c);
        const referenceDerivative = math.derivative(reference, "t", { simplify: false }).compile();
        const compiled = reference.compile();
        for (const t of [0.37, 1.21, 1.83]) {
          const jet = invariantJet(INVARIANTS[cls], v.coefficients, t, {}, 2, DoubleField);
          const x0 = compiled.evaluate({ t }) as number;
          const x1 = referenceDerivative.evaluate({ t }) as number;
          expect(Math.abs(jet[0] - x0)).toBeLessThanOrEqual(1e-10 * Math.max(1, Math.abs(x0)));
          expect(Math.abs(jet[1] - x1)).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(x1)));
        }
      }
    });
  }
});

describe("invariant check values at t = 1", () => {
  // Source: derived in ../shared/math (painleve.md §8, "Invariant check values", [✓ invariant_values]).
  const bStar =
    "(1330*sin(t) + 75*sin(2*t) - 90*sin(3*t) + 109*cos(t) - (2409/2)*cos(2*t) - 9*cos(3*t) + 809/2) / (40*(3*sin(t) + 10)^3)";
  const N4 = { a: "1 + 0.3*sin(t)", k: "0.1", c: "0.2*cos(t)", h: "2*exp(0.3*t)", f: "0.4*t", e: "t^2", g: "0.5", b: bStar };
  const K3 = {
    p: "1 + 0.3*cos(t)",
    q: "(1 + 0.3*cos(t))/1.3*exp(0.1*t + 0.46*sin(t))",
    r: "0.1",
    s: "0.2*cos(t)",
    g: "0.5*sin(t)",
    m: "0.06 + 0.052*cos(t)",
    l: "0.1*cos(t) + 0.13*sin(t) + 0.006*sin(t)*cos(t)",
  };
  const cases: [string, EquationClass, Record<string, string>, number][] = [
    ["N1", "nls", { a: "1", h: "2", k: "0.1" }, 0.04],
    ["N2", "nls", { a: "1 + 0.3*sin(t)", h: "2/(1+t^2)", b: "0.1", k: "0.05", c: "0.2", f: "0.4", e: "t" }, 0.193076386785166],
    ["N4", "nls", N4, 0],
    ["N4 with b + 0.01", "nls", { ...N4, b: `${bStar} + 0.01` }, -0.0500976518176948],
    ["a=1, h=2/(1+t^2)", "nls", { a: "1", h: "2/(1+t^2)" }, 1],
    ["GP trap a=1/2, b=-1/2, h=1", "nls", { a: "1/2", b: "-1/2", h: "1" }, 1],
    ["a=1, k=0.1, h=2e^{-0.2t}", "nls", { a: "1", k: "0.1", h: "2*exp(-0.2*t)" }, 0.16],
    ["K1 r=0.1", "kdv", { p: "1", q: "1", r: "0.1" }, 0.02],
    ["K2 p=t, q=t^2", "kdv", { p: "t", q: "t^2" }, -1],
    ["K3", "kdv", K3, 0],
    ["K4 = K3, m + 0.01", "kdv", { ...K3, m: "0.07 + 0.052*cos(t)" }, -0.0116209069176044],
    ["cylindrical r = 1/(2t)", "kdv", { p: "1", q: "1", r: "1/(2*t)" }, 0],
    ["m = 0.1", "kdv", { p: "1", q: "1", m: "0.1" }, -0.1],
    ["M1 r = 0.1", "mkdv", { p: "6", q: "1", r: "0.1" }, 0.2],
    ["M2", "mkdv", { q: "1 + 0.5*sin(t)", r: "0.2 + 0.1*cos(t)", s: "0.1*cos(t)", g: "0.3*t", p: "6*(1 + 0.5*sin(t))*exp(0.4*t)" }, 0],
    ["r = 1/(2t)", "mkdv", { p: "1", q: "1", r: "1/(2*t)" }, 1],
    ["r = s = 1/(2t)", "mkdv", { p: "1", q: "1", r: "1/(2*t)", s: "1/(2*t)" }, 0],
  ];
  for (const [name, cls, c, expected] of cases) {
    it(`${cls} ${name}: ${INVARIANTS[cls].symbol}(1) = ${expected}`, () => {
      const v = buildVariant(cls, c, [0.5, 2]);
      const value = invariantJet(INVARIANTS[cls], v.coefficients, 1, {}, 1, DoubleField)[0];
      expect(Math.abs(value - expected)).toBeLessThanOrEqual(1e-12);
    });
  }
});

describe("monomial tables", () => {
  it("have the sizes of the class files (13, 14, 4 monomials) and print their polynomial form", () => {
    // Source: nls.md §3 (R-poly, 13 monomials), kdv.md §2 (14), mkdv.md §2 (4).
    expect(INVARIANTS.nls.monomials).toHaveLength(13);
    expect(INVARIANTS.kdv.monomials).toHaveLength(14);
    expect(INVARIANTS.mkdv.monomials).toHaveLength(4);
    expect(polynomialFormLatex(INVARIANTS.mkdv)).toBe("pqQ = pq' - qp' + 2pqr - 2pqs");
    expect(polynomialFormLatex(INVARIANTS.nls).startsWith("-a^{2}h^{2}R = 4a^{3}bh^{2} - 4a^{2}k^{2}h^{2}")).toBe(true);
  });
});
