/**
 * Complex jets over any Field<T> (pairs re/im of T), for the extended-precision recheck of
 * ../shared/math/painleve.md §7 with decimalField(digits). Same rules as double-jets.ts.
 */
import type { Field } from "../expr/types";
import { PI_TEXT } from "../expr";
import { ZeroPivotError, type JetAlgebra } from "./jet-algebra";

export interface FieldJet<T> {
  re: T[];
  im: T[];
  valid: number;
}

/**
 * The complex-jet algebra over `field` for jets of length N; `unitRoundoff` of that field.
 * `scaleOrders` limits the (costly) conversion of term scales to doubles to the orders used.
 */
export function fieldJets<T>(N: number, field: Field<T>, unitRoundoff: number, scaleOrders = N): JetAlgebra<FieldJet<T>, T> {
  const F = field;
  const Z = F.zero;
  const make = (valid = N): FieldJet<T> => ({ re: new Array<T>(N).fill(Z), im: new Array<T>(N).fill(Z), valid });
  const fromDouble = (x: number): T => (x === 0 ? Z : F.fromNumber(x));

  const alg: JetAlgebra<FieldJet<T>, T> = {
    precision: F.name,
    N,
    field: F,
    unitRoundoff,
    scaleOrders: Math.min(scaleOrders, N),
    zero: () => make(),
    constant(re, im) {
      const r = make();
      r.re[0] = fromDouble(re);
      r.im[0] = fromDouble(im);
      return r;
    },
    fromDoubles(re, im) {
      const r = make();
      for (let m = 0; m < N && m < re.length; m++) r.re[m] = fromDouble(re[m]);
      for (let m = 0; m < N && m < im.length; m++) r.im[m] = fromDouble(im[m]);
      return r;
    },
    fromReal(c) {
      if (c.length < N) throw new Error(`fromReal: jet of length ${c.length} < ${N}`);
      const r = make();
      for (let m = 0; m < N; m++) r.re[m] = c[m];
      return r;
    },
    rootOfUnity(k, n) {
      const q = (((4 * k) % (4 * n)) + 4 * n) % (4 * n);
      if (q % n === 0) {
        const c = [[1, 0], [0, 1], [-1, 0], [0, -1]][q / n];
        return alg.constant(c[0], c[1]);
      }
      const angle = F.div(F.mul(F.fromText(PI_TEXT), F.fromNumber(2 * k)), F.fromNumber(n));
      const r = make();
      r.re[0] = F.cos(angle);
      r.im[0] = F.sin(angle);
      return r;
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
        r.re[m] = F.add(a.re[m], b.re[m]);
        r.im[m] = F.add(a.im[m], b.im[m]);
      }
      return r;
    },
    sub(a, b) {
      const r = make(Math.min(a.valid, b.valid));
      for (let m = 0; m < r.valid; m++) {
        r.re[m] = F.sub(a.re[m], b.re[m]);
        r.im[m] = F.sub(a.im[m], b.im[m]);
      }
      return r;
    },
    neg(a) {
      const r = make(a.valid);
      for (let m = 0; m < r.valid; m++) {
        r.re[m] = F.neg(a.re[m]);
        r.im[m] = F.neg(a.im[m]);
      }
      return r;
    },
    conj(a) {
      const r = make(a.valid);
      for (let m = 0; m < r.valid; m++) {
        r.re[m] = a.re[m];
        r.im[m] = F.neg(a.im[m]);
      }
      return r;
    },
    mul(a, b) {
      const r = make(Math.min(a.valid, b.valid));
      alg.mulAcc(r, a, b);
      return r;
    },
    mulAcc(acc, a, b) {
      const v = Math.min(acc.valid, a.valid, b.valid);
      acc.valid = v;
      // Exact zeros are common (real coefficient jets, constants); skipping them is exact.
      const az = a.re.map((x, k) => (F.isZero(x) ? 1 : 0) | (F.isZero(a.im[k]) ? 2 : 0));
      const bz = b.re.map((x, k) => (F.isZero(x) ? 1 : 0) | (F.isZero(b.im[k]) ? 2 : 0));
      for (let n = 0; n < v; n++) {
        let sr = acc.re[n];
        let si = acc.im[n];
        for (let k = 0; k <= n; k++) {
          const za = az[k], zb = bz[n - k];
          if (za === 3 || zb === 3) continue;
          const xr = a.re[k], xi = a.im[k], yr = b.re[n - k], yi = b.im[n - k];
          if (!(za & 1) && !(zb & 1)) sr = F.add(sr, F.mul(xr, yr));
          if (!(za & 2) && !(zb & 2)) sr = F.sub(sr, F.mul(xi, yi));
          if (!(za & 1) && !(zb & 2)) si = F.add(si, F.mul(xr, yi));
          if (!(za & 2) && !(zb & 1)) si = F.add(si, F.mul(xi, yr));
        }
        acc.re[n] = sr;
        acc.im[n] = si;
      }
      for (let n = v; n < N; n++) {
        acc.re[n] = Z;
        acc.im[n] = Z;
      }
    },
    addTo(acc, a) {
      const v = Math.min(acc.valid, a.valid);
      acc.valid = v;
      for (let m = 0; m < v; m++) {
        acc.re[m] = F.add(acc.re[m], a.re[m]);
        acc.im[m] = F.add(acc.im[m], a.im[m]);
      }
      for (let m = v; m < N; m++) {
        acc.re[m] = Z;
        acc.im[m] = Z;
      }
    },
    div(a, b) {
      const b0r = b.re[0], b0i = b.im[0];
      const d = F.add(F.mul(b0r, b0r), F.mul(b0i, b0i));
      if (F.isZero(d) || !F.isFinite(d)) throw new ZeroPivotError("jet division by a zero leading coefficient");
      const r = make(Math.min(a.valid, b.valid));
      for (let n = 0; n < r.valid; n++) {
        let sr = a.re[n];
        let si = a.im[n];
        for (let k = 1; k <= n; k++) {
          const xr = b.re[k], xi = b.im[k], yr = r.re[n - k], yi = r.im[n - k];
          sr = F.sub(sr, F.sub(F.mul(xr, yr), F.mul(xi, yi)));
          si = F.sub(si, F.add(F.mul(xr, yi), F.mul(xi, yr)));
        }
        r.re[n] = F.div(F.add(F.mul(sr, b0r), F.mul(si, b0i)), d);
        r.im[n] = F.div(F.sub(F.mul(si, b0r), F.mul(sr, b0i)), d);
      }
      return r;
    },
    scale(a, re, im) {
      const r = make(a.valid);
      const cr = fromDouble(re);
      const ci = fromDouble(im);
      if (im === 0 || re === 0) {
        // Real or imaginary factor: two products instead of four.
        for (let m = 0; m < r.valid; m++) {
          if (im === 0) {
            r.re[m] = F.mul(a.re[m], cr);
            r.im[m] = F.mul(a.im[m], cr);
          } else {
            r.re[m] = F.neg(F.mul(a.im[m], ci));
            r.im[m] = F.mul(a.re[m], ci);
          }
        }
        return r;
      }
      for (let m = 0; m < r.valid; m++) {
        r.re[m] = F.sub(F.mul(a.re[m], cr), F.mul(a.im[m], ci));
        r.im[m] = F.add(F.mul(a.re[m], ci), F.mul(a.im[m], cr));
      }
      return r;
    },
    dtau(a) {
      const r = make(Math.max(a.valid - 1, 0));
      for (let m = 0; m < r.valid; m++) {
        const k = F.fromNumber(m + 1);
        r.re[m] = F.mul(k, a.re[m + 1]);
        r.im[m] = F.mul(k, a.im[m + 1]);
      }
      return r;
    },
    modulus(a) {
      const r = new Float64Array(N);
      for (let m = 0; m < a.valid; m++) r[m] = Math.hypot(F.toNumber(a.re[m]), F.toNumber(a.im[m]));
      return r;
    },
    addModulus(acc, a) {
      const top = Math.min(a.valid, alg.scaleOrders);
      for (let m = 0; m < top; m++) acc[m] += Math.hypot(F.toNumber(a.re[m]), F.toNumber(a.im[m]));
    },
    coefficient: (a, m) => ({ re: F.toNumber(a.re[m]) + 0, im: F.toNumber(a.im[m]) + 0 }),
    isFinite(a) {
      for (let m = 0; m < a.valid; m++) if (!F.isFinite(a.re[m]) || !F.isFinite(a.im[m])) return false;
      return true;
    },
  };
  return alg;
}
