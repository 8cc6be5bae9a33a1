"use client";
import { useCallback, useEffect, useState } from "react";

interface TokenRow {
  id: string;
  name: string;
  prefix: string;
  createdAt: string;
  lastUsedAt: string | null;
  revokedAt: string | null;
}

const day = (iso: string | null) => (iso ? iso.replace("T", " ").slice(0, 16) : "—");

/** Personal API tokens for scripts: shown once when created, stored only as a hash. */
export function ApiTokens() {
  const [tokens, setTokens] = useState<TokenRow[] | null>(null);
  const [created, setCreated] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const load = useCallback(async () => {
    const res = await fetch("/api/tokens");
    if (res.ok) setTokens(((await res.json()) as { tokens: TokenRow[] }).tokens);
  }, []);
  useEffect(() => {
    void load();
  }, [load]);

  async function create(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const el = event.currentTarget;
    const res = await fetch("/api/tokens", { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ name: new FormData(el).get("name") }) });
    const body = (await res.json()) as { token?: { secret: string }; error?: string };
    if (res.ok && body.token) {
      setCreated(body.token.secret);
      setError(null);
      el.reset();
    } else setError(body.error ?? "Could not create the token.");
    await load();
  }

  async function revoke(id: string) {
    await fetch(`/api/tokens/${id}`, { method: "DELETE" });
    await load();
  }

  return (
    <div className="space-y-3">
      <form onSubmit={create} className="flex flex-wrap items-end gap-2" aria-label="Create an API token">
        <label className="text-sm font-semibold">
          Token name
          <input name="name" required maxLength={80} placeholder="e.g. sweep script on the lab cluster" className="mt-1 block w-72 max-w-full rounded-md border border-rule bg-white px-3 py-2 font-normal" />
        </label>
        <button type="submit" className="rounded-md bg-tide-600 px-4 py-2 font-semibold text-white hover:bg-tide-700">Create token</button>
      </form>
      {created ? (
        <p role="status" className="rounded-md bg-reed-100 px-3 py-2 text-sm text-reed-700">
          Copy it now — it is shown only once: <code className="break-all font-mono" data-testid="new-token">{created}</code>
        </p>
      ) : null}
      {error ? <p role="alert" className="rounded-md bg-coral-100 px-3 py-2 text-sm text-coral-700">{error}</p> : null}
      {tokens && tokens.length > 0 ? (
        <div className="overflow-x-auto rounded-lg border border-rule bg-panel">
          <table className="w-full text-left text-sm">
            <thead className="border-b border-rule bg-paper text-abyss-500"><tr><th className="px-3 py-2">Name</th><th className="px-3 py-2">Starts with</th><th className="px-3 py-2">Created (UTC)</th><th className="px-3 py-2">Last used</th><th className="px-3 py-2"><span className="sr-only">Actions</span></th></tr></thead>
            <tbody>
              {tokens.map((t) => (
                <tr key={t.id} className="border-b border-rule last:border-0">
                  <td className="px-3 py-2">{t.name}</td>
                  <td className="px-3 py-2 font-mono text-xs">{t.prefix}…</td>
                  <td className="px-3 py-2 font-mono text-xs">{day(t.createdAt)}</td>
                  <td className="px-3 py-2 font-mono text-xs">{day(t.lastUsedAt)}</td>
                  <td className="px-3 py-2 text-right">
                    {t.revokedAt ? <span className="text-abyss-500">revoked</span> : <button type="button" onClick={() => revoke(t.id)} className="text-coral-700 underline">Revoke</button>}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ) : tokens ? <p className="text-sm text-abyss-500">No tokens yet.</p> : null}
    </div>
  );
}
