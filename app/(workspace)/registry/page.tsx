import { pageAccess } from "@/lib/auth/page";
import { PageHeader, NotAllowed, NotBuiltYet } from "@/components/shell/page-header";

export const metadata = { title: "Registry" };

export default async function RegistryPage() {
  const access = await pageAccess("viewer");
  if (!access.allowed) return <NotAllowed needed={access.needed} />;
  return (
    <>
      <PageHeader title="Registry" />
      <NotBuiltYet what="The registry of screened families" />
    </>
  );
}
