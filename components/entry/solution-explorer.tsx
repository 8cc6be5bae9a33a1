"use client";
/**
 * Exact solutions of the original equation with editable parameters. The plots are recomputed in
 * the browser from the stored map table with the engine's pure evaluateSolution / intensityOnGrid
 * (lib/screening/solutions) — no request, no new mathematics in the UI.
 */
import { useId, useMemo, useRef, useState } from "react";
import { evaluateSolution, intensityOnGrid, plotRange, type SolutionParameter, type SolutionSpec } from "@/lib/screening/solutions";
import type { MapTable } from "@/lib/screening/transform";
import { Tex } from "./tex";
import { Heatmap } from "./heatmap";
import { CurveChart } from "./curve-chart";

const GRID = 64;
const PROFILE_POINTS = 241;

function linspace(a: number, b: number, n: number): number[] {
  return Array.from({ length: n }, (_, i) => (i === n - 1 ? b : a + ((b - a) * i) / (n - 1)));
}

function problem(p: SolutionParameter, v: number): string | null {
  if (!Number.isFinite(v)) return "enter a number";
  if (v < p.min || (v === p.min && !p.minInclusive)) return `must be ${p.minInclusive ? "at least" : "more than"} ${p.min}`;
  if (v > p.max || (v === p.max && !p.maxInclusive)) return `must be ${p.maxInclusive ? "at most" : "less than"} ${p.max}`;
  return null;
}

function ParameterInput({ p, value, onChange }: { p: SolutionParameter; value: string; onChange: (v: string) => void }) {
  const id = useId();
  const v = Number(value);
  const err = value.trim() === "" ? "enter a number" : problem(p, v);
  const step = Number(((p.max - p.min) / 200).toPrecision(2));
  const lo = p.minInclusive ? p.min : p.min + step;
  const hi = p.maxInclusive ? p.max : p.max - step;
  return (
    <div className="rounded-md border border-rule p-2">
      <label htmlFor={`${id}-n`} className="flex flex-col gap-x-2 text-sm font-semibold sm:flex-row sm:items-baseline sm:justify-between">
        <span><Tex latex={p.latex} /> <span className="text-xs font-normal text-abyss-500">({p.name})</span></span>
        <span className="text-xs font-normal text-abyss-500">{p.description}</span>
      </label>
      <div className="mt-1 flex items-center gap-2">
        <input type="range" aria-label={`${p.name} slider`} min={lo} max={hi} step={step} value={Number.isFinite(v) ? Math.min(hi, Math.max(lo, v)) : p.defaultValue} onChange={(e) => onChange(e.target.value)} className="min-w-0 flex-1 accent-tide-600" />
        <input id={`${id}-n`} type="number" inputMode="decimal" step="any" value={value} onChange={(e) => onChange(e.target.value)} aria-invalid={err ? true : undefined} aria-describedby={err ? `${id}-e` : undefined} className="w-24 rounded border border-rule px-2 py-1 font-mono text-sm" data-testid={`param-${p.name}`} />
      </div>
      {err ? <p id={`${id}-e`} role="alert" className="mt-1 text-xs text-coral-700">{p.name} {err}</p> : null}
    </div>
  );
}

export function SolutionExplorer({ solutions, table, mapWindow, notes }: { solutions: SolutionSpec[]; table: MapTable; mapWindow: [number, number]; notes: string[] }) {
  const [selectedId, setSelectedId] = useState(solutions[0]?.id ?? "");
  const spec = solutions.find((s) => s.id === selectedId) ?? solutions[0];
  const [drafts, setDrafts] = useState<Record<string, Record<string, string>>>({});
  const [tFraction, setTFraction] = useState(0.5);

  const draft = useMemo(() => {
    const own = drafts[spec?.id ?? ""] ?? {};
    return Object.fromEntries((spec?.parameters ?? []).map((p) => [p.name, own[p.name] ?? String(p.defaultValue)]));
  }, [drafts, spec]);
  const params = useMemo(() => Object.fromEntries(Object.entries(draft).map(([k, v]) => [k, Number(v)])), [draft]);
  const valid = spec ? spec.parameters.every((p) => draft[p.name].trim() !== "" && problem(p, params[p.name]) === null) : false;
  const [t0, t1] = mapWindow;
  const tProfile = t0 + (t1 - t0) * tFraction;

  // The last valid parameters keep the plots on screen while a field is being edited.
  const lastValid = useRef<{ id: string; params: Record<string, number> } | null>(null);
  if (valid && spec) lastValid.current = { id: spec.id, params };
  const shownKey = lastValid.current && lastValid.current.id === spec?.id ? JSON.stringify(lastValid.current) : "";

  const plots = useMemo(() => {
    if (!spec || !shownKey) return null;
    const shown = JSON.parse(shownKey) as { id: string; params: Record<string, number> };
    const [xa, xb] = plotRange(spec, table, shown.params);
    const xs = linspace(xa, xb, GRID);
    const ts = linspace(t0, t1, GRID);
    const grid = intensityOnGrid(spec, table, shown.params, xs, ts);
    const px = linspace(xa, xb, PROFILE_POINTS);
    const u = px.map((x) => evaluateSolution(spec, table, shown.params, x, tProfile));
    return {
      xs, ts, grid,
      profile: [
        { name: "|u|²", t: px, values: u.map((z) => z.re * z.re + z.im * z.im) },
        { name: "Re u", t: px, values: u.map((z) => z.re) },
        { name: "Im u", t: px, values: u.map((z) => z.im) },
      ],
    };
  }, [spec, shownKey, table, t0, t1, tProfile]);

  if (!spec) return <p className="text-sm text-abyss-500">No exact solution is offered for this canonical sign.</p>;
  const set = (name: string, value: string) => setDrafts((d) => ({ ...d, [spec.id]: { ...(d[spec.id] ?? {}), [name]: value } }));

  return (
    <div className="space-y-3" data-testid="solution-explorer">
      <div className="flex flex-wrap gap-2" role="radiogroup" aria-label="Exact solution">
        {solutions.map((s) => (
          <label key={s.id} className={`cursor-pointer rounded-md border px-3 py-1.5 text-sm font-semibold ${s.id === spec.id ? "border-tide-600 bg-tide-100 text-tide-700" : "border-rule bg-panel"}`}>
            <input type="radio" name="solution" value={s.id} checked={s.id === spec.id} onChange={() => setSelectedId(s.id)} className="sr-only" />
            {s.label}
          </label>
        ))}
      </div>
      <div className="rounded-lg border border-rule bg-panel p-3 text-sm">
        <p className="text-xs font-semibold uppercase tracking-wide text-abyss-500">Canonical solution</p>
        <Tex latex={spec.canonicalLatex} display />
        <p className="text-xs font-semibold uppercase tracking-wide text-abyss-500">Solution of the original equation</p>
        <Tex latex={spec.mappedLatex} display />
        <ul className="mt-1 list-disc pl-5 text-xs text-abyss-700">{spec.features.map((f) => <li key={f}>{f}</li>)}</ul>
        <p className="mt-1 text-xs text-abyss-500">Source: {spec.source}</p>
      </div>
      <fieldset className="grid gap-2 sm:grid-cols-2">
        <legend className="mb-1 text-sm font-semibold">Parameters (the plots redraw as you change them)</legend>
        {spec.parameters.map((p) => <ParameterInput key={p.name} p={p} value={draft[p.name]} onChange={(v) => set(p.name, v)} />)}
      </fieldset>
      <div className="flex items-center justify-between gap-3">
        <p className="text-xs text-abyss-500">{valid ? "" : "Fix the highlighted parameter; the plots show the last valid values."}</p>
        <button type="button" onClick={() => setDrafts((d) => ({ ...d, [spec.id]: {} }))} className="rounded-md border border-rule bg-panel px-2 py-1 text-sm font-semibold">Reset to defaults</button>
      </div>
      {plots ? (
        <div className="grid gap-3 lg:grid-cols-2">
          <Heatmap x={plots.xs} t={plots.ts} values={plots.grid} label={`|u(x,t)|² of the ${spec.label} over the map window`} testId="solution-heatmap" />
          <div className="min-w-0 space-y-2">
            <CurveChart title={`Profile at t = ${Number(tProfile.toPrecision(4))}`} curves={plots.profile} xLabel="x" testId="solution-profile" />
            <label className="flex items-center gap-2 text-sm">
              Time of the profile
              <input type="range" min={0} max={1} step={0.01} value={tFraction} onChange={(e) => setTFraction(Number(e.target.value))} className="flex-1 accent-tide-600" />
            </label>
          </div>
        </div>
      ) : null}
      {notes.length ? <ul className="text-xs text-abyss-500">{notes.map((n) => <li key={n}>{n}</li>)}</ul> : null}
    </div>
  );
}
