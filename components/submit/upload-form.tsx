"use client";
import { useCallback, useState } from "react";
import { useDropzone } from "react-dropzone";
import Link from "next/link";
import { FileReportCard } from "./file-report-card";
import type { FileReport } from "./types";

interface Props {
  maxFileBytes: number;
  maxFiles: number;
}

type Stored = { id: string; families: number; reusedFamilies: number; variants: number; errors: number };

export function UploadForm({ maxFileBytes, maxFiles }: Props) {
  const [files, setFiles] = useState<File[]>([]);
  const [pasted, setPasted] = useState("");
  const [reports, setReports] = useState<FileReport[] | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [stored, setStored] = useState<Stored | null>(null);

  const buildForm = useCallback((list: File[], text: string, title?: string) => {
    const form = new FormData();
    for (const f of list) form.append("files", f, f.name);
    if (text.trim()) form.append("text", text);
    if (title) form.append("title", title);
    return form;
  }, []);

  const preview = useCallback(
    async (list: File[], text: string) => {
      setStored(null);
      setProblem(null);
      if (list.length === 0 && !text.trim()) return setReports(null);
      setBusy(true);
      const res = await fetch("/api/batches/validate", { method: "POST", body: buildForm(list, text) });
      const body = (await res.json()) as { files?: FileReport[]; error?: string };
      setBusy(false);
      if (res.ok) setReports(body.files ?? []);
      else {
        setReports(null);
        setProblem(body.error ?? `validation failed (${res.status})`);
      }
    },
    [buildForm],
  );

  const onDrop = useCallback(
    (accepted: File[]) => {
      const next = [...files, ...accepted].slice(0, maxFiles);
      setFiles(next);
      void preview(next, pasted);
    },
    [files, maxFiles, pasted, preview],
  );

  const { getRootProps, getInputProps, isDragActive, fileRejections } = useDropzone({
    onDrop,
    accept: { "application/yaml": [".yaml", ".yml"], "text/yaml": [".yaml", ".yml"] },
    maxSize: maxFileBytes,
    maxFiles,
  });

  async function submit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const title = String(new FormData(event.currentTarget).get("title") ?? "");
    setBusy(true);
    const res = await fetch("/api/batches", { method: "POST", body: buildForm(files, pasted, title) });
    const body = (await res.json()) as { batch?: Stored; files?: FileReport[]; error?: string };
    setBusy(false);
    if (body.files) setReports(body.files);
    if (res.ok && body.batch) {
      setStored(body.batch);
      setFiles([]);
      setPasted("");
    } else setProblem(body.error ?? `upload failed (${res.status})`);
  }

  const validFamilies = reports?.reduce((n, r) => n + r.families.length, 0) ?? 0;

  return (
    <form onSubmit={submit} className="space-y-5">
      <div
        {...getRootProps({
          className: `cursor-pointer rounded-xl border-2 border-dashed px-6 py-10 text-center ${isDragActive ? "border-tide-600 bg-tide-100" : "border-rule bg-panel hover:border-tide-600"}`,
        })}
      >
        <input {...getInputProps({ "aria-label": "Family files" })} data-testid="file-input" />
        <p className="font-semibold">Drop family files here, or click to choose</p>
        <p className="mt-1 text-sm text-abyss-500">
          YAML (.yaml, .yml), format <code className="font-mono">wavesieve: 1</code> · up to {maxFiles} files · {maxFileBytes / 1048576} MB each. See the{" "}
          <a className="text-tide-700 underline" href="/docs/family-format" target="_blank" rel="noreferrer">format guide</a>.
        </p>
      </div>
      {fileRejections.length > 0 ? (
        <p role="alert" className="rounded-md bg-coral-100 px-3 py-2 text-sm text-coral-700">
          Not accepted: {fileRejections.map((r) => `${r.file.name} (${r.errors.map((e) => e.message).join("; ")})`).join(", ")}
        </p>
      ) : null}
      {files.length > 0 ? (
        <ul className="flex flex-wrap gap-2 text-sm" aria-label="Chosen files">
          {files.map((f, i) => (
            <li key={`${f.name}-${i}`} className="flex items-center gap-2 rounded-md border border-rule bg-panel px-2 py-1 font-mono text-xs">
              {f.name}
              <button
                type="button"
                aria-label={`Remove ${f.name}`}
                className="text-coral-700"
                onClick={() => {
                  const next = files.filter((_, j) => j !== i);
                  setFiles(next);
                  void preview(next, pasted);
                }}
              >
                ×
              </button>
            </li>
          ))}
        </ul>
      ) : null}
      <details className="rounded-lg border border-rule bg-panel px-4 py-2">
        <summary className="cursor-pointer text-sm font-semibold">…or paste YAML text</summary>
        <textarea
          aria-label="Pasted YAML"
          value={pasted}
          onChange={(e) => setPasted(e.target.value)}
          onBlur={() => void preview(files, pasted)}
          rows={10}
          spellCheck={false}
          className="mt-2 w-full rounded-md border border-rule p-2 font-mono text-xs"
          placeholder={"wavesieve: 1\nfamilies:\n  - id: my-model\n    ..."}
        />
      </details>
      {problem ? <p role="alert" className="rounded-md bg-coral-100 px-3 py-2 text-sm text-coral-700">{problem}</p> : null}
      {busy ? <p className="text-sm text-abyss-500" role="status">Checking…</p> : null}
      {reports ? <div className="space-y-3">{reports.map((r, i) => <FileReportCard key={`${r.file}-${i}`} report={r} />)}</div> : null}
      {stored ? (
        <p role="status" className="rounded-md bg-reed-100 px-3 py-2 text-sm text-reed-700">
          Batch stored: {stored.families} families ({stored.reusedFamilies} already known, linked), {stored.variants} variants queued.{" "}
          <Link className="font-semibold underline" href={`/batches/${stored.id}`}>Open the batch</Link>
        </p>
      ) : null}
      <div className="flex flex-wrap items-end gap-3">
        <label className="text-sm font-semibold">
          Batch title (optional)
          <input name="title" maxLength={200} className="mt-1 block w-72 max-w-full rounded-md border border-rule bg-white px-3 py-2 font-normal" />
        </label>
        <button type="submit" disabled={busy || validFamilies === 0} className="rounded-md bg-tide-600 px-4 py-2 font-semibold text-white hover:bg-tide-700 disabled:opacity-50">
          Submit {validFamilies > 0 ? `${validFamilies} valid ${validFamilies === 1 ? "family" : "families"}` : ""}
        </button>
      </div>
    </form>
  );
}
