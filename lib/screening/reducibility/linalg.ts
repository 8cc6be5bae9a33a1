/**
 * Small dense linear algebra for the free-parameter solve: one-sided Jacobi SVD (Hestenes 1958;
 * Golub & Van Loan, "Matrix Computations", 4th ed. 2013, §8.6.4), greedy column pivoting
 * (Businger & Golub 1965) and Gaussian elimination with partial pivoting in any field.
 */
import type { Field } from "../expr";

export type Matrix = number[][];

export interface Svd {
  /** Singular values, descending. */
  sigma: number[];
  /** Right singular vectors as columns: v[i][j] is component i of vector j. */
  v: Matrix;
}

/** Singular values and right singular vectors of an m×n matrix (one-sided Jacobi). */
export function svd(a: Matrix): Svd {
  const m = a.length;
  const n = m === 0 ? 0 : a[0].length;
  const u = a.map((row) => row.slice());
  const v: Matrix = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (i === j ? 1 : 0)));
  for (let sweep = 0; sweep < 60; sweep++) {
    let rotated = false;
    for (let p = 0; p < n - 1; p++) {
      for (let q = p + 1; q < n; q++) {
        let alpha = 0;
        let beta = 0;
        let gamma = 0;
        for (let i = 0; i < m; i++) {
          alpha += u[i][p] * u[i][p];
          beta += u[i][q] * u[i][q];
          gamma += u[i][p] * u[i][q];
        }
        if (Math.abs(gamma) <= 1e-15 * Math.sqrt(alpha * beta) || gamma === 0) continue;
        rotated = true;
        const zeta = (beta - alpha) / (2 * gamma);
        const t = Math.sign(zeta || 1) / (Math.abs(zeta) + Math.sqrt(1 + zeta * zeta));
        const c = 1 / Math.sqrt(1 + t * t);
        const s = c * t;
        for (let i = 0; i < m; i++) {
          const x = u[i][p];
          const y = u[i][q];
          u[i][p] = c * x - s * y;
          u[i][q] = s * x + c * y;
        }
        for (let i = 0; i < n; i++) {
          const x = v[i][p];
          const y = v[i][q];
          v[i][p] = c * x - s * y;
          v[i][q] = s * x + c * y;
        }
      }
    }
    if (!rotated) break;
  }
  const norms = Array.from({ length: n }, (_, j) => Math.sqrt(u.reduce((acc, row) => acc + row[j] * row[j], 0)));
  const order = norms.map((_, j) => j).sort((x, y) => norms[y] - norms[x]);
  return {
    sigma: order.map((j) => norms[j]),
    v: v.map((row) => order.map((j) => row[j])),
  };
}

/** Indices of `rank` columns of `a` chosen by greedy pivoting on the largest remaining norm. */
export function pivotColumns(a: Matrix, rank: number): number[] {
  const m = a.length;
  const n = m === 0 ? 0 : a[0].length;
  const cols = Array.from({ length: n }, (_, j) => a.map((row) => row[j]));
  const chosen: number[] = [];
  for (let k = 0; k < rank; k++) {
    let best = -1;
    let bestNorm = -1;
    for (let j = 0; j < n; j++) {
      if (chosen.includes(j)) continue;
      const norm = Math.hypot(...cols[j]);
      if (norm > bestNorm) {
        bestNorm = norm;
        best = j;
      }
    }
    if (best < 0 || bestNorm === 0) break;
    chosen.push(best);
    const q = cols[best].map((x) => x / bestNorm);
    for (let j = 0; j < n; j++) {
      if (chosen.includes(j)) continue;
      const dot = cols[j].reduce((acc, x, i) => acc + x * q[i], 0);
      cols[j] = cols[j].map((x, i) => x - dot * q[i]);
    }
  }
  return chosen.sort((x, y) => x - y);
}

/** Solve A x = b (A square) by Gaussian elimination with partial pivoting; null when singular. */
export function solveLinear<T>(a: T[][], b: T[], F: Field<T>): T[] | null {
  const n = b.length;
  const m = a.map((row, i) => [...row, b[i]]);
  for (let col = 0; col < n; col++) {
    let pivot = col;
    for (let r = col + 1; r < n; r++) if (F.lt(F.abs(m[pivot][col]), F.abs(m[r][col]))) pivot = r;
    if (F.isZero(m[pivot][col])) return null;
    [m[col], m[pivot]] = [m[pivot], m[col]];
    for (let r = col + 1; r < n; r++) {
      const f = F.div(m[r][col], m[col][col]);
      for (let c = col; c <= n; c++) m[r][c] = F.sub(m[r][c], F.mul(f, m[col][c]));
    }
  }
  const x = new Array<T>(n).fill(F.zero);
  for (let r = n - 1; r >= 0; r--) {
    let acc = m[r][n];
    for (let c = r + 1; c < n; c++) acc = F.sub(acc, F.mul(m[r][c], x[c]));
    x[r] = F.div(acc, m[r][r]);
  }
  return x;
}

/** Normal equations (JᵀJ + damping·D) δ = −Jᵀr in any field; D = diag(JᵀJ) floored (Marquardt 1963). */
export function normalStep<T>(j: T[][], r: T[], damping: T, F: Field<T>): T[] | null {
  const n = j.length === 0 ? 0 : j[0].length;
  const a: T[][] = Array.from({ length: n }, () => new Array<T>(n).fill(F.zero));
  const g: T[] = new Array<T>(n).fill(F.zero);
  for (let i = 0; i < j.length; i++) {
    for (let p = 0; p < n; p++) {
      g[p] = F.sub(g[p], F.mul(j[i][p], r[i]));
      for (let q = 0; q < n; q++) a[p][q] = F.add(a[p][q], F.mul(j[i][p], j[i][q]));
    }
  }
  if (!F.isZero(damping)) {
    let maxDiag = F.zero;
    for (let p = 0; p < n; p++) if (F.lt(maxDiag, a[p][p])) maxDiag = a[p][p];
    const floor = F.mul(maxDiag, F.fromNumber(1e-12));
    for (let p = 0; p < n; p++) {
      const d = F.lt(a[p][p], floor) ? floor : a[p][p];
      a[p][p] = F.add(a[p][p], F.mul(damping, F.isZero(d) ? F.one : d));
    }
  }
  return solveLinear(a, g, F);
}
