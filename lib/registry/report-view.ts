/**
 * Reading a stored report defensively. Reports are kept as JSON from whichever engine version
 * wrote them; newer fields (agreement, transformation, solutions, verification) may be missing in
 * old ones, and the UI says "not computed by this engine version" instead of failing.
 */
import type { VariantReport, ReducibilityReport } from "@/lib/screening/report";
import type { TransformationResult } from "@/lib/screening/transform";
import type { SolutionSet } from "@/lib/screening/solutions";
import type { VerificationResult } from "@/lib/screening/verify";
import type { PainleveEvidence } from "@/lib/screening/painleve";

/** A stage that is present, absent (older engine) or unreadable. */
export type Stage<T> = { state: "present"; value: T } | { state: "absent" } | { state: "invalid"; problem: string };

export interface ReportView {
  engine: string;
  parameters: Record<string, number>;
  free: string[];
  window: [number, number] | null;
  reducibility: Stage<ReducibilityReport>;
  painleve: Stage<{ verdict: string; reason: string; evidence: Partial<PainleveEvidence> | null }>;
  agreement: Stage<string>;
  transformation: Stage<TransformationResult>;
  solutions: Stage<SolutionSet>;
  verification: Stage<VerificationResult>;
  timings: Record<string, number>;
}

const isObject = (v: unknown): v is Record<string, unknown> => typeof v === "object" && v !== null && !Array.isArray(v);

function stage<T>(value: unknown, check: (v: Record<string, unknown>) => string | null): Stage<T> {
  if (value === undefined || value === null) return { state: "absent" };
  if (!isObject(value)) return { state: "invalid", problem: "not an object" };
  const problem = check(value);
  return problem ? { state: "invalid", problem } : { state: "present", value: value as T };
}

const numberRecord = (v: unknown): Record<string, number> =>
  isObject(v) ? Object.fromEntries(Object.entries(v).filter((e): e is [string, number] => typeof e[1] === "number")) : {};

export function readReport(reportJson: string | null): ReportView | null {
  if (!reportJson) return null;
  let raw: unknown;
  try {
    raw = JSON.parse(reportJson);
  } catch {
    return null;
  }
  if (!isObject(raw)) return null;
  const r = raw as Partial<VariantReport> & Record<string, unknown>;
  const window = Array.isArray(r.window) && r.window.length === 2 && r.window.every((n) => typeof n === "number") ? (r.window as [number, number]) : null;
  const painleveRaw = r.painleve as unknown;
  return {
    engine: typeof r.engine === "string" ? r.engine : "unknown",
    parameters: numberRecord(r.parameters),
    free: Array.isArray(r.free) ? r.free.filter((s): s is string => typeof s === "string") : [],
    window,
    reducibility: stage<ReducibilityReport>(r.reducibility, (v) => (typeof v.verdict === "string" ? null : "no verdict")),
    painleve: isObject(painleveRaw) && typeof painleveRaw.verdict === "string"
      ? {
          state: "present",
          value: {
            verdict: painleveRaw.verdict,
            reason: typeof painleveRaw.reason === "string" ? painleveRaw.reason : "",
            // The engine keeps its evidence under `evidence` (PainleveResult) or `details` (PainleveReport).
            evidence: isObject(painleveRaw.evidence) ? (painleveRaw.evidence as Partial<PainleveEvidence>) : isObject(painleveRaw.details) ? (painleveRaw.details as Partial<PainleveEvidence>) : null,
          },
        }
      : painleveRaw === undefined ? { state: "absent" } : { state: "invalid", problem: "no verdict" },
    agreement: typeof r.agreement === "string" ? { state: "present", value: r.agreement } : { state: "absent" },
    transformation: stage<TransformationResult>(r.transformation, (v) => (typeof v.ok !== "boolean" ? "no ok flag" : v.ok && !(isObject(v.table) && Array.isArray((v.table as Record<string, unknown>).t)) ? "no map table" : null)),
    solutions: stage<SolutionSet>(r.solutions, (v) => (typeof v.ok !== "boolean" ? "no ok flag" : v.ok && !Array.isArray(v.solutions) ? "no solution list" : null)),
    verification: stage<VerificationResult>(r.verification, (v) => (Array.isArray(v.residuals) ? null : "no residuals")),
    timings: numberRecord(r.timings),
  };
}
