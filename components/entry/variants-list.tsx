/** The members of a swept family, a page at a time, each with its verdicts; one is shown in detail. */
import Link from "next/link";
import type { VariantSummary } from "@/lib/registry/entry";
import { VerdictBadge } from "@/components/registry/verdict-badge";
import { paramsText } from "./format";

export function VariantsList({ entryId, rows, page, pages, total, selected }: { entryId: string; rows: VariantSummary[]; page: number; pages: number; total: number; selected: number | null }) {
  return (
    <div className="space-y-2">
      <div className="relative max-h-72 overflow-auto rounded-lg border border-rule bg-panel">
        <table className="w-full text-left text-sm" aria-label="Members of the family">
          <thead className="sticky top-0 bg-paper text-abyss-500"><tr><th className="px-2 py-1">#</th><th className="px-2 py-1">parameters</th><th className="px-2 py-1">reducibility</th><th className="px-2 py-1">Painlevé</th><th className="px-2 py-1">agreement</th></tr></thead>
          <tbody>
            {rows.map((v) => (
              <tr key={v.id} className={`border-t border-rule ${v.index === selected ? "bg-tide-100" : ""}`} aria-current={v.index === selected ? "true" : undefined}>
                <td className="px-2 py-1"><Link href={`/registry/${entryId}?variant=${v.index}#member`} className="font-semibold text-tide-700 underline">{v.index}</Link></td>
                <td className="px-2 py-1 font-mono text-xs">{paramsText(v.parameters)}</td>
                <td className="px-2 py-1"><VerdictBadge value={v.reducibility} /></td>
                <td className="px-2 py-1"><VerdictBadge value={v.painleve} /></td>
                <td className="px-2 py-1"><VerdictBadge value={v.agreement} /></td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {pages > 1 ? (
        <nav aria-label="Member pages" className="flex items-center gap-3 text-sm">
          {page > 1 ? <Link href={`/registry/${entryId}?vpage=${page - 1}`} className="font-semibold text-tide-700 underline">Previous members</Link> : null}
          <span>page {page} of {pages} ({total} members)</span>
          {page < pages ? <Link href={`/registry/${entryId}?vpage=${page + 1}`} className="font-semibold text-tide-700 underline">Next members</Link> : null}
        </nav>
      ) : null}
    </div>
  );
}
