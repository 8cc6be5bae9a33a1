/**
 * Mapped-back solutions of the original equations, over RealOps:
 *   NLS  u = A e^{i(αx² + δx + κ)} χ(βx + ε, γ)            (nls.md §1, §9)
 *   KdV  u = A U(βx + ε, γ) + B x + C                        (kdv.md §1, §6)
 *   mKdV u = A U(βx + ε, γ)                                  (mkdv.md §1, §5)
 * `m` holds the map functions at the time of evaluation (numbers, or t-jets lifted to T).
 */
import { type Complex, type RealOps, cxMul, cxScale, expi, real } from "./algebra";
import { type KdvKind, type MkdvKind, type NlsKind, type Params, type SolutionKind, canonicalKdv, canonicalMkdv, canonicalNls } from "./canonical";

export type MapValues<T> = Record<string, T>;

export function mappedSolution<T>(o: RealOps<T>, kind: SolutionKind, p: Params, m: MapValues<T>, x: T): Complex<T> {
  const X = o.add(o.mul(m.beta, x), m.eps);
  if (kind.startsWith("nls-")) {
    const chi = canonicalNls(o, kind as NlsKind, p, X, m.gamma);
    const phase = o.add(o.add(o.mul(m.alpha, o.mul(x, x)), o.mul(m.delta, x)), m.kappa);
    return cxScale(o, cxMul(o, expi(o, phase), chi), m.A);
  }
  if (kind.startsWith("kdv-")) {
    const U = canonicalKdv(o, kind as KdvKind, p, X, m.gamma);
    return real(o, o.add(o.add(o.mul(m.A, U), o.mul(m.B, x)), m.C));
  }
  return real(o, o.mul(m.A, canonicalMkdv(o, kind as MkdvKind, p, X, m.gamma)));
}
