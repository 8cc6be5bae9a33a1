import { pageAccess } from "@/lib/auth/page";
import { PageHeader, NotAllowed, NotBuiltYet } from "@/components/shell/page-header";

export const metadata = { title: "Submit" };

export default async function SubmitPage() {
  const access = await pageAccess("researcher");
  if (!access.allowed) return <NotAllowed needed={access.needed} />;
  return (
    <>
      <PageHeader title="Submit" />
      <NotBuiltYet what="Uploading family files" />
    </>
  );
}
