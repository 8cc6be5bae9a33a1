"use client";
import { useState } from "react";
import { signIn } from "next-auth/react";
import { useRouter } from "next/navigation";

const MESSAGES: Record<string, string> = {
  CredentialsSignin: "E-mail or password is wrong.",
  locked: "Too many wrong passwords: this account is locked for 15 minutes.",
  disabled: "This account is disabled. Ask an admin.",
};

export function SignInForm() {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function onSubmit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    setBusy(true);
    setError(null);
    const result = await signIn("credentials", { email: String(form.get("email")), password: String(form.get("password")), redirect: false });
    setBusy(false);
    if (result?.ok && !result.error) {
      router.replace("/overview");
      router.refresh();
    } else if (result?.status === 429) {
      setError("Too many sign-in attempts from here; wait a minute.");
    } else {
      setError(MESSAGES[result?.error ?? ""] ?? "Sign-in failed.");
    }
  }

  return (
    <form onSubmit={onSubmit} className="space-y-4" aria-describedby={error ? "signin-error" : undefined}>
      <label className="block text-sm font-semibold">
        E-mail
        <input name="email" type="email" autoComplete="username" required className="mt-1 block w-full rounded-md border border-rule bg-white px-3 py-2 font-normal" />
      </label>
      <label className="block text-sm font-semibold">
        Password
        <input name="password" type="password" autoComplete="current-password" required className="mt-1 block w-full rounded-md border border-rule bg-white px-3 py-2 font-normal" />
      </label>
      {error ? (
        <p id="signin-error" role="alert" className="rounded-md bg-coral-100 px-3 py-2 text-sm text-coral-700">
          {error}
        </p>
      ) : null}
      <button type="submit" disabled={busy} className="w-full rounded-md bg-tide-600 px-4 py-2 font-semibold text-white hover:bg-tide-700 disabled:opacity-60">
        {busy ? "Signing in…" : "Sign in"}
      </button>
    </form>
  );
}
