"use client";
/** Curators' actions on one entry. Every action goes through the API (which checks the role) and the audit log. */
import { useEffect, useState } from "react";
import { useRouter } from "next/navigation";

interface Candidate {
  id: string;
  slug: string;
  title: string;
  submitter: string;
  curationState: string;
  match: "same family" | "same coefficients";
}

interface Props {
  entryId: string;
  curationState: string;
  published: boolean;
  agreement: string;
  screened: boolean;
  tags: string[];
  duplicateOf: { id: string; slug: string } | null;
}

async function send(url: string, method: string, body: unknown): Promise<{ ok: boolean; error?: string }> {
  const res = await fetch(url, { method, headers: { "content-type": "application/json" }, body: JSON.stringify(body) });
  if (res.ok) return { ok: true };
  const b = (await res.json().catch(() => ({}))) as { error?: string };
  return { ok: false, error: b.error ?? `error ${res.status}` };
}

const button = "rounded-md px-3 py-1.5 text-sm font-semibold disabled:opacity-40";

export function CurationPanel({ entryId, curationState, published, agreement, screened, tags, duplicateOf }: Props) {
  const router = useRouter();
  const [note, setNote] = useState("");
  const [tagText, setTagText] = useState(tags.join(", "));
  const [busy, setBusy] = useState(false);
  const [notice, setNotice] = useState<{ ok: boolean; text: string } | null>(null);
  const [candidates, setCandidates] = useState<Candidate[] | null>(null);
  const [original, setOriginal] = useState("");

  useEffect(() => setTagText(tags.join(", ")), [tags]);
  useEffect(() => {
    fetch(`/api/entries/${entryId}/duplicates`)
      .then((r) => (r.ok ? r.json() : { candidates: [] }))
      .then((b: { candidates: Candidate[] }) => setCandidates(b.candidates))
      .catch(() => setCandidates([]));
  }, [entryId]);

  async function act(label: string, url: string, method: string, body: unknown, clearNote = true) {
    setBusy(true);
    setNotice(null);
    const r = await send(url, method, body);
    setBusy(false);
    setNotice(r.ok ? { ok: true, text: `${label}.` } : { ok: false, text: r.error ?? "failed" });
    if (r.ok) {
      if (clearNote) setNote("");
      router.refresh();
    }
  }

  const curate = (action: "accept" | "reject" | "return", label: string) => act(label, `/api/entries/${entryId}/curate`, "POST", { action, note });

  return (
    <section aria-labelledby="curation-heading" className="space-y-4 rounded-lg border border-tide-600/40 bg-panel p-4" data-testid="curation-panel">
      <h2 id="curation-heading" className="text-lg font-bold">Curation</h2>
      {notice ? <p role={notice.ok ? "status" : "alert"} className={`rounded-md px-3 py-2 text-sm ${notice.ok ? "bg-reed-100 text-reed-700" : "bg-coral-100 text-coral-700"}`}>{notice.text}</p> : null}

      <div className="space-y-2">
        <label className="block text-sm font-semibold">
          Note for the history{agreement === "conflict" ? " (required to accept: say how the conflict between the verdicts was resolved)" : " (required to reject or send back)"}
          <textarea value={note} onChange={(e) => setNote(e.target.value)} rows={3} maxLength={2000} className="mt-1 block w-full rounded-md border border-rule px-3 py-2 font-normal" data-testid="curation-note" />
        </label>
        <div className="flex flex-wrap gap-2">
          <button type="button" disabled={busy || !screened || curationState === "accepted"} onClick={() => curate("accept", "Accepted")} className={`${button} bg-reed-700 text-white`}>Accept</button>
          <button type="button" disabled={busy || curationState === "returned"} onClick={() => curate("return", "Sent back to the submitter")} className={`${button} border border-ember-700/40 bg-ember-100 text-ember-700`}>Send back</button>
          <button type="button" disabled={busy || curationState === "rejected"} onClick={() => curate("reject", "Rejected")} className={`${button} border border-coral-700/40 bg-coral-100 text-coral-700`}>Reject</button>
          {published ? (
            <button type="button" disabled={busy} onClick={() => act("Unpublished", `/api/entries/${entryId}/publish`, "POST", { published: false, note })} className={`${button} border border-rule bg-paper`}>Unpublish</button>
          ) : (
            <button type="button" disabled={busy || curationState !== "accepted"} onClick={() => act("Published", `/api/entries/${entryId}/publish`, "POST", { published: true, note })} className={`${button} bg-tide-600 text-white`} title={curationState !== "accepted" ? "Only accepted entries can be published" : undefined}>Publish</button>
          )}
        </div>
        {!screened ? <p className="text-xs text-abyss-500">Not screened yet: it can be accepted once a report exists.</p> : null}
      </div>

      <form className="space-y-2" onSubmit={(e) => { e.preventDefault(); void act("Tags saved", `/api/entries/${entryId}/tags`, "PATCH", { tags: tagText.split(",").map((t) => t.trim()).filter(Boolean), note }); }}>
        <label className="block text-sm font-semibold">
          Tags (comma-separated)
          <input value={tagText} onChange={(e) => setTagText(e.target.value)} className="mt-1 block w-full rounded-md border border-rule px-3 py-2 font-mono text-sm font-normal" />
        </label>
        <button type="submit" disabled={busy} className={`${button} border border-rule bg-paper`}>Save tags</button>
      </form>

      <div className="space-y-2">
        <h3 className="text-sm font-bold">Duplicates</h3>
        {duplicateOf ? (
          <p className="text-sm">
            Marked as a duplicate of <a className="font-semibold text-tide-700 underline" href={`/registry/${duplicateOf.id}`}>{duplicateOf.slug}</a>.{" "}
            <button type="button" disabled={busy} onClick={() => act("Duplicate mark removed", `/api/entries/${entryId}/duplicate`, "POST", { duplicateOf: null, note })} className="font-semibold text-tide-700 underline">Remove the mark</button>
          </p>
        ) : null}
        {candidates === null ? (
          <p className="text-sm text-abyss-500">Looking for entries with the same coefficients…</p>
        ) : candidates.length === 0 ? (
          <p className="text-sm text-abyss-500">No other entry has the same normalised family or the same coefficients.</p>
        ) : (
          <ul className="space-y-1 text-sm" aria-label="Possible duplicates">
            {candidates.map((c) => (
              <li key={c.id} className="flex flex-wrap items-center gap-2">
                <a className="font-semibold text-tide-700 underline" href={`/registry/${c.id}`}>{c.slug}</a>
                <span className="text-abyss-500">{c.title} · {c.submitter} · {c.match} · {c.curationState}</span>
                <button type="button" disabled={busy || duplicateOf?.id === c.id} onClick={() => act(`Marked as a duplicate of ${c.slug}`, `/api/entries/${entryId}/duplicate`, "POST", { duplicateOf: c.id, note })} className={`${button} border border-rule bg-paper py-0.5`}>Mark this entry as its duplicate</button>
              </li>
            ))}
          </ul>
        )}
        <form className="flex flex-wrap items-end gap-2" onSubmit={(e) => { e.preventDefault(); void act("Marked as a duplicate", `/api/entries/${entryId}/duplicate`, "POST", { duplicateOf: original.trim(), note }); }}>
          <label className="text-sm font-semibold">
            Or give the original&apos;s entry id
            <input value={original} onChange={(e) => setOriginal(e.target.value)} placeholder="entry id (UUID)" className="mt-1 block w-80 max-w-full rounded-md border border-rule px-3 py-1.5 font-mono text-xs font-normal" />
          </label>
          <button type="submit" disabled={busy || !original.trim()} className={`${button} border border-rule bg-paper`}>Mark as duplicate</button>
        </form>
      </div>
    </section>
  );
}
