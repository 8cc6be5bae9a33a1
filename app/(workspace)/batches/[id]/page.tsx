import { notFound } from "next/navigation";
import { pageAccess } from "@/lib/auth/page";
import { PageHeader, NotAllowed } from "@/components/shell/page-header";
import { StateBadge } from "@/components/batches/state-badge";
import { getBatch } from "@/lib/batches";
import { whereText, type LocatedError } from "@/components/submit/types";
import { BatchProgressPanel } from "@/components/batches/batch-progress";
import { batchProgress } from "@/lib/queue";

export const metadata = { title: "Batch" };
export const dynamic = "force-dynamic";

interface FileRecord {
  name: string;
  bytes: number;
  families: number;
  errors: LocatedError[];
}

export default async function BatchPage({ params }: { params: Promise<{ id: string }> }) {
  const access = await pageAccess("researcher");
  if (!access.allowed) return <NotAllowed needed={access.needed} />;
  const batch = await getBatch(access.user, (await params).id);
  if (!batch) notFound();
  const files = batch.files as FileRecord[];
  const progress = await batchProgress(access.user, batch.id);
  return (
    <>
      <PageHeader title={batch.title} lead={<>Submitted {batch.createdAt.replace("T", " ").slice(0, 16)} UTC by {batch.owner}{progress ? null : <> · <StateBadge state={batch.state} /></>}</>} />
      <section className="mb-6 grid grid-cols-3 gap-3 sm:max-w-lg">
        {[["families", batch.families], ["variants", batch.variants], ["errors in files", batch.errors]].map(([label, n]) => (
          <div key={label} className="rounded-lg border border-rule bg-panel p-3"><div className="text-2xl font-bold">{n}</div><div className="text-xs text-abyss-500">{label}</div></div>
        ))}
      </section>
      {progress ? <BatchProgressPanel initial={progress} /> : null}
      <h2 className="mb-2 text-lg font-bold">Families</h2>
      <div className="mb-6 overflow-x-auto rounded-lg border border-rule bg-panel">
        <table className="w-full text-left text-sm" data-testid="batch-families">
          <thead className="border-b border-rule bg-paper text-abyss-500"><tr><th className="px-3 py-2">id</th><th className="px-3 py-2">Title</th><th className="px-3 py-2">Class</th><th className="px-3 py-2">Variants</th><th className="px-3 py-2">File</th></tr></thead>
          <tbody>
            {batch.familyList.map((f) => (
              <tr key={f.id} className="border-b border-rule last:border-0">
                <td className="px-3 py-2 font-mono text-xs">{f.slug}{f.reused ? <span className="ml-2 rounded bg-paper px-1 text-abyss-500">known, linked</span> : null}</td>
                <td className="px-3 py-2">{f.title}</td>
                <td className="px-3 py-2 uppercase">{f.class}</td>
                <td className="px-3 py-2">{f.variants}</td>
                <td className="px-3 py-2 font-mono text-xs">{f.file}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {files.some((f) => f.errors.length) ? (
        <>
          <h2 className="mb-2 text-lg font-bold">Errors in the submitted files (not stored)</h2>
          <ul className="space-y-1 rounded-lg border border-rule bg-panel p-3 text-sm">
            {files.flatMap((f) => f.errors).map((e, i) => (
              <li key={i}><span className="font-semibold text-coral-700">{e.message}</span> <span className="block font-mono text-xs text-abyss-500">{whereText(e)}</span></li>
            ))}
          </ul>
        </>
      ) : null}
    </>
  );
}
