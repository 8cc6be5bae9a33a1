/**
 * The jet recurrences of ./jets.ts specialised to IEEE double. Generic code calls Field methods
 * through an object, which V8 cannot inline once several fields are in use (measured 5–8× slower);
 * jets.ts dispatches here when the field is DoubleField. Same formulas (painleve.md §5); the
 * tests check these against the generic versions coefficient by coefficient.
 */
import { JetEvaluationError } from "./jet-error";

type J = number[];

export function mulD(a: J, b: J): J {
  const n = Math.min(a.length, b.length);
  const r = new Array<number>(n);
  for (let k = 0; k < n; k++) {
    let s = 0;
    for (let j = 0; j <= k; j++) s += a[j] * b[k - j];
    r[k] = s;
  }
  return r;
}

export function divD(a: J, b: J): J {
  const b0 = b[0];
  if (b0 === 0) throw new JetEvaluationError("zero-divisor", "division by a quantity that is zero here");
  const n = Math.min(a.length, b.length);
  const r = new Array<number>(n);
  for (let k = 0; k < n; k++) {
    let s = a[k];
    for (let j = 1; j <= k; j++) s -= b[j] * r[k - j];
    r[k] = s / b0;
  }
  return r;
}

export function expD(a: J): J {
  const n = a.length;
  const r = new Array<number>(n);
  r[0] = Math.exp(a[0]);
  if (!Number.isFinite(r[0])) throw new JetEvaluationError("non-finite", "exp is not finite");
  for (let m = 1; m < n; m++) {
    let s = 0;
    for (let k = 1; k <= m; k++) s += k * a[k] * r[m - k];
    r[m] = s / m;
  }
  return r;
}

export function logD(a: J): J {
  const a0 = a[0];
  if (!(a0 > 0)) throw new JetEvaluationError("log-domain", "log of a quantity that is not positive here");
  const n = a.length;
  const r = new Array<number>(n);
  r[0] = Math.log(a0);
  for (let m = 1; m < n; m++) {
    let s = 0;
    for (let k = 1; k < m; k++) s += k * r[k] * a[m - k];
    r[m] = (a[m] - s / m) / a0;
  }
  return r;
}

export function sinCosLikeD(a: J, hyperbolic: boolean): [J, J] {
  const n = a.length;
  const s = new Array<number>(n);
  const c = new Array<number>(n);
  s[0] = hyperbolic ? Math.sinh(a[0]) : Math.sin(a[0]);
  c[0] = hyperbolic ? Math.cosh(a[0]) : Math.cos(a[0]);
  if (!Number.isFinite(s[0]) || !Number.isFinite(c[0])) {
    throw new JetEvaluationError("non-finite", `${hyperbolic ? "sinh/cosh" : "sin/cos"} is not finite`);
  }
  const sign = hyperbolic ? 1 : -1;
  for (let m = 1; m < n; m++) {
    let ss = 0;
    let cc = 0;
    for (let k = 1; k <= m; k++) {
      const ka = k * a[k];
      ss += ka * c[m - k];
      cc += ka * s[m - k];
    }
    s[m] = ss / m;
    c[m] = (sign * cc) / m;
  }
  return [s, c];
}

export function powConstD(a: J, p: number): J {
  const n = a.length;
  const a0 = a[0];
  if (n > 1 && !(a0 > 0)) {
    throw new JetEvaluationError("pow-domain", "non-integer power of a quantity that is not positive here");
  }
  const r = new Array<number>(n);
  r[0] = Math.pow(a0, p);
  if (!Number.isFinite(r[0])) throw new JetEvaluationError("non-finite", "power is not finite");
  const p1 = p + 1;
  for (let m = 1; m < n; m++) {
    let s = 0;
    for (let k = 1; k <= m; k++) s += (k * p1 - m) * a[k] * r[m - k];
    r[m] = s / (m * a0);
  }
  return r;
}

export function sqrtD(a: J): J {
  const n = a.length;
  const a0 = a[0];
  if (a0 < 0) throw new JetEvaluationError("sqrt-domain", "square root of a negative quantity here");
  if (n > 1 && a0 === 0) throw new JetEvaluationError("sqrt-domain", "square root of zero is not differentiable here");
  const r = new Array<number>(n);
  r[0] = Math.sqrt(a0);
  const twoR0 = 2 * r[0];
  for (let m = 1; m < n; m++) {
    let s = a[m];
    for (let j = 1; j < m; j++) s -= r[j] * r[m - j];
    r[m] = s / twoR0;
  }
  return r;
}

export function addD(a: J, b: J): J {
  const n = Math.min(a.length, b.length);
  const r = new Array<number>(n);
  for (let k = 0; k < n; k++) r[k] = a[k] + b[k];
  return r;
}

export function subD(a: J, b: J): J {
  const n = Math.min(a.length, b.length);
  const r = new Array<number>(n);
  for (let k = 0; k < n; k++) r[k] = a[k] - b[k];
  return r;
}
