"use client";
/**
 * The registry table: server-side sorting, filtering and paging (GET /api/registry); the query
 * lives in the URL so a link shows the same view; the chosen columns are remembered per browser.
 */
import Link from "next/link";
import { useCallback, useEffect, useMemo, useState } from "react";
import { usePathname, useRouter, useSearchParams } from "next/navigation";
import { flexRender, getCoreRowModel, useReactTable, type ColumnDef, type VisibilityState } from "@tanstack/react-table";
import {
  EXPORT_CAP, PAGE_SIZES, parseRegistryQuery, registryQueryToParams, SORT_KEYS,
  type RegistryFilters, type RegistryQuery, type SortKey,
} from "@/lib/registry/filters";
import type { RegistryRow } from "@/lib/registry/queries";
import { VerdictBadge } from "./verdict-badge";
import { RegistryFilterForm } from "./registry-filters";

const COLUMNS_KEY = "wavesieve.registry.columns.v1";

interface PageData {
  rows: RegistryRow[];
  total: number;
  page: number;
  size: number;
  pages: number;
}

const CLASS_LABEL: Record<string, string> = { nls: "vc-NLS", kdv: "vc-KdV", mkdv: "vc-mKdV" };
const day = (iso: string | null) => (iso ? iso.slice(0, 10) : "—");

const DEFAULT_HIDDEN: VisibilityState = { submitter: false, batch: false, engine: false, screened: false, published: false };

function columns(): ColumnDef<RegistryRow>[] {
  return [
    {
      id: "title", header: "Family", enableHiding: false,
      cell: ({ row: { original: r } }) => (
        <div className="min-w-48">
          <Link href={`/registry/${r.id}`} className="font-semibold text-tide-700 hover:underline">{r.title}</Link>
          <div className="font-mono text-xs text-abyss-500">{r.slug}{r.duplicateOfId ? " · duplicate" : ""}</div>
        </div>
      ),
    },
    { id: "class", header: "Class", cell: ({ row }) => <span className="whitespace-nowrap">{CLASS_LABEL[row.original.class] ?? row.original.class}</span> },
    {
      id: "reducibility", header: "Reducibility",
      cell: ({ row: { original: r } }) => (
        <div className="whitespace-nowrap"><VerdictBadge value={r.reducibility} />{r.variants.total > 1 ? <span className="ml-1 text-xs text-abyss-500">{r.variants.reducible}/{r.variants.total}</span> : null}</div>
      ),
    },
    { id: "painleve", header: "Painlevé", cell: ({ row }) => <VerdictBadge value={row.original.painleve} /> },
    { id: "agreement", header: "Agreement", cell: ({ row }) => <VerdictBadge value={row.original.agreement} /> },
    {
      id: "state", header: "Curation",
      cell: ({ row: { original: r } }) => (
        <div className="whitespace-nowrap"><VerdictBadge value={r.curationState} />{r.published ? <span className="ml-1 text-xs text-reed-700">published</span> : null}</div>
      ),
    },
    {
      id: "tags", header: "Tags", enableSorting: false,
      cell: ({ row }) => (
        <ul className="flex min-w-32 max-w-56 flex-wrap gap-1" aria-label="tags">
          {row.original.tags.map((t) => <li key={t} className="rounded bg-paper px-1.5 py-0.5 font-mono text-xs text-abyss-700">{t}</li>)}
        </ul>
      ),
    },
    { id: "submitter", header: "Submitter", cell: ({ row }) => <span className="font-mono text-xs">{row.original.submitter}</span> },
    { id: "batch", header: "Batch", enableSorting: false, cell: ({ row }) => <span className="font-mono text-xs">{row.original.batchId.slice(0, 8)}</span> },
    { id: "engine", header: "Engine", cell: ({ row }) => <span className="font-mono text-xs">{row.original.engineVersion ?? "—"}</span> },
    { id: "variants", header: "Variants", cell: ({ row: { original: r } }) => <span className="whitespace-nowrap text-xs">{r.variants.screened}/{r.variants.total} screened</span> },
    { id: "created", header: "Submitted", cell: ({ row }) => <span className="whitespace-nowrap font-mono text-xs">{day(row.original.createdAt)}</span> },
    { id: "screened", header: "Screened", cell: ({ row }) => <span className="whitespace-nowrap font-mono text-xs">{day(row.original.screenedAt)}</span> },
    { id: "published", header: "Published", cell: ({ row }) => <span className="whitespace-nowrap font-mono text-xs">{day(row.original.publishedAt)}</span> },
  ];
}

const isSortKey = (id: string): id is SortKey => (SORT_KEYS as readonly string[]).includes(id);

function readColumns(): VisibilityState {
  try {
    const raw = window.localStorage.getItem(COLUMNS_KEY);
    const v: unknown = raw ? JSON.parse(raw) : null;
    if (v && typeof v === "object") return { ...DEFAULT_HIDDEN, ...(v as VisibilityState) };
  } catch {
    // storage disabled or corrupt: fall back to the defaults
  }
  return DEFAULT_HIDDEN;
}

export function RegistryTable({ canFilterPublished }: { canFilterPublished: boolean }) {
  const router = useRouter();
  const pathname = usePathname();
  const searchParams = useSearchParams();
  const query = useMemo(() => parseRegistryQuery(searchParams), [searchParams]);
  const apiParams = registryQueryToParams(query).toString();
  const exportParams = registryQueryToParams(query, { paging: false }).toString();

  const [data, setData] = useState<PageData | null>(null);
  const [loading, setLoading] = useState(true);
  const [error, setError] = useState<string | null>(null);
  const [visibility, setVisibility] = useState<VisibilityState>(DEFAULT_HIDDEN);
  const [columnsLoaded, setColumnsLoaded] = useState(false);

  useEffect(() => {
    setVisibility(readColumns());
    setColumnsLoaded(true);
  }, []);
  useEffect(() => {
    if (columnsLoaded) window.localStorage.setItem(COLUMNS_KEY, JSON.stringify(visibility));
  }, [visibility, columnsLoaded]);

  useEffect(() => {
    const abort = new AbortController();
    setLoading(true);
    setError(null);
    fetch(`/api/registry${apiParams ? `?${apiParams}` : ""}`, { signal: abort.signal })
      .then(async (res) => {
        if (!res.ok) throw new Error(((await res.json().catch(() => ({}))) as { error?: string }).error ?? `error ${res.status}`);
        return (await res.json()) as PageData;
      })
      .then((body) => {
        setData(body);
        setLoading(false);
      })
      .catch((err: unknown) => {
        if (abort.signal.aborted) return;
        setError(err instanceof Error ? err.message : "could not load the registry");
        setLoading(false);
      });
    return () => abort.abort();
  }, [apiParams]);

  const navigate = useCallback(
    (next: RegistryQuery) => {
      const qs = registryQueryToParams(next).toString();
      router.replace(qs ? `${pathname}?${qs}` : pathname, { scroll: false });
    },
    [router, pathname],
  );
  const setFilters = useCallback((filters: RegistryFilters) => navigate({ ...query, filters, page: 1 }), [navigate, query]);

  const cols = useMemo(columns, []);
  const table = useReactTable({
    data: data?.rows ?? [],
    columns: cols,
    getCoreRowModel: getCoreRowModel(),
    manualSorting: true,
    manualPagination: true,
    manualFiltering: true,
    state: { columnVisibility: visibility, sorting: [{ id: query.sort, desc: query.dir === "desc" }] },
    onColumnVisibilityChange: setVisibility,
    getRowId: (r) => r.id,
  });

  function toggleSort(id: SortKey) {
    const dir = query.sort === id ? (query.dir === "asc" ? "desc" : "asc") : id === "created" || id === "screened" || id === "published" ? "desc" : "asc";
    navigate({ ...query, sort: id, dir, page: 1 });
  }

  const activeFilters = Object.keys(query.filters).length;
  const total = data?.total ?? 0;

  return (
    <div className="space-y-3">
      <RegistryFilterForm filters={query.filters} onChange={setFilters} canFilterPublished={canFilterPublished} />

      <div className="flex flex-wrap items-center gap-x-4 gap-y-2 text-sm">
        <p role="status" aria-live="polite" className="text-abyss-700" data-testid="registry-count">
          {loading && !data ? "Loading entries…" : `${total.toLocaleString("en")} ${total === 1 ? "entry" : "entries"}${activeFilters ? " match" : ""}`}
        </p>
        {activeFilters ? (
          <button type="button" onClick={() => setFilters({})} className="font-semibold text-tide-700 underline-offset-2 hover:underline">Clear filters</button>
        ) : null}
        <details className="relative">
          <summary className="cursor-pointer rounded-md border border-rule bg-panel px-2 py-1 font-semibold">Columns</summary>
          <fieldset className="absolute z-10 mt-1 w-52 space-y-1 rounded-md border border-rule bg-panel p-2 shadow">
            <legend className="sr-only">Shown columns</legend>
            {table.getAllLeafColumns().filter((c) => c.getCanHide()).map((c) => (
              <label key={c.id} className="flex items-center gap-2">
                <input type="checkbox" checked={c.getIsVisible()} onChange={c.getToggleVisibilityHandler()} /> {String(c.columnDef.header)}
              </label>
            ))}
          </fieldset>
        </details>
        <div className="ml-auto flex flex-wrap items-center gap-2">
          <span className="text-abyss-500">Export the {activeFilters ? "filtered" : "whole"} set:</span>
          <a href={`/api/registry/export?format=csv${exportParams ? `&${exportParams}` : ""}`} download className="rounded-md border border-rule bg-panel px-2 py-1 font-semibold text-tide-700 hover:bg-paper" data-testid="export-csv">CSV</a>
          <a href={`/api/registry/export?format=json${exportParams ? `&${exportParams}` : ""}`} download className="rounded-md border border-rule bg-panel px-2 py-1 font-semibold text-tide-700 hover:bg-paper">JSON</a>
        </div>
      </div>
      {total > EXPORT_CAP ? (
        <p className="rounded-md bg-ember-100 px-3 py-2 text-sm text-ember-700">Exports stop at the first {EXPORT_CAP.toLocaleString("en")} rows in the current order; narrow the filters to export the rest.</p>
      ) : null}
      {error ? <p role="alert" className="rounded-md bg-coral-100 px-3 py-2 text-sm text-coral-700">The registry could not be loaded: {error}</p> : null}

      <div className="relative overflow-x-auto rounded-lg border border-rule bg-panel" aria-busy={loading}>
        <table className={`w-full text-left text-sm ${loading && data ? "opacity-60" : ""}`} data-testid="registry-table">
          <caption className="sr-only">Registry entries{activeFilters ? ", filtered" : ""}, sorted by {query.sort} ({query.dir === "asc" ? "ascending" : "descending"})</caption>
          <thead className="border-b border-rule bg-paper text-abyss-500">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const id = header.column.id;
                  const sortable = header.column.columnDef.enableSorting !== false && isSortKey(id);
                  const active = query.sort === id;
                  return (
                    <th key={header.id} scope="col" className="px-3 py-2 font-semibold" aria-sort={sortable ? (active ? (query.dir === "asc" ? "ascending" : "descending") : "none") : undefined}>
                      {sortable ? (
                        <button type="button" onClick={() => toggleSort(id)} className="inline-flex items-center gap-1 whitespace-nowrap rounded hover:text-abyss-900">
                          {flexRender(header.column.columnDef.header, header.getContext())}
                          <span aria-hidden="true" className={active ? "text-tide-700" : "text-rule"}>{active ? (query.dir === "asc" ? "▲" : "▼") : "↕"}</span>
                          <span className="sr-only">{active ? `, sorted ${query.dir === "asc" ? "ascending" : "descending"}; activate to reverse` : ", activate to sort"}</span>
                        </button>
                      ) : (
                        flexRender(header.column.columnDef.header, header.getContext())
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {loading && !data ? (
              Array.from({ length: 5 }, (_, i) => (
                <tr key={i} className="border-b border-rule last:border-0">
                  <td colSpan={table.getVisibleLeafColumns().length} className="px-3 py-3"><div className="h-4 w-2/3 animate-pulse rounded bg-paper" /></td>
                </tr>
              ))
            ) : table.getRowModel().rows.length === 0 ? (
              <tr>
                <td colSpan={table.getVisibleLeafColumns().length} className="px-3 py-8 text-center text-abyss-500" data-testid="registry-empty">
                  {activeFilters ? "No entries match these filters." : "The registry has no entries you can see yet."}
                </td>
              </tr>
            ) : (
              table.getRowModel().rows.map((row) => (
                <tr key={row.id} className="border-b border-rule align-top last:border-0" data-testid="registry-row">
                  {row.getVisibleCells().map((cell) => <td key={cell.id} className="px-3 py-2">{flexRender(cell.column.columnDef.cell, cell.getContext())}</td>)}
                </tr>
              ))
            )}
          </tbody>
        </table>
      </div>

      <nav aria-label="Pages" className="flex flex-wrap items-center gap-3 text-sm">
        <button type="button" disabled={!data || query.page <= 1} onClick={() => navigate({ ...query, page: query.page - 1 })} className="rounded-md border border-rule bg-panel px-3 py-1 font-semibold disabled:opacity-40">Previous</button>
        <span>Page {data?.page ?? query.page} of {data?.pages ?? 1}</span>
        <button type="button" disabled={!data || (data?.page ?? 1) >= (data?.pages ?? 1)} onClick={() => navigate({ ...query, page: (data?.page ?? query.page) + 1 })} className="rounded-md border border-rule bg-panel px-3 py-1 font-semibold disabled:opacity-40">Next</button>
        <label className="ml-auto flex items-center gap-2">
          Rows per page
          <select value={query.size} onChange={(e) => navigate({ ...query, size: Number(e.target.value), page: 1 })} className="rounded border border-rule bg-white px-2 py-1">
            {PAGE_SIZES.map((n) => <option key={n} value={n}>{n}</option>)}
          </select>
        </label>
      </nav>
    </div>
  );
}
