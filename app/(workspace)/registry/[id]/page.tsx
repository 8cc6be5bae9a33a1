import Link from "next/link";
import { notFound } from "next/navigation";
import { pageAccess } from "@/lib/auth/page";
import { hasRole } from "@/lib/auth/roles";
import { NotAllowed } from "@/components/shell/page-header";
import { getEntryDetail } from "@/lib/registry/entry";
import { hardwareConcern } from "@/lib/registry/safety";
import type { EquationClass } from "@/lib/screening/spec";
import { VerdictBadge } from "@/components/registry/verdict-badge";
import { SafetyCaution } from "@/components/entry/safety-caution";
import { EquationSection } from "@/components/entry/equation-section";
import { VariantsList } from "@/components/entry/variants-list";
import { ReducibilityEvidence } from "@/components/entry/reducibility-evidence";
import { PainleveEvidenceView } from "@/components/entry/painleve-evidence";
import { TransformationSection } from "@/components/entry/transformation-section";
import { SolutionExplorer } from "@/components/entry/solution-explorer";
import { VerificationSection } from "@/components/entry/verification-section";
import { History } from "@/components/entry/history";
import { CurationPanel } from "@/components/entry/curation-panel";
import { Section, NotComputed, Invalid, KeyValues } from "@/components/entry/section";
import { paramsText, utc } from "@/components/entry/format";

export const metadata = { title: "Registry entry" };
export const dynamic = "force-dynamic";

const CLASS_NAME: Record<string, string> = { nls: "vc-NLS", kdv: "vc-KdV", mkdv: "vc-mKdV" };

type Props = { params: Promise<{ id: string }>; searchParams: Promise<Record<string, string | string[] | undefined>> };

const one = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v);
const intParam = (v: string | undefined) => (v !== undefined && /^\d{1,6}$/.test(v) ? Number(v) : undefined);

export default async function EntryPage({ params, searchParams }: Props) {
  const access = await pageAccess("viewer");
  if (!access.allowed) return <NotAllowed needed={access.needed} />;
  const user = access.user;
  const sp = await searchParams;
  const detail = await getEntryDetail(user, (await params).id, { variant: intParam(one(sp.variant)), variantPage: intParam(one(sp.vpage)) });
  if (!detail) notFound();
  const { entry, family, selected } = detail;
  const cls = family.class as EquationClass;
  const curator = hasRole(user.role, "curator");
  const concern = hardwareConcern({ title: family.title, notes: family.notes, tags: family.tags });
  const report = selected?.report ?? null;
  const engine = report?.engine ?? "unknown";
  const variantQuery = selected ? `&variant=${selected.summary.index}` : "";
  const tr = report?.transformation;
  const sol = report?.solutions;
  const ver = report?.verification;

  return (
    <article className="space-y-8">
      <header className="space-y-3">
        <p className="text-sm"><Link href="/registry" className="text-tide-700 underline">Registry</Link> / <span className="font-mono text-xs">{entry.slug}</span></p>
        <h1 className="text-2xl font-bold tracking-tight">{entry.title}</h1>
        <div className="flex flex-wrap items-center gap-2 text-sm">
          <span className="rounded bg-paper px-1.5 py-0.5 font-semibold">{CLASS_NAME[cls] ?? cls}</span>
          <span>reducibility</span><VerdictBadge value={entry.reducibility} />
          <span>Painlevé</span><VerdictBadge value={entry.painleve} />
          <span>agreement</span><VerdictBadge value={entry.agreement} />
          <span>curation</span><VerdictBadge value={entry.curationState} />
          {entry.published ? <span className="font-semibold text-reed-700">published {entry.publishedAt?.slice(0, 10)}</span> : <span className="text-abyss-500">not published</span>}
        </div>
        {family.tags.length ? (
          <ul className="flex flex-wrap gap-1" aria-label="Tags">{family.tags.map((t) => <li key={t}><Link href={`/registry?tags=${encodeURIComponent(t)}`} className="rounded bg-paper px-1.5 py-0.5 font-mono text-xs text-abyss-700 hover:underline">{t}</Link></li>)}</ul>
        ) : null}
        <div className="flex flex-wrap items-center gap-2 text-sm">
          <span className="text-abyss-500">Export:</span>
          <a href={`/api/entries/${entry.id}/export?format=json`} download className="rounded-md border border-rule bg-panel px-2 py-1 font-semibold text-tide-700">JSON</a>
          <a href={`/api/entries/${entry.id}/export?format=yaml`} download className="rounded-md border border-rule bg-panel px-2 py-1 font-semibold text-tide-700">YAML source</a>
          <a href={`/api/entries/${entry.id}/export?format=latex${variantQuery}`} download className="rounded-md border border-rule bg-panel px-2 py-1 font-semibold text-tide-700">LaTeX</a>
          {curator ? <a href="#curation-heading" className="ml-auto font-semibold text-tide-700 underline">Curate</a> : null}
        </div>
        {concern ? <SafetyCaution concern={concern} /> : null}
        {entry.agreement === "conflict" ? (
          <p role="note" className="rounded-md bg-coral-100 px-3 py-2 text-sm text-coral-700">The two judges disagree on at least one member: the reducibility verdict and the Painlevé test should say the same for these classes. A curator has to resolve it.</p>
        ) : null}
        {detail.duplicateOf ? (
          <p className="rounded-md bg-ember-100 px-3 py-2 text-sm text-ember-700">Marked as a duplicate of <Link href={`/registry/${detail.duplicateOf.id}`} className="font-semibold underline">{detail.duplicateOf.title}</Link>.</p>
        ) : null}
        {family.notes ? <p className="max-w-3xl whitespace-pre-line text-abyss-700">{family.notes}</p> : null}
      </header>

      <Section id="equation" title="Equation">
        <EquationSection cls={cls} spec={family.spec} variant={selected?.variant ?? null} parameters={selected?.summary.parameters ?? {}} />
      </Section>

      {detail.variantsPage.total > 1 ? (
        <Section id="members" title={`Members (${detail.variantsPage.total})`}>
          <VariantsList entryId={entry.id} {...detail.variantsPage} selected={selected?.summary.index ?? null} />
        </Section>
      ) : null}

      <Section id="member" title={selected ? `Member ${selected.summary.index}: ${paramsText(selected.summary.parameters)}` : "Member"} aside={report ? <span className="text-xs text-abyss-500">engine {report.engine}; screened {utc(selected?.summary.finishedAt)}</span> : null}>
        {!report ? (
          <p className="rounded-md border border-dashed border-rule bg-panel px-3 py-2 text-sm text-abyss-500">This member has not been screened yet.</p>
        ) : (
          <div className="space-y-8">
            <div className="grid gap-6 lg:grid-cols-2">
              <div className="min-w-0 space-y-2">
                <h3 className="font-bold">Reducibility</h3>
                {report.reducibility.state === "present" ? <ReducibilityEvidence report={report.reducibility.value} /> : report.reducibility.state === "absent" ? <NotComputed what="Reducibility" engine={engine} /> : <Invalid what="Reducibility" problem={report.reducibility.problem} />}
              </div>
              <div className="min-w-0 space-y-2">
                <h3 className="font-bold">Painlevé test</h3>
                {report.painleve.state === "present" ? <PainleveEvidenceView {...report.painleve.value} /> : report.painleve.state === "absent" ? <NotComputed what="Painlevé test" engine={engine} /> : <Invalid what="Painlevé test" problem={report.painleve.problem} />}
                <h3 className="pt-2 font-bold">Agreement of the two judges</h3>
                {report.agreement.state === "present" ? <p className="text-sm"><VerdictBadge value={report.agreement.value} /></p> : <NotComputed what="Agreement" engine={engine} />}
              </div>
            </div>

            <div className="space-y-2">
              <h3 className="font-bold">Transformation to the canonical equation</h3>
              {!tr || tr.state === "absent" ? <NotComputed what="Transformation" engine={engine} /> : tr.state === "invalid" ? <Invalid what="Transformation" problem={tr.problem} /> : tr.value.ok ? <TransformationSection tr={tr.value} /> : <p className="text-sm text-abyss-700">No transformation: {tr.value.reason}</p>}
            </div>

            <div className="space-y-2">
              <h3 className="font-bold">Exact solutions</h3>
              {!sol || sol.state === "absent" ? <NotComputed what="Exact solutions" engine={engine} /> : sol.state === "invalid" ? <Invalid what="Exact solutions" problem={sol.problem} /> : !sol.value.ok ? <p className="text-sm text-abyss-700">No exact solutions: {sol.value.reason}</p> : tr?.state === "present" && tr.value.ok ? (
                <SolutionExplorer solutions={sol.value.solutions} table={tr.value.table} mapWindow={tr.value.mapWindow} notes={sol.value.notes} />
              ) : <p className="text-sm text-abyss-500">The solutions need the map table, which this report lacks.</p>}
            </div>

            <div className="space-y-2">
              <h3 className="font-bold">Numerical verification</h3>
              {!ver || ver.state === "absent" ? <NotComputed what="Verification" engine={engine} /> : ver.state === "invalid" ? <Invalid what="Verification" problem={ver.problem} /> : <VerificationSection v={ver.value} solutions={sol?.state === "present" && sol.value.ok ? sol.value.solutions : []} />}
            </div>
          </div>
        )}
      </Section>

      <Section id="provenance" title="Provenance">
        <KeyValues items={[
          ["submitter", entry.submitter],
          ["batch", detail.batch ? (hasRole(user.role, "researcher") ? <Link key="b" href={`/batches/${detail.batch.id}`} className="text-tide-700 underline">{detail.batch.title}</Link> : detail.batch.title) : "—"],
          ["file", family.fileName ? `${family.fileName}${family.documentIndex !== null ? `, document ${family.documentIndex + 1}` : ""}` : "—"],
          ["submitted", utc(family.createdAt)],
          ["screened", utc(entry.screenedAt)],
          ["published", utc(entry.publishedAt)],
          ["engine version", entry.engineVersion ?? "not screened"],
          ["members screened", `${entry.variants.screened} of ${entry.variants.total} (${entry.variants.reducible} reducible)`],
          ["family hash", <span key="h" className="font-mono text-xs">{entry.normalisedKey ?? "—"}</span>],
          ["entry id", <span key="i" className="font-mono text-xs">{entry.id}</span>],
        ]} />
        <details className="rounded-lg border border-rule bg-panel p-3" open={false}>
          <summary className="cursor-pointer text-sm font-semibold text-tide-700">Source YAML</summary>
          <pre className="mt-2 overflow-x-auto rounded bg-abyss-900 p-3 font-mono text-xs text-[#e6edf2]" data-testid="source-yaml">{family.sourceYaml}</pre>
        </details>
      </Section>

      <Section id="history" title="Curation history">
        <History items={detail.history} />
      </Section>

      {curator ? (
        <CurationPanel
          entryId={entry.id}
          curationState={entry.curationState}
          published={entry.published}
          agreement={entry.agreement}
          screened={entry.variants.screened > 0}
          tags={family.tags}
          duplicateOf={detail.duplicateOf ? { id: detail.duplicateOf.id, slug: detail.duplicateOf.slug } : null}
        />
      ) : null}
    </article>
  );
}
