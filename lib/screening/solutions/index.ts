/**
 * Exact solutions: canonical solitons and periodic waves (nls.md §8, kdv.md §5, mkdv.md §5),
 * mapped back through the tabulated transformation (nls.md §9, kdv.md §6, mkdv.md §5).
 *
 * Syntax
 *   buildSolutions(variant, transformation) → SolutionSet
 *   evaluateSolution(spec, table, params, x, t) → { re, im }     (pure; browser-safe)
 * Example
 *   const set = buildSolutions(v, tr);
 *   if (set.ok && tr.ok) evaluateSolution(set.solutions[0], tr.table, { eta: 1.5 }, 0.5, 0.8);
 * See also
 *   ../transform (the map), ../verify (residual and split-step checks), ../special (sn, cn, dn).
 */
export { buildSolutions, plotRange } from "./build";
export { evaluateSolution, intensityOnGrid } from "./evaluate";
export { CATALOGUE, solutionsFor, withDefaults, checkParameters, canonicalFeature } from "./catalogue";
export { canonicalNls, canonicalKdv, canonicalMkdv } from "./canonical";
export type { NlsKind, KdvKind, MkdvKind, SolutionKind, Params } from "./canonical";
export { mappedSolution } from "./mapped";
export type { MapValues } from "./mapped";
export { mapAt, bracket } from "./interpolate";
export { numberOps, cx, cxAdd, cxMul, cxScale, expi, real } from "./algebra";
export type { RealOps, Complex } from "./algebra";
export type { CheckPoint, IntensityGrid, SolutionParameter, SolutionSet, SolutionSpec } from "./types";
