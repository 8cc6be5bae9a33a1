/** What the Design form shows per class: the coefficients with their meaning, and a starting example. */
export type DesignClass = "nls" | "kdv" | "mkdv";

export interface CoefficientInfo {
  name: string;
  meaning: string;
}

export const CLASS_LABEL: Record<DesignClass, string> = { nls: "vc-NLS", kdv: "vc-KdV", mkdv: "vc-mKdV" };

export const NORMAL_FORM: Record<DesignClass, string> = {
  nls: "i u_t + a u_xx + (b x² + f x + e) u + h |u|² u + i k u + i c x u_x + i g u_x = 0",
  kdv: "u_t + p u u_x + q u_xxx + r u + (s x + g) u_x = l + m x",
  mkdv: "u_t + p u² u_x + q u_xxx + r u + (s x + g) u_x = 0",
};

export const COEFFICIENTS: Record<DesignClass, CoefficientInfo[]> = {
  nls: [
    { name: "a", meaning: "dispersion" },
    { name: "h", meaning: "nonlinearity" },
    { name: "k", meaning: "damping (loss > 0, gain < 0)" },
    { name: "b", meaning: "parabolic potential" },
    { name: "c", meaning: "dilation" },
    { name: "f", meaning: "linear potential" },
    { name: "e", meaning: "potential offset" },
    { name: "g", meaning: "drift" },
  ],
  kdv: [
    { name: "p", meaning: "nonlinearity" },
    { name: "q", meaning: "dispersion" },
    { name: "r", meaning: "damping" },
    { name: "s", meaning: "dilation" },
    { name: "g", meaning: "drift" },
    { name: "l", meaning: "forcing (constant part)" },
    { name: "m", meaning: "forcing (linear part)" },
  ],
  mkdv: [
    { name: "p", meaning: "nonlinearity" },
    { name: "q", meaning: "dispersion" },
    { name: "r", meaning: "damping" },
    { name: "s", meaning: "dilation" },
    { name: "g", meaning: "drift" },
  ],
};

export interface Preset {
  solve: string;
  set: Record<string, string>;
  window: [number, number];
}

/** Invented starting points: a tapered fibre with loss; a shelf wave; a damped mKdV pulse. */
export const PRESETS: Record<DesignClass, Preset> = {
  nls: { solve: "h", set: { a: "(1 + 0.2*t)/2", k: "0.05" }, window: [0, 5] },
  kdv: { solve: "r", set: { p: "6", q: "1" }, window: [1, 5] },
  mkdv: { solve: "p", set: { q: "1 + 0.5*sin(t)", r: "0.2" }, window: [0, 3] },
};

export const KIND_LABEL: Record<string, string> = {
  explicit: "explicit (the condition is linear in the unknown)",
  quadrature: "by quadrature",
  "linear-first-order": "linear first-order equation",
  "linear-second-order": "linear second-order equation (two constants)",
  riccati: "Riccati equation (solved through its linearisation)",
  "nonlinear-second-order": "nonlinear second-order equation",
};
