/**
 * Display tidying of trees that are outside the exponential–power class: products are collected
 * into coefficient × Π factor^power (equal factors merged, exp(a)·exp(b) = exp(a + b)), sums into
 * Σ coefficient × product (like terms merged). Integer powers of products are distributed;
 * fractional powers are kept on their base (no branch assumptions). Display only: the tidied tree
 * is checked against the integrated table like every other formula (closed-form/finish.ts).
 */
import { type Expr, add, call, div, exprToString, mul, neg, num, pow, sub } from "../../expr";
import { simpleFraction } from "./to-expr";

interface Factor {
  base: Expr;
  power: number;
}
/** coef × Π factors; an exp factor is kept apart as its (summed) argument. */
interface Product {
  coef: number;
  factors: Map<string, Factor>;
  expArg: Sum | null;
}
/** Σ products (keyed by their factor part). */
interface Sum {
  terms: Map<string, Product>;
}

const one = (): Product => ({ coef: 1, factors: new Map(), expArg: null });
const keyOf = (p: Product) => {
  const f = [...p.factors.entries()].map(([k, v]) => `${k}^${v.power}`).sort().join("*");
  return p.expArg ? `${f}*exp(${sumKey(p.expArg)})` : f;
};
function sumKey(s: Sum): string {
  // coefficients rounded to 12 digits, so 5·(1/5 + 3/50 x) and 1 + 3/10 x share a key
  return [...s.terms.entries()].map(([k, p]) => `${p.coef.toPrecision(12)}*${k}`).sort().join("+");
}

function sumOf(p: Product): Sum {
  return { terms: new Map([[keyOf(p), p]]) };
}
function addSum(a: Sum, b: Sum, sign = 1): Sum {
  const terms = new Map<string, Product>();
  for (const [k, p] of a.terms) terms.set(k, { ...p });
  for (const [k, p] of b.terms) {
    const old = terms.get(k);
    if (old) {
      const c = old.coef + sign * p.coef;
      if (Math.abs(c) <= 1e-14 * (Math.abs(old.coef) + Math.abs(p.coef))) terms.delete(k);
      else terms.set(k, { ...old, coef: c });
    } else terms.set(k, { ...p, coef: sign * p.coef });
  }
  return { terms };
}
function scaleSum(a: Sum, s: number): Sum {
  const terms = new Map<string, Product>();
  if (s === 0) return { terms };
  for (const [k, p] of a.terms) terms.set(k, { ...p, coef: p.coef * s });
  return { terms };
}
function mulProducts(a: Product, b: Product, powerOfB = 1): Product {
  const factors = new Map(a.factors);
  for (const [k, f] of b.factors) {
    const old = factors.get(k);
    const power = (old ? old.power : 0) + powerOfB * f.power;
    if (Math.abs(power) < 1e-14) factors.delete(k);
    else factors.set(k, { base: f.base, power });
  }
  let expArg = a.expArg;
  if (b.expArg) expArg = expArg ? addSum(expArg, b.expArg, powerOfB) : scaleSum(b.expArg, powerOfB);
  if (expArg && expArg.terms.size === 0) expArg = null;
  return { coef: a.coef * Math.pow(b.coef, powerOfB), factors, expArg };
}
/** A sum that is a single product (or a constant). */
function single(s: Sum): Product | null {
  if (s.terms.size === 0) return { ...one(), coef: 0 };
  return s.terms.size === 1 ? [...s.terms.values()][0] : null;
}
/** The value of a sum that is a plain number, else null. */
function coefficientOnly(s: Sum): number | null {
  const p = single(s);
  return p && !p.factors.size && !p.expArg ? p.coef : null;
}
/** A sum as one product: itself if it has one term, else a single factor (keyed canonically). */
function asProduct(s: Sum): Product {
  const p = single(s);
  if (p) return p;
  // content: divide by the coefficient of the first term in key order, so c·S and S share a key
  const pivot = [...s.terms.keys()].sort()[0];
  const c = (s.terms.get(pivot) as Product).coef;
  const monic = scaleSum(s, 1 / c);
  const f = { ...one(), coef: c };
  f.factors.set(`S:${sumKey(monic)}`, { base: rebuild(monic), power: 1 });
  return f;
}
function atom(e: Expr): Sum {
  const p = one();
  p.factors.set(exprToString(e), { base: e, power: 1 });
  return sumOf(p);
}
function constant(v: number): Sum {
  return v === 0 ? { terms: new Map() } : sumOf({ ...one(), coef: v });
}

function collect(e: Expr): Sum {
  switch (e.kind) {
    case "num":
      return constant(e.value);
    case "sym":
      return atom(e);
    case "neg":
      return scaleSum(collect(e.arg), -1);
    case "add":
      return addSum(collect(e.left), collect(e.right));
    case "sub":
      return addSum(collect(e.left), collect(e.right), -1);
    case "mul":
    case "div": {
      const l = collect(e.left);
      const r = collect(e.right);
      const cl = coefficientOnly(l);
      const cr = coefficientOnly(r);
      if (e.kind === "mul") {
        if (cr !== null) return scaleSum(l, cr);
        if (cl !== null) return scaleSum(r, cl);
        return sumOf(mulProducts(asProduct(l), asProduct(r)));
      }
      if (cr !== null && cr !== 0) return scaleSum(l, 1 / cr);
      const pr = single(r);
      const pl = asProduct(l);
      const cancels = [...pl.factors.keys()].some((k) => k.startsWith("S:") && pr?.factors.has(k));
      if (pr && pr.coef !== 0 && !cancels) {
        // (Σ p_i) / q = Σ p_i / q
        const inv = mulProducts(one(), pr, -1);
        let acc: Sum = { terms: new Map() };
        for (const p of l.terms.values()) acc = addSum(acc, sumOf(mulProducts(p, inv)));
        return acc;
      }
      return sumOf(mulProducts(pl, asProduct(r), -1));
    }
    case "pow": {
      const b = collect(e.left);
      const q = coefficientOnly(collect(e.right));
      if (q === null) return atom(pow(rebuild(b), rebuild(collect(e.right))));
      const pb = asProduct(b);
      if (pb.coef === 0 && q > 0) return constant(0);
      if (Number.isInteger(q) && pb.coef !== 0) return sumOf(mulProducts(one(), pb, q));
      if (pb.coef > 0) {
        // (c Π fᵖ e^{a})^q = c^q Π f^{pq} e^{q a}: exact for c > 0 and positive factors f; where a
        // factor is negative on the window the table comparison rejects the formula (finish.ts)
        const factors = new Map<string, Factor>();
        for (const [k, f] of pb.factors) factors.set(k, { base: f.base, power: f.power * q });
        return sumOf({ coef: Math.pow(pb.coef, q), factors, expArg: pb.expArg && scaleSum(pb.expArg, q) });
      }
      // other fractional powers: one factor on the tidied base (no branch assumptions)
      const p = one();
      const base = rebuild(b);
      p.factors.set(`P:${sumKey(b)}`, { base, power: q });
      return sumOf(p);
    }
    case "call": {
      const a = collect(e.arg);
      if (e.fn === "exp") {
        const p = one();
        const c = single(a);
        if (c && !c.factors.size && !c.expArg) return constant(Math.exp(c.coef));
        p.expArg = a;
        return sumOf(p);
      }
      if (e.fn === "sqrt") return collect(pow(e.arg, num(0.5)));
      return atom(call(e.fn, rebuild(a)));
    }
  }
}

function magnitude(v: number): Expr {
  const f = simpleFraction(v);
  if (f && f[1] !== 1) return div(num(f[0]), num(f[1]));
  if (f) return num(f[0]);
  const text = Number(v.toPrecision(12)).toString();
  return num(Number(text), text);
}

function productExpr(p: Product): { negative: boolean; expr: Expr } {
  const numer: Expr[] = [];
  const denom: Expr[] = [];
  for (const f of p.factors.values()) {
    const mag = Math.abs(f.power);
    const target = f.power < 0 ? denom : numer;
    target.push(mag === 1 ? f.base : pow(f.base, magnitude(mag)));
  }
  if (p.expArg) numer.push(call("exp", rebuild(p.expArg)));
  const negative = p.coef < 0;
  const c = Math.abs(p.coef);
  const frac = simpleFraction(c);
  const prod = (xs: Expr[]) => xs.reduce((x, y) => mul(x, y));
  if (frac || Math.abs(c - 1) <= 1e-14) {
    // p/q · N/D written as (p N)/(q D)
    const [pn, qd] = frac ?? [1, 1];
    if (!denom.length && numer.length && qd !== 1) {
      // p/q · N: the fraction in front, \frac{p}{q} N
      return { negative, expr: mul(div(num(pn), num(qd)), prod(numer)) };
    }
    if (pn !== 1 || !numer.length) numer.unshift(num(pn));
    if (qd !== 1) denom.unshift(num(qd));
    const top = prod(numer);
    return { negative, expr: denom.length ? div(top, prod(denom)) : top };
  }
  const rest = numer.length ? prod(numer) : null;
  const body = denom.length ? div(rest ?? num(1), prod(denom)) : rest;
  return { negative, expr: body ? mul(magnitude(c), body) : magnitude(c) };
}

function rebuild(s: Sum): Expr {
  const parts = [...s.terms.values()].map(productExpr);
  if (!parts.length) return num(0);
  // a positive term first reads better
  const firstPos = parts.findIndex((p) => !p.negative);
  if (firstPos > 0) parts.unshift(...parts.splice(firstPos, 1));
  let acc = parts[0].negative ? neg(parts[0].expr) : parts[0].expr;
  for (let i = 1; i < parts.length; i++) acc = parts[i].negative ? sub(acc, parts[i].expr) : add(acc, parts[i].expr);
  return acc;
}

/** The tidied tree (same value wherever the original is defined). */
export function tidy(e: Expr): Expr {
  return rebuild(collect(e));
}
