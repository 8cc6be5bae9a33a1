"use client";
/** Heat map of a grid (values[i][j] at t_i, x_j) on a plain <canvas>: one filled rectangle per cell. */
import { useEffect, useRef } from "react";

// A perceptually ordered dark-to-light ramp (sampled from a viridis-like scale, hand-picked stops).
const STOPS: [number, number, number][] = [
  [68, 1, 84], [72, 40, 120], [62, 74, 137], [49, 104, 142], [38, 130, 142], [31, 158, 137], [53, 183, 121], [109, 205, 89], [180, 222, 44], [253, 231, 37],
];

export function rampColour(s: number): string {
  const x = Math.max(0, Math.min(1, s)) * (STOPS.length - 1);
  const i = Math.min(STOPS.length - 2, Math.floor(x));
  const f = x - i;
  const c = STOPS[i].map((v, k) => Math.round(v + (STOPS[i + 1][k] - v) * f));
  return `rgb(${c[0]},${c[1]},${c[2]})`;
}

const fmt = (v: number) => (Math.abs(v) >= 1e4 || (Math.abs(v) < 1e-3 && v !== 0) ? v.toExponential(2) : String(Number(v.toPrecision(3))));

export function Heatmap({ x, t, values, label, testId }: { x: number[]; t: number[]; values: (number | null)[][]; label: string; testId?: string }) {
  const canvas = useRef<HTMLCanvasElement>(null);
  let max = 0;
  let min = Infinity;
  for (const row of values) for (const v of row) if (v !== null && Number.isFinite(v)) {
    max = Math.max(max, v);
    min = Math.min(min, v);
  }
  if (!Number.isFinite(min)) min = 0;

  useEffect(() => {
    const el = canvas.current;
    const ctx = el?.getContext("2d");
    if (!el || !ctx) return;
    const rowsN = values.length;
    const colsN = values[0]?.length ?? 0;
    ctx.clearRect(0, 0, el.width, el.height);
    if (!rowsN || !colsN) return;
    const w = el.width / colsN;
    const h = el.height / rowsN;
    const span = max - min || 1;
    for (let i = 0; i < rowsN; i++) {
      for (let j = 0; j < colsN; j++) {
        const v = values[i][j];
        ctx.fillStyle = v === null || !Number.isFinite(v) ? "#d9d6cc" : rampColour((v - min) / span);
        // t grows upwards: row 0 (t0) at the bottom.
        ctx.fillRect(Math.floor(j * w), Math.floor(el.height - (i + 1) * h), Math.ceil(w) + 1, Math.ceil(h) + 1);
      }
    }
  }, [values, min, max]);

  const x0 = x[0] ?? 0;
  const x1 = x[x.length - 1] ?? 0;
  const t0 = t[0] ?? 0;
  const t1 = t[t.length - 1] ?? 0;
  return (
    <figure className="min-w-0 rounded-lg border border-rule bg-panel p-3" data-testid={testId}>
      <figcaption className="mb-2 text-sm font-semibold">{label}</figcaption>
      <div className="flex gap-2">
        <div className="flex flex-col justify-between py-0.5 text-right font-mono text-[11px] text-abyss-500" aria-hidden="true">
          <span>{fmt(t1)}</span><span>t</span><span>{fmt(t0)}</span>
        </div>
        <div className="min-w-0 flex-1">
          <canvas ref={canvas} width={512} height={256} role="img" aria-label={`${label}; x from ${fmt(x0)} to ${fmt(x1)}, t from ${fmt(t0)} to ${fmt(t1)}; values from ${fmt(min)} to ${fmt(max)}`} className="block h-48 w-full rounded border border-rule sm:h-64" />
          <div className="mt-0.5 flex justify-between font-mono text-[11px] text-abyss-500" aria-hidden="true"><span>{fmt(x0)}</span><span>x</span><span>{fmt(x1)}</span></div>
        </div>
      </div>
      <div className="mt-2 flex items-center gap-2 text-[11px] text-abyss-500" aria-hidden="true">
        <span className="font-mono">{fmt(min)}</span>
        <span className="h-2 flex-1 rounded" style={{ background: `linear-gradient(to right, ${STOPS.map((_, i) => rampColour(i / (STOPS.length - 1))).join(", ")})` }} />
        <span className="font-mono">{fmt(max)}</span>
      </div>
    </figure>
  );
}
