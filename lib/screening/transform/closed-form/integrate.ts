/**
 * Closed-form antiderivatives inside the exponential–power class (sums.ts):
 *   ∫ tⁿ e^{zt} dt = e^{zt} Σ_{j=0}^{n} (−1)^j n!/(n−j)! t^{n−j} / z^{j+1}      (z ≠ 0; repeated integration by parts)
 *   ∫ tⁿ (s t + r)^p dt, with u = s t + r, t = s(u − r):  s^{n+1} Σ_k C(n,k) (−r)^{n−k} u^{k+p+1}/(k+p+1)
 *                                                        (ln|u| when k + p = −1)
 * Terms outside these two shapes make the integral "not found" (the caller shows ∫ notation).
 */
import { type C, cdiv, cmul, cscale, czero, isZeroC } from "./complex";
import { type LinearFactor, type Sum, type Term, addSums, constant, evalSum, expSum, mulSums, normalize, scaleSum, tSum } from "./sums";

/** Σ coef · ln|s t + r|. */
export interface LogTerm {
  coef: number;
  s: 1 | -1;
  r: number;
}
export interface Antiderivative {
  sum: Sum;
  logs: LogTerm[];
}

function integrateTerm(t: Term): Antiderivative | null {
  if (t.L.length === 0) {
    if (isZeroC(t.z)) return { sum: [{ ...t, c: cscale(t.c, 1 / (t.n + 1)), n: t.n + 1 }], logs: [] };
    const out: Term[] = [];
    let fall = 1; // n!/(n−j)!
    let zpow: C = t.z; // z^{j+1}
    for (let j = 0; j <= t.n; j++) {
      const c = cdiv(cscale(t.c, (j % 2 === 0 ? 1 : -1) * fall), zpow);
      out.push({ c, n: t.n - j, z: t.z, L: [] });
      fall *= t.n - j;
      zpow = cmul(zpow, t.z);
    }
    return { sum: normalize(out), logs: [] };
  }
  if (t.L.length === 1 && isZeroC(t.z)) {
    const f = t.L[0];
    const { s, r, p } = f;
    const sum: Term[] = [];
    const logs: LogTerm[] = [];
    let binom = 1;
    for (let k = 0; k <= t.n; k++) {
      // C(n,k) (−r)^{n−k} ∫ u^{k+p} du, times s^{n+1} (from tⁿ = sⁿ(u − r)ⁿ and dt = s du)
      const coef = binom * Math.pow(-r, t.n - k) * Math.pow(s, t.n + 1);
      const e = k + p + 1;
      if (Math.abs(e) < 1e-13) {
        if (Math.abs(t.c.im) > 0) return null;
        logs.push({ coef: coef * t.c.re, s, r });
      } else {
        const factor: LinearFactor = { s, r, p: e };
        sum.push(...mulSums([{ c: cscale(t.c, coef / e), n: 0, z: czero, L: [] }], [{ c: { re: 1, im: 0 }, n: 0, z: czero, L: [factor] }]));
      }
      binom = (binom * (t.n - k)) / (k + 1);
    }
    return { sum: normalize(sum), logs };
  }
  return null;
}

/** An antiderivative of a sum, or null if some term is outside the integrable shapes. */
export function antiderivative(a: Sum): Antiderivative | null {
  let sum: Sum = [];
  const logs: LogTerm[] = [];
  for (const term of a) {
    const r = integrateTerm(term);
    if (!r) return null;
    sum = addSums(sum, r.sum);
    logs.push(...r.logs);
  }
  return { sum, logs: mergeLogs(logs) };
}

function mergeLogs(logs: LogTerm[]): LogTerm[] {
  const m = new Map<string, LogTerm>();
  for (const l of logs) {
    const k = `${l.s}:${l.r.toPrecision(13)}`;
    const o = m.get(k);
    m.set(k, o ? { ...o, coef: o.coef + l.coef } : { ...l });
  }
  return [...m.values()].filter((l) => l.coef !== 0);
}

export function evalAntiderivative(F: Antiderivative, t: number): number {
  let v = evalSum(F.sum, t);
  for (const l of F.logs) v += l.coef * Math.log(Math.abs(l.s * t + l.r));
  return v;
}

/** ∫_{t0}^{t} a(s) ds = F(t) − F(t0). */
export function definiteIntegral(a: Sum, t0: number): Antiderivative | null {
  const F = antiderivative(a);
  if (!F) return null;
  const at0 = evalAntiderivative(F, t0);
  // F(t0) that is rounding noise (e.g. Σ c sin(0)) is snapped to 0, so no "+ 0" term appears
  let mag = 0;
  for (const term of F.sum) mag += Math.abs(evalSum([term], t0));
  for (const l of F.logs) mag += Math.abs(l.coef * Math.log(Math.abs(l.s * t0 + l.r)));
  const c = Math.abs(at0) <= 1e-14 * mag ? 0 : -at0;
  return { sum: addSums(F.sum, constant(c)), logs: F.logs };
}

/**
 * exp(F) for an antiderivative whose sum part is real linear: e^{c0 + c1 t} Π |s t + r|^{coef}.
 * The factor |s t + r| is written with the orientation that is positive at t0 (on the window the
 * factor keeps its sign, otherwise a coefficient would be singular inside it).
 */
export function expAntiderivative(F: Antiderivative, t0: number): Sum | null {
  let r = expSum(F.sum);
  if (!r) return null;
  for (const l of F.logs) {
    const positive = l.s * t0 + l.r > 0;
    const f: LinearFactor = positive ? { s: l.s, r: l.r, p: l.coef } : { s: (-l.s) as 1 | -1, r: -l.r, p: l.coef };
    r = mulSums(r, [{ c: { re: 1, im: 0 }, n: 0, z: czero, L: [f] }]);
  }
  return r;
}

/** True when the antiderivative is itself a sum (no logarithms), so it can enter further algebra. */
export function asSum(F: Antiderivative): Sum | null {
  return F.logs.length === 0 ? F.sum : null;
}

export { scaleSum, tSum };
