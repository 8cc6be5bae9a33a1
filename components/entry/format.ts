/** Number and date formatting for evidence tables (plain functions; server and client). */
export function sci(v: number | null | undefined, digits = 3): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return "—";
  if (v === 0) return "0";
  const a = Math.abs(v);
  return a >= 1e4 || a < 1e-3 ? v.toExponential(digits - 1) : String(Number(v.toPrecision(digits + 1)));
}

export function utc(iso: string | null | undefined): string {
  return iso ? `${iso.replace("T", " ").slice(0, 16)} UTC` : "—";
}

export function paramsText(p: Record<string, number>): string {
  const e = Object.entries(p);
  return e.length ? e.map(([k, v]) => `${k} = ${v}`).join(", ") : "no parameters";
}
