import Link from "next/link";
import { requirePageUser } from "@/lib/auth/page";
import { PageHeader } from "@/components/shell/page-header";
import { ROLE_LABELS } from "@/lib/auth/roles";
import { QueuePanel } from "@/components/queue/queue-panel";
import { StatCard } from "@/components/overview/stat-card";
import { StateBadge } from "@/components/batches/state-badge";
import { overviewFor } from "@/lib/overview";

export const metadata = { title: "Overview" };
export const dynamic = "force-dynamic";

export default async function OverviewPage() {
  const user = await requirePageUser();
  const data = await overviewFor(user);
  return (
    <>
      <PageHeader title="Overview" lead={`Signed in as ${user.email} (${ROLE_LABELS[user.role]}).`} />
      <section aria-label="Registry at a glance" className="mb-6 grid grid-cols-2 gap-3 sm:grid-cols-5">
        <StatCard label="entries you can see" value={data.totals.entries} href="/registry" />
        <StatCard label="reducible" value={data.totals.reducible} href="/registry?reducibility=reducible" />
        <StatCard label="published" value={data.totals.published} href="/registry?published=true" />
        {data.review ? (
          <>
            <StatCard label="conflicts to review" value={data.review.conflicts} href="/review" tone="alert" />
            <StatCard label="candidates awaiting a decision" value={data.review.candidates} href="/review" />
          </>
        ) : null}
      </section>

      <div className="grid gap-6 lg:grid-cols-2">
        {data.myBatches ? (
          <section aria-labelledby="my-batches" className="rounded-lg border border-rule bg-panel p-4">
            <h2 id="my-batches" className="mb-2 font-bold">My latest batches</h2>
            {data.myBatches.length === 0 ? (
              <p className="text-sm text-abyss-500">None yet. <Link className="font-semibold text-tide-700 underline" href="/submit">Submit family files</Link>.</p>
            ) : (
              <ul className="divide-y divide-rule text-sm">
                {data.myBatches.map((b) => (
                  <li key={b.id} className="flex items-center justify-between gap-2 py-1.5">
                    <Link className="font-semibold text-tide-700 hover:underline" href={`/batches/${b.id}`}>{b.title}</Link>
                    <span className="flex shrink-0 items-center gap-2 text-xs text-abyss-500">{b.variants} variants <StateBadge state={b.state} /></span>
                  </li>
                ))}
              </ul>
            )}
          </section>
        ) : null}

        <section aria-labelledby="newly-accepted" className="rounded-lg border border-rule bg-panel p-4">
          <h2 id="newly-accepted" className="mb-2 font-bold">Newly accepted entries</h2>
          {data.accepted.length === 0 ? (
            <p className="text-sm text-abyss-500">No accepted entries yet.</p>
          ) : (
            <ul className="divide-y divide-rule text-sm">
              {data.accepted.map((e) => (
                <li key={e.id} className="flex items-center justify-between gap-2 py-1.5">
                  <Link className="font-semibold text-tide-700 hover:underline" href={`/registry/${e.id}`}>{e.title}</Link>
                  <span className="shrink-0 text-xs uppercase text-abyss-500">{e.class}</span>
                </li>
              ))}
            </ul>
          )}
        </section>
      </div>

      <div className="mt-6">
        <QueuePanel user={user} />
      </div>
    </>
  );
}
