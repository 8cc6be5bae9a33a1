/**
 * Exports of one entry: JSON (entry, family, every variant's latest report; streamed), YAML (the
 * family as a complete `wavesieve: 1` file that uploads again) and a LaTeX fragment (equation,
 * reducibility condition and verdict, transformation formulas) for papers and notes.
 */
import type { EquationClass, Variant } from "@/lib/screening/spec";
import type { CurrentUser } from "@/lib/auth/current-user";
import { getEntryDetail, entryReports, type EntryDetail } from "./entry";
import { equationLatex, NORMAL_FORM_LATEX } from "./equation-latex";

export function familyFileYaml(detail: Pick<EntryDetail, "entry" | "family">, exportedAt = new Date()): string {
  const body = detail.family.sourceYaml.replace(/\s+$/, "").split("\n");
  const lines = body.map((line, i) => (i === 0 ? `  - ${line}` : line.length ? `    ${line}` : line));
  return [
    `# Family ${detail.family.slug} from the Wavesieve registry (entry ${detail.entry.id}),`,
    `# exported ${exportedAt.toISOString()}; submitted by ${detail.entry.submitter}.`,
    "wavesieve: 1",
    "families:",
    ...lines,
    "",
  ].join("\n");
}

/** LaTeX text mode: escape the characters TeX treats specially. */
export function latexText(s: string): string {
  return s.replace(/[\\{}$&#%^_~]/g, (c) => (c === "\\" ? "\\textbackslash{}" : c === "^" ? "\\^{}" : c === "~" ? "\\~{}" : `\\${c}`));
}

const VERDICT_WORDS: Record<string, string> = {
  reducible: "reducible to the canonical equation by a point map",
  "not-reducible": "not reducible by the point map of its class",
  undecided: "undecided",
};

export function entryLatex(detail: EntryDetail, exportedAt = new Date()): string {
  const cls = detail.family.class as EquationClass;
  const sel = detail.selected;
  const out: string[] = [
    `% Wavesieve registry entry ${detail.entry.slug}: ${detail.entry.title.replace(/\n/g, " ")}`,
    `% entry ${detail.entry.id}, exported ${exportedAt.toISOString()}`,
    `% engine ${sel?.report?.engine ?? detail.entry.engineVersion ?? "not screened"}; variant ${sel ? sel.summary.index : "none"}`,
    `% Needs amsmath. Normal form of the class: $${NORMAL_FORM_LATEX[cls]}$`,
    "",
    `\\paragraph{${latexText(detail.entry.title)}}`,
  ];
  const variant: Variant | null = sel?.variant ?? null;
  if (variant) {
    const params = Object.entries(sel?.summary.parameters ?? {});
    if (params.length) out.push(`Parameters: ${params.map(([k, v]) => `$${k.replace(/_/g, "\\_")} = ${v}$`).join(", ")}.`);
    out.push("\\begin{equation}", `  ${equationLatex(cls, variant.coefficients)}`, "\\end{equation}");
  }
  const red = sel?.report?.reducibility;
  if (red?.state === "present") {
    const r = red.value;
    out.push(`Reducibility: ${VERDICT_WORDS[r.verdict] ?? latexText(r.verdict)} (invariant $${r.evidence?.invariant ?? "?"}$, $\\rho_{\\mathrm{inv}} \\le ${Math.max(...(r.evidence?.windows ?? []).map((w) => w.rhoMax), 0).toExponential(2)}$).`);
    if (r.evidence?.formula?.definition) out.push("\\begin{equation*}", `  ${r.evidence.formula.definition}`, "\\end{equation*}");
    if (r.evidence?.display?.latex) out.push("With the coefficients substituted:", "\\begin{equation*}", `  ${r.evidence.display.latex}`, "\\end{equation*}");
    if (r.constraints?.length) out.push(`Conditions on the free parameters: ${r.constraints.map((c) => `$${c.parameter.replace(/_/g, "\\_")} = ${c.exact}$`).join(", ")}.`);
  }
  const pain = sel?.report?.painleve;
  if (pain?.state === "present") {
    out.push(`Painlev\\'e test: ${latexText(pain.value.verdict)}${pain.value.reason ? ` (${latexText(pain.value.reason)})` : ""}.`);
    const cond = pain.value.evidence?.nontrivialCondition;
    if (cond?.latex) out.push("\\begin{equation*}", `  ${cond.latex}`, "\\end{equation*}");
  }
  const tr = sel?.report?.transformation;
  if (tr?.state === "present" && tr.value.ok) {
    out.push("Transformation to the canonical equation:", "\\begin{align*}");
    const lines = tr.value.formulas.map((f) => `  ${f.latex.replace(/=/, "&=")}`);
    out.push(lines.join(" \\\\\n"), "\\end{align*}");
    if (tr.value.truncation) out.push(`The map holds on $[${tr.value.mapWindow[0]}, ${tr.value.mapWindow[1]}]$ (${latexText(tr.value.truncation.reason)}).`);
  } else if (tr?.state === "present" && !tr.value.ok) {
    out.push(`No transformation: ${latexText(tr.value.reason)}.`);
  }
  out.push("");
  return out.join("\n");
}

export type EntryExportFormat = "json" | "yaml" | "latex";

export interface EntryExport {
  body: ReadableStream<Uint8Array> | string;
  contentType: string;
  fileName: string;
}

export async function exportEntry(user: CurrentUser, id: string, format: EntryExportFormat, variant?: number): Promise<EntryExport | null> {
  const detail = await getEntryDetail(user, id, { variant });
  if (!detail) return null;
  const base = `wavesieve-${detail.entry.slug}`;
  if (format === "yaml") return { body: familyFileYaml(detail), contentType: "application/yaml; charset=utf-8", fileName: `${base}.yaml` };
  if (format === "latex") return { body: entryLatex(detail), contentType: "application/x-latex; charset=utf-8", fileName: `${base}.tex` };
  const encoder = new TextEncoder();
  const head = {
    exportedAt: new Date().toISOString(),
    entry: detail.entry,
    family: { ...detail.family, spec: detail.family.spec },
    batch: detail.batch,
    history: detail.history,
    duplicateOf: detail.duplicateOf,
  };
  const reports = entryReports(detail.family.id);
  let first = true;
  let opened = false;
  const body = new ReadableStream<Uint8Array>({
    async pull(controller) {
      if (!opened) {
        opened = true;
        controller.enqueue(encoder.encode(JSON.stringify(head).replace(/}$/, ',"variants":[')));
        return;
      }
      const { value, done } = await reports.next();
      if (done) {
        controller.enqueue(encoder.encode("]}\n"));
        controller.close();
        return;
      }
      controller.enqueue(encoder.encode(value.map((v) => (first ? ((first = false), "") : ",") + JSON.stringify(v)).join("")));
    },
    async cancel() {
      await reports.return(undefined);
    },
  });
  return { body, contentType: "application/json; charset=utf-8", fileName: `${base}.json` };
}
