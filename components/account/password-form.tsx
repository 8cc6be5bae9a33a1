"use client";
import { useState } from "react";

export function PasswordForm() {
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  async function onSubmit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const el = event.currentTarget;
    const form = new FormData(el);
    const res = await fetch("/api/account/password", {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ currentPassword: form.get("current"), newPassword: form.get("next") }),
    });
    const body = (await res.json()) as { error?: string };
    setMessage(res.ok ? { ok: true, text: "Password changed." } : { ok: false, text: body.error ?? "Could not change the password." });
    if (res.ok) el.reset();
  }
  return (
    <form onSubmit={onSubmit} className="max-w-sm space-y-3">
      <label className="block text-sm font-semibold">
        Current password
        <input name="current" type="password" autoComplete="current-password" required className="mt-1 block w-full rounded-md border border-rule bg-white px-3 py-2 font-normal" />
      </label>
      <label className="block text-sm font-semibold">
        New password (at least 10 characters)
        <input name="next" type="password" minLength={10} autoComplete="new-password" required className="mt-1 block w-full rounded-md border border-rule bg-white px-3 py-2 font-normal" />
      </label>
      {message ? (
        <p role={message.ok ? "status" : "alert"} className={`rounded-md px-3 py-2 text-sm ${message.ok ? "bg-reed-100 text-reed-700" : "bg-coral-100 text-coral-700"}`}>{message.text}</p>
      ) : null}
      <button type="submit" className="rounded-md bg-tide-600 px-4 py-2 font-semibold text-white hover:bg-tide-700">Change password</button>
    </form>
  );
}
