/**
 * The designed model as a family file (`wavesieve: 1`, docs/family-format.md): the fixed
 * coefficients as the user wrote them, the designed coefficient as canonical text, the user's
 * parameters and the integration constants as fixed parameters. Written by hand (the structure
 * is fixed); strings are JSON-quoted, which YAML 1.2 reads as double-quoted scalars.
 */
import type { EquationClass } from "../spec/types";

export interface FamilyYamlInput {
  id: string;
  title: string;
  cls: EquationClass;
  parameters: { name: string; value: number; comment?: string }[];
  coefficients: { name: string; text: string; comment?: string }[];
  window: [number, number];
  tags: string[];
  notes: string[];
}

const q = (s: string): string => JSON.stringify(s);
const n = (x: number): string => (Object.is(x, -0) ? "0" : String(x));
/** Comments are single lines without control characters. */
const comment = (s?: string): string => (s ? `  # ${s.replace(/[\r\n\t]+/g, " ")}` : "");

export function familyYaml(f: FamilyYamlInput): string {
  const lines = ["wavesieve: 1", "families:", `  - id: ${f.id}`, `    title: ${q(f.title)}`, `    class: ${f.cls}`];
  if (f.parameters.length > 0) {
    lines.push("    parameters:");
    for (const p of f.parameters) lines.push(`      ${p.name}: ${n(p.value)}${comment(p.comment)}`);
  }
  lines.push("    coefficients:");
  for (const c of f.coefficients) lines.push(`      ${c.name}: ${q(c.text)}${comment(c.comment)}`);
  lines.push(`    window: [${n(f.window[0])}, ${n(f.window[1])}]`);
  if (f.tags.length > 0) lines.push(`    tags: [${f.tags.join(", ")}]`);
  if (f.notes.length > 0) {
    lines.push("    notes: |");
    for (const line of f.notes) lines.push(`      ${line.replace(/[\r\n]+/g, " ")}`);
  }
  return lines.join("\n") + "\n";
}
