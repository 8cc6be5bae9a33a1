import { pageAccess } from "@/lib/auth/page";
import { PageHeader, NotAllowed, NotBuiltYet } from "@/components/shell/page-header";

export const metadata = { title: "Review" };

export default async function ReviewPage() {
  const access = await pageAccess("curator");
  if (!access.allowed) return <NotAllowed needed={access.needed} />;
  return (
    <>
      <PageHeader title="Review" />
      <NotBuiltYet what="The curators' review queue" />
    </>
  );
}
