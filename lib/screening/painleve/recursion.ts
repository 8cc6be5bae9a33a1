/**
 * Steps 4–5 of ../shared/math/painleve.md §6: the resonance matrix M(j) by unit perturbation
 * (E_j is affine in w_j, so the difference is exact), the resonances as roots of the
 * interpolated det M(j), and the recursion j = 1 … J with the compatibility condition at each
 * positive resonance (scalar: C = R_j; 2×2: C = ℓ·R_j with ℓ a row of adj M(j)).
 */
import { RESONANCE_INTEGRALITY, RESONANCE_LEADING_ZERO } from "../tolerances";
import type { BiSeries } from "./biseries";
import type { Complex, JetAlgebra } from "./jet-algebra";
import { seriesOf, type Branch, type ExpansionSetup } from "./leading";
import { cabs, cmul, csub, interpolate, polynomialRoots } from "./polynomial";
import { residualAt, type DerivativeCache, type EquationResidual, type PointContext } from "./residual";

/** M(j) (M[e][c] = ∂E_e/∂w_j of variable c) and R_j (with w_j = 0), all Taylor orders. */
function matrixAndResidual<J, T>(
  ctx: PointContext<J, T>,
  setup: ExpansionSetup,
  known: Record<string, J[]>,
  j: number,
): { M: J[][]; R: EquationResidual<J>[] } {
  const { alg } = ctx;
  const vars = setup.variables;
  const build = (perturbed: string | null): Record<string, BiSeries<J>> => {
    const out: Record<string, BiSeries<J>> = {};
    for (const v of vars) out[v] = seriesOf(setup.alpha, [...known[v].slice(0, j), v === perturbed ? alg.constant(1, 0) : alg.zero()]);
    return out;
  };
  const power = setup.lowest + j;
  const cache: DerivativeCache<J> = new Map();
  const R = residualAt(ctx, build(null), power, cache);
  const M: J[][] = vars.map(() => vars.map(() => alg.zero()));
  vars.forEach((c, ci) => {
    // Only c's series changes: the other variables' derivative series are reused.
    const shared: DerivativeCache<J> = new Map([...cache].filter(([v]) => v !== c));
    const R1 = residualAt(ctx, build(c), power, shared);
    R1.forEach((r, e) => {
      M[e][ci] = alg.sub(r.value, R[e].value);
    });
  });
  return { M, R };
}

function determinant0<J, T>(alg: JetAlgebra<J, T>, M: J[][]): Complex {
  const m = M.map((row) => row.map((x) => alg.coefficient(x, 0)));
  if (m.length === 1) return m[0][0];
  return csub(cmul(m[0][0], m[1][1]), cmul(m[0][1], m[1][0]));
}

export type ResonanceResult =
  | { kind: "integer"; resonances: number[]; determinants: { j: number; value: Complex }[] }
  | { kind: "non-integer"; root: Complex; roots: Complex[]; determinants: { j: number; value: Complex }[] };

/**
 * Resonances of a branch: det M(j) at τ^0 for j = 1 … D+1, interpolated, roots (§6 Step 4).
 * Only τ^0 is read, so `ctx` may use jets as short as (highest t-derivative + 1).
 */
export function resonances<J, T>(ctx: PointContext<J, T>, setup: ExpansionSetup, lead: Branch<J>): ResonanceResult {
  const { alg } = ctx;
  const D = setup.determinantDegree;
  const determinants: { j: number; value: Complex }[] = [];
  for (let j = 1; j <= D + 1; j++) {
    const known: Record<string, J[]> = {};
    for (const v of setup.variables) known[v] = [lead[v], ...Array.from({ length: j - 1 }, () => alg.zero())];
    const { M } = matrixAndResidual(ctx, setup, known, j);
    determinants.push({ j, value: determinant0(alg, M) });
  }
  const poly = interpolate(determinants.map((d) => d.j), determinants.map((d) => d.value));
  // Interpolation noise in a vanishing top coefficient would give a spurious huge root.
  const size = Math.max(...poly.map(cabs));
  while (poly.length > 1 && cabs(poly[poly.length - 1]) <= RESONANCE_LEADING_ZERO * size) poly.pop();
  const roots = polynomialRoots(poly);
  const biggest = Math.max(1, ...roots.map(cabs));
  for (const r of roots) {
    const rounded = Math.round(r.re);
    if (Math.hypot(r.re - rounded, r.im) > RESONANCE_INTEGRALITY * biggest) {
      return { kind: "non-integer", root: r, roots, determinants };
    }
  }
  return { kind: "integer", resonances: roots.map((r) => Math.round(r.re) + 0).sort((a, b) => a - b), determinants };
}

/** One compatibility condition as computed (all Taylor orders). */
export interface RawCondition<J> {
  resonance: number;
  value: J;
  scale: Float64Array;
  /** λ_0 with ℓ_0 = λ_0 (m21, -m11) at τ^0 (2×2 systems); 1 for scalars. */
  normalisation: Complex;
}

export interface BranchRun<J> {
  conditions: RawCondition<J>[];
  /** w_0 … w_J per variable. */
  known: Record<string, J[]>;
}

/**
 * The recursion j = 1 … J on one branch (§6 Step 5). `nextFree` supplies the arbitrary
 * functions at resonances (random jets, never zero: later conditions may depend on them).
 */
export function runBranch<J, T>(
  ctx: PointContext<J, T>,
  setup: ExpansionSetup,
  lead: Branch<J>,
  positive: ReadonlySet<number>,
  J: number,
  nextFree: () => J,
): BranchRun<J> {
  const { alg } = ctx;
  const vars = setup.variables;
  const known: Record<string, J[]> = {};
  for (const v of vars) known[v] = [lead[v]];
  const conditions: RawCondition<J>[] = [];
  for (let j = 1; j <= J; j++) {
    const { M, R } = matrixAndResidual(ctx, setup, known, j);
    if (vars.length === 1) {
      if (positive.has(j)) {
        conditions.push({ resonance: j, value: R[0].value, scale: R[0].scale, normalisation: { re: 1, im: 0 } });
        known[vars[0]].push(nextFree());
      } else {
        known[vars[0]].push(alg.div(alg.neg(R[0].value), M[0][0]));
      }
      continue;
    }
    const [[m11, m12], [m21, m22]] = M;
    const [R1, R2] = [R[0].value, R[1].value];
    if (!positive.has(j)) {
      // Explicit inverse in jet arithmetic: w = -M^{-1} R.
      const det = alg.sub(alg.mul(m11, m22), alg.mul(m12, m21));
      known[vars[0]].push(alg.div(alg.sub(alg.mul(R2, m12), alg.mul(R1, m22)), det));
      known[vars[1]].push(alg.div(alg.sub(alg.mul(R1, m21), alg.mul(R2, m11)), det));
      continue;
    }
    // ℓ = the row of adj M with the larger τ^0 norm; r1 = (m22, -m12) wins a tie.
    const size0 = (x: J) => cabs(alg.coefficient(x, 0));
    const r1: [J, J] = [m22, alg.neg(m12)];
    const r2: [J, J] = [alg.neg(m21), m11];
    const [l1, l2] = size0(r1[0]) + size0(r1[1]) >= size0(r2[0]) + size0(r2[1]) ? r1 : r2;
    const value = alg.add(alg.mul(l1, R1), alg.mul(l2, R2));
    const scale = new Float64Array(alg.N);
    const a1 = alg.modulus(l1), a2 = alg.modulus(l2);
    for (let n = 0; n < alg.N; n++) {
      let s = 0;
      for (let k = 0; k <= n; k++) s += a1[k] * R[0].scale[n - k] + a2[k] * R[1].scale[n - k];
      scale[n] = s;
    }
    // Report normalised to ℓ = (m21, -m11): λ_0 = ℓ2_0 / (-m11_0).
    const l20 = alg.coefficient(l2, 0);
    const m110 = alg.coefficient(m11, 0);
    const d = m110.re * m110.re + m110.im * m110.im;
    const normalisation = { re: -(l20.re * m110.re + l20.im * m110.im) / d, im: -(l20.im * m110.re - l20.re * m110.im) / d };
    conditions.push({ resonance: j, value, scale, normalisation });
    // Pivot: the largest |M[e][o]_0| in row-major order (first maximum wins); unknown 1-o is free.
    let e = 0, o = 0, best = -1;
    for (let ei = 0; ei < 2; ei++) {
      for (let oi = 0; oi < 2; oi++) {
        const s = size0(M[ei][oi]);
        if (s > best) {
          best = s;
          e = ei;
          o = oi;
        }
      }
    }
    const free = nextFree();
    const solved = alg.div(alg.neg(alg.add(R[e].value, alg.mul(M[e][1 - o], free))), M[e][o]);
    const fresh: J[] = [];
    fresh[1 - o] = free;
    fresh[o] = solved;
    known[vars[0]].push(fresh[0]);
    known[vars[1]].push(fresh[1]);
  }
  return { conditions, known };
}
