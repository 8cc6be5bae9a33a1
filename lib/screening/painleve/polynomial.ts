/**
 * Small complex-polynomial tools in double precision: roots (Aberth–Ehrlich simultaneous
 * iteration, O. Aberth, Math. Comp. 27 (1973) 339–344, with Newton polishing) and the
 * interpolating polynomial through equally spaced samples (Newton divided differences).
 * Coefficients are in ascending powers. Used for the leading-order polynomial (§6 Step 3)
 * and det M(j) (§6 Step 4) of ../shared/math/painleve.md.
 */
import type { Complex } from "./jet-algebra";

const cadd = (a: Complex, b: Complex): Complex => ({ re: a.re + b.re, im: a.im + b.im });
const csub = (a: Complex, b: Complex): Complex => ({ re: a.re - b.re, im: a.im - b.im });
const cmul = (a: Complex, b: Complex): Complex => ({ re: a.re * b.re - a.im * b.im, im: a.re * b.im + a.im * b.re });
const cdiv = (a: Complex, b: Complex): Complex => {
  const d = b.re * b.re + b.im * b.im;
  return { re: (a.re * b.re + a.im * b.im) / d, im: (a.im * b.re - a.re * b.im) / d };
};
export const cabs = (a: Complex): number => Math.hypot(a.re, a.im);
const csqrt = (a: Complex): Complex => {
  const r = cabs(a);
  const re = Math.sqrt((r + a.re) / 2);
  const im = Math.sqrt(Math.max((r - a.re) / 2, 0));
  return { re, im: a.im < 0 ? -im : im };
};

/** p(z) and p'(z) by Horner. */
function evalWithDerivative(c: Complex[], z: Complex): [Complex, Complex] {
  let p: Complex = { re: 0, im: 0 };
  let dp: Complex = { re: 0, im: 0 };
  for (let k = c.length - 1; k >= 0; k--) {
    dp = cadd(cmul(dp, z), p);
    p = cadd(cmul(p, z), c[k]);
  }
  return [p, dp];
}

/**
 * All roots of Σ c_k z^k (c ascending). Exact zero leading coefficients are removed; exact zero
 * trailing coefficients give roots at 0.
 */
export function polynomialRoots(coefficients: Complex[]): Complex[] {
  const c = [...coefficients];
  while (c.length > 0 && c[c.length - 1].re === 0 && c[c.length - 1].im === 0) c.pop();
  const roots: Complex[] = [];
  while (c.length > 1 && c[0].re === 0 && c[0].im === 0) {
    c.shift();
    roots.push({ re: 0, im: 0 });
  }
  const n = c.length - 1;
  if (n < 1) return roots;
  if (n === 1) return [...roots, cdiv({ re: -c[0].re, im: -c[0].im }, c[1])];
  if (n === 2) {
    // Stable quadratic formula: q = -(b + sign·sqrt(b² - 4ac))/2, roots q/a and c/q.
    const [c0, c1, c2] = c;
    const disc = csqrt(csub(cmul(c1, c1), cmul({ re: 4, im: 0 }, cmul(c2, c0))));
    const s = c1.re * disc.re + c1.im * disc.im >= 0 ? cadd(c1, disc) : csub(c1, disc);
    const q = { re: -s.re / 2, im: -s.im / 2 };
    if (q.re === 0 && q.im === 0) return [...roots, { re: 0, im: 0 }, { re: 0, im: 0 }];
    return [...roots, cdiv(q, c2), cdiv(c0, q)];
  }
  // Aberth–Ehrlich: start on a circle of the Cauchy-bound radius, slightly rotated.
  const lead = c[n];
  let radius = 0;
  for (let k = 0; k < n; k++) radius = Math.max(radius, Math.pow(cabs(c[k]) / cabs(lead), 1 / (n - k)));
  radius = Math.max(radius, 1e-300);
  let z: Complex[] = Array.from({ length: n }, (_, k) => {
    const a = (2 * Math.PI * k) / n + 0.4;
    return { re: radius * Math.cos(a), im: radius * Math.sin(a) };
  });
  for (let iter = 0; iter < 500; iter++) {
    let moved = 0;
    const next = z.map((zk, k) => {
      const [p, dp] = evalWithDerivative(c, zk);
      if (p.re === 0 && p.im === 0) return zk;
      const ratio = cdiv(p, dp);
      let sum: Complex = { re: 0, im: 0 };
      for (let m = 0; m < n; m++) if (m !== k) sum = cadd(sum, cdiv({ re: 1, im: 0 }, csub(zk, z[m])));
      const w = cdiv(ratio, csub({ re: 1, im: 0 }, cmul(ratio, sum)));
      moved = Math.max(moved, cabs(w) / Math.max(cabs(zk), 1e-300));
      return csub(zk, w);
    });
    z = next;
    if (moved < 1e-15) break;
  }
  // Newton polishing of each root.
  z = z.map((zk) => {
    let r = zk;
    for (let i = 0; i < 3; i++) {
      const [p, dp] = evalWithDerivative(c, r);
      if (cabs(dp) === 0) break;
      r = csub(r, cdiv(p, dp));
    }
    return r;
  });
  return [...roots, ...z];
}

/**
 * Coefficients (ascending) of the polynomial of degree ≤ n-1 through (x_k, y_k), k = 0..n-1
 * (Newton divided differences, then expansion).
 */
export function interpolate(x: number[], y: Complex[]): Complex[] {
  const n = x.length;
  const d = y.map((v) => ({ ...v }));
  for (let level = 1; level < n; level++) {
    for (let k = n - 1; k >= level; k--) {
      const h = x[k] - x[k - level];
      d[k] = { re: (d[k].re - d[k - 1].re) / h, im: (d[k].im - d[k - 1].im) / h };
    }
  }
  // Horner-style expansion of Σ d_k Π_{m<k} (z - x_m).
  let poly: Complex[] = [d[n - 1]];
  for (let k = n - 2; k >= 0; k--) {
    const next: Complex[] = new Array(poly.length + 1).fill(null).map(() => ({ re: 0, im: 0 }));
    for (let i = 0; i < poly.length; i++) {
      next[i + 1] = cadd(next[i + 1], poly[i]);
      next[i] = csub(next[i], { re: x[k] * poly[i].re, im: x[k] * poly[i].im });
    }
    next[0] = cadd(next[0], d[k]);
    poly = next;
  }
  return poly;
}

export { cadd, csub, cmul, cdiv };
