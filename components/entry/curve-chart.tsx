"use client";
/** Line chart of sampled curves over t (recharts). Values that are not finite are gaps. */
import { CartesianGrid, Legend, Line, LineChart, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";

export interface Curve {
  name: string;
  t: number[];
  values: (number | null)[];
}

const PALETTE = ["#0f6b7b", "#e0a43a", "#a12a2a", "#2f6b2a", "#5b4a9e", "#4a6275", "#c05f9a", "#0e1b26"];
const GREEK: Record<string, string> = { mu: "μ", mu2: "μ₂", beta: "β", gamma: "γ", alpha: "α", delta: "δ", eps: "ε", kappa: "κ", sigma: "σ" };

export const curveLabel = (name: string) => GREEK[name] ?? name;

const fmt = (v: number) => (Math.abs(v) >= 1e4 || (Math.abs(v) < 1e-3 && v !== 0) ? v.toExponential(2) : String(Number(v.toPrecision(4))));

/** Rows {x, name1, name2, …} over the union of the curves' sample points. */
function rows(curves: Curve[], xKey: string): Record<string, number | null>[] {
  const byX = new Map<number, Record<string, number | null>>();
  for (const c of curves) {
    c.t.forEach((x, i) => {
      const row = byX.get(x) ?? { [xKey]: x };
      const v = c.values[i];
      row[c.name] = typeof v === "number" && Number.isFinite(v) ? v : null;
      byX.set(x, row);
    });
  }
  return [...byX.values()].sort((a, b) => (a[xKey] as number) - (b[xKey] as number));
}

/** Curves that are zero at every sample are listed in words instead of drawn (they would hide the axis). */
export function CurveChart({ title, curves: all, xLabel = "t", height = 240, logY = false, testId, hideZero = false }: { title: string; curves: Curve[]; xLabel?: string; height?: number; logY?: boolean; testId?: string; hideZero?: boolean }) {
  const isZero = (c: Curve) => c.values.every((v) => v === 0);
  const curves = hideZero ? all.filter((c) => !isZero(c)) : all;
  const zero = hideZero ? all.filter(isZero).map((c) => curveLabel(c.name)) : [];
  const data = rows(curves, "__x");
  const empty = data.length === 0;
  return (
    <figure className="min-w-0 rounded-lg border border-rule bg-panel p-3" data-testid={testId}>
      <figcaption className="mb-1 text-sm font-semibold">{title} <span className="font-normal text-abyss-500">(against {xLabel})</span></figcaption>
      {empty ? (
        <p className="py-6 text-center text-sm text-abyss-500">No finite values to plot.</p>
      ) : (
        <div role="img" aria-label={`${title}: ${curves.map((c) => curveLabel(c.name)).join(", ")} against ${xLabel}`} style={{ width: "100%", height }}>
          <ResponsiveContainer width="100%" height="100%">
            <LineChart data={data} margin={{ top: 4, right: 12, bottom: 0, left: 4 }}>
              <CartesianGrid stroke="#e8e5dc" />
              <XAxis dataKey="__x" type="number" domain={["dataMin", "dataMax"]} tickFormatter={fmt} fontSize={11} />
              <YAxis tickFormatter={fmt} fontSize={11} width={58} scale={logY ? "log" : "auto"} domain={logY ? ["auto", "auto"] : ["auto", "auto"]} allowDataOverflow={logY} />
              <Tooltip formatter={(v) => (typeof v === "number" ? fmt(v) : String(v))} labelFormatter={(l) => `${xLabel} = ${typeof l === "number" ? fmt(l) : String(l)}`} />
              <Legend wrapperStyle={{ fontSize: 12 }} />
              {curves.map((c, i) => (
                <Line key={c.name} type="monotone" dataKey={c.name} name={curveLabel(c.name)} stroke={PALETTE[i % PALETTE.length]} dot={false} strokeWidth={1.8} connectNulls={false} isAnimationActive={false} />
              ))}
            </LineChart>
          </ResponsiveContainer>
        </div>
      )}
      {zero.length ? <p className="mt-1 text-xs text-abyss-500">Zero throughout: {zero.join(", ")}.</p> : null}
    </figure>
  );
}
