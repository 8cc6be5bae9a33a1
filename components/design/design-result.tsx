"use client";
/** One design: the formula (or table), its condition, the screen's verdict, poles, the plots and the YAML. */
import type { DesignResult } from "@/lib/screening/design";
import { Tex } from "@/components/entry/tex";
import { CurveChart } from "@/components/entry/curve-chart";
import { sci } from "@/components/entry/format";
import { KIND_LABEL } from "./presets";

function Badge({ ok, children, testId }: { ok: boolean; children: React.ReactNode; testId?: string }) {
  return (
    <span data-testid={testId} className={`inline-block rounded border px-2 py-0.5 text-xs font-semibold ${ok ? "border-reed-700/30 bg-reed-100 text-reed-700" : "border-ember-700/30 bg-ember-100 text-ember-700"}`}>
      {children}
    </span>
  );
}

export function DesignResultView({ result }: { result: DesignResult }) {
  const s = result.screening;
  const solved = result.plot.filter((c) => c.role === "solved");
  const fixed = result.plot.filter((c) => c.role === "fixed");
  const sol = result.solution;
  return (
    <section className="space-y-4" aria-label="Design result" data-testid="design-result">
      <div className="rounded-lg border border-rule bg-panel p-4" data-testid="design-formula">
        <p className="text-xs text-abyss-500">
          {result.solve} solves {KIND_LABEL[result.condition.kind] ?? result.condition.kind} — the condition {result.condition.invariant} ≡ 0:
        </p>
        <Tex latex={result.condition.latex} display className="text-sm" />
        {sol.form === "closed" ? (
          <>
            <p className="mt-2 text-sm font-semibold">Closed form</p>
            <Tex latex={`${result.solve}(t) = ${sol.displayLatex ?? sol.latex}`} display />
            <p className="font-mono text-xs text-abyss-500 break-all" data-testid="design-text">{sol.text}</p>
          </>
        ) : (
          <>
            <p className="mt-2 text-sm font-semibold">No closed form: tabulated ({sol.t.length} nodes on [{sci(sol.reached[0], 5)}, {sci(sol.reached[1], 5)}])</p>
            <p className="text-sm text-abyss-500">{sol.reason}.</p>
            <p className="text-sm" data-testid="design-accuracy">Accuracy: {sol.accuracy.text}.</p>
            {sol.stopped ? <p className="text-sm text-ember-700">The integration stopped at t = {sci(sol.stopped.t, 6)}: {sol.stopped.message}</p> : null}
          </>
        )}
        <p className="mt-2 text-xs text-abyss-500">{result.condition.method}</p>
      </div>

      <div className="flex flex-wrap items-center gap-2" data-testid="design-verdict">
        {s.kind === "pipeline" ? (
          <>
            <Badge ok={s.reducibility === "reducible"} testId="design-reducibility">{s.reducibility}</Badge>
            <Badge ok={s.painleve === "passes"}>Painlevé {s.painleve}</Badge>
            <span className="text-xs text-abyss-500">screened by the pipeline: ρ_inv ≤ {sci(s.rhoMax)} at {s.samples.length} points ({s.precision})</span>
          </>
        ) : (
          <>
            <Badge ok={s.reducibility === "reducible"} testId="design-reducibility">{s.reducibility}</Badge>
            <Badge ok={false}>numerical design</Badge>
            <span className="text-xs text-abyss-500">{s.summary}</span>
          </>
        )}
      </div>
      {s.kind === "pipeline" && s.painleveReason ? <p className="text-xs text-abyss-500">Painlevé: {s.painleveReason}</p> : null}

      {result.poles.length > 0 ? (
        <ul className="rounded-md border border-ember-700/30 bg-ember-100 px-3 py-2 text-sm text-ember-700" data-testid="design-poles">
          {result.poles.map((p) => (
            <li key={`${p.kind}-${p.t}`}>{p.kind === "pole" ? "Pole" : "Zero"} at t = {sci(p.t, 8)}: {p.detail}</li>
          ))}
        </ul>
      ) : null}

      <div className="grid gap-3 lg:grid-cols-2" data-testid="design-plot">
        <CurveChart title={`Designed ${result.solve}`} curves={solved} testId="design-plot-solved" />
        <CurveChart title="Fixed coefficients" curves={fixed} testId="design-plot-fixed" hideZero />
      </div>

      {result.transformation ? (
        <details className="rounded-lg border border-rule bg-panel p-3">
          <summary className="cursor-pointer text-sm font-semibold text-tide-700">
            Map of the designed model{result.transformation.sigma !== null ? ` (σ = ${result.transformation.sigma > 0 ? "+1" : "−1"})` : ""}
          </summary>
          {result.transformation.formulas.map((f) => (
            <Tex key={f.name} latex={f.latex} display className="[&_.katex-display]:my-0.5" />
          ))}
          <p className="text-xs text-abyss-500">Identity at t0: {result.transformation.identityAtStart.holds ? "yes" : "no"} — {result.transformation.identityAtStart.condition}</p>
        </details>
      ) : null}

      {result.notes.length > 0 ? (
        <ul className="list-disc pl-5 text-sm text-abyss-500">
          {result.notes.map((n) => <li key={n}>{n}</li>)}
        </ul>
      ) : null}
    </section>
  );
}
