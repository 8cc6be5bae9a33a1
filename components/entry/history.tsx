/** The entry's curation history from the audit log: who, when, what and why. */
import type { HistoryItem } from "@/lib/registry/entry";
import { utc } from "./format";

const ACTION_TEXT: Record<string, string> = {
  "entry.accepted": "accepted",
  "entry.rejected": "rejected",
  "entry.returned": "sent back to the submitter",
  "entry.published": "published",
  "entry.unpublished": "unpublished",
  "entry.tags": "changed the tags",
  "entry.duplicate": "marked as a duplicate",
  "entry.not-duplicate": "removed the duplicate mark",
};

export function History({ items }: { items: HistoryItem[] }) {
  if (!items.length) return <p className="text-sm text-abyss-500" data-testid="history">No curation actions yet.</p>;
  return (
    <ol className="space-y-2 border-l-2 border-rule pl-4" data-testid="history">
      {items.map((h) => (
        <li key={h.id} className="text-sm" data-testid="history-item">
          <span className="font-mono text-xs text-abyss-500">{utc(h.at)}</span>{" "}
          <span className="font-semibold">{h.actor ?? "system"}</span> {ACTION_TEXT[h.action] ?? h.action}
          {h.detail ? <span className="block text-abyss-700">{h.detail}</span> : null}
        </li>
      ))}
    </ol>
  );
}
