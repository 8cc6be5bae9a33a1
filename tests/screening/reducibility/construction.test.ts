/**
 * Randomized property test: members built to be reducible by construction, then perturbed.
 *
 * Construction (derived in ../shared/math):
 * - NLS (nls.md §3): choose a, h, k, c; b = [W' - (a'/a)W + W² + 2cW]/(4a), W = a'/a - h'/h + 2(k - c),
 *   so R ≡ 0 exactly; built as an expression tree with symbolic d/dt.
 * - KdV (kdv.md §2): choose p, q, r, s; m = [Z' + Z(Z + r + s - p'/p)]/p, Z = q'/q - p'/p + r - 2s.
 * - mKdV (mkdv.md §2): choose q, s, F; r = s + F'/2, p = κ q e^F, so Q = q'/q - p'/p + 2(r - s) ≡ 0.
 *
 * Perturbation: one coefficient times (1 + ε), ε = 1e-6, 1e-7, 1e-8, 1e-9, written as an exact
 * decimal literal. What is asserted: the unperturbed member is `reducible`; ε ≥ 1e-8 gives
 * `not-reducible`; ε = 1e-9 is never `reducible` (it may be `undecided`; with the 40/80-digit
 * confirmation it comes out `not-reducible` on every member here).
 */
import { describe, it, expect } from "vitest";
import { add, differentiate, div, mul, num, simplifyConstants, sub, call } from "../../../lib/screening/expr";
import type { Expr } from "../../../lib/screening/expr";
import { runReducibility } from "../../../lib/screening/reducibility";
import { createRng } from "../../../lib/screening/random";
import type { EquationClass } from "../../../lib/screening/spec/types";
import { buildVariant, parse } from "./build-variant";

const d = (e: Expr): Expr => differentiate(e, "t");
const logD = (e: Expr): Expr => div(d(e), e);
const two = num(2);

function randomPieces(seed: number): (lo: number, hi: number) => string {
  const rng = createRng(seed);
  return (lo, hi) => rng.uniform(lo, hi).toFixed(6);
}

function nlsByConstruction(seed: number): Record<string, Expr> {
  const u = randomPieces(seed);
  const a = parse(`${u(0.8, 1.5)} + ${u(-0.3, 0.3)}*sin(${u(0.5, 2)}*t)`);
  const h = parse(`${u(0.5, 2)}*exp(${u(-0.4, 0.4)}*t)/(1 + ${u(0.05, 0.4)}*t^2)`);
  const k = parse(`${u(-0.3, 0.3)} + ${u(-0.2, 0.2)}*cos(t)`);
  const c = parse(`${u(-0.3, 0.3)}*t`);
  const W = add(sub(logD(a), logD(h)), mul(two, sub(k, c)));
  const b = simplifyConstants(div(add(add(sub(d(W), mul(logD(a), W)), mul(W, W)), mul(mul(two, c), W)), mul(num(4), a)));
  return { a, b, c, h, k, e: parse("t"), f: parse("0.2"), g: parse("0.1") };
}

function kdvByConstruction(seed: number): Record<string, Expr> {
  const u = randomPieces(seed);
  const p = parse(`${u(1, 2)} + ${u(-0.4, 0.4)}*cos(${u(0.5, 2)}*t)`);
  const q = parse(`${u(0.5, 2)}*exp(${u(-0.3, 0.3)}*t)`);
  const r = parse(`${u(-0.5, 0.5)} + ${u(-0.2, 0.2)}*sin(t)`);
  const s = parse(`${u(-0.5, 0.5)}*t`);
  const Z = sub(add(sub(logD(q), logD(p)), r), mul(two, s));
  const m = simplifyConstants(div(add(d(Z), mul(Z, sub(add(add(Z, r), s), logD(p)))), p));
  return { p, q, r, s, m, g: parse("t"), l: parse("0.5") };
}

function mkdvByConstruction(seed: number): Record<string, Expr> {
  const u = randomPieces(seed);
  const q = parse(`${u(0.5, 2)} + ${u(-0.3, 0.3)}*sin(t)`);
  const s = parse(`${u(-0.5, 0.5)}*cos(t)`);
  const F = parse(`${u(-0.5, 0.5)}*t + ${u(-0.3, 0.3)}*sin(${u(0.5, 2)}*t)`);
  const r = simplifyConstants(add(s, div(d(F), two)));
  const p = mul(mul(parse(u(-6, 6)), q), call("exp", F));
  return { p, q, r, s, g: parse("0.3*t") };
}

const BUILDERS: Record<EquationClass, { build: (seed: number) => Record<string, Expr>; perturb: string; window: [number, number] }> = {
  nls: { build: nlsByConstruction, perturb: "b", window: [0, 2] },
  kdv: { build: kdvByConstruction, perturb: "m", window: [0, 2] },
  mkdv: { build: mkdvByConstruction, perturb: "r", window: [0, 2] },
};

const EPSILONS: [string, string][] = [
  ["1e-6", "1.000001"],
  ["1e-7", "1.0000001"],
  ["1e-8", "1.00000001"],
  ["1e-9", "1.000000001"],
];

describe("members reducible by construction, and their perturbations", () => {
  for (const cls of ["nls", "kdv", "mkdv"] as const) {
    it(`${cls}: 5 random members are reducible; perturbed by ε ≥ 1e-8 not-reducible; ε = 1e-9 never reducible`, async () => {
      const { build, perturb, window } = BUILDERS[cls];
      for (let seed = 1; seed <= 5; seed++) {
        const coefficients = build(1000 * seed + cls.length);
        const exact = await runReducibility(buildVariant(cls, coefficients, window, [], seed));
        expect(exact.verdict, `${cls} seed ${seed} unperturbed`).toBe("reducible");
        for (const [eps, factor] of EPSILONS) {
          const perturbed = { ...coefficients, [perturb]: mul(coefficients[perturb], num(Number(factor), factor)) };
          const report = await runReducibility(buildVariant(cls, perturbed, window, [], seed));
          if (eps === "1e-9") expect(report.verdict, `${cls} seed ${seed} ε = ${eps}`).not.toBe("reducible");
          else expect(report.verdict, `${cls} seed ${seed} ε = ${eps}`).toBe("not-reducible");
        }
      }
    });
  }
});
