import { Suspense } from "react";
import { pageAccess } from "@/lib/auth/page";
import { hasRole } from "@/lib/auth/roles";
import { PageHeader, NotAllowed } from "@/components/shell/page-header";
import { RegistryTable } from "@/components/registry/registry-table";

export const metadata = { title: "Registry" };

export default async function RegistryPage() {
  const access = await pageAccess("viewer");
  if (!access.allowed) return <NotAllowed needed={access.needed} />;
  const role = access.user.role;
  const lead = hasRole(role, "curator")
    ? "Every screened family, published or not. Filters and sorting are kept in the address, so a link shows the same view."
    : hasRole(role, "researcher")
      ? "Published families, and your own that are not published yet. Filters and sorting are kept in the address, so a link shows the same view."
      : "Published families. Filters and sorting are kept in the address, so a link shows the same view.";
  return (
    <>
      <PageHeader title="Registry" lead={lead} />
      <Suspense fallback={<p className="text-abyss-500">Loading the registry…</p>}>
        <RegistryTable canFilterPublished={hasRole(role, "researcher")} />
      </Suspense>
    </>
  );
}
