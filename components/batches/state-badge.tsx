const STYLES: Record<string, string> = {
  queued: "bg-paper text-abyss-700 border-rule",
  running: "bg-tide-100 text-tide-700 border-tide-600/30",
  done: "bg-reed-100 text-reed-700 border-reed-700/30",
  failed: "bg-coral-100 text-coral-700 border-coral-700/30",
  "timed-out": "bg-ember-100 text-ember-700 border-ember-700/30",
  cancelled: "bg-paper text-abyss-500 border-rule",
};

export function StateBadge({ state }: { state: string }) {
  return <span className={`inline-block rounded border px-1.5 py-0.5 text-xs font-semibold ${STYLES[state] ?? STYLES.queued}`}>{state}</span>;
}
