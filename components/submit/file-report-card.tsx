import { whereText, type FileReport } from "./types";

export function FileReportCard({ report }: { report: FileReport }) {
  const variants = report.families.reduce((n, f) => n + f.variants, 0);
  return (
    <section className="rounded-lg border border-rule bg-panel" aria-label={`Validation of ${report.file}`} data-testid="file-report">
      <header className="flex flex-wrap items-baseline justify-between gap-2 border-b border-rule px-4 py-2">
        <h3 className="font-mono text-sm font-semibold">{report.file}</h3>
        <p className="text-sm text-abyss-500">
          {report.families.length} valid {report.families.length === 1 ? "family" : "families"} · {variants} variants ·{" "}
          <span className={report.errors.length ? "font-semibold text-coral-700" : ""}>{report.errors.length} {report.errors.length === 1 ? "error" : "errors"}</span>
        </p>
      </header>
      {report.families.length > 0 ? (
        <div className="overflow-x-auto">
          <table className="w-full text-left text-sm">
            <thead className="text-abyss-500"><tr><th className="px-4 py-1.5">id</th><th className="px-4 py-1.5">title</th><th className="px-4 py-1.5">class</th><th className="px-4 py-1.5">variants</th><th className="px-4 py-1.5">free</th></tr></thead>
            <tbody>
              {report.families.map((f) => (
                <tr key={f.id} className="border-t border-rule">
                  <td className="px-4 py-1.5 font-mono text-xs">{f.id}</td>
                  <td className="px-4 py-1.5">{f.title}</td>
                  <td className="px-4 py-1.5 uppercase">{f.class}</td>
                  <td className="px-4 py-1.5">{f.variants}</td>
                  <td className="px-4 py-1.5 font-mono text-xs">{f.free.join(", ") || "—"}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ) : null}
      {report.errors.length > 0 ? (
        <ul className="space-y-1 border-t border-rule bg-coral-100/40 px-4 py-2 text-sm" aria-label="Errors">
          {report.errors.map((e, i) => (
            <li key={i} data-testid="located-error">
              <span className="font-semibold text-coral-700">{e.message}</span>
              <span className="block font-mono text-xs text-abyss-500">{whereText(e)}</span>
            </li>
          ))}
        </ul>
      ) : null}
    </section>
  );
}
