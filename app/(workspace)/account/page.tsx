import { requirePageUser } from "@/lib/auth/page";
import { PageHeader } from "@/components/shell/page-header";
import { PasswordForm } from "@/components/account/password-form";
import { ROLE_LABELS, hasRole } from "@/lib/auth/roles";
import { NotificationToggles } from "@/components/account/notification-toggles";
import { mailPreferences } from "@/lib/mail/preferences";
import { ApiTokens } from "@/components/account/api-tokens";

export const metadata = { title: "My account" };

export default async function AccountPage() {
  const user = await requirePageUser();
  const prefs = (await mailPreferences(user.id)) ?? { notifyBatchDone: true, notifyDigest: true };
  return (
    <>
      <PageHeader title="My account" />
      <section className="mb-8 rounded-lg border border-rule bg-panel p-4">
        <dl className="grid grid-cols-[8rem_1fr] gap-y-1 text-sm">
          <dt className="text-abyss-500">Name</dt><dd>{user.name}</dd>
          <dt className="text-abyss-500">E-mail</dt><dd>{user.email}</dd>
          <dt className="text-abyss-500">Role</dt><dd>{ROLE_LABELS[user.role]}</dd>
        </dl>
      </section>
      <h2 className="mb-3 text-lg font-bold">Notifications</h2>
      <NotificationToggles notifyBatchDone={prefs.notifyBatchDone} notifyDigest={prefs.notifyDigest} showDigest={hasRole(user.role, "curator")} />
      <h2 className="mb-3 text-lg font-bold">Password</h2>
      <PasswordForm />
      {hasRole(user.role, "researcher") ? (
        <section className="mt-8">
          <h2 className="mb-1 text-lg font-bold">API tokens</h2>
          <p className="mb-3 max-w-3xl text-sm text-abyss-500">
            For scripts: send <code className="font-mono">Authorization: Bearer ws_…</code> to <code className="font-mono">POST /api/batches</code>. A token acts as you; revoke it when a script no longer needs it.
          </p>
          <ApiTokens />
        </section>
      ) : null}
    </>
  );
}
