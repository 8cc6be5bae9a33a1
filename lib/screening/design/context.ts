/**
 * What every solver works with: the fixed coefficients (parameters substituted, exact), the
 * window, the integration constants (symbols in closed forms, values in numerics) and the tree
 * operations the formulas are built from.
 */
import { add, differentiate, div, mul, num, simplifyConstants, sub, substitute, sym } from "../expr";
import type { Expr } from "../expr";
import type { EquationClass } from "../spec/types";
import { antiderivative } from "./integrate";
import { normalise, polyDependsOnT, isZeroPoly, toPoly } from "./normal";
import type { NormalContext } from "./normal";
import { normalContext, valueAt } from "./sampling";
import type { WindowContext } from "./sampling";

export interface DesignContext {
  cls: EquationClass;
  unknown: string;
  /** Every coefficient of the class except the unknown (unset ones are 0), parameters substituted. */
  coefficients: Record<string, Expr>;
  window: [number, number];
  t0: number;
  /** Constant values (by symbol name) for numerical evaluation. */
  win: WindowContext;
  normal: NormalContext;
  /** Symbol used for each integration constant (its base name unless a parameter already has it). */
  names: Record<string, string>;
  /** Constant values by base name. */
  values: Record<string, number>;
}

export function makeContext(
  cls: EquationClass,
  unknown: string,
  coefficients: Record<string, Expr>,
  window: [number, number],
  names: Record<string, string>,
  values: Record<string, number>,
): DesignContext {
  const symbolValues: Record<string, number> = {};
  for (const [base, v] of Object.entries(values)) symbolValues[names[base] ?? base] = v;
  const win: WindowContext = { window, values: symbolValues };
  return { cls, unknown, coefficients, window, t0: window[0], win, normal: normalContext(win), names, values };
}

export class Ops {
  constructor(readonly dc: DesignContext) {}

  c(name: string): Expr {
    return this.dc.coefficients[name] ?? num(0);
  }
  /** The symbol of integration constant `base`. */
  k(base: string): Expr {
    return sym(this.dc.names[base] ?? base);
  }
  n(v: number): Expr {
    return num(v);
  }
  d(e: Expr): Expr {
    return simplifyConstants(differentiate(e, "t"));
  }
  /** e'/e. */
  logD(e: Expr): Expr {
    return div(this.d(e), e);
  }
  /** Normal form (exact) of a tree. */
  norm(e: Expr): Expr {
    return normalise(e, this.dc.normal);
  }
  isZero(e: Expr): boolean {
    return isZeroPoly(toPoly(e, this.dc.normal));
  }
  /** Free of t (a constant function). */
  tFree(e: Expr): boolean {
    return !polyDependsOnT(toPoly(e, this.dc.normal));
  }
  /** The tree at t = t0, in normal form (exact). */
  at0(e: Expr): Expr {
    return this.norm(substitute(e, { t: num(this.dc.t0) }));
  }
  /** Numerical value at t0 (constants at their values). */
  value0(e: Expr): number {
    return valueAt(e, this.dc.win, this.dc.t0);
  }
  /** ∫_{t0}^{t} e in closed form, or null. */
  integral(e: Expr): Expr | null {
    return antiderivative(e, this.dc.win);
  }
  /** τ = t − t0. */
  tau(): Expr {
    return this.dc.t0 === 0 ? sym("t") : sub(sym("t"), num(this.dc.t0));
  }
  add(...xs: Expr[]): Expr {
    return xs.reduce((a, b) => add(a, b));
  }
  mul(...xs: Expr[]): Expr {
    return xs.reduce((a, b) => mul(a, b));
  }
}
