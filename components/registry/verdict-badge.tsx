/** Small coloured labels for verdicts, agreement and curation state (text always readable alone). */
const TONE: Record<string, string> = {
  good: "bg-reed-100 text-reed-700 border-reed-700/30",
  bad: "bg-coral-100 text-coral-700 border-coral-700/30",
  warn: "bg-ember-100 text-ember-700 border-ember-700/30",
  info: "bg-tide-100 text-tide-700 border-tide-600/30",
  plain: "bg-paper text-abyss-700 border-rule",
};

const TONE_OF: Record<string, keyof typeof TONE> = {
  reducible: "good",
  passes: "good",
  agree: "good",
  accepted: "good",
  "not-reducible": "plain",
  fails: "plain",
  conflict: "bad",
  rejected: "bad",
  undecided: "warn",
  mixed: "warn",
  inconclusive: "warn",
  returned: "warn",
  candidate: "info",
  pending: "plain",
  "not-run": "plain",
};

const LABEL: Record<string, string> = {
  "not-reducible": "not reducible",
  "not-run": "not run",
  returned: "sent back",
};

export function VerdictBadge({ value, title }: { value: string; title?: string }) {
  return (
    <span title={title} className={`inline-block whitespace-nowrap rounded border px-1.5 py-0.5 text-xs font-semibold ${TONE[TONE_OF[value] ?? "plain"]}`}>
      {LABEL[value] ?? value}
    </span>
  );
}

export function verdictLabel(value: string): string {
  return LABEL[value] ?? value;
}
