import { pageAccess } from "@/lib/auth/page";
import { PageHeader, NotAllowed, NotBuiltYet } from "@/components/shell/page-header";

export const metadata = { title: "Batches" };

export default async function BatchesPage() {
  const access = await pageAccess("researcher");
  if (!access.allowed) return <NotAllowed needed={access.needed} />;
  return (
    <>
      <PageHeader title="Batches" />
      <NotBuiltYet what="The list of batches" />
    </>
  );
}
