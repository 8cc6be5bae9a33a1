/**
 * The exact solutions offered per class and canonical sign, with their parameters (names,
 * defaults, ranges). Defaults are the check-value parameters of nls.md §11, kdv.md §7, mkdv.md §6.
 */
import type { EquationClass } from "../spec/types";
import { ellipticK } from "../special";
import type { Params, SolutionKind } from "./canonical";
import type { SolutionParameter, SolutionSpec } from "./types";

const P = (name: string, latex: string, d: number, min: number, max: number, minInc: boolean, maxInc: boolean, description: string): SolutionParameter => ({
  name, latex, defaultValue: d, min, max, minInclusive: minInc, maxInclusive: maxInc, description,
});
const eta = (d = 1) => P("eta", "\\eta", d, 0, 5, false, true, "amplitude / inverse width (> 0)");
const xi0 = P("xi0", "\\xi_0", 0, -20, 20, true, true, "position at τ = 0 in the canonical variable");
const phi0 = P("phi0", "\\phi_0", 0, -Math.PI, Math.PI, true, true, "phase");
const X0 = P("X0", "X_0", 0, -20, 20, true, true, "position at T = 0 in the canonical variable");
const mJ = P("mJ", "m_J", 0.64, 0, 1, false, false, "Jacobi parameter 0 < mJ < 1 (sn(z|mJ) as scipy.special.ellipj)");
const boost = (d: number) => P("V", "V", d, -3, 3, true, true, "Galilean boost: wavenumber V, velocity 2V in the canonical frame");

const NLS_MAP = "u(x,t) = A(t)\\, e^{i(\\alpha x^2 + \\delta x + \\kappa)}\\, \\chi(\\beta x + \\varepsilon, \\gamma)";
const ELLIPTIC_SOURCE = "nls.md §8; stationary cnoidal NLS waves, Carr, Clark & Reinhardt, Phys. Rev. A 62 (2000) 063610/063611 (from memory)";

export const CATALOGUE: readonly SolutionSpec[] = [
  {
    id: "nls-bright", kind: "nls-bright", class: "nls", label: "bright soliton", sigma: 1, localized: true,
    canonicalLatex: "\\chi = \\eta\\,\\operatorname{sech}\\big(\\eta(\\xi - 2V\\tau - \\xi_0)\\big)\\, e^{i[V\\xi + (\\eta^2 - V^2)\\tau + \\phi_0]}",
    mappedLatex: "u = A\\eta\\,\\operatorname{sech}\\big(\\eta(\\beta x + \\varepsilon - 2V\\gamma - \\xi_0)\\big)\\, e^{i[\\alpha x^2 + \\delta x + \\kappa + V(\\beta x + \\varepsilon) + (\\eta^2 - V^2)\\gamma + \\phi_0]}",
    parameters: [eta(), boost(0.5), xi0, phi0],
    source: "nls.md §8–9; Ablowitz & Segur, Solitons and the Inverse Scattering Transform, SIAM 1981 (from memory)",
    features: ["peak |u| = A η", "centre x_c(t) = (ξ0 + 2Vγ − ε)/β", "width ∝ 1/(η|β|)", "local wavenumber 2αx + δ + Vβ"],
  },
  {
    id: "nls-dark", kind: "nls-dark", class: "nls", label: "dark (grey) soliton", sigma: -1, localized: false,
    canonicalLatex: "\\chi = \\rho\\big[\\lambda \\tanh\\big(\\rho\\lambda(\\xi - 2\\rho\\nu\\tau - \\xi_0)\\big) + i\\nu\\big] e^{i(-2\\rho^2\\tau + \\phi_0)},\\ \\lambda = \\sqrt{1 - \\nu^2}",
    mappedLatex: "u = A\\rho\\big[\\lambda\\tanh\\big(\\rho\\lambda(\\beta x + \\varepsilon - 2\\rho\\nu\\gamma - \\xi_0)\\big) + i\\nu\\big] e^{i[\\alpha x^2 + \\delta x + \\kappa - 2\\rho^2\\gamma + \\phi_0]}",
    parameters: [P("rho", "\\rho", 1, 0, 5, false, true, "background amplitude (> 0)"), P("nu", "\\nu", 0.5, -1, 1, false, false, "greyness: min|χ| = ρ|ν|, velocity 2ρν; ν = 0 black"), xi0, phi0],
    source: "nls.md §8–9; Kivshar & Luther-Davies, Phys. Rep. 298 (1998) 81 (from memory)",
    features: ["background |u| → Aρ", "dip min |u| = Aρ|ν|", "centre x_c(t) = (ξ0 + 2ρνγ − ε)/β"],
  },
  {
    id: "nls-dn", kind: "nls-dn", class: "nls", label: "dn periodic wave", sigma: 1, localized: false,
    canonicalLatex: "\\chi = \\eta\\,\\operatorname{dn}(\\eta\\xi\\,|\\,m_J)\\, e^{i\\eta^2(2 - m_J)\\tau}\\ (\\text{boosted by } V)",
    mappedLatex: NLS_MAP, parameters: [eta(), mJ, boost(0), xi0, phi0], source: ELLIPTIC_SOURCE,
    features: ["period of χ in ξ: 2K(mJ)/η", "|u|² has period 2K(mJ)/(η|β(t)|) in x", "mJ → 1: bright soliton"],
  },
  {
    id: "nls-cn", kind: "nls-cn", class: "nls", label: "cn periodic wave", sigma: 1, localized: false,
    canonicalLatex: "\\chi = \\eta\\sqrt{m_J}\\,\\operatorname{cn}(\\eta\\xi\\,|\\,m_J)\\, e^{i\\eta^2(2m_J - 1)\\tau}\\ (\\text{boosted by } V)",
    mappedLatex: NLS_MAP, parameters: [eta(), mJ, boost(0), xi0, phi0], source: ELLIPTIC_SOURCE,
    features: ["period of χ in ξ: 4K(mJ)/η", "|u|² has period 2K(mJ)/(η|β(t)|) in x", "mJ → 1: bright soliton"],
  },
  {
    id: "nls-sn", kind: "nls-sn", class: "nls", label: "sn periodic wave", sigma: -1, localized: false,
    canonicalLatex: "\\chi = \\eta\\sqrt{m_J}\\,\\operatorname{sn}(\\eta\\xi\\,|\\,m_J)\\, e^{-i\\eta^2(1 + m_J)\\tau}\\ (\\text{boosted by } V)",
    mappedLatex: NLS_MAP, parameters: [eta(), mJ, boost(0), xi0, phi0], source: ELLIPTIC_SOURCE,
    features: ["period of χ in ξ: 4K(mJ)/η", "|u|² has period 2K(mJ)/(η|β(t)|) in x", "mJ → 1: black soliton"],
  },
  {
    id: "kdv-soliton", kind: "kdv-soliton", class: "kdv", label: "soliton", sigma: null, localized: true,
    canonicalLatex: "U = 2\\eta^2 \\operatorname{sech}^2\\big(\\eta(X - 4\\eta^2 T - X_0)\\big)",
    mappedLatex: "u = 2A\\eta^2 \\operatorname{sech}^2\\big(\\eta(\\beta x + \\varepsilon - 4\\eta^2\\gamma - X_0)\\big) + B x + C",
    parameters: [eta(), X0],
    source: "kdv.md §5–6; Drazin & Johnson, Solitons: an Introduction, CUP 1989, ch. 1–2 (from memory; u → −u of their form)",
    features: ["height above Bx + C: 2Aη²", "centre x_c(t) = (X0 + 4η²γ − ε)/β", "width ∝ 1/(η|β|)"],
  },
  {
    id: "kdv-cnoidal", kind: "kdv-cnoidal", class: "kdv", label: "cnoidal wave", sigma: null, localized: false,
    canonicalLatex: "U = U_b + 2m_J\\eta^2\\operatorname{cn}^2\\big(\\eta(X - V_c T - X_0)\\,|\\,m_J\\big),\\ V_c = 6U_b + 4\\eta^2(2m_J - 1)",
    mappedLatex: "u = A\\big[U_b + 2m_J\\eta^2\\operatorname{cn}^2\\big(\\eta(\\beta x + \\varepsilon - V_c\\gamma - X_0)\\,|\\,m_J\\big)\\big] + Bx + C",
    parameters: [eta(), mJ, P("Ub", "U_b", 0, -10, 10, true, true, "base level; zero mean at U_b = −2η²(E/K − 1 + mJ)"), X0],
    source: "kdv.md §5–6; Korteweg & de Vries 1895; Whitham, Linear and Nonlinear Waves, 1974, ch. 13 (from memory)",
    features: ["period in X: 2K(mJ)/η; in x: 2K(mJ)/(η|β(t)|)", "mJ → 1 (Ub = 0): the soliton"],
  },
  {
    id: "mkdv-soliton", kind: "mkdv-soliton", class: "mkdv", label: "soliton", sigma: 1, localized: true,
    canonicalLatex: "U = \\eta\\,\\operatorname{sech}\\big(\\eta(X - \\eta^2 T - X_0)\\big)",
    mappedLatex: "u = A\\eta\\,\\operatorname{sech}\\big(\\eta(\\beta x + \\varepsilon - \\eta^2\\gamma - X_0)\\big)",
    parameters: [eta(), X0],
    source: "mkdv.md §5; Wadati, J. Phys. Soc. Jpn. 34 (1973) 1289 (from memory)",
    features: ["peak |u| = |A|η", "centre x_c = (X0 + η²γ − ε)/β"],
  },
  {
    id: "mkdv-kink", kind: "mkdv-kink", class: "mkdv", label: "kink", sigma: -1, localized: false,
    canonicalLatex: "U = \\eta\\tanh\\big(\\eta(X + 2\\eta^2 T - X_0)\\big)",
    mappedLatex: "u = A\\eta\\tanh\\big(\\eta(\\beta x + \\varepsilon + 2\\eta^2\\gamma - X_0)\\big)",
    parameters: [eta(), X0],
    source: "mkdv.md §5",
    features: ["levels ±|A|η", "centre x_c = (X0 − 2η²γ − ε)/β"],
  },
];

export function solutionsFor(cls: EquationClass, sigma: 1 | -1 | null): SolutionSpec[] {
  return CATALOGUE.filter((s) => s.class === cls && (cls === "kdv" || s.sigma === sigma));
}

export function withDefaults(spec: SolutionSpec, params: Partial<Params> = {}): Params {
  const out: Params = {};
  for (const p of spec.parameters) {
    const v = params[p.name];
    out[p.name] = typeof v === "number" && Number.isFinite(v) ? v : p.defaultValue;
  }
  return out;
}

/** Problems with user parameters (outside the ranges), as messages; empty when valid. */
export function checkParameters(spec: SolutionSpec, params: Params): string[] {
  const out: string[] = [];
  for (const p of spec.parameters) {
    const v = params[p.name];
    const lowOk = p.minInclusive ? v >= p.min : v > p.min;
    const highOk = p.maxInclusive ? v <= p.max : v < p.max;
    if (!(lowOk && highOk)) out.push(`${p.name} = ${v} is outside ${p.minInclusive ? "[" : "("}${p.min}, ${p.max}${p.maxInclusive ? "]" : ")"}`);
  }
  return out;
}

/** Centre and width in the canonical space variable at canonical time τ (nls.md §9, kdv.md §6, mkdv.md §5). */
export function canonicalFeature(kind: SolutionKind, p: Params, tau: number): { centre: number; width: number; period?: number } {
  switch (kind) {
    case "nls-bright":
      return { centre: p.xi0 + 2 * p.V * tau, width: 1 / p.eta };
    case "nls-dark":
      return { centre: p.xi0 + 2 * p.rho * p.nu * tau, width: 1 / (p.rho * Math.sqrt(1 - p.nu * p.nu)) };
    case "nls-dn":
    case "nls-cn":
    case "nls-sn":
      return { centre: p.xi0 + 2 * p.V * tau, width: 1 / p.eta, period: (2 * ellipticK(p.mJ)) / p.eta };
    case "kdv-soliton":
      return { centre: p.X0 + 4 * p.eta * p.eta * tau, width: 1 / p.eta };
    case "kdv-cnoidal":
      return { centre: p.X0 + (6 * p.Ub + 4 * p.eta * p.eta * (2 * p.mJ - 1)) * tau, width: 1 / p.eta, period: (2 * ellipticK(p.mJ)) / p.eta };
    case "mkdv-soliton":
      return { centre: p.X0 + p.eta * p.eta * tau, width: 1 / p.eta };
    case "mkdv-kink":
      return { centre: p.X0 - 2 * p.eta * p.eta * tau, width: 1 / p.eta };
  }
}
