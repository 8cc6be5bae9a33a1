"use client";
import { useCallback, useEffect, useState } from "react";
import { ROLES, ROLE_LABELS, type Role } from "@/lib/auth/roles";

interface UserRow {
  id: string;
  email: string;
  name: string;
  role: Role;
  disabled: boolean;
  invited: boolean;
}

export function UsersTable({ selfId }: { selfId: string }) {
  const [users, setUsers] = useState<UserRow[] | null>(null);
  const [notice, setNotice] = useState<{ ok: boolean; text: string } | null>(null);

  const load = useCallback(async () => {
    const res = await fetch("/api/users");
    if (res.ok) setUsers(((await res.json()) as { users: UserRow[] }).users);
  }, []);
  useEffect(() => {
    void load();
  }, [load]);

  async function patch(id: string, change: Partial<Pick<UserRow, "role" | "disabled">>) {
    const res = await fetch(`/api/users/${id}`, { method: "PATCH", headers: { "content-type": "application/json" }, body: JSON.stringify(change) });
    const body = (await res.json()) as { error?: string };
    setNotice(res.ok ? { ok: true, text: "Saved." } : { ok: false, text: body.error ?? "Could not save." });
    await load();
  }

  async function invite(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const el = event.currentTarget;
    const form = new FormData(el);
    const res = await fetch("/api/users", {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ email: form.get("email"), name: form.get("name"), role: form.get("role") }),
    });
    const body = (await res.json()) as { error?: string; mailed?: boolean };
    if (res.ok) {
      el.reset();
      setNotice({ ok: true, text: body.mailed ? "Invitation sent; see the outbox." : "User created, but the mail could not be sent." });
    } else setNotice({ ok: false, text: body.error ?? "Could not invite." });
    await load();
  }

  return (
    <div className="space-y-6">
      <form onSubmit={invite} className="grid gap-3 rounded-lg border border-rule bg-panel p-4 sm:grid-cols-[1fr_1fr_10rem_auto] sm:items-end" aria-label="Invite a user">
        <label className="text-sm font-semibold">E-mail<input name="email" type="email" required className="mt-1 block w-full rounded-md border border-rule px-3 py-2 font-normal" /></label>
        <label className="text-sm font-semibold">Name<input name="name" required maxLength={120} className="mt-1 block w-full rounded-md border border-rule px-3 py-2 font-normal" /></label>
        <label className="text-sm font-semibold">Role
          <select name="role" defaultValue="researcher" className="mt-1 block w-full rounded-md border border-rule bg-white px-3 py-2 font-normal">
            {ROLES.map((r) => <option key={r} value={r}>{ROLE_LABELS[r]}</option>)}
          </select>
        </label>
        <button type="submit" className="rounded-md bg-tide-600 px-4 py-2 font-semibold text-white hover:bg-tide-700">Invite</button>
      </form>
      {notice ? <p role={notice.ok ? "status" : "alert"} className={`rounded-md px-3 py-2 text-sm ${notice.ok ? "bg-reed-100 text-reed-700" : "bg-coral-100 text-coral-700"}`}>{notice.text}</p> : null}
      {users === null ? (
        <p className="text-abyss-500">Loading users…</p>
      ) : (
        <div className="overflow-x-auto rounded-lg border border-rule bg-panel">
          <table className="w-full text-left text-sm">
            <thead className="border-b border-rule bg-paper text-abyss-500">
              <tr><th className="px-3 py-2">Name</th><th className="px-3 py-2">E-mail</th><th className="px-3 py-2">Role</th><th className="px-3 py-2">State</th></tr>
            </thead>
            <tbody>
              {users.map((u) => (
                <tr key={u.id} className="border-b border-rule last:border-0">
                  <td className="px-3 py-2">{u.name}</td>
                  <td className="px-3 py-2 font-mono text-xs">{u.email}</td>
                  <td className="px-3 py-2">
                    <select aria-label={`Role of ${u.email}`} value={u.role} disabled={u.id === selfId} onChange={(e) => patch(u.id, { role: e.target.value as Role })} className="rounded border border-rule bg-white px-2 py-1">
                      {ROLES.map((r) => <option key={r} value={r}>{ROLE_LABELS[r]}</option>)}
                    </select>
                  </td>
                  <td className="px-3 py-2">
                    {u.invited ? <span className="mr-2 rounded bg-ember-100 px-1.5 py-0.5 text-xs text-ember-700">invited</span> : null}
                    <label className="inline-flex items-center gap-1">
                      <input type="checkbox" checked={u.disabled} disabled={u.id === selfId} onChange={(e) => patch(u.id, { disabled: e.target.checked })} /> disabled
                    </label>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </div>
  );
}
