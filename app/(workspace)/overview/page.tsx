import { requirePageUser } from "@/lib/auth/page";
import { PageHeader, NotBuiltYet } from "@/components/shell/page-header";
import { ROLE_LABELS } from "@/lib/auth/roles";
import { QueuePanel } from "@/components/queue/queue-panel";

export const metadata = { title: "Overview" };

export default async function OverviewPage() {
  const user = await requirePageUser();
  return (
    <>
      <PageHeader title="Overview" lead={`Signed in as ${user.email} (${ROLE_LABELS[user.role]}).`} />
      <QueuePanel user={user} />
      <NotBuiltYet what="The dashboard of batches and new entries" />
    </>
  );
}
