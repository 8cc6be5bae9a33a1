/**
 * evaluateSolution: the value of a mapped-back exact solution at (x, t), from the stored map table
 * (cubic Hermite in t) and the canonical formula. Pure: the browser calls it to redraw after the
 * user changes parameters. Returns NaN parts outside the map window.
 */
import type { MapTable } from "../transform/types";
import { numberOps } from "./algebra";
import { withDefaults } from "./catalogue";
import type { Params } from "./canonical";
import { mapAt } from "./interpolate";
import { mappedSolution } from "./mapped";
import type { SolutionSpec } from "./types";

export function evaluateSolution(solutionSpec: SolutionSpec, transformTable: MapTable, params: Partial<Params>, x: number, t: number): { re: number; im: number } {
  const p = withDefaults(solutionSpec, params);
  const m = mapAt(transformTable, t);
  return mappedSolution(numberOps, solutionSpec.kind, p, m, x);
}

/** |u|² on a grid (values[i][j] at t_i, x_j); null where not finite. */
export function intensityOnGrid(spec: SolutionSpec, table: MapTable, params: Partial<Params>, xs: readonly number[], ts: readonly number[]): (number | null)[][] {
  const p = withDefaults(spec, params);
  return ts.map((t) => {
    const m = mapAt(table, t);
    return xs.map((x) => {
      const u = mappedSolution(numberOps, spec.kind, p, m, x);
      const v = u.re * u.re + u.im * u.im;
      return Number.isFinite(v) ? v : null;
    });
  });
}
