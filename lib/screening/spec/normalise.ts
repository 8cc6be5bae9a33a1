/**
 * The normalised form of a family and its content hash. Two uploads of the same family — however
 * formatted, commented, titled or with renamed variables or helpers written out — hash the same:
 * the hash covers the class, each nonzero coefficient as canonical text in t (helpers inlined,
 * numbers in canonical decimal form), the parameter specifications and the window.
 */
import { exprToString, num, simplifyConstants, type Expr } from "../expr";
import type { EquationClass, ParameterSpec } from "./types";
import { canonicalDecimal } from "./scalars";
import { sha256Hex } from "./hash";

/** Numbers rewritten to canonical decimal text ("2.50" → "2.5"), pi and e left as they are. */
function canonicalNumbers(e: Expr): Expr {
  switch (e.kind) {
    case "num": {
      if (!/^[-+]?(?:[0-9]+\.?[0-9]*|\.[0-9]+)(?:[eE][-+]?[0-9]+)?$/.test(e.text) || e.text.length > 40) return e;
      const text = canonicalDecimal(e.text);
      return text === e.text ? e : num(e.value, text);
    }
    case "sym":
      return e;
    case "neg":
    case "call":
      return { ...e, arg: canonicalNumbers(e.arg) };
    default:
      return { ...e, left: canonicalNumbers(e.left), right: canonicalNumbers(e.right) };
  }
}

/** Canonical text of a coefficient: exact constant folding, then canonical decimals. */
export function canonicalCoefficient(e: Expr): string {
  return exprToString(canonicalNumbers(simplifyConstants(e)));
}

function specJson(spec: ParameterSpec): unknown {
  switch (spec.kind) {
    case "fixed":
      return ["fixed", canonicalDecimal(spec.text)];
    case "values":
      return ["values", spec.values.map((v) => canonicalDecimal(v.text))];
    case "range":
      return ["range", canonicalDecimal(spec.fromText ?? String(spec.from)), canonicalDecimal(spec.toText ?? String(spec.to)), spec.steps];
    case "free":
      return ["free"];
  }
}

const byName = <T>(a: [string, T], b: [string, T]) => (a[0] < b[0] ? -1 : a[0] > b[0] ? 1 : 0);

/** The normalised JSON text the hash is taken of (arrays only, so key order cannot vary). */
export function normalisedFamilyJson(
  cls: EquationClass,
  coefficients: ReadonlyMap<string, Expr>,
  parameters: ReadonlyArray<[string, ParameterSpec]>,
  windowTexts: [string, string],
): string {
  const coeffs = [...coefficients.entries()]
    .map(([name, e]): [string, string] => [name, canonicalCoefficient(e)])
    .filter(([, text]) => text !== "0")
    .sort(byName);
  const params = [...parameters].sort(byName).map(([name, spec]) => [name, specJson(spec)]);
  return JSON.stringify(["wavesieve-family", 1, cls, coeffs, params, windowTexts.map(canonicalDecimal)]);
}

export function familyHash(
  cls: EquationClass,
  coefficients: ReadonlyMap<string, Expr>,
  parameters: ReadonlyArray<[string, ParameterSpec]>,
  windowTexts: [string, string],
): string {
  return sha256Hex(normalisedFamilyJson(cls, coefficients, parameters, windowTexts));
}
