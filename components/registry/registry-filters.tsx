"use client";
import { useEffect, useId, useRef, useState } from "react";
import {
  AGREEMENT_VALUES, CURATION_VALUES, EQUATION_CLASSES, PAINLEVE_VALUES, REDUCIBILITY_VALUES,
  type RegistryFilters,
} from "@/lib/registry/filters";
import { verdictLabel } from "./verdict-badge";

const CLASS_LABEL: Record<string, string> = { nls: "vc-NLS", kdv: "vc-KdV", mkdv: "vc-mKdV" };

type ListKey = "class" | "reducibility" | "painleve" | "agreement" | "state";

const inputClass = "mt-1 block w-full rounded-md border border-rule bg-white px-2 py-1.5 text-sm font-normal";

function ListSelect({ label, name, values, current, onChange, format = verdictLabel }: {
  label: string; name: ListKey; values: readonly string[]; current?: string[]; onChange: (name: ListKey, v: string[] | undefined) => void; format?: (v: string) => string;
}) {
  const joined = current?.join(",") ?? "";
  return (
    <label className="text-xs font-semibold text-abyss-700">
      {label}
      <select name={name} value={joined} onChange={(e) => onChange(name, e.target.value ? e.target.value.split(",") : undefined)} className={inputClass}>
        <option value="">any</option>
        {current && current.length > 1 ? <option value={joined}>{current.map(format).join(" or ")}</option> : null}
        {values.map((v) => <option key={v} value={v}>{format(v)}</option>)}
      </select>
    </label>
  );
}

/** A text field that reports its value after the user pauses typing (and at once on Enter or blur). */
function DebouncedText({ label, value, onCommit, placeholder, type = "text", hint }: {
  label: string; value: string; onCommit: (v: string) => void; placeholder?: string; type?: string; hint?: string;
}) {
  const [draft, setDraft] = useState(value);
  const committed = useRef(value);
  const hintId = useId();
  useEffect(() => {
    committed.current = value;
    setDraft(value);
  }, [value]);
  const commit = (v: string) => {
    if (v === committed.current) return;
    committed.current = v;
    onCommit(v);
  };
  useEffect(() => {
    if (draft === committed.current) return;
    const timer = setTimeout(() => {
      if (draft === committed.current) return;
      committed.current = draft;
      onCommit(draft);
    }, 400);
    return () => clearTimeout(timer);
  }, [draft, onCommit]);
  return (
    <label className="text-xs font-semibold text-abyss-700">
      {label}
      <input
        type={type} value={draft} placeholder={placeholder} aria-describedby={hint ? hintId : undefined}
        onChange={(e) => setDraft(e.target.value)} onBlur={() => commit(draft)}
        onKeyDown={(e) => { if (e.key === "Enter") { e.preventDefault(); commit(draft); } }}
        className={inputClass}
      />
      {hint ? <span id={hintId} className="mt-0.5 block font-normal text-abyss-500">{hint}</span> : null}
    </label>
  );
}

export function RegistryFilterForm({ filters, onChange, canFilterPublished }: {
  filters: RegistryFilters;
  onChange: (next: RegistryFilters) => void;
  canFilterPublished: boolean;
}) {
  const set = <K extends keyof RegistryFilters>(key: K, value: RegistryFilters[K] | undefined) => {
    const next = { ...filters };
    if (value === undefined || value === "" || (Array.isArray(value) && value.length === 0)) delete next[key];
    else next[key] = value;
    onChange(next);
  };
  const setList = (name: ListKey, v: string[] | undefined) => set(name, v);
  const date = (key: "createdFrom" | "createdTo" | "screenedFrom" | "screenedTo", label: string) => (
    <label className="text-xs font-semibold text-abyss-700">
      {label}
      <input type="date" value={filters[key] ?? ""} onChange={(e) => set(key, e.target.value || undefined)} className={inputClass} />
    </label>
  );
  const more = Boolean(filters.submitter || filters.batch || filters.engine || filters.createdFrom || filters.createdTo || filters.screenedFrom || filters.screenedTo || filters.published !== undefined);
  return (
    <form role="search" aria-label="Filter the registry" onSubmit={(e) => e.preventDefault()} className="space-y-3 rounded-lg border border-rule bg-panel p-3">
      <div className="grid grid-cols-2 items-end gap-3 md:grid-cols-4 lg:grid-cols-7">
        <div className="col-span-2 md:col-span-4 lg:col-span-2">
          <DebouncedText label="Search title and notes" value={filters.q ?? ""} onCommit={(v) => set("q", v.trim() || undefined)} placeholder="e.g. amplifier" />
        </div>
        <ListSelect label="Class" name="class" values={EQUATION_CLASSES} current={filters.class} onChange={setList} format={(v) => CLASS_LABEL[v] ?? v} />
        <ListSelect label="Reducibility" name="reducibility" values={REDUCIBILITY_VALUES} current={filters.reducibility} onChange={setList} />
        <ListSelect label="Painlevé test" name="painleve" values={PAINLEVE_VALUES} current={filters.painleve} onChange={setList} />
        <ListSelect label="Agreement" name="agreement" values={AGREEMENT_VALUES} current={filters.agreement} onChange={setList} />
        <ListSelect label="Curation" name="state" values={CURATION_VALUES} current={filters.state} onChange={setList} />
      </div>
      <div className="grid grid-cols-1 gap-3 md:grid-cols-3">
        <DebouncedText label="Tags (all of)" value={filters.tags?.join(", ") ?? ""} onCommit={(v) => set("tags", v.split(",").map((t) => t.trim().toLowerCase().replace(/\s+/g, "-")).filter(Boolean))} placeholder="e.g. fibre-amplifier, gain" hint="Separate tags with commas." />
      </div>
      <details open={more} className="group">
        <summary className="cursor-pointer text-sm font-semibold text-tide-700">More filters: submitter, batch, engine, dates</summary>
        <div className="mt-3 grid grid-cols-2 gap-3 md:grid-cols-4">
          <DebouncedText label="Submitter e-mail" type="email" value={filters.submitter ?? ""} onCommit={(v) => set("submitter", v.trim().toLowerCase() || undefined)} />
          <DebouncedText label="Batch id" value={filters.batch ?? ""} onCommit={(v) => set("batch", v.trim() || undefined)} />
          <DebouncedText label="Engine version" value={filters.engine ?? ""} onCommit={(v) => set("engine", v.trim() || undefined)} placeholder="e.g. 0.1.0" />
          {canFilterPublished ? (
            <label className="text-xs font-semibold text-abyss-700">
              Published
              <select value={filters.published === undefined ? "" : filters.published ? "yes" : "no"} onChange={(e) => set("published", e.target.value === "" ? undefined : e.target.value === "yes")} className={inputClass}>
                <option value="">either</option><option value="yes">published</option><option value="no">not published</option>
              </select>
            </label>
          ) : <span />}
          {date("createdFrom", "Submitted from")}
          {date("createdTo", "Submitted until")}
          {date("screenedFrom", "Screened from")}
          {date("screenedTo", "Screened until")}
        </div>
      </details>
    </form>
  );
}
