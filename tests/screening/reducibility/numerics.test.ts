/**
 * The small numerical tools of the free-parameter solve: dual numbers and the linear algebra.
 */
import { describe, it, expect } from "vitest";
import { create, all } from "mathjs";
import { DoubleField, evalJet, variableJet } from "../../../lib/screening/expr";
import { dualField } from "../../../lib/screening/reducibility";
import { pivotColumns, solveLinear, svd } from "../../../lib/screening/reducibility/linalg";
import { parse } from "./build-variant";

const math = create(all);

describe("dual numbers", () => {
  it("give the exact parameter gradient of a jet (mathjs derivative as the reference)", () => {
    const F = dualField(DoubleField, 2);
    const e = parse("exp(g0*t)*sin(b0*t)/(1 + b0^2) + sqrt(1 + g0^2*t)", ["b0", "g0"]);
    const env = { t: variableJet(F.constant(0.7), 1, F), b0: [F.variable(0.4, 0), F.zero], g0: [F.variable(-0.3, 1), F.zero] };
    const jet = evalJet(e, env, 1, F);
    const ref = math.parse("exp(g0*t)*sin(b0*t)/(1 + b0^2) + sqrt(1 + g0^2*t)");
    const scope = { t: 0.7, b0: 0.4, g0: -0.3 };
    expect(jet[0].v).toBeCloseTo(ref.evaluate(scope) as number, 14);
    expect(jet[0].d[0]).toBeCloseTo(math.derivative(ref, "b0").evaluate(scope) as number, 13);
    expect(jet[0].d[1]).toBeCloseTo(math.derivative(ref, "g0").evaluate(scope) as number, 13);
    // d/dt of the value, and its b0-derivative (mixed second derivative).
    expect(jet[1].v).toBeCloseTo(math.derivative(ref, "t").evaluate(scope) as number, 13);
    expect(jet[1].d[0]).toBeCloseTo(math.derivative(math.derivative(ref, "t"), "b0").evaluate(scope) as number, 12);
  });
});

describe("linear algebra", () => {
  it("SVD of [[3,0],[4,5]] has singular values √45 and √5 (AᵀA = [[25,20],[20,25]], eigenvalues 45 and 5)", () => {
    const { sigma, v } = svd([[3, 0], [4, 5]]);
    expect(sigma[0]).toBeCloseTo(Math.sqrt(45), 13);
    expect(sigma[1]).toBeCloseTo(Math.sqrt(5), 13);
    // Right singular vectors of AᵀA = [[25,20],[20,25]]: (1,1)/√2 and (1,-1)/√2.
    expect(Math.abs(v[0][0])).toBeCloseTo(Math.SQRT1_2, 13);
    expect(Math.abs(v[0][1])).toBeCloseTo(Math.SQRT1_2, 13);
  });

  it("detects a rank-1 matrix and picks its largest column as the pivot", () => {
    const a = [[1, 2], [2, 4], [3, 6]];
    const { sigma } = svd(a);
    expect(sigma[1] / sigma[0]).toBeLessThan(1e-15);
    expect(pivotColumns(a, 1)).toEqual([1]);
  });

  it("solves a linear system like mathjs lusolve", () => {
    const A = [[2, 1, -1], [-3, -1, 2], [-2, 1, 2]];
    const b = [8, -11, -3];
    const x = solveLinear(A, b, DoubleField) ?? [];
    const ref = (math.lusolve(A, b) as number[][]).map((r) => r[0]);
    x.forEach((xi, i) => expect(xi).toBeCloseTo(ref[i], 13));
    expect(solveLinear([[1, 2], [2, 4]], [1, 2], DoubleField)).toBeNull();
  });
});
