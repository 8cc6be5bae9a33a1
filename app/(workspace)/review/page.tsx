import { pageAccess } from "@/lib/auth/page";
import { PageHeader, NotAllowed } from "@/components/shell/page-header";
import { ReviewQueueSection } from "@/components/review/review-queue";
import { VerdictChanges } from "@/components/review/verdict-changes";

export const metadata = { title: "Review" };
export const dynamic = "force-dynamic";

export default async function ReviewPage() {
  const access = await pageAccess("curator");
  if (!access.allowed) return <NotAllowed needed={access.needed} />;
  return (
    <>
      <PageHeader title="Review" lead="Conflicts between the two judges first, then screened candidates; each decision is recorded in the entry's history." />
      <ReviewQueueSection />
      <div className="mt-8">
        <VerdictChanges />
      </div>
    </>
  );
}
