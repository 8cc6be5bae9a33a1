export interface LocatedError {
  code: string;
  message: string;
  file?: string;
  document?: number;
  familyId?: string;
  path: string;
  line?: number;
  column?: number;
  char?: number;
}

export interface FileReport {
  file: string;
  bytes: number;
  families: { id: string; title: string; class: string; variants: number; free: string[] }[];
  errors: LocatedError[];
}

export function whereText(e: LocatedError): string {
  const parts = [e.file, e.document !== undefined && e.document > 0 ? `document ${e.document + 1}` : null, e.familyId ? `family ${e.familyId}` : null, e.path || null];
  const pos = e.line ? `line ${e.line}${e.column ? `, column ${e.column}` : ""}` : null;
  return [...parts, pos, e.char ? `char ${e.char} of the expression` : null].filter(Boolean).join(" · ");
}
