"use client";
/** Mail preferences on My account: each switch saves at once through PATCH /api/account. */
import { useState } from "react";

interface Props {
  notifyBatchDone: boolean;
  notifyDigest: boolean;
  /** The digest goes to curators and admins only. */
  showDigest: boolean;
}

type Key = "notifyBatchDone" | "notifyDigest";

export function NotificationToggles(props: Props) {
  const [values, setValues] = useState({ notifyBatchDone: props.notifyBatchDone, notifyDigest: props.notifyDigest });
  const [saving, setSaving] = useState<Key | null>(null);
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);

  async function toggle(key: Key, value: boolean) {
    setSaving(key);
    setMessage(null);
    const res = await fetch("/api/account", { method: "PATCH", headers: { "content-type": "application/json" }, body: JSON.stringify({ [key]: value }) });
    const body = (await res.json()) as { user?: Record<Key, boolean>; error?: string };
    setSaving(null);
    if (res.ok && body.user) {
      setValues({ notifyBatchDone: body.user.notifyBatchDone, notifyDigest: body.user.notifyDigest });
      setMessage({ ok: true, text: "Saved." });
    } else setMessage({ ok: false, text: body.error ?? "Could not save the setting." });
  }

  const rows: { key: Key; label: string; hint: string }[] = [
    { key: "notifyBatchDone", label: "Mail me when a batch of mine has been screened", hint: "With the counts of reducible, not reducible and undecided variants and a link to the batch." },
  ];
  if (props.showDigest) rows.push({ key: "notifyDigest", label: "Daily curator digest", hint: "New candidates and verdicts changed by the nightly re-screen, once a day." });

  return (
    <fieldset className="mb-8 max-w-xl space-y-3 rounded-lg border border-rule bg-panel p-4" data-testid="notification-toggles">
      <legend className="px-1 text-sm font-semibold">E-mail</legend>
      {rows.map((r) => (
        <label key={r.key} className="flex items-start gap-3 text-sm">
          <input
            type="checkbox"
            className="mt-0.5 h-4 w-4 accent-tide-600"
            checked={values[r.key]}
            disabled={saving !== null}
            onChange={(e) => void toggle(r.key, e.currentTarget.checked)}
            name={r.key}
          />
          <span>
            <span className="font-semibold">{r.label}</span>
            <span className="block text-abyss-500">{r.hint}</span>
          </span>
        </label>
      ))}
      {message ? <p role={message.ok ? "status" : "alert"} className={`text-sm ${message.ok ? "text-reed-700" : "text-coral-700"}`}>{message.text}</p> : null}
    </fieldset>
  );
}
