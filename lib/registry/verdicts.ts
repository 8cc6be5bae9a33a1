/**
 * The verdict fields of a stored report that the registry summarises (CLI JSON names). Pure: the
 * run model derives its verdict columns with it, so summaries never re-read whole reports.
 */
export interface ReportVerdicts {
  reducibility: string;
  painleve: string;
  agreement: string;
  engine?: string;
}

export function reportVerdicts(reportJson: string | null): ReportVerdicts | null {
  if (!reportJson) return null;
  const r = JSON.parse(reportJson) as { engine?: string; reducibility?: { verdict?: string }; painleve?: { verdict?: string }; agreement?: string };
  return {
    reducibility: r.reducibility?.verdict ?? "undecided",
    painleve: r.painleve?.verdict ?? "not-run",
    agreement: r.agreement ?? "inconclusive",
    engine: r.engine,
  };
}

/** The three verdict columns of a run for a report (all null without one). */
export function verdictColumns(reportJson: string | null) {
  const v = reportVerdicts(reportJson);
  return { reducibilityVerdict: v?.reducibility ?? null, painleveVerdict: v?.painleve ?? null, agreementVerdict: v?.agreement ?? null };
}

/** The verdicts a run's columns hold (null for a run without a report). */
export function verdictsOfColumns(run: { reducibilityVerdict: string | null; painleveVerdict: string | null; agreementVerdict: string | null }): ReportVerdicts | null {
  if (run.reducibilityVerdict === null) return null;
  return { reducibility: run.reducibilityVerdict, painleve: run.painleveVerdict ?? "not-run", agreement: run.agreementVerdict ?? "inconclusive" };
}
