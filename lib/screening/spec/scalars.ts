/**
 * Reading numbers from YAML scalars, keeping the exact decimal text.
 * Plain scalars follow the YAML 1.2 core schema (YAML 1.2.2 spec §10.3.2) for null, booleans,
 * integers and floats; numbers that overflow or underflow a double are refused, not rounded.
 */
import Decimal from "decimal.js";
import type { YScalar } from "./yaml-tree";

export type NumberRead =
  | { ok: true; value: number; text: string }
  | { ok: false; message: string };

const DECIMAL = /^[-+]?(?:[0-9]+(?:\.[0-9]*)?|\.[0-9]+)(?:[eE][-+]?[0-9]+)?$/;
const HEX = /^0x[0-9a-fA-F]+$/;
const OCTAL = /^0o[0-7]+$/;
const NON_FINITE = /^[-+]?(?:\.inf|\.Inf|\.INF|\.nan|\.NaN|\.NAN|inf|Inf|INF|infinity|Infinity|INFINITY|nan|NaN|NAN)$/;
const NULLS = new Set(["", "~", "null", "Null", "NULL"]);
const BOOLS = new Set(["true", "True", "TRUE", "false", "False", "FALSE"]);

export function isPlain(node: YScalar): boolean {
  return node.style === 1;
}

/** A plain scalar the core schema reads as null (`~`, `null`, or nothing). */
export function isNullScalar(node: YScalar): boolean {
  return node.empty || (isPlain(node) && NULLS.has(node.text));
}

export function isBoolScalar(node: YScalar): boolean {
  return isPlain(node) && BOOLS.has(node.text);
}

/** True when the scalar is written as a number (plain, core schema), finite or not. */
export function looksNumeric(node: YScalar): boolean {
  const t = node.text.trim();
  return isPlain(node) && (DECIMAL.test(t) || HEX.test(t) || OCTAL.test(t) || NON_FINITE.test(t));
}

/**
 * A finite number from a scalar. Quoted numerals are accepted too (a number is a number);
 * anything else gets a message a physicist can act on.
 */
export function readNumber(node: YScalar, what: string): NumberRead {
  const t = node.text.trim();
  if (node.empty || (isPlain(node) && NULLS.has(t))) return { ok: false, message: `${what} is empty; give a number` };
  if (NON_FINITE.test(t)) return { ok: false, message: `${what} is '${t}', which is not a finite number` };
  if (HEX.test(t)) return { ok: true, value: parseInt(t.slice(2), 16), text: String(parseInt(t.slice(2), 16)) };
  if (OCTAL.test(t)) return { ok: true, value: parseInt(t.slice(2), 8), text: String(parseInt(t.slice(2), 8)) };
  if (DECIMAL.test(t)) {
    const value = Number(t);
    const text = t.startsWith("+") ? t.slice(1) : t;
    if (!Number.isFinite(value)) {
      return { ok: false, message: `${what} is ${t}, which is too large for double precision (about ±1.8e308 at most)` };
    }
    if (value === 0 && /[1-9]/.test(t.replace(/[eE].*$/, ""))) {
      return { ok: false, message: `${what} is ${t}, which is too small for double precision (it would be read as 0)` };
    }
    return { ok: true, value, text };
  }
  if (/^[-+]?[0-9.]+(?:[eE][-+]?[0-9]+)?\s*[A-Za-zµ°%]/.test(t)) {
    return { ok: false, message: `${what} is '${t}': units are not supported; give a plain number in the family's own units` };
  }
  if (isBoolScalar(node)) return { ok: false, message: `${what} is ${t}, a yes/no value; give a number` };
  return { ok: false, message: `${what} is '${clip(t)}', which is not a number` };
}

export function clip(text: string, max = 40): string {
  const one = text.replace(/\s+/g, " ");
  return one.length > max ? `${one.slice(0, max - 1)}…` : one;
}

const Exact = Decimal.clone({ precision: 200 });

/** Canonical text of a decimal (for hashing): "2.50" → "2.5", "1e3" → "1000", "-0" → "0". */
export function canonicalDecimal(text: string): string {
  const d = new Exact(text);
  return d.isZero() ? "0" : d.toString();
}
