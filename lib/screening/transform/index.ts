/**
 * Transformation stage: for a reducible member, the point map to the canonical equation
 * (../shared/math/nls.md §5–§7, kdv.md §3–§4, mkdv.md §3–§4): tabulated map functions from an
 * ODE integrator, the canonical sign, the free constants with their defaults, display formulas
 * (closed form where the quadratures are elementary in the supported class, ∫ otherwise) and
 * the singular (focusing) times inside the window.
 *
 * Syntax
 *   buildTransformation(variant, overrides?) → TransformationOk | { ok: false, code, reason }
 * Example
 *   const r = buildTransformation(variant);        // variant.class === "nls", a = 1/2, h = 1
 *   if (r.ok) r.table.values.gamma;                // ≈ t/2 on the window
 * See also
 *   ../solutions (exact solutions through the map), ../verify (independent checks).
 */
import type { Variant } from "../spec/types";
import { coefficientSet, unresolvedSymbols } from "./coefficients";
import { buildNlsTransformation } from "./nls";
import { buildKdvTransformation } from "./kdv";
import { buildMkdvTransformation } from "./mkdv";
import type { ConstantOverrides, TransformationResult } from "./types";

export function buildTransformation(variant: Variant, overrides: ConstantOverrides = {}): TransformationResult {
  const left = unresolvedSymbols(variant);
  if (left.length) {
    return { ok: false, code: "free-parameters", reason: `the coefficients still contain ${left.join(", ")}; the map needs numeric coefficients (solve or fix the free parameters first)` };
  }
  const [t0, t1] = variant.window;
  if (!(Number.isFinite(t0) && Number.isFinite(t1) && t1 > t0)) {
    return { ok: false, code: "precondition", reason: `the window [${t0}, ${t1}] is not a finite interval with t0 < t1` };
  }
  const coefs = coefficientSet(variant);
  switch (variant.class) {
    case "nls":
      return buildNlsTransformation(variant, coefs, overrides);
    case "kdv":
      return buildKdvTransformation(variant, coefs, overrides);
    case "mkdv":
      return buildMkdvTransformation(variant, coefs, overrides);
  }
}

export { MAP_FUNCTIONS } from "./types";
export type {
  ConstantOverrides, FreeConstant, IntegratorReport, MapFormula, MapTable, SampledCurve, SingularKind, SingularTime,
  TransformChecks, TransformPlotData, TransformationOk, TransformationRefusal, TransformationResult,
} from "./types";
export { coefficientSet, unresolvedSymbols } from "./coefficients";
export type { CoefficientSet } from "./coefficients";
