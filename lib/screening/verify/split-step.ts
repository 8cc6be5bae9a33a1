/**
 * Split-step Fourier simulation of the original vc-NLS (nls.md §0) with c ≡ 0:
 *   u_t = i a u_xx − g u_x − k u  +  i (b x² + f x + e + h|u|²) u
 * Strang splitting (second order), optionally composed into Yoshida's fourth-order triple jump
 * (H. Yoshida, Phys. Lett. A 150 (1990) 262, eq. 4.4 [from memory]): the potential/nonlinear flow is exact because |u| is constant
 * in it (u ← u e^{i(∫b x² + ∫f x + ∫e + ∫h |u|²)}); the linear flow is exact in Fourier space
 * (û ← û e^{−iκ²∫a − iκ∫g − ∫k}), the coefficient integrals taken by 3-point Gauss–Legendre
 * quadrature over each substep. Consecutive half steps are merged (exact for the same flow).
 * A dilation c x u_x is neither diagonal in x nor in κ, so the caller must not use this for c ≢ 0.
 * Periodic box [xMin, xMax): the solution must be negligible at its edges.
 */
import { complexFft } from "./fft";

export interface SplitStepProblem {
  /** Coefficient values at t: a, b, e, f, g, h, k (c must be 0). */
  coefficients(t: number): Record<string, number>;
  /** Time nodes t_0 < t_1 < … < t_steps (non-uniform allowed). */
  times: readonly number[];
  xMin: number;
  xMax: number;
  N: number;
  /** Initial data u(x_j, t0), interleaved re/im, length 2N. */
  initial: Float64Array;
  /** Step indices (1..steps) after which `observe` is called. */
  observeAt: readonly number[];
  observe(step: number, t: number, u: Float64Array): void;
  /** 2: Strang; 4: Yoshida triple jump of Strang (default 4). */
  order?: 2 | 4;
}

/** Yoshida's weights w1 = 1/(2 − 2^{1/3}), w0 = 1 − 2 w1 (negative: a backward substep). */
const Y1 = 1 / (2 - Math.cbrt(2));
const Y0 = 1 - 2 * Y1;
/** Below this |φ| the nonlinear phase factor uses its Taylor polynomial (cheaper than Math.cos/sin). */
const SMALL_ANGLE = 0.25;

const GL = [
  { x: -Math.sqrt(3 / 5), w: 5 / 9 },
  { x: 0, w: 8 / 9 },
  { x: Math.sqrt(3 / 5), w: 5 / 9 },
];

/** ∫_{ta}^{tb} of each coefficient (3-point Gauss–Legendre, exact for quintics). */
function integrals(coef: (t: number) => Record<string, number>, ta: number, tb: number): Record<string, number> {
  const half = (tb - ta) / 2;
  const mid = (ta + tb) / 2;
  const out: Record<string, number> = { a: 0, b: 0, e: 0, f: 0, g: 0, h: 0, k: 0 };
  for (const node of GL) {
    const v = coef(mid + half * node.x);
    for (const n of Object.keys(out)) out[n] += node.w * half * v[n];
  }
  return out;
}

export function runSplitStep(pr: SplitStepProblem): { evaluations: number; fftPairs: number } {
  const { N } = pr;
  const steps = pr.times.length - 1;
  const L = pr.xMax - pr.xMin;
  const dx = L / N;
  const x = new Float64Array(N);
  const kap = new Float64Array(N);
  for (let j = 0; j < N; j++) {
    x[j] = pr.xMin + j * dx;
    kap[j] = ((2 * Math.PI) / L) * (j < N / 2 ? j : j - N);
  }
  const fft = complexFft(N);
  const u = Float64Array.from(pr.initial);
  const spec = new Float64Array(2 * N);
  const observeSet = new Set(pr.observeAt);
  let evaluations = 0;

  const potentialCache = new Map<string, Float64Array>();
  const nonlinear = (ta: number, tb: number) => {
    const I = integrals(pr.coefficients, ta, tb);
    evaluations += 3;
    let pot: Float64Array | undefined;
    if (I.b !== 0 || I.f !== 0 || I.e !== 0) {
      // e^{i(∫b x² + ∫f x + ∫e)}, cached while the integrals repeat (constant coefficients)
      const key = `${I.b}|${I.f}|${I.e}`;
      pot = potentialCache.get(key);
      if (!pot) {
        pot = new Float64Array(2 * N);
        for (let j = 0; j < N; j++) {
          const ph = (I.b * x[j] + I.f) * x[j] + I.e;
          pot[2 * j] = Math.cos(ph);
          pot[2 * j + 1] = Math.sin(ph);
        }
        if (potentialCache.size >= 4) potentialCache.clear();
        potentialCache.set(key, pot);
      }
    }
    for (let j = 0; j < N; j++) {
      let re = u[2 * j];
      let im = u[2 * j + 1];
      const phi = I.h * (re * re + im * im);
      let c: number;
      let sn: number;
      if (Math.abs(phi) < SMALL_ANGLE) {
        // Taylor series of cos and sin to φ¹²/12!, φ¹³/13!: truncation < 1e-19 for |φ| < 0.25
        const p2 = phi * phi;
        c = 1 - p2 * (1 / 2 - p2 * (1 / 24 - p2 * (1 / 720 - p2 * (1 / 40320 - p2 * (1 / 3628800 - p2 / 479001600)))));
        sn = phi * (1 - p2 * (1 / 6 - p2 * (1 / 120 - p2 * (1 / 5040 - p2 * (1 / 362880 - p2 * (1 / 39916800 - p2 / 6227020800))))));
      } else {
        c = Math.cos(phi);
        sn = Math.sin(phi);
      }
      if (pot) {
        const pc = pot[2 * j];
        const ps = pot[2 * j + 1];
        const c2 = c * pc - sn * ps;
        sn = c * ps + sn * pc;
        c = c2;
      }
      const r2 = re * c - im * sn;
      im = re * sn + im * c;
      re = r2;
      u[2 * j] = re;
      u[2 * j + 1] = im;
    }
  };
  const cache = new Map<string, Float64Array>();
  const linear = (ta: number, tb: number) => {
    const I = integrals(pr.coefficients, ta, tb);
    evaluations += 3;
    const key = `${I.a}|${I.g}|${I.k}`;
    let factor = cache.get(key);
    if (!factor) {
      // e^{−iκ²∫a − iκ∫g − ∫k}
      factor = new Float64Array(2 * N);
      const damp = Math.exp(-I.k);
      for (let j = 0; j < N; j++) {
        const ph = -(kap[j] * kap[j] * I.a + kap[j] * I.g);
        factor[2 * j] = damp * Math.cos(ph);
        factor[2 * j + 1] = damp * Math.sin(ph);
      }
      if (cache.size >= 4) cache.clear();
      cache.set(key, factor);
    }
    fft.forward(spec, u);
    for (let j = 0; j < N; j++) {
      const re = spec[2 * j];
      const im = spec[2 * j + 1];
      spec[2 * j] = re * factor[2 * j] - im * factor[2 * j + 1];
      spec[2 * j + 1] = re * factor[2 * j + 1] + im * factor[2 * j];
    }
    fft.inverse(u, spec);
  };

  // Each Strang substep on [ta, tb] is N(ta, tm) · L(ta, tb) · N(tm, tb), tm = (ta + tb)/2; the
  // closing N of one substep is merged with the opening N of the next (one exact flow).
  const weights = (pr.order ?? 4) === 4 ? [Y1, Y0, Y1] : [1];
  let pendingFrom = pr.times[0]; // start of the nonlinear flow not yet applied
  for (let n = 1; n <= steps; n++) {
    const t0 = pr.times[n - 1];
    const h = pr.times[n] - t0;
    let ta = t0;
    for (let w = 0; w < weights.length; w++) {
      const tb = w === weights.length - 1 ? pr.times[n] : ta + weights[w] * h;
      const tm = (ta + tb) / 2;
      nonlinear(pendingFrom, tm);
      linear(ta, tb);
      pendingFrom = tm;
      ta = tb;
    }
    if (observeSet.has(n) || n === steps) {
      nonlinear(pendingFrom, pr.times[n]);
      pendingFrom = pr.times[n];
      if (observeSet.has(n)) pr.observe(n, pr.times[n], u);
    }
  }
  return { evaluations, fftPairs: steps * weights.length };
}
