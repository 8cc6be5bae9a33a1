/** Minimal complex arithmetic for the closed-form sums (coefficients and exponential rates). */
export interface C {
  re: number;
  im: number;
}
export const czero: C = { re: 0, im: 0 };
export const cadd = (a: C, b: C): C => ({ re: a.re + b.re, im: a.im + b.im });
export const csub = (a: C, b: C): C => ({ re: a.re - b.re, im: a.im - b.im });
export const cneg = (a: C): C => ({ re: -a.re, im: -a.im });
export const cmul = (a: C, b: C): C => ({ re: a.re * b.re - a.im * b.im, im: a.re * b.im + a.im * b.re });
export const cscale = (a: C, s: number): C => ({ re: a.re * s, im: a.im * s });
export function cinv(a: C): C {
  const d = a.re * a.re + a.im * a.im;
  return { re: a.re / d, im: -a.im / d };
}
export const cdiv = (a: C, b: C): C => cmul(a, cinv(b));
export const isZeroC = (a: C): boolean => a.re === 0 && a.im === 0;
/** Imaginary part negligible against the real part (rounding from Euler's formula). */
export const isReal = (a: C): boolean => Math.abs(a.im) <= 1e-14 * Math.max(Math.abs(a.re), 1e-300) || a.im === 0;
export const re = (a: C): number => a.re;
/** c^q: any complex c for integer q; real c > 0 for other real q (no branch choice made); else null. */
export function cpowReal(c: C, q: number): C | null {
  if (Number.isInteger(q)) {
    const mag = Math.pow(Math.hypot(c.re, c.im), q);
    const ph = Math.atan2(c.im, c.re) * q;
    return isReal(c) ? { re: Math.pow(c.re, q), im: 0 } : { re: mag * Math.cos(ph), im: mag * Math.sin(ph) };
  }
  if (isReal(c) && c.re > 0) return { re: Math.pow(c.re, q), im: 0 };
  return null;
}
