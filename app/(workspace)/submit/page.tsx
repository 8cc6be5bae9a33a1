import { pageAccess } from "@/lib/auth/page";
import { PageHeader, NotAllowed } from "@/components/shell/page-header";
import { UploadForm } from "@/components/submit/upload-form";
import { MAX_FILES_PER_UPLOAD, MAX_UPLOAD_FILE_BYTES } from "@/lib/batches/limits";

export const metadata = { title: "Submit" };

export default async function SubmitPage() {
  const access = await pageAccess("researcher");
  if (!access.allowed) return <NotAllowed needed={access.needed} />;
  return (
    <>
      <PageHeader
        title="Submit families"
        lead="Upload YAML files of model families. Each file is checked as soon as you add it; valid families are stored even when another family in the same file has errors, and a family you uploaded before is linked, not copied."
      />
      <UploadForm maxFileBytes={MAX_UPLOAD_FILE_BYTES} maxFiles={MAX_FILES_PER_UPLOAD} />
    </>
  );
}
