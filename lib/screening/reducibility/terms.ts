/**
 * Monomials of an invariant's polynomial form as jets at a point, in any field: each coefficient
 * is evaluated as a jet of order (orders − 1 + maxDerivative), differentiated by the jet rule
 * c'_m = (m+1) c_{m+1} (painleve.md §5), and multiplied out (nls.md §3 "Numerical decision").
 */
import { constantJet, evalJet, jetDerivative, jetMul, jetPowInt, variableJet } from "../expr";
import type { Expr, Field, Jet } from "../expr";
import { SingularPointError } from "../zero";
import type { TermSource } from "../zero";
import type { InvariantDefinition, Monomial } from "./invariants";

/** Parameter values by name, as exact decimal text or as field values. */
export type ParameterValues<T> = Record<string, T>;

/** Jets of every coefficient and its derivatives up to maxDerivative, each of length `orders`. */
export function coefficientDerivativeJets<T>(
  def: InvariantDefinition,
  coefficients: Record<string, Expr>,
  t: T,
  parameters: ParameterValues<T>,
  orders: number,
  field: Field<T>,
): Record<string, Jet<T>[]> {
  const order = orders - 1 + def.maxDerivative;
  const env: Record<string, Jet<T>> = { t: variableJet(t, order, field) };
  for (const [name, value] of Object.entries(parameters)) env[name] = constantJet(value, order, field);
  const out: Record<string, Jet<T>[]> = {};
  for (const name of def.inputs) {
    const expr = coefficients[name];
    let jet = expr ? evalJet(expr, env, order, field) : constantJet(field.zero, order, field);
    const derivatives: Jet<T>[] = [jet.slice(0, orders)];
    for (let d = 1; d <= def.maxDerivative; d++) {
      jet = jetDerivative(jet, field);
      derivatives.push(jet.slice(0, orders));
    }
    out[name] = derivatives;
  }
  return out;
}

/** One monomial as a jet of length `orders`. */
export function monomialJet<T>(mono: Monomial, jets: Record<string, Jet<T>[]>, orders: number, field: Field<T>): Jet<T> {
  let r = constantJet(field.fromNumber(mono.coefficient), orders - 1, field);
  for (const [name, derivative, power] of mono.factors) {
    const base = jets[name][derivative];
    r = jetMul(r, power === 1 ? base : jetPowInt(base, power, field), field);
  }
  return r;
}

const factorKey = ([name, derivative, power]: readonly [string, number, number]): string => `${name}${derivative}^${power}`;

/** Factor orders that share prefixes (most frequent factors first), computed once per table. */
const sharedOrder = new WeakMap<readonly Monomial[], { factors: (readonly [string, number, number])[]; keys: string[] }[]>();

function orderedFactors(monos: readonly Monomial[]): { factors: (readonly [string, number, number])[]; keys: string[] }[] {
  const cached = sharedOrder.get(monos);
  if (cached) return cached;
  const count = new Map<string, number>();
  for (const m of monos) for (const f of m.factors) count.set(factorKey(f), (count.get(factorKey(f)) ?? 0) + 1);
  const out = monos.map((m) => {
    const factors = [...m.factors].sort((x, y) => (count.get(factorKey(y)) ?? 0) - (count.get(factorKey(x)) ?? 0) || factorKey(x).localeCompare(factorKey(y)));
    const keys: string[] = [];
    let key = "";
    for (const f of factors) keys.push((key += `*${factorKey(f)}`));
    return { factors, keys };
  });
  sharedOrder.set(monos, out);
  return out;
}

/** All monomials of a table at once, sharing powers and common factor prefixes (same values as monomialJet). */
export function monomialJets<T>(monos: readonly Monomial[], jets: Record<string, Jet<T>[]>, orders: number, field: Field<T>): Jet<T>[] {
  const prefix = new Map<string, Jet<T>>();
  const powers = new Map<string, Jet<T>>();
  const power = (f: readonly [string, number, number]): Jet<T> => {
    const [name, derivative, p] = f;
    if (p === 1) return jets[name][derivative];
    const k = factorKey(f);
    let j = powers.get(k);
    if (!j) powers.set(k, (j = jetPowInt(jets[name][derivative], p, field)));
    return j;
  };
  return orderedFactors(monos).map(({ factors, keys }, i) => {
    let product: Jet<T> | null = null;
    for (let k = 0; k < factors.length; k++) {
      const hit = prefix.get(keys[k]);
      if (hit) {
        product = hit;
        continue;
      }
      product = product === null ? power(factors[k]) : jetMul(product, power(factors[k]), field);
      prefix.set(keys[k], product);
    }
    const c = field.fromNumber(monos[i].coefficient);
    return (product ?? constantJet(field.one, orders - 1, field)).map((x) => field.mul(c, x));
  });
}

/** Precondition of the class at the point: the `nonzero` coefficients must not vanish (README). */
function checkPreconditions<T>(def: InvariantDefinition, jets: Record<string, Jet<T>[]>, t: T, field: Field<T>): void {
  for (const name of def.nonzero) {
    if (field.isZero(jets[name][0][0])) {
      throw new SingularPointError(`${name} = 0 at t = ${String(field.toNumber(t))} (precondition ${def.nonzero.join(" ")} ≠ 0)`);
    }
  }
}

/** terms[order][i] = Taylor coefficient `order` of monomial i (nls.md §3). */
export function invariantTerms<T>(
  def: InvariantDefinition,
  coefficients: Record<string, Expr>,
  t: T,
  parameters: ParameterValues<T>,
  orders: number,
  field: Field<T>,
): T[][] {
  const jets = coefficientDerivativeJets(def, coefficients, t, parameters, orders, field);
  checkPreconditions(def, jets, t, field);
  const monos = monomialJets(def.monomials, jets, orders, field);
  const rows: T[][] = [];
  for (let k = 0; k < orders; k++) rows.push(monos.map((j) => j[k]));
  return rows;
}

/** The invariant itself (R, K or Q) as a jet: P / N (nls.md §3, kdv.md §2, mkdv.md §2). */
export function invariantJet<T>(
  def: InvariantDefinition,
  coefficients: Record<string, Expr>,
  t: T,
  parameters: ParameterValues<T>,
  orders: number,
  field: Field<T>,
): Jet<T> {
  const jets = coefficientDerivativeJets(def, coefficients, t, parameters, orders, field);
  checkPreconditions(def, jets, t, field);
  let p = constantJet(field.zero, orders - 1, field);
  for (const j of monomialJets(def.monomials, jets, orders, field)) p = p.map((c, i) => field.add(c, j[i]));
  const n = monomialJet(def.normalizer, jets, orders, field);
  // Series division P/N (N(t_s) ≠ 0 by the preconditions).
  const r: T[] = [];
  for (let k = 0; k < orders; k++) {
    let acc = p[k];
    for (let j = 1; j <= k; j++) acc = field.sub(acc, field.mul(n[j], r[k - j]));
    r.push(field.div(acc, n[0]));
  }
  return r;
}

/** A zero-test term source for fixed coefficients; parameter values as exact decimal text. */
export function invariantSource(
  def: InvariantDefinition,
  coefficients: Record<string, Expr>,
  parameters: Record<string, string>,
  orders: number,
): TermSource {
  return {
    terms<T>(t: string, field: Field<T>): T[][] {
      const values: ParameterValues<T> = {};
      for (const [name, text] of Object.entries(parameters)) values[name] = field.fromText(text);
      return invariantTerms(def, coefficients, field.fromText(t), values, orders, field);
    },
  };
}

/** P (the polynomial form), Σ|m_i| and the normalizer N at one point, Taylor order 0 (nls.md §3). */
export function polynomialParts<T>(
  def: InvariantDefinition,
  coefficients: Record<string, Expr>,
  t: T,
  parameters: ParameterValues<T>,
  field: Field<T>,
): { p: T; scale: T; normalizer: T } {
  const jets = coefficientDerivativeJets(def, coefficients, t, parameters, 1, field);
  checkPreconditions(def, jets, t, field);
  let p = field.zero;
  let scale = field.zero;
  for (const j of monomialJets(def.monomials, jets, 1, field)) {
    p = field.add(p, j[0]);
    scale = field.add(scale, field.abs(j[0]));
  }
  return { p, scale, normalizer: monomialJet(def.normalizer, jets, 1, field)[0] };
}
