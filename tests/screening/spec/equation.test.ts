import { describe, it, expect } from "vitest";
import { parseFamilies, parseEquation, CLASS_COEFFICIENTS, type FamilySpec } from "../../../lib/screening/spec";
import { compileExpression, parseExpression, type Expr } from "../../../lib/screening/expr";

/**
 * Each case gives an equation as a practitioner writes it and the same family with its
 * normal-form coefficients written out by hand. The hand derivation moves every term to the left
 * and divides so the equation starts with i u_t (NLS) or u_t (KdV, mKdV), then reads the
 * coefficients off the normal forms in ../shared/math/README.md ("The three classes" table).
 */
interface Case {
  name: string;
  cls: "nls" | "kdv" | "mkdv";
  equation: string;
  coefficients: Record<string, string>;
  extra?: string; // extra YAML lines (parameters, functions, variables), 4-space indented
  window?: string;
}

const CASES: Case[] = [
  {
    // Canonical NLS target of the README with sigma = +1: i chi_tau + chi_xixi + 2|chi|^2 chi = 0.
    name: "canonical NLS",
    cls: "nls",
    equation: "i*u_t + u_xx + 2*|u|^2*u = 0",
    coefficients: { a: "1", h: "2" },
  },
  {
    // Canonical KdV target U_T + 6 U U_X + U_XXX = 0 (README).
    name: "canonical KdV",
    cls: "kdv",
    equation: "u_t + 6*u*u_x + u_xxx = 0",
    coefficients: { p: "6", q: "1" },
  },
  {
    // Canonical mKdV target with sigma = +1 (README).
    name: "canonical mKdV",
    cls: "mkdv",
    equation: "u_t + 6*u^2*u_x + u_xxx = 0",
    coefficients: { p: "6", q: "1" },
  },
  {
    // Gross–Pitaevskii type with a breathing trap. Derived in ../shared/math/nls.md
    // ("Gross–Pitaevskii": a = 1/2, b = -omega^2/2, h = -G); here the cubic term is +g, so h = g.
    name: "Gross–Pitaevskii with a modulated trap",
    cls: "nls",
    equation: "i*u_t + 1/2*u_xx - w(t)^2/2*x^2*u + g(t)*|u|^2*u = 0",
    coefficients: { a: "1/2", b: "-w(t)^2/2", h: "g(t)" },
    extra: `    parameters: { w0: 0.8, eps: 0.1, Om: 3, g0: 1.5 }
    functions:
      w: "w0*(1 + eps*cos(Om*t))"
      g: "-g0*exp(-t)"`,
  },
  {
    // Fibre form with gain. Derived in ../shared/math/nls.md ("Fibre optics": a = -beta2/2,
    // h = gnl, k = alphaL/2); a gain g0 is alphaL = -g0, written on the right as i g0/2 u, so k = -g0/2.
    name: "fibre with distributed gain",
    cls: "nls",
    equation: "i*u_z - beta2(z)/2*u_TT + gam*|u|^2*u = i*g0/2*u",
    coefficients: { a: "-beta2(z)/2", h: "gam", k: "-g0/2" },
    extra: `    variables: { evolution: z, space: T }
    parameters: { L: 2, gam: 1.3, g0: 0.2 }
    functions: { beta2: "-1/(1 + z/L)" }`,
  },
  {
    // Cylindrical KdV: u_t + 6 u u_x + u_xxx + u/(2t) = 0, so r = 1/(2t).
    name: "cylindrical KdV",
    cls: "kdv",
    equation: "u_t + 6*u*u_x + u_xxx + u/(2*t) = 0",
    coefficients: { p: "6", q: "1", r: "1/(2*t)" },
    window: "[1, 5]",
  },
  {
    // Damped NLS: i k u with k = gam > 0 is damping (README).
    name: "damped NLS",
    cls: "nls",
    equation: "i*u_t + u_xx + |u|^2*u + i*gam*u = 0",
    coefficients: { a: "1", h: "1", k: "gam" },
    extra: "    parameters: { gam: 0.05 }",
  },
  {
    // Forced KdV: the right side l + m x of the normal form.
    name: "KdV with forcing",
    cls: "kdv",
    equation: "u_t + 6*u*u_x + u_xxx = F0*cos(Om*t) + F1*x",
    coefficients: { p: "6", q: "1", l: "F0*cos(Om*t)", m: "F1" },
    extra: "    parameters: { F0: 0.3, Om: 2, F1: -0.1 }",
  },
  {
    // u_t = i u_xx + i |u|^2 u; multiplying by i gives i u_t + u_xx + |u|^2 u = 0.
    name: "NLS written as an evolution law",
    cls: "nls",
    equation: "u_t = i*u_xx + i*|u|^2*u",
    coefficients: { a: "1", h: "1" },
  },
  {
    // 2 i u_t + u_xx + 4|u|^2 u = 0 divided by 2.
    name: "NLS with a factor on i u_t, abs() form",
    cls: "nls",
    equation: "2*i*u_t + u_xx + 4*abs(u)^2*u = 0",
    coefficients: { a: "1/2", h: "2" },
  },
  {
    // Every NLS term, with the potential in parentheses and |u|^2 after u.
    name: "NLS with every normal-form term",
    cls: "nls",
    equation: "i*u_t + a0*u_xx + (b0*x^2 + f0*x + e0)*u + h0*u*|u|^2 + i*k0*u + i*c0*x*u_x + i*g1*u_x = 0",
    coefficients: { a: "a0", b: "b0", f: "f0", e: "e0", h: "h0", k: "k0", c: "c0", g: "g1" },
    extra: "    parameters: { a0: 0.7, b0: -0.2, f0: 0.1, e0: 0.3, h0: -1.1, k0: 0.05, c0: 0.4, g1: -0.6 }",
  },
  {
    // vc-mKdV with every term.
    name: "mKdV with every normal-form term",
    cls: "mkdv",
    equation: "u_t + p0*exp(t)*u^2*u_x + q0*u_xxx + r0*u + (s0*x + g0)*u_x = 0",
    coefficients: { p: "p0*exp(t)", q: "q0", r: "r0", s: "s0", g: "g0" },
    extra: "    parameters: { p0: 6, q0: 1, r0: 0.1, s0: -0.2, g0: 0.5 }",
  },
  {
    // Nonlinear term on the right: u_t + u_xxx = -6 u_x u.
    name: "KdV with the nonlinearity on the right",
    cls: "kdv",
    equation: "u_t + u_xxx = -6*u_x*u",
    coefficients: { p: "6", q: "1" },
  },
  {
    // 3 u_t + 18 u u_x + u_xxx = 0 divided by 3.
    name: "KdV with a factor on u_t",
    cls: "kdv",
    equation: "3*u_t + 18*u*u_x + u_xxx = 0",
    coefficients: { p: "6", q: "1/3" },
  },
  {
    // A time-dependent factor on i u_t: divide the whole equation by m(t).
    name: "NLS with a time-dependent factor on i u_t and a free parameter",
    cls: "nls",
    equation: "i*m(t)*u_t + u_xx + h1*|u|^2*u - 0.25*x^2*u = 0",
    coefficients: { a: "1/m(t)", h: "h1/m(t)", b: "-0.25/m(t)" },
    extra: `    parameters: { h1: free, m0: { values: [1, 2] } }
    functions: { m: "m0 + t" }`,
  },
  {
    // The unknown named psi (variables.field), a Gross–Pitaevskii habit.
    name: "NLS with the unknown called psi",
    cls: "nls",
    equation: "i*psi_t = -1/2*psi_xx + 1/2*x^2*psi - |psi|^2*psi",
    coefficients: { a: "1/2", b: "-1/2", h: "1" },
    extra: "    variables: { field: psi }",
  },
];

function yamlFor(c: Case, form: "equation" | "coefficients"): string {
  const body =
    form === "equation"
      ? `    equation: ${JSON.stringify(c.equation)}`
      : `    coefficients:\n${Object.entries(c.coefficients).map(([k, v]) => `      ${k}: ${JSON.stringify(v)}`).join("\n")}`;
  // "field" only belongs to equation families; drop it from the written-out form.
  const extra = (c.extra ?? "").replace(/variables: \{ field: psi \}/, form === "equation" ? "variables: { field: psi }" : "");
  return `wavesieve: 1
families:
  - id: case
    class: ${c.cls}
${extra}
${body}
    window: ${c.window ?? "[0, 2]"}
`;
}

function only(text: string): FamilySpec {
  const r = parseFamilies(text);
  expect(r.errors).toEqual([]);
  expect(r.families).toHaveLength(1);
  return r.families[0];
}

function evaluator(e: Expr, free: string[]): (t: number, f: number[]) => number {
  const fn = compileExpression(e, ["t", ...free]);
  return (t, f) => fn(t, ...f);
}

describe("equation strings give the same normal-form coefficients as writing them out", () => {
  for (const c of CASES) {
    it(c.name, () => {
      const fromEquation = only(yamlFor(c, "equation"));
      const written = only(yamlFor(c, "coefficients"));
      expect(fromEquation.equation).toBe(c.equation);
      expect(fromEquation.variants.length).toBe(written.variants.length);
      const [t0, t1] = written.window;
      const ts = [0, 0.17, 0.5, 0.83, 1].map((s) => t0 + s * (t1 - t0));
      const freeValues = written.variants[0].free.map((_, j) => 0.7 + 0.3 * j);
      fromEquation.variants.forEach((v, i) => {
        const w = written.variants[i];
        expect(v.parameters).toEqual(w.parameters);
        expect(v.free).toEqual(w.free);
        for (const name of CLASS_COEFFICIENTS[c.cls]) {
          const got = evaluator(v.coefficients[name], v.free);
          const want = evaluator(w.coefficients[name], w.free);
          for (const t of ts) {
            const g = got(t, freeValues);
            const e = want(t, freeValues);
            expect(Math.abs(g - e), `${name} at t=${t}: ${g} vs ${e}`).toBeLessThanOrEqual(1e-13 * Math.max(1, Math.abs(e)));
          }
        }
      });
    });
  }

  it("reads the coefficients exactly for the canonical NLS (canonical text)", () => {
    const scope = { evolution: "t", space: "x", parameters: new Set<string>(), helpers: new Map() };
    const r = parseEquation({ text: "i*u_t + u_xx + 2*|u|^2*u = 0", cls: "nls", scope });
    expect(r.ok).toBe(true);
    if (r.ok) {
      expect([...r.coefficients.keys()].sort()).toEqual(["a", "h"]);
      expect(r.coefficients.get("a")).toEqual({ kind: "num", value: 1, text: "1" });
      expect(r.coefficients.get("h")).toEqual({ kind: "num", value: 2, text: "2" });
    }
  });
});

describe("equation strings with terms outside the class", () => {
  const scope = (params: string[] = []) => ({ evolution: "t", space: "x", parameters: new Set(params), helpers: new Map() });
  const problemsOf = (text: string, cls: "nls" | "kdv" | "mkdv", params: string[] = []) => {
    const r = parseEquation({ text, cls, scope: scope(params) });
    expect(r.ok).toBe(false);
    return r.ok ? [] : r.problems;
  };

  it("reports u^3 in a KdV equation at its position", () => {
    const text = "u_t + 6*u*u_x + u_xxx + u^3 = 0";
    const [p] = problemsOf(text, "kdv");
    expect(p.code).toBe("equation-term");
    expect(p.message).toMatch(/term 'u\^3' is not part of the vc-KdV normal form/);
    expect(p.char).toBe(text.indexOf("u^3") + 1);
  });

  it("reports an imaginary dispersion coefficient in NLS", () => {
    const text = "i*u_t + i*u_xx + |u|^2*u = 0";
    const [p] = problemsOf(text, "nls");
    expect(p.code).toBe("equation-term");
    expect(p.char).toBe(text.indexOf("i*u_xx") + 1);
  });

  it("reports the KdV nonlinearity in an mKdV equation and u_xx in KdV", () => {
    expect(problemsOf("u_t + 6*u*u_x + u_xxx = 0", "mkdv")[0].message).toMatch(/'6\*u\*u_x' is not part of the vc-mKdV/);
    const dispersive = "u_t + 6*u*u_x + u_xxx + u_xx = 0";
    expect(problemsOf(dispersive, "kdv")[0].char).toBe(dispersive.lastIndexOf("u_xx") + 1);
  });

  it("reports x^3, sin(u), division by u and a right-side term at their positions", () => {
    const cubic = "i*u_t + u_xx + x^3*u + |u|^2*u = 0";
    expect(problemsOf(cubic, "nls")[0].char).toBe(cubic.indexOf("x^3") + 1);
    const sine = "u_t + sin(u)*u_x + u_xxx = 0";
    const s = problemsOf(sine, "kdv")[0];
    expect(s.code).toBe("equation-term");
    expect(s.char).toBe(sine.indexOf("sin") + 1);
    const quotient = "u_t + u_x/u + u*u_x + u_xxx = 0";
    expect(problemsOf(quotient, "kdv")[0].char).toBe(quotient.indexOf("u_x/u") + 1);
    const right = "u_t + 6*u*u_x + u_xxx = u^2";
    expect(problemsOf(right, "kdv")[0].char).toBe(right.indexOf("u^2") + 1);
  });

  it("reports a missing time derivative, a space-dependent u_t factor and two '='", () => {
    expect(problemsOf("6*u*u_x + u_xxx = 0", "kdv")[0].code).toBe("equation-no-time-derivative");
    expect(problemsOf("x*u_t + 6*u*u_x + u_xxx = 0", "kdv")[0].code).toBe("equation-term");
    expect(problemsOf("u_t = 6*u*u_x = 0", "kdv")[0].code).toBe("equation-syntax");
    expect(problemsOf("u_t + 6*u*u_x + u_xxx", "kdv")[0].code).toBe("equation-syntax");
  });

  it("maps positions back through the |u| rewriting", () => {
    const text = "i*u_t + |u|^2*u + w*u_xx = 0";
    const [p] = problemsOf(text, "nls");
    expect(p.code).toBe("unknown-symbol");
    expect(p.char).toBe(text.indexOf("w*u_xx") + 1);
  });

  it("refuses |…| around anything but the unknown", () => {
    const text = "i*u_t + u_xx + |u + 1|^2*u = 0";
    const [p] = problemsOf(text, "nls");
    expect(p.code).toBe("equation-syntax");
    expect(p.char).toBe(text.indexOf("|") + 1);
  });

  it("does not split inside exponents of numbers (1e-3)", () => {
    const r = parseEquation({ text: "u_t + 1e-3*u*u_x + u_xxx = 0", cls: "kdv", scope: scope() });
    expect(r.ok).toBe(true);
    if (r.ok) {
      const p = r.coefficients.get("p")!;
      expect(compileExpression(p, [])()).toBeCloseTo(1e-3, 15);
    }
  });
});

describe("coefficient strings are parsed with the same expression layer", () => {
  it("matches a direct parse of the written coefficient", () => {
    const direct = parseExpression("-g0/2", { symbols: new Set(["g0", "t"]) });
    expect(direct.ok).toBe(true);
    const f = only(`wavesieve: 1
families:
  - id: direct
    class: nls
    parameters: { g0: free }
    coefficients: { a: 1, h: 1, k: "-g0/2" }
    window: [0, 1]
`);
    if (direct.ok) expect(f.variants[0].coefficients.k).toEqual(direct.expr);
    expect(f.variants[0].coefficients.b).toEqual({ kind: "num", value: 0, text: "0" });
  });
});
