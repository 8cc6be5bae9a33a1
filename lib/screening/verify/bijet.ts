/**
 * Bivariate truncated Taylor series in (x, t) ("bijets"): c[i][j] = ∂x^i ∂t^j f / (i! j!) at a
 * point, kept for i ≤ nx, j ≤ nt. A function of a bijet is formed by composition with its
 * univariate Taylor coefficients, f(g) = Σ_k f^{(k)}(g0)/k! (g − g0)^k, k ≤ nx + nt
 * (Griewank & Walther, Evaluating Derivatives, 2nd ed. 2008, §13: univariate Taylor propagation;
 * the Jacobi coefficients come from ../special). Used to take the exact x- and t-derivatives of a
 * mapped-back solution for the residual of the original equation.
 */
import { DoubleField, jetSech, jetTanh, variableJet } from "../expr";
import { jacobiEllipticJet } from "../special";
import type { RealOps } from "../solutions";

export interface Bijet {
  nx: number;
  nt: number;
  /** Row-major: index i * (nt + 1) + j. */
  c: Float64Array;
}

export function bijetZero(nx: number, nt: number): Bijet {
  return { nx, nt, c: new Float64Array((nx + 1) * (nt + 1)) };
}
export function bijetConstant(v: number, nx: number, nt: number): Bijet {
  const b = bijetZero(nx, nt);
  b.c[0] = v;
  return b;
}
/** The space variable x at x_s: x_s + dx. */
export function bijetX(xs: number, nx: number, nt: number): Bijet {
  const b = bijetConstant(xs, nx, nt);
  if (nx >= 1) b.c[nt + 1] = 1;
  return b;
}
/** A function of t with known Taylor coefficients [f, f', f''/2, …] at t_s, lifted. */
export function bijetOfT(coeffs: readonly number[], nx: number, nt: number): Bijet {
  const b = bijetZero(nx, nt);
  for (let j = 0; j <= nt && j < coeffs.length; j++) b.c[j] = coeffs[j];
  return b;
}
/** ∂x^i ∂t^j f at the point: i! j! c[i][j]. */
export function bijetDerivative(b: Bijet, i: number, j: number): number {
  let f = 1;
  for (let k = 2; k <= i; k++) f *= k;
  for (let k = 2; k <= j; k++) f *= k;
  return f * b.c[i * (b.nt + 1) + j];
}

function mul(a: Bijet, b: Bijet): Bijet {
  const { nx, nt } = a;
  const w = nt + 1;
  const r = bijetZero(nx, nt);
  for (let i1 = 0; i1 <= nx; i1++) {
    for (let j1 = 0; j1 <= nt; j1++) {
      const av = a.c[i1 * w + j1];
      if (av === 0) continue;
      for (let i2 = 0; i1 + i2 <= nx; i2++) {
        for (let j2 = 0; j1 + j2 <= nt; j2++) r.c[(i1 + i2) * w + j1 + j2] += av * b.c[i2 * w + j2];
      }
    }
  }
  return r;
}
function lin(a: Bijet, b: Bijet, sa: number, sb: number): Bijet {
  const r = bijetZero(a.nx, a.nt);
  for (let k = 0; k < r.c.length; k++) r.c[k] = sa * a.c[k] + sb * b.c[k];
  return r;
}
function scale(a: Bijet, s: number): Bijet {
  const r = bijetZero(a.nx, a.nt);
  for (let k = 0; k < r.c.length; k++) r.c[k] = s * a.c[k];
  return r;
}

/** Σ_k f_k (g − g0)^k by Horner's rule; f has nx + nt + 1 entries. */
function compose(g: Bijet, f: readonly number[]): Bijet {
  const h = scale(g, 1);
  h.c[0] = 0;
  let r = bijetConstant(f[f.length - 1], g.nx, g.nt);
  for (let k = f.length - 2; k >= 0; k--) {
    r = mul(r, h);
    r.c[0] += f[k];
  }
  return r;
}

function order(g: Bijet): number {
  return g.nx + g.nt;
}
function factorials(n: number): number[] {
  const f = [1];
  for (let k = 1; k <= n; k++) f.push(f[k - 1] * k);
  return f;
}

export function bijetOps(nx: number, nt: number): RealOps<Bijet> {
  const K = nx + nt;
  const fact = factorials(K);
  const F = DoubleField;
  return {
    constant: (v) => bijetConstant(v, nx, nt),
    add: (a, b) => lin(a, b, 1, 1),
    sub: (a, b) => lin(a, b, 1, -1),
    mul,
    div: (a, b) => {
      // 1/y: f_k = (−1)^k / y0^{k+1}
      const y0 = b.c[0];
      const f = Array.from({ length: K + 1 }, (_, k) => (k % 2 === 0 ? 1 : -1) / Math.pow(y0, k + 1));
      return mul(a, compose(b, f));
    },
    neg: (a) => scale(a, -1),
    scale,
    exp: (a) => {
      const e = Math.exp(a.c[0]);
      return compose(a, fact.map((k) => e / k));
    },
    // derivatives cycle cos → −sin → −cos → sin (no cos(θ + kπ/2): that rounds θ when |θ| is large)
    cos: (a) => {
      const c = Math.cos(a.c[0]);
      const s = Math.sin(a.c[0]);
      const cyc = [c, -s, -c, s];
      return compose(a, fact.map((k, i) => cyc[i % 4] / k));
    },
    sin: (a) => {
      const c = Math.cos(a.c[0]);
      const s = Math.sin(a.c[0]);
      const cyc = [s, c, -s, -c];
      return compose(a, fact.map((k, i) => cyc[i % 4] / k));
    },
    sech: (a) => compose(a, jetSech(variableJet(a.c[0], order(a), F), F)),
    tanh: (a) => compose(a, jetTanh(variableJet(a.c[0], order(a), F), F)),
    jacobi: (z, m) => {
      const unit = [z.c[0], 1, ...new Array<number>(order(z) - 1).fill(0)];
      const j = jacobiEllipticJet(unit, m);
      return { sn: compose(z, j.sn), cn: compose(z, j.cn), dn: compose(z, j.dn) };
    },
  };
}
