"use client";
import { useState } from "react";
import Link from "next/link";

export function SetPasswordForm({ token }: { token: string }) {
  const [state, setState] = useState<{ error?: string; done?: string }>({});
  async function onSubmit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const password = String(form.get("password"));
    if (password !== String(form.get("confirm"))) return setState({ error: "The two passwords differ." });
    const res = await fetch("/api/invites/accept", { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ token, password }) });
    const body = (await res.json()) as { error?: string; email?: string };
    setState(res.ok ? { done: body.email } : { error: body.error ?? "Could not set the password." });
  }
  if (state.done)
    return (
      <p role="status" className="text-sm">
        Password set for <strong>{state.done}</strong>. <Link className="font-semibold text-tide-700 underline" href="/signin">Sign in</Link>
      </p>
    );
  return (
    <form onSubmit={onSubmit} className="space-y-4">
      <label className="block text-sm font-semibold">
        New password (at least 10 characters)
        <input name="password" type="password" minLength={10} autoComplete="new-password" required className="mt-1 block w-full rounded-md border border-rule bg-white px-3 py-2 font-normal" />
      </label>
      <label className="block text-sm font-semibold">
        Repeat it
        <input name="confirm" type="password" minLength={10} autoComplete="new-password" required className="mt-1 block w-full rounded-md border border-rule bg-white px-3 py-2 font-normal" />
      </label>
      {state.error ? <p role="alert" className="rounded-md bg-coral-100 px-3 py-2 text-sm text-coral-700">{state.error}</p> : null}
      <button type="submit" className="w-full rounded-md bg-tide-600 px-4 py-2 font-semibold text-white hover:bg-tide-700">Set password</button>
    </form>
  );
}
