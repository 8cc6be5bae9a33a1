import { pageAccess } from "@/lib/auth/page";
import { PageHeader, NotAllowed } from "@/components/shell/page-header";
import { AdminTabs } from "@/components/admin/admin-tabs";
import { UsersTable } from "@/components/admin/users-table";

export const metadata = { title: "Users" };

export default async function UsersPage() {
  const access = await pageAccess("admin");
  if (!access.allowed) return <NotAllowed needed={access.needed} />;
  return (
    <>
      <PageHeader title="Admin" lead="Invite people, set their roles, disable accounts." />
      <AdminTabs current="users" />
      <UsersTable selfId={access.user.id} />
    </>
  );
}
