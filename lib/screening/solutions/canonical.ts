/**
 * Canonical solutions, written over RealOps (see algebra.ts):
 *   NLS  i χ_τ + χ_ξξ + 2σ|χ|²χ = 0   (../shared/math/nls.md §8)
 *   KdV  U_T + 6 U U_X + U_XXX = 0     (kdv.md §5)
 *   mKdV U_T + 6σ U² U_X + U_XXX = 0   (mkdv.md §5)
 * Periodic NLS waves carry the Galilean boost χ → e^{i(Vξ − V²τ)} χ(ξ − 2Vτ, τ) (nls.md §8), plus a
 * translation ξ0 and a phase φ0.
 */
import { type Complex, type RealOps, cxMul, expi, real } from "./algebra";

export type NlsKind = "nls-bright" | "nls-dark" | "nls-dn" | "nls-cn" | "nls-sn";
export type KdvKind = "kdv-soliton" | "kdv-cnoidal";
export type MkdvKind = "mkdv-soliton" | "mkdv-kink";
export type SolutionKind = NlsKind | KdvKind | MkdvKind;

export type Params = Record<string, number>;

/** χ(ξ, τ) of nls.md §8. */
export function canonicalNls<T>(o: RealOps<T>, kind: NlsKind, p: Params, xi: T, tau: T): Complex<T> {
  switch (kind) {
    case "nls-bright": {
      // η sech(η(ξ − 2Vτ − ξ0)) e^{i[Vξ + (η² − V²)τ + φ0]}
      const { eta, V, xi0, phi0 } = p;
      const arg = o.scale(o.sub(o.sub(xi, o.scale(tau, 2 * V)), o.constant(xi0)), eta);
      const phase = o.add(o.add(o.scale(xi, V), o.scale(tau, eta * eta - V * V)), o.constant(phi0));
      return cxMul(o, real(o, o.scale(o.sech(arg), eta)), expi(o, phase));
    }
    case "nls-dark": {
      // ρ[λ tanh(ρλ(ξ − 2ρντ − ξ0)) + iν] e^{i(−2ρ²τ + φ0)}, λ = sqrt(1 − ν²)
      const { rho, nu, xi0, phi0 } = p;
      const lam = Math.sqrt(1 - nu * nu);
      const arg = o.scale(o.sub(o.sub(xi, o.scale(tau, 2 * rho * nu)), o.constant(xi0)), rho * lam);
      const front = { re: o.scale(o.tanh(arg), rho * lam), im: o.constant(rho * nu) };
      return cxMul(o, front, expi(o, o.add(o.scale(tau, -2 * rho * rho), o.constant(phi0))));
    }
    default: {
      const { eta, mJ, V, xi0, phi0 } = p;
      const xiMoving = o.sub(o.sub(xi, o.scale(tau, 2 * V)), o.constant(xi0));
      const w = o.jacobi(o.scale(xiMoving, eta), mJ);
      let amp: T;
      let omega: number;
      if (kind === "nls-dn") {
        amp = o.scale(w.dn, eta); // η dn(ηξ|m) e^{iη²(2 − m)τ}
        omega = eta * eta * (2 - mJ);
      } else if (kind === "nls-cn") {
        amp = o.scale(w.cn, eta * Math.sqrt(mJ)); // η√m cn(ηξ|m) e^{iη²(2m − 1)τ}
        omega = eta * eta * (2 * mJ - 1);
      } else {
        amp = o.scale(w.sn, eta * Math.sqrt(mJ)); // η√m sn(ηξ|m) e^{−iη²(1 + m)τ}
        omega = -eta * eta * (1 + mJ);
      }
      const phase = o.add(o.add(o.scale(xi, V), o.scale(tau, omega - V * V)), o.constant(phi0));
      return cxMul(o, real(o, amp), expi(o, phase));
    }
  }
}

/** U(X, T) of kdv.md §5. */
export function canonicalKdv<T>(o: RealOps<T>, kind: KdvKind, p: Params, X: T, Tm: T): T {
  if (kind === "kdv-soliton") {
    // 2η² sech²(η(X − 4η²T − X0))
    const { eta, X0 } = p;
    const s = o.sech(o.scale(o.sub(o.sub(X, o.scale(Tm, 4 * eta * eta)), o.constant(X0)), eta));
    return o.scale(o.mul(s, s), 2 * eta * eta);
  }
  // Ub + 2 m η² cn²(η(X − Vc T − X0) | m),  Vc = 6 Ub + 4η²(2m − 1)
  const { eta, mJ, Ub, X0 } = p;
  const Vc = 6 * Ub + 4 * eta * eta * (2 * mJ - 1);
  const c = o.jacobi(o.scale(o.sub(o.sub(X, o.scale(Tm, Vc)), o.constant(X0)), eta), mJ).cn;
  return o.add(o.constant(Ub), o.scale(o.mul(c, c), 2 * mJ * eta * eta));
}

/** U(X, T) of mkdv.md §5. */
export function canonicalMkdv<T>(o: RealOps<T>, kind: MkdvKind, p: Params, X: T, Tm: T): T {
  const { eta, X0 } = p;
  if (kind === "mkdv-soliton") {
    // σ = +1: η sech(η(X − η²T − X0))
    return o.scale(o.sech(o.scale(o.sub(o.sub(X, o.scale(Tm, eta * eta)), o.constant(X0)), eta)), eta);
  }
  // σ = −1: η tanh(η(X + 2η²T − X0))
  return o.scale(o.tanh(o.scale(o.sub(o.add(X, o.scale(Tm, 2 * eta * eta)), o.constant(X0)), eta)), eta);
}
