/**
 * Complex jets in IEEE double: Float64Array re/im plus `valid` (../shared/math/painleve.md §5).
 * The hot loops of the Painlevé stage run here, so every operation is a plain typed-array loop.
 */
import { DoubleField } from "../expr";
import { UNIT_ROUNDOFF_DOUBLE } from "../tolerances";
import { ZeroPivotError, type Complex, type JetAlgebra } from "./jet-algebra";

export interface DoubleJet {
  re: Float64Array;
  im: Float64Array;
  valid: number;
}

/** Exact cos/sin of 2πk/n at the multiples of π/2 (so 4th roots of unity are exact). */
function unitCircle(k: number, n: number): Complex {
  const q = (((4 * k) % (4 * n)) + 4 * n) % (4 * n);
  if (q % n === 0) {
    const quarter = q / n;
    return [complexOf(1, 0), complexOf(0, 1), complexOf(-1, 0), complexOf(0, -1)][quarter];
  }
  const angle = (2 * Math.PI * k) / n;
  return complexOf(Math.cos(angle), Math.sin(angle));
}
function complexOf(re: number, im: number): Complex {
  return { re, im };
}

/** The double-precision complex-jet algebra for jets of length N. */
export function doubleJets(N: number): JetAlgebra<DoubleJet, number> {
  const make = (valid = N): DoubleJet => ({ re: new Float64Array(N), im: new Float64Array(N), valid });

  const alg: JetAlgebra<DoubleJet, number> = {
    precision: "double",
    N,
    field: DoubleField,
    unitRoundoff: UNIT_ROUNDOFF_DOUBLE,
    scaleOrders: N,
    zero: () => make(),
    constant(re, im) {
      const r = make();
      r.re[0] = re;
      r.im[0] = im;
      return r;
    },
    fromDoubles(re, im) {
      const r = make();
      for (let m = 0; m < N && m < re.length; m++) r.re[m] = re[m];
      for (let m = 0; m < N && m < im.length; m++) r.im[m] = im[m];
      return r;
    },
    fromReal(c) {
      if (c.length < N) throw new Error(`fromReal: jet of length ${c.length} < ${N}`);
      const r = make();
      for (let m = 0; m < N; m++) r.re[m] = c[m];
      return r;
    },
    rootOfUnity(k, n) {
      const z = unitCircle(k, n);
      return alg.constant(z.re, z.im);
    },
    valid: (a) => a.valid,
    truncate(a, v) {
      const r = make(Math.min(v, a.valid));
      for (let m = 0; m < r.valid; m++) {
        r.re[m] = a.re[m];
        r.im[m] = a.im[m];
      }
      return r;
    },
    add(a, b) {
      const r = make(Math.min(a.valid, b.valid));
      for (let m = 0; m < r.valid; m++) {
        r.re[m] = a.re[m] + b.re[m];
        r.im[m] = a.im[m] + b.im[m];
      }
      return r;
    },
    sub(a, b) {
      const r = make(Math.min(a.valid, b.valid));
      for (let m = 0; m < r.valid; m++) {
        r.re[m] = a.re[m] - b.re[m];
        r.im[m] = a.im[m] - b.im[m];
      }
      return r;
    },
    neg(a) {
      const r = make(a.valid);
      for (let m = 0; m < r.valid; m++) {
        r.re[m] = -a.re[m];
        r.im[m] = -a.im[m];
      }
      return r;
    },
    conj(a) {
      const r = make(a.valid);
      for (let m = 0; m < r.valid; m++) {
        r.re[m] = a.re[m];
        r.im[m] = -a.im[m];
      }
      return r;
    },
    mul(a, b) {
      const r = make(Math.min(a.valid, b.valid));
      alg.mulAcc(r, a, b);
      return r;
    },
    mulAcc(acc, a, b) {
      // Truncated Cauchy product (§5); orders ≥ the common validity are not computed.
      const v = Math.min(acc.valid, a.valid, b.valid);
      acc.valid = v;
      const ar = a.re, ai = a.im, br = b.re, bi = b.im;
      for (let n = 0; n < v; n++) {
        let sr = 0;
        let si = 0;
        for (let k = 0; k <= n; k++) {
          const xr = ar[k], xi = ai[k], yr = br[n - k], yi = bi[n - k];
          sr += xr * yr - xi * yi;
          si += xr * yi + xi * yr;
        }
        acc.re[n] += sr;
        acc.im[n] += si;
      }
      for (let n = v; n < N; n++) {
        acc.re[n] = 0;
        acc.im[n] = 0;
      }
    },
    addTo(acc, a) {
      const v = Math.min(acc.valid, a.valid);
      acc.valid = v;
      for (let m = 0; m < v; m++) {
        acc.re[m] += a.re[m];
        acc.im[m] += a.im[m];
      }
      for (let m = v; m < N; m++) {
        acc.re[m] = 0;
        acc.im[m] = 0;
      }
    },
    div(a, b) {
      const b0r = b.re[0], b0i = b.im[0];
      const d = b0r * b0r + b0i * b0i;
      if (d === 0 || !Number.isFinite(d)) throw new ZeroPivotError("jet division by a zero leading coefficient");
      const r = make(Math.min(a.valid, b.valid));
      for (let n = 0; n < r.valid; n++) {
        let sr = a.re[n];
        let si = a.im[n];
        for (let k = 1; k <= n; k++) {
          const xr = b.re[k], xi = b.im[k], yr = r.re[n - k], yi = r.im[n - k];
          sr -= xr * yr - xi * yi;
          si -= xr * yi + xi * yr;
        }
        r.re[n] = (sr * b0r + si * b0i) / d;
        r.im[n] = (si * b0r - sr * b0i) / d;
      }
      return r;
    },
    scale(a, re, im) {
      const r = make(a.valid);
      if (im === 0) {
        for (let m = 0; m < r.valid; m++) {
          r.re[m] = a.re[m] * re;
          r.im[m] = a.im[m] * re;
        }
        return r;
      }
      for (let m = 0; m < r.valid; m++) {
        r.re[m] = a.re[m] * re - a.im[m] * im;
        r.im[m] = a.re[m] * im + a.im[m] * re;
      }
      return r;
    },
    dtau(a) {
      const r = make(Math.max(a.valid - 1, 0));
      for (let m = 0; m < r.valid; m++) {
        r.re[m] = (m + 1) * a.re[m + 1];
        r.im[m] = (m + 1) * a.im[m + 1];
      }
      return r;
    },
    modulus(a) {
      const r = new Float64Array(N);
      for (let m = 0; m < a.valid; m++) r[m] = Math.hypot(a.re[m], a.im[m]);
      return r;
    },
    addModulus(acc, a) {
      for (let m = 0; m < a.valid; m++) acc[m] += Math.hypot(a.re[m], a.im[m]);
    },
    coefficient: (a, m) => ({ re: a.re[m] + 0, im: a.im[m] + 0 }), // + 0 turns -0 into 0 (JSON has no -0)
    isFinite(a) {
      for (let m = 0; m < a.valid; m++) if (!Number.isFinite(a.re[m]) || !Number.isFinite(a.im[m])) return false;
      return true;
    },
  };
  return alg;
}
