/** Dry-run validation of uploaded files: what would be stored, and every located error. */
import { parseFamilies } from "@/lib/screening/spec";
import type { FamilySpec, SpecError } from "@/lib/screening/spec/types";
import { MAX_FILES_PER_UPLOAD, MAX_UPLOAD_FILE_BYTES, MAX_UPLOAD_TOTAL_BYTES, MAX_FILE_NAME_LENGTH } from "./limits";

export interface UploadFile {
  name: string;
  text: string;
}

export interface FileValidation {
  file: string;
  bytes: number;
  families: FamilySpec[];
  errors: SpecError[];
}

export interface FamilySummary {
  id: string;
  title: string;
  class: string;
  variants: number;
  free: string[];
  hash: string;
}

export function summariseFamily(f: FamilySpec): FamilySummary {
  return { id: f.id, title: f.title, class: f.class, variants: f.variants.length, free: f.variants[0]?.free ?? [], hash: f.hash };
}

export type UploadCheck = { ok: true } | { ok: false; status: number; error: string };

export function checkUploadShape(files: UploadFile[]): UploadCheck {
  if (files.length === 0) return { ok: false, status: 400, error: "no files: send one or more .yaml/.yml files" };
  if (files.length > MAX_FILES_PER_UPLOAD) return { ok: false, status: 413, error: `too many files (${files.length}; limit ${MAX_FILES_PER_UPLOAD})` };
  let total = 0;
  for (const f of files) {
    const bytes = Buffer.byteLength(f.text, "utf8");
    total += bytes;
    if (f.name.length > MAX_FILE_NAME_LENGTH) return { ok: false, status: 400, error: `file name too long: ${f.name.slice(0, 40)}…` };
    if (bytes > MAX_UPLOAD_FILE_BYTES)
      return { ok: false, status: 413, error: `${f.name}: file too large (${(bytes / 1048576).toFixed(1)} MB; limit ${MAX_UPLOAD_FILE_BYTES / 1048576} MB)` };
  }
  if (total > MAX_UPLOAD_TOTAL_BYTES) return { ok: false, status: 413, error: `upload too large (${(total / 1048576).toFixed(1)} MB; limit ${MAX_UPLOAD_TOTAL_BYTES / 1048576} MB in all)` };
  return { ok: true };
}

export function validateFiles(files: UploadFile[]): FileValidation[] {
  return files.map((f) => {
    const result = parseFamilies(f.text, { file: f.name });
    return { file: f.name, bytes: Buffer.byteLength(f.text, "utf8"), families: result.families, errors: result.errors };
  });
}

/** The JSON a client sees for a validation (no expression trees). */
export function validationView(v: FileValidation[]) {
  return v.map((f) => ({ file: f.file, bytes: f.bytes, families: f.families.map(summariseFamily), errors: f.errors }));
}
