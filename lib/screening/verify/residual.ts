/**
 * Residuals of the ORIGINAL equations for mapped-back solutions, from exact derivatives (bijets)
 * at table nodes, relative to Σ|terms|:
 *   (N)  i u_t + a u_xx + (b x² + f x + e) u + h|u|²u + i k u + i c x u_x + i g u_x      (nls.md §0)
 *   (NK) u_t + p u u_x + q u_xxx + r u + (s x + g) u_x − l − m x                           (kdv.md §0)
 *   (NM) u_t + p u² u_x + q u_xxx + r u + (s x + g) u_x                                    (mkdv.md §0)
 * and of the canonical equations for the canonical solutions (nls.md §8, kdv.md §5, mkdv.md §5).
 * The map functions enter as their values and exact slopes at the node (transform/types.ts).
 */
import type { EquationClass } from "../spec/types";
import type { MapTable } from "../transform/types";
import {
  type Complex, type KdvKind, type MkdvKind, type NlsKind, type Params, type SolutionKind,
  canonicalKdv, canonicalMkdv, canonicalNls, mappedSolution,
} from "../solutions";
import { type Bijet, bijetDerivative, bijetOfT, bijetOps, bijetX } from "./bijet";

interface Cn {
  re: number;
  im: number;
}
const cadd = (a: Cn, b: Cn): Cn => ({ re: a.re + b.re, im: a.im + b.im });
const csc = (a: Cn, s: number): Cn => ({ re: a.re * s, im: a.im * s });
const I = (a: Cn): Cn => ({ re: -a.im, im: a.re });
const cabs = (a: Cn) => Math.hypot(a.re, a.im);

/** Derivative ∂x^i ∂t^j of a complex bijet. */
function d(u: Complex<Bijet>, i: number, j: number): Cn {
  return { re: bijetDerivative(u.re, i, j), im: bijetDerivative(u.im, i, j) };
}

export interface ResidualPoint {
  x: number;
  t: number;
  residual: number;
  scale: number;
  rel: number;
}

function finish(x: number, t: number, terms: Cn[]): ResidualPoint {
  let s: Cn = { re: 0, im: 0 };
  let scale = 0;
  for (const term of terms) {
    s = cadd(s, term);
    scale += cabs(term);
  }
  const residual = cabs(s);
  return { x, t, residual, scale, rel: scale === 0 ? 0 : residual / scale };
}

/** Residual of the original equation at (x, table node i). */
export function originalResidual(cls: EquationClass, kind: SolutionKind, params: Params, table: MapTable, i: number, coef: Record<string, number>, x: number): ResidualPoint {
  const nx = cls === "nls" ? 2 : 3;
  const o = bijetOps(nx, 1);
  const m: Record<string, Bijet> = {};
  for (const name of Object.keys(table.values)) m[name] = bijetOfT([table.values[name][i], table.slopes[name][i]], nx, 1);
  const u = mappedSolution(o, kind, params, m, bijetX(x, nx, 1));
  const t = table.t[i];
  const u0 = d(u, 0, 0);
  const ux = d(u, 1, 0);
  const ut = d(u, 0, 1);
  if (cls === "nls") {
    const uxx = d(u, 2, 0);
    const mod2 = u0.re * u0.re + u0.im * u0.im;
    return finish(x, t, [
      I(ut), csc(uxx, coef.a), csc(u0, coef.b * x * x), csc(u0, coef.f * x), csc(u0, coef.e),
      csc(u0, coef.h * mod2), I(csc(u0, coef.k)), I(csc(ux, coef.c * x)), I(csc(ux, coef.g)),
    ]);
  }
  const uxxx = d(u, 3, 0);
  const nonlinear = cls === "kdv" ? csc(ux, coef.p * u0.re) : csc(ux, coef.p * u0.re * u0.re);
  const terms = [ut, nonlinear, csc(uxxx, coef.q), csc(u0, coef.r), csc(ux, coef.s * x), csc(ux, coef.g)];
  if (cls === "kdv") terms.push({ re: -coef.l, im: 0 }, { re: -coef.m * x, im: 0 });
  return finish(x, t, terms);
}

/** Residual of the canonical equation for the canonical solution at (ξ, τ). */
export function canonicalResidual(kind: SolutionKind, params: Params, sigma: 1 | -1 | null, xi: number, tau: number): ResidualPoint {
  const nls = kind.startsWith("nls-");
  const nx = nls ? 2 : 3;
  const o = bijetOps(nx, 1);
  const X = bijetX(xi, nx, 1);
  const T = bijetOfT([tau, 1], nx, 1);
  if (nls) {
    const chi = canonicalNls(o, kind as NlsKind, params, X, T);
    const c0 = d(chi, 0, 0);
    const mod2 = c0.re * c0.re + c0.im * c0.im;
    // i χ_τ + χ_ξξ + 2σ|χ|²χ
    return finish(xi, tau, [I(d(chi, 0, 1)), d(chi, 2, 0), csc(c0, 2 * (sigma ?? 1) * mod2)]);
  }
  const U = kind.startsWith("kdv-") ? canonicalKdv(o, kind as KdvKind, params, X, T) : canonicalMkdv(o, kind as MkdvKind, params, X, T);
  const Uc = { re: U, im: o.constant(0) };
  const u0 = bijetDerivative(U, 0, 0);
  const ux = d(Uc, 1, 0);
  // KdV: U_T + 6 U U_X + U_XXX;  mKdV: U_T + 6σ U² U_X + U_XXX
  const nonlinear = kind.startsWith("kdv-") ? csc(ux, 6 * u0) : csc(ux, 6 * (sigma ?? 1) * u0 * u0);
  return finish(xi, tau, [d(Uc, 0, 1), nonlinear, d(Uc, 3, 0)]);
}

