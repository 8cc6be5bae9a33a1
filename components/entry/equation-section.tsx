/** The equation as submitted (the family's own variables and parameters) and in the class's normal form for the shown member. */
import { parseStoredCoefficients, type StoredSpec } from "@/lib/registry/coefficients";
import { coefficientLines, equationLatex, NORMAL_FORM_LATEX } from "@/lib/registry/equation-latex";
import type { EquationClass, Variant } from "@/lib/screening/spec";
import { Tex } from "./tex";
import { paramsText } from "./format";

const CLASS_NAME: Record<string, string> = { nls: "vc-NLS", kdv: "vc-KdV", mkdv: "vc-mKdV" };

export function EquationSection({ cls, spec, variant, parameters }: { cls: EquationClass; spec: StoredSpec; variant: Variant | null; parameters: Record<string, number> }) {
  const parsed = parseStoredCoefficients(spec);
  const evolution = spec.variables?.evolution ?? "t";
  const submitted = coefficientLines(parsed.submitted, evolution);
  const raw = spec.coefficients ?? {};
  return (
    <div className="grid gap-4 lg:grid-cols-2">
      <div className="min-w-0 rounded-lg border border-rule bg-panel p-3">
        <h3 className="text-sm font-semibold">As submitted</h3>
        {spec.equation ? (
          <>
            <p className="mt-1 text-xs text-abyss-500">Equation string:</p>
            <pre className="mt-1 overflow-x-auto rounded bg-paper p-2 font-mono text-xs">{spec.equation}</pre>
          </>
        ) : null}
        <p className="mt-2 text-xs text-abyss-500">Coefficients{spec.variables?.evolution && spec.variables.evolution !== "t" ? ` (evolution variable ${spec.variables.evolution})` : ""}:</p>
        <div data-testid="submitted-coefficients">
          {submitted.map((l) => <Tex key={l.name} latex={l.latex} display className="[&_.katex-display]:my-1" />)}
          {parsed.unreadable.map((name) => <pre key={name} className="font-mono text-xs">{name}: {raw[name]}</pre>)}
        </div>
        {Object.keys(spec.functions ?? {}).length ? (
          <p className="mt-2 text-xs text-abyss-500">Helper functions: {Object.entries(spec.functions ?? {}).map(([k, v]) => `${k} = ${v}`).join("; ")}</p>
        ) : null}
      </div>
      <div className="min-w-0 rounded-lg border border-rule bg-panel p-3">
        <h3 className="text-sm font-semibold">Normal form ({CLASS_NAME[cls] ?? cls})</h3>
        <Tex latex={NORMAL_FORM_LATEX[cls]} display className="text-abyss-500" />
        {variant ? (
          <>
            <p className="mt-2 text-xs text-abyss-500">This member ({paramsText(parameters)}{variant.free.length ? `; free: ${variant.free.join(", ")}` : ""}), in t and x:</p>
            <div data-testid="normal-form"><Tex latex={equationLatex(cls, variant.coefficients)} display /></div>
          </>
        ) : (
          <p className="text-sm text-abyss-500">No member of this family is stored.</p>
        )}
      </div>
    </div>
  );
}
