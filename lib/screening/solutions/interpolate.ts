/**
 * Cubic Hermite interpolation of the tabulated map functions (values and exact slopes at the
 * nodes; error O(h⁴ f⁗), e.g. ≲ 1e-10 relative for 256 nodes on windows of a few time units).
 * Pure data in, numbers out: safe to run in the browser.
 */
import type { MapTable } from "../transform/types";

/** Index i with t_i ≤ t ≤ t_{i+1}, or −1 outside [t_0, t_last]. */
export function bracket(ts: readonly number[], t: number): number {
  const n = ts.length;
  if (!(t >= ts[0] && t <= ts[n - 1])) return -1;
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (ts[mid] <= t) lo = mid;
    else hi = mid;
  }
  return Math.min(lo, n - 2);
}

/** Every map function at t; NaN for all of them outside the map window. */
export function mapAt(table: MapTable, t: number): Record<string, number> {
  const out: Record<string, number> = {};
  const i = bracket(table.t, t);
  const names = Object.keys(table.values);
  if (i < 0) {
    for (const n of names) out[n] = NaN;
    return out;
  }
  const t0 = table.t[i];
  const h = table.t[i + 1] - t0;
  const s = (t - t0) / h;
  const h00 = (1 + 2 * s) * (1 - s) * (1 - s);
  const h10 = s * (1 - s) * (1 - s);
  const h01 = s * s * (3 - 2 * s);
  const h11 = s * s * (s - 1);
  for (const n of names) {
    const v = table.values[n];
    const d = table.slopes[n];
    out[n] = h00 * v[i] + h10 * h * d[i] + h01 * v[i + 1] + h11 * h * d[i + 1];
  }
  return out;
}
