/**
 * Family members used by the transform, solutions and verify tests, with their sources.
 * NLS cases: ../shared/math/nls.md §11 (σ = +1 versions; the dark rows use h → −h).
 * KdV: kdv.md §7 and §2 (special members). mKdV: mkdv.md §6.
 */
import { parseExpression, num } from "../../../lib/screening/expr";
import { CLASS_COEFFICIENTS, type EquationClass, type Variant } from "../../../lib/screening/spec/types";

export function variant(cls: EquationClass, coefficients: Record<string, string>, window: [number, number], id = "test"): Variant {
  const coefs: Variant["coefficients"] = {};
  for (const name of CLASS_COEFFICIENTS[cls]) {
    const text = coefficients[name];
    if (text === undefined) {
      coefs[name] = num(0);
      continue;
    }
    const r = parseExpression(text, { symbols: new Set(["t"]) });
    if (!r.ok) throw new Error(`fixture ${id}.${name}: ${r.error.message}`);
    coefs[name] = r.expr;
  }
  return { familyId: id, index: 0, class: cls, parameters: {}, free: [], coefficients: coefs, window };
}

/** nls.md §11 rows: coefficients and the check values u(0.5, 0.8) for bright (η=1, V=1/2) and dark (ρ=1, ν=1/2). */
export interface NlsCase {
  id: string;
  coefficients: Record<string, string>;
  bright?: [number, number];
  dark?: [number, number];
}
export const NLS_CASES: NlsCase[] = [
  { id: "a", coefficients: { a: "1/2", h: "1" }, bright: [0.848279588441, 0.520084637999], dark: [0.410800806854, 0.294685749832] },
  { id: "b", coefficients: { a: "1/2", f: "0.3", h: "1" }, bright: [0.817159052547, 0.576398371798], dark: [0.319691242853, 0.384456121256] },
  { id: "c2", coefficients: { a: "1/2", k: "0.1", h: "exp(t/5)" }, bright: [0.783060754396, 0.480098630841], dark: [0.379216939916, 0.272029232717] },
  { id: "d", coefficients: { a: "1/2", b: "-1/(8*(1+t)^2)", h: "(1+t)^(-1/2)" }, bright: [0.778146537554, 0.367745283841], dark: [0.27009616514, 0.340560388286] },
  { id: "d2", coefficients: { a: "1/2", b: "-1/2", h: "1/cos(t)" }, bright: [0.957902992909, 0.678433709158], dark: [0.621109753139, 0.074843027905] },
  { id: "e", coefficients: { a: "1", c: "1", k: "1/4", f: "1", g: "-1/2", h: "2*exp(t/2)" }, bright: [-0.670891765404, 0.969602659829], dark: [0.390596058925, -1.37780371757] },
  { id: "e3", coefficients: { a: "1", c: "1", h: "2" }, bright: [-0.535815893303, 1.500511301448], dark: [-0.172115660013, -1.643674930916] },
  { id: "k1", coefficients: { a: "1/2", k: "1/(2*(1+t))", h: "1" }, bright: [0.516151943174, 0.203171122049], dark: [0.123265292844, 0.250002344679] },
  { id: "k2", coefficients: { a: "1/2", k: "0.1", b: "0.02", h: "1" }, bright: [0.747329504494, 0.403208542786], dark: [0.303333312202, 0.303943507328] },
  { id: "g1", coefficients: { a: "1/2", e: "cos(t)", f: "0.3*sin(t)", g: "0.2", h: "1" }, bright: [0.347264277488, 0.93394430374], dark: [-0.042033380422, 0.502257910725] },
];
/** Not reducible rows of nls.md §11 with their R. */
export const NLS_FAILING: { id: string; coefficients: Record<string, string>; R: number }[] = [
  { id: "c1", coefficients: { a: "1/2", k: "0.1", h: "1" }, R: 1 / 25 },
  { id: "e1", coefficients: { a: "1", c: "1", k: "1/4", f: "1", g: "-1/2", h: "2" }, R: -3 / 4 },
  { id: "e2", coefficients: { a: "1", c: "1", k: "1/2", h: "2" }, R: -1 },
];

export function nlsVariant(c: NlsCase | { id: string; coefficients: Record<string, string> }, dark = false, window: [number, number] = [0, 1.2]): Variant {
  const co = { ...c.coefficients };
  if (dark) co.h = `-(${co.h})`;
  return variant("nls", co, window, c.id);
}

/** kdv.md §7: all seven coefficients nonzero, K ≡ 0. */
export const KDV_EXAMPLE: Record<string, string> = {
  p: "1 + 0.3*cos(t)",
  q: "((1 + 0.3*cos(t))/1.3)*exp(0.1*t + 0.46*sin(t))",
  r: "0.1",
  s: "0.2*cos(t)",
  g: "0.5*sin(t)",
  m: "0.06 + 0.052*cos(t)",
  l: "0.1*cos(t) + 0.13*sin(t) + 0.006*sin(t)*cos(t)",
};
/** mkdv.md §6, for sigma = ±1. */
export function mkdvExample(sigma: 1 | -1): Record<string, string> {
  return {
    q: "1 + 0.5*sin(t)",
    r: "0.2 + 0.1*cos(t)",
    s: "0.1*cos(t)",
    g: "0.3*t",
    p: `${6 * sigma}*(1 + 0.5*sin(t))*exp(0.4*t)`,
  };
}

/** Every leaf is a finite number, string, boolean or null; no typed arrays, functions or undefined in arrays. */
export function nonJsonLeaves(value: unknown, path = "$", out: string[] = []): string[] {
  if (value === null || typeof value === "string" || typeof value === "boolean") return out;
  if (typeof value === "number") {
    if (!Number.isFinite(value)) out.push(`${path} = ${value}`);
    return out;
  }
  if (Array.isArray(value)) {
    value.forEach((v, i) => (v === undefined ? out.push(`${path}[${i}] undefined`) : nonJsonLeaves(v, `${path}[${i}]`, out)));
    return out;
  }
  if (typeof value === "object" && Object.getPrototypeOf(value) === Object.prototype) {
    for (const [k, v] of Object.entries(value as Record<string, unknown>)) if (v !== undefined) nonJsonLeaves(v, `${path}.${k}`, out);
    return out;
  }
  out.push(`${path}: ${typeof value} ${Object.prototype.toString.call(value)}`);
  return out;
}
