import { requirePageUser } from "@/lib/auth/page";
import { PageHeader } from "@/components/shell/page-header";
import { PasswordForm } from "@/components/account/password-form";
import { ROLE_LABELS } from "@/lib/auth/roles";

export const metadata = { title: "My account" };

export default async function AccountPage() {
  const user = await requirePageUser();
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
      <h2 className="mb-3 text-lg font-bold">Password</h2>
      <PasswordForm />
    </>
  );
}
