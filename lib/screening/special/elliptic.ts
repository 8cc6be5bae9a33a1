/**
 * Complete elliptic integrals and Jacobi elliptic functions, parameter convention mJ
 * (../shared/math/README.md: sn(z|mJ) as scipy.special.ellipj(z, mJ) and Abramowitz & Stegun,
 * Handbook of Mathematical Functions, 1964, ch. 16–17; DLMF modulus k = sqrt(mJ)).
 * Method: arithmetic–geometric mean (A&S 17.6 for K, E; A&S 16.4 "descending Landen / AGM"
 * for sn, cn, dn). Accuracy ≈ 1e-15 relative for |z| ≤ a few periods (tests/screening/special).
 */

/** Stop the AGM when |c_n| ≤ this (A&S 17.6: c_n → 0 quadratically; double precision floor). */
const AGM_EPS = 1e-17;
const AGM_MAX_STEPS = 40;

interface AgmSequence {
  a: number[];
  c: number[];
}

/** AGM with a0 = 1, b0 = sqrt(1 − m), c0 = sqrt(m) (A&S 17.6.1–2). Requires m ≤ 1. */
function agm(m: number): AgmSequence {
  let a = 1;
  let b = Math.sqrt(1 - m);
  let c = Math.sqrt(Math.abs(m));
  const as = [a];
  const cs = [c];
  for (let n = 0; n < AGM_MAX_STEPS && Math.abs(c) > AGM_EPS * a; n++) {
    const an = (a + b) / 2;
    c = (a - b) / 2;
    b = Math.sqrt(a * b);
    a = an;
    as.push(a);
    cs.push(c);
  }
  return { a: as, c: cs };
}

/** K(m) = ∫_0^{π/2} (1 − m sin²θ)^{-1/2} dθ = π/(2 a_N)  (A&S 17.3.1, 17.6.4). Infinite at m = 1. */
export function ellipticK(m: number): number {
  if (!(m <= 1)) return NaN;
  if (m === 1) return Infinity;
  const { a } = agm(m);
  return Math.PI / (2 * a[a.length - 1]);
}

/** E(m) = ∫_0^{π/2} (1 − m sin²θ)^{1/2} dθ = K(m)(1 − Σ_{n≥0} 2^{n−1} c_n²)  (A&S 17.3.3, 17.6.3–4). */
export function ellipticE(m: number): number {
  if (!(m <= 1)) return NaN;
  if (m === 1) return 1;
  const { a, c } = agm(m);
  let sum = m / 2; // n = 0 term: 2^{-1} c_0², with c_0² = m exactly
  for (let n = 1; n < c.length; n++) sum += Math.pow(2, n - 1) * c[n] * c[n];
  return (Math.PI / (2 * a[a.length - 1])) * (1 - sum);
}

export interface JacobiValues {
  sn: number;
  cn: number;
  dn: number;
}

/**
 * sn, cn, dn(z | m) for 0 ≤ m ≤ 1 and real z.
 * A&S 16.4.2–3: φ_N = 2^N a_N z, sin(2φ_{n−1} − φ_n) = (c_n/a_n) sin φ_n, sn = sin φ_0,
 * cn = cos φ_0. dn is taken from dn² = (1 − m) + m cn² (A&S 16.9.1), which has no cancellation
 * (the AGM quotient cos φ_0 / cos(φ_1 − φ_0) loses digits near the zeros of cn).
 * z is first reduced modulo the real period 4K(m) (A&S 16.2) to keep φ_N small.
 */
export function jacobiElliptic(z: number, m: number): JacobiValues {
  if (!Number.isFinite(z) || !(m >= 0 && m <= 1)) return { sn: NaN, cn: NaN, dn: NaN };
  if (m === 0) return { sn: Math.sin(z), cn: Math.cos(z), dn: 1 }; // A&S 16.6.1–3
  if (m === 1) {
    const s = 1 / Math.cosh(z); // A&S 16.6.1–3 at m = 1
    return { sn: Math.tanh(z), cn: s, dn: s };
  }
  const seq = agm(m);
  const N = seq.a.length - 1;
  const K = Math.PI / (2 * seq.a[N]);
  const period = 4 * K;
  const zr = z - period * Math.round(z / period);
  let phi = Math.pow(2, N) * seq.a[N] * zr;
  for (let n = N; n >= 1; n--) {
    const t = (seq.c[n] / seq.a[n]) * Math.sin(phi);
    phi = (Math.asin(Math.max(-1, Math.min(1, t))) + phi) / 2;
  }
  const sn = Math.sin(phi);
  const cn = Math.cos(phi);
  const dn = Math.sqrt(1 - m + m * cn * cn);
  return { sn, cn, dn };
}

/**
 * Taylor coefficients of sn, cn, dn ∘ z for a jet z (z_k = z^(k)(s)/k!), from the derivative
 * rules sn' = cn dn, cn' = −sn dn, dn' = −m sn cn (A&S 16.16.1–3) applied to the chain rule:
 * (k+1) f_{k+1} = Σ_{j=0}^{k} g_j w_{k−j}, w = z'. Returns jets of the same length as z.
 */
export function jacobiEllipticJet(z: readonly number[], m: number): { sn: number[]; cn: number[]; dn: number[] } {
  const L = z.length;
  const v = jacobiElliptic(z[0], m);
  const s = [v.sn];
  const c = [v.cn];
  const d = [v.dn];
  const w: number[] = [];
  for (let j = 0; j + 1 < L; j++) w.push((j + 1) * z[j + 1]);
  const cd: number[] = [];
  const sd: number[] = [];
  const sc: number[] = [];
  for (let k = 0; k + 1 < L; k++) {
    let p = 0;
    let q = 0;
    let r = 0;
    for (let j = 0; j <= k; j++) {
      p += c[j] * d[k - j];
      q += s[j] * d[k - j];
      r += s[j] * c[k - j];
    }
    cd.push(p);
    sd.push(q);
    sc.push(r);
    let ds = 0;
    let dc = 0;
    let dd = 0;
    for (let j = 0; j <= k; j++) {
      ds += cd[j] * w[k - j];
      dc -= sd[j] * w[k - j];
      dd -= m * sc[j] * w[k - j];
    }
    s.push(ds / (k + 1));
    c.push(dc / (k + 1));
    d.push(dd / (k + 1));
  }
  return { sn: s, cn: c, dn: d };
}
