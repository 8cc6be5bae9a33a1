import { describe, it, expect } from "vitest";
import * as math from "mathjs";
import {
  DoubleField,
  decimalField,
  evalJet,
  evalJetAt,
  evalJetDouble,
  variableJet,
  constantJet,
  jetAdd,
  jetMul,
  jetDiv,
  jetDerivative,
  jetDerivativeValue,
  jetPow,
  jetPowConst,
  jetPowInt,
  jetSqrt,
  jetLog,
  jetAbs,
  jetScale,
  jetSub,
  JetEvaluationError,
} from "../../../lib/screening/expr";
import type { Jet } from "../../../lib/screening/expr";
import { CORPUS, PARAMS, parseOk } from "./helpers";

const POINTS = [0.35, 0.8, 1.45];
const MAX_ORDER = 4;

function factorial(k: number): number {
  let f = 1;
  for (let j = 2; j <= k; j++) f *= j;
  return f;
}

/** Reference: repeated symbolic differentiation by mathjs (`derivative`), then evaluation. */
function mathjsDerivatives(text: string, t: number, order: number): number[] {
  let node: math.MathNode = math.parse(text);
  const scope = { ...PARAMS, t };
  const out: number[] = [];
  for (let k = 0; k <= order; k++) {
    out.push(Number(node.compile().evaluate(scope)));
    // simplify: false — mathjs simplify on the swollen 4th derivatives takes minutes.
    node = math.derivative(node, "t", { simplify: false });
  }
  return out;
}

describe("jets agree with mathjs derivative (general reference library)", () => {
  for (const text of CORPUS) {
    it(`${text}: derivatives 0..${MAX_ORDER} at ${POINTS.length} points, rel. error ≤ 1e-12`, () => {
      const expr = parseOk(text);
      for (const t of POINTS) {
        const jet = evalJetAt(expr, "t", t, PARAMS, MAX_ORDER, DoubleField);
        const ref = mathjsDerivatives(text, t, MAX_ORDER);
        for (let k = 0; k <= MAX_ORDER; k++) {
          const got = jet[k] * factorial(k);
          // Relative to the size of the reference (or 1 where the derivative itself is near 0).
          expect(Math.abs(got - ref[k])).toBeLessThanOrEqual(1e-12 * Math.max(1, Math.abs(ref[k])));
        }
      }
    });
  }
});

describe("jets in decimalField(50)", () => {
  const D = decimalField(50);

  it("agree with the double jets on the whole corpus (rel. 1e-12)", () => {
    for (const text of CORPUS) {
      const expr = parseOk(text);
      const params = Object.fromEntries(Object.entries(PARAMS).map(([k, v]) => [k, D.fromNumber(v)]));
      const dec = evalJetAt(expr, "t", D.fromNumber(0.8), params, MAX_ORDER, D);
      const dbl = evalJetAt(expr, "t", 0.8, PARAMS, MAX_ORDER, DoubleField);
      for (let k = 0; k <= MAX_ORDER; k++) {
        const x = D.toNumber(dec[k]);
        expect(Math.abs(x - dbl[k]), `${text} c${k}`).toBeLessThanOrEqual(1e-12 * Math.max(1, Math.abs(x)));
      }
    }
  });

  it("sin² + cos² − 1 vanishes to |c_k| < 1e-45 (Pythagorean identity)", () => {
    const expr = parseOk("sin(w*t + eps)^2 + cos(w*t + eps)^2 - 1");
    const params = { w: D.fromText("1.7"), eps: D.fromText("0.3") };
    for (const t of ["0.35", "0.8", "1.45"]) {
      const jet = evalJetAt(expr, "t", D.fromText(t), params, 8, D);
      for (const c of jet) expect(Math.abs(D.toNumber(c))).toBeLessThan(1e-45);
    }
  });

  it("cosh² − sinh² − 1, exp(log(u)) − u, sqrt(v)² − v, tanh − sinh·sech vanish to 1e-45 (hyperbolic identity; inverse functions)", () => {
    const id1 = parseOk("cosh(3*t)^2 - sinh(3*t)^2 - 1");
    const id2 = parseOk("exp(log(2 + sin(t))) - (2 + sin(t))");
    const id3 = parseOk("sqrt(1 + t^2)^2 - 1 - t^2");
    const id4 = parseOk("tanh(t) - sinh(t)*sech(t)");
    for (const expr of [id1, id2, id3, id4]) {
      const jet = evalJetAt(expr, "t", D.fromText("0.8"), { k: D.fromText("0.6") }, 6, D);
      for (const c of jet) expect(Math.abs(D.toNumber(c))).toBeLessThan(1e-45);
    }
  });

  it("reads pi as written to ~60 digits: sin(pi) jet is ~1e-50, not the double error 1.2e-16", () => {
    const expr = parseOk("sin(pi*t)");
    const jet = evalJetAt(expr, "t", D.one, {}, 0, D);
    expect(Math.abs(D.toNumber(jet[0]))).toBeLessThan(1e-48);
  });

  it("reads 0.1 exactly: 10*0.1 - 1 is exactly 0 in decimal (0.1 is not a double)", () => {
    const jet = evalJet(parseOk("10*0.1 - 1"), {}, 0, D);
    expect(D.isZero(jet[0])).toBe(true);
  });

  it("exp(g0 t) matches the closed form c_k = g0^k e^{g0 t}/k! to 1e-45 (Taylor series of exp)", () => {
    const expr = parseOk("exp(g0*t)");
    const g0 = D.fromText("-0.4");
    const t = D.fromText("0.8");
    const jet = evalJetAt(expr, "t", t, { g0 }, 6, D);
    let ref = D.exp(D.mul(g0, t));
    for (let k = 0; k <= 6; k++) {
      if (k > 0) ref = D.div(D.mul(ref, g0), D.fromNumber(k));
      expect(Math.abs(D.toNumber(D.sub(jet[k], ref)))).toBeLessThan(1e-45);
    }
  });
});

describe("jet arithmetic", () => {
  const F = DoubleField;
  const a: Jet<number> = [2, 1, 0.5, -0.25];
  const b: Jet<number> = [1.5, -2, 0, 3];

  it("mul then div returns the factor (div is the inverse of the Cauchy product)", () => {
    const back = jetDiv(jetMul(a, b, F), b, F);
    back.forEach((c, k) => expect(c).toBeCloseTo(a[k], 14));
  });

  it("add, sub and scale act coefficient-wise", () => {
    expect(jetAdd(a, b, F)).toEqual([3.5, -1, 0.5, 2.75]);
    expect(jetSub(a, b, F)).toEqual([0.5, 3, 0.5, -3.25]);
    expect(jetScale(a, 2, F)).toEqual([4, 2, 1, -0.5]);
  });

  it("derivative: c'_m = (m+1) c_{m+1}, one order shorter (painleve.md §5)", () => {
    expect(jetDerivative(a, F)).toEqual([1, 1, -0.75]);
    // d/dt of the jet of t^3 at t = 2 is the jet of 3 t^2: [12, 12, 3].
    const t3 = jetPowInt(variableJet(2, 3, F), 3, F);
    expect(jetDerivative(t3, F)).toEqual([12, 12, 3]);
    expect(jetDerivativeValue(t3, 3, F)).toBe(6);
  });

  it("integer powers of a negative base are exact; (-2+τ)^3 = -8 + 12τ - 6τ² + τ³", () => {
    const x = variableJet(-2, 3, F);
    expect(jetPowInt(x, 3, F)).toEqual([-8, 12, -6, 1]);
    expect(jetPowConst(x, 3, F)).toEqual([-8, 12, -6, 1]);
    expect(jetPow(x, constantJet(3, 3, F), F)).toEqual([-8, 12, -6, 1]);
    // (t-2)^-2 at t = 0: 1/(τ-2)^2 = 1/4 + τ/4 + 3τ²/16 + τ³/8.
    const inv = jetPowInt(variableJet(-2, 3, F), -2, F);
    [0.25, 0.25, 0.1875, 0.125].forEach((c, k) => expect(inv[k]).toBeCloseTo(c, 15));
  });

  it("sqrt squared is the argument", () => {
    const s = jetSqrt(a, F);
    jetMul(s, s, F).forEach((c, k) => expect(c).toBeCloseTo(a[k], 14));
  });

  it("evalJetDouble equals evalJet over DoubleField", () => {
    const expr = parseOk("a0*exp(g0*t)");
    const env = { t: variableJet(0.5, 2, F), a0: constantJet(1.3, 2, F), g0: constantJet(-0.4, 2, F) };
    expect(evalJetDouble(expr, env, 2)).toEqual(evalJet(expr, env, 2, F));
  });

  describe("throws JetEvaluationError where the point is singular", () => {
    const cases: [string, number, string][] = [
      ["1/(t - 1)", 1, "zero-divisor"],
      ["log(t)", 0, "log-domain"],
      ["log(t - 2)", 1, "log-domain"],
      ["sqrt(t - 2)", 1, "sqrt-domain"],
      ["sqrt(t)", 0, "sqrt-domain"],
      ["abs(t)", 0, "abs-at-zero"],
      ["t^0.5", 0, "pow-domain"],
      ["(t - 2)^1.5", 1, "pow-domain"],
      ["csch(t)", 0, "zero-divisor"],
      ["coth(t)", 0, "zero-divisor"],
      ["exp(exp(t))", 7, "non-finite"],
    ];
    for (const [text, t, failure] of cases) {
      it(`${text} at t = ${t}: ${failure}`, () => {
        const expr = parseOk(text);
        let caught: unknown;
        try {
          evalJetAt(expr, "t", t, {}, 2, F);
        } catch (err) {
          caught = err;
        }
        expect(caught).toBeInstanceOf(JetEvaluationError);
        expect((caught as JetEvaluationError).failure).toBe(failure);
      });
    }
    it("log and abs fail directly on bad leading coefficients", () => {
      expect(() => jetLog([-1, 1], F)).toThrow(JetEvaluationError);
      expect(() => jetAbs([0, 1], F)).toThrow(JetEvaluationError);
      expect(jetAbs([0], F)).toEqual([0]);
      expect(jetAbs([-2, 1], F)).toEqual([2, -1]);
    });
  });
});
