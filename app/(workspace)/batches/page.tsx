import Link from "next/link";
import { pageAccess } from "@/lib/auth/page";
import { PageHeader, NotAllowed } from "@/components/shell/page-header";
import { StateBadge } from "@/components/batches/state-badge";
import { listBatches } from "@/lib/batches";
import { hasRole } from "@/lib/auth/roles";

export const metadata = { title: "Batches" };
export const dynamic = "force-dynamic";

export default async function BatchesPage() {
  const access = await pageAccess("researcher");
  if (!access.allowed) return <NotAllowed needed={access.needed} />;
  const batches = await listBatches(access.user);
  const everyone = hasRole(access.user.role, "curator");
  return (
    <>
      <PageHeader title="Batches" lead={everyone ? "Every group member's uploads, newest first." : "Your uploads, newest first."} />
      {batches.length === 0 ? (
        <p className="rounded-lg border border-dashed border-rule bg-panel p-6 text-abyss-500">
          No batches yet. <Link className="font-semibold text-tide-700 underline" href="/submit">Submit family files</Link> to start one.
        </p>
      ) : (
        <div className="overflow-x-auto rounded-lg border border-rule bg-panel">
          <table className="w-full text-left text-sm" data-testid="batches-table">
            <thead className="border-b border-rule bg-paper text-abyss-500">
              <tr><th className="px-3 py-2">Batch</th>{everyone ? <th className="px-3 py-2">Owner</th> : null}<th className="px-3 py-2">State</th><th className="px-3 py-2">Families</th><th className="px-3 py-2">Variants</th><th className="px-3 py-2">Errors</th><th className="px-3 py-2">Submitted (UTC)</th></tr>
            </thead>
            <tbody>
              {batches.map((b) => (
                <tr key={b.id} className="border-b border-rule last:border-0">
                  <td className="px-3 py-2"><Link className="font-semibold text-tide-700 hover:underline" href={`/batches/${b.id}`}>{b.title}</Link></td>
                  {everyone ? <td className="px-3 py-2 font-mono text-xs">{b.owner}</td> : null}
                  <td className="px-3 py-2"><StateBadge state={b.state} /></td>
                  <td className="px-3 py-2">{b.families}</td>
                  <td className="px-3 py-2">{b.variants}</td>
                  <td className="px-3 py-2">{b.errors}</td>
                  <td className="px-3 py-2 font-mono text-xs">{b.createdAt.replace("T", " ").slice(0, 16)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </>
  );
}
