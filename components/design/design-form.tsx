"use client";
/**
 * The Design page's form: fix all coefficients but one, pick the unknown, solve (POST /api/design),
 * edit the integration constants and solve again, then submit the designed family
 * (POST /api/design/submit) or download its YAML.
 */
import { useState } from "react";
import Link from "next/link";
import type { DesignError, DesignResult } from "@/lib/screening/design";
import { DesignResultView } from "./design-result";
import { CLASS_LABEL, COEFFICIENTS, NORMAL_FORM, PRESETS, type DesignClass } from "./presets";

interface Props {
  solvable: Record<DesignClass, string[]>;
}

type Stored = { id: string; families: number; variants: number };

const input = "w-full rounded-md border border-rule bg-white px-2 py-1 font-mono text-sm";

/** "g0 = 0.2" lines → { g0: "0.2" }; blank lines are skipped. */
function parseParameters(text: string): Record<string, string> | string {
  const out: Record<string, string> = {};
  for (const line of text.split("\n").map((l) => l.trim()).filter(Boolean)) {
    const m = /^([A-Za-z][A-Za-z0-9_]*)\s*[=:]\s*(\S+)$/.exec(line);
    if (!m) return `parameter line '${line}' should read name = value`;
    out[m[1]] = m[2];
  }
  return out;
}

export function DesignForm({ solvable }: Props) {
  const [cls, setCls] = useState<DesignClass>("nls");
  const [solve, setSolve] = useState(PRESETS.nls.solve);
  const [set, setSet] = useState<Record<string, string>>(PRESETS.nls.set);
  const [span, setSpan] = useState<[string, string]>(["0", "5"]);
  const [params, setParams] = useState("");
  const [constants, setConstants] = useState<Record<string, string>>({});
  const [result, setResult] = useState<DesignResult | null>(null);
  const [errors, setErrors] = useState<DesignError[] | string | null>(null);
  const [busy, setBusy] = useState(false);
  const [stored, setStored] = useState<Stored | null>(null);

  function chooseClass(next: DesignClass) {
    setCls(next);
    setSolve(PRESETS[next].solve);
    setSet(PRESETS[next].set);
    setSpan([String(PRESETS[next].window[0]), String(PRESETS[next].window[1])]);
    setConstants({});
    setResult(null);
    setErrors(null);
    setStored(null);
  }

  function chooseUnknown(name: string) {
    setSolve(name);
    setConstants({});
  }

  function requestBody(withConstants: boolean): Record<string, unknown> | string {
    const parameters = parseParameters(params);
    if (typeof parameters === "string") return parameters;
    const fixed = Object.fromEntries(Object.entries(set).filter(([k, v]) => k !== solve && v.trim() !== ""));
    const body: Record<string, unknown> = { class: cls, solve, set: fixed, window: [Number(span[0]), Number(span[1])], parameters };
    if (withConstants) {
      const values: Record<string, number> = {};
      for (const [k, v] of Object.entries(constants)) if (v.trim() !== "") values[k] = Number(v);
      body.constants = values;
    }
    return body;
  }

  async function run(withConstants: boolean) {
    const body = requestBody(withConstants);
    setStored(null);
    if (typeof body === "string") return setErrors(body);
    setBusy(true);
    setErrors(null);
    try {
      const res = await fetch("/api/design", { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) });
      const data = (await res.json()) as { result?: DesignResult; errors?: DesignError[]; error?: string };
      if (res.ok && data.result) {
        setResult(data.result);
        setConstants(Object.fromEntries(data.result.constants.map((c) => [c.name, String(c.value)])));
      } else {
        setResult(null);
        setErrors(data.errors ?? data.error ?? `the design failed (${res.status})`);
      }
    } finally {
      setBusy(false);
    }
  }

  async function submit() {
    const body = requestBody(true);
    if (typeof body === "string") return setErrors(body);
    setBusy(true);
    try {
      const res = await fetch("/api/design/submit", { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) });
      const data = (await res.json()) as { batch?: Stored; error?: string };
      if (res.ok && data.batch) setStored(data.batch);
      else setErrors(data.error ?? `the submission failed (${res.status})`);
    } finally {
      setBusy(false);
    }
  }

  const rows = COEFFICIENTS[cls];
  const offered = new Set(solvable[cls]);
  const fileName = result?.yaml ? `${/- id: (\S+)/.exec(result.yaml)?.[1] ?? "designed"}.yaml` : "designed.yaml";

  return (
    <div className="space-y-6">
      <form
        className="space-y-4 rounded-lg border border-rule bg-panel p-4"
        onSubmit={(e) => {
          e.preventDefault();
          void run(false);
        }}
      >
        <div className="flex flex-wrap items-end gap-4">
          <label className="text-sm font-semibold">
            Class
            <select aria-label="Class" value={cls} onChange={(e) => chooseClass(e.target.value as DesignClass)} className="mt-1 block rounded-md border border-rule bg-white px-2 py-1 font-normal">
              {(Object.keys(CLASS_LABEL) as DesignClass[]).map((c) => <option key={c} value={c}>{CLASS_LABEL[c]}</option>)}
            </select>
          </label>
          <label className="text-sm font-semibold">
            Window start t0
            <input aria-label="Window start" value={span[0]} onChange={(e) => setSpan([e.target.value, span[1]])} className={`${input} mt-1 block w-24`} />
          </label>
          <label className="text-sm font-semibold">
            Window end t1
            <input aria-label="Window end" value={span[1]} onChange={(e) => setSpan([span[0], e.target.value])} className={`${input} mt-1 block w-24`} />
          </label>
        </div>
        <p className="font-mono text-xs text-abyss-500">{NORMAL_FORM[cls]}</p>
        <div className="relative overflow-x-auto">
          <table className="w-full text-sm" data-testid="design-coefficients">
            <thead className="text-left text-abyss-500">
              <tr><th className="px-2 py-1">coefficient</th><th className="px-2 py-1">expression in t (empty = 0)</th><th className="px-2 py-1">solve for</th></tr>
            </thead>
            <tbody>
              {rows.map((c) => (
                <tr key={c.name} className="border-t border-rule">
                  <td className="px-2 py-1"><span className="font-mono font-semibold">{c.name}</span> <span className="text-xs text-abyss-500">{c.meaning}</span></td>
                  <td className="px-2 py-1">
                    {c.name === solve ? (
                      <span className="text-sm italic text-tide-700">solved for</span>
                    ) : (
                      <input aria-label={`Coefficient ${c.name}`} value={set[c.name] ?? ""} onChange={(e) => setSet({ ...set, [c.name]: e.target.value })} className={input} spellCheck={false} />
                    )}
                  </td>
                  <td className="px-2 py-1">
                    {offered.has(c.name) ? (
                      <input type="radio" name="solve" aria-label={`Solve for ${c.name}`} checked={solve === c.name} onChange={() => chooseUnknown(c.name)} />
                    ) : (
                      <span className="text-xs text-abyss-500">—</span>
                    )}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        <details className="text-sm">
          <summary className="cursor-pointer font-semibold">Parameters used in the expressions</summary>
          <textarea aria-label="Parameters" value={params} onChange={(e) => setParams(e.target.value)} rows={3} className={`${input} mt-2`} placeholder={"g0 = 0.2\nL = 5"} spellCheck={false} />
        </details>
        <button type="submit" disabled={busy} className="rounded-md bg-tide-600 px-4 py-2 font-semibold text-white hover:bg-tide-700 disabled:opacity-50">
          {busy ? "Working…" : `Solve for ${solve}`}
        </button>
      </form>

      {errors ? (
        <div role="alert" className="rounded-md bg-coral-100 px-3 py-2 text-sm text-coral-700" data-testid="design-errors">
          {typeof errors === "string" ? errors : (
            <ul>{errors.map((e, i) => <li key={i}>{e.field ? <span className="font-mono">{e.field}: </span> : null}{e.message}</li>)}</ul>
          )}
        </div>
      ) : null}

      {result ? (
        <>
          {result.constants.length > 0 ? (
            <form
              className="rounded-lg border border-rule bg-panel p-4"
              onSubmit={(e) => {
                e.preventDefault();
                void run(true);
              }}
              data-testid="design-constants"
            >
              <p className="mb-2 text-sm font-semibold">Integration constants</p>
              <div className="space-y-2">
                {result.constants.map((c) => (
                  <label key={c.name} className="flex flex-wrap items-center gap-3 text-sm">
                    <span className="w-16 font-mono font-semibold">{c.name}</span>
                    <input aria-label={`Constant ${c.name}`} value={constants[c.name] ?? ""} onChange={(e) => setConstants({ ...constants, [c.name]: e.target.value })} className="w-32 rounded-md border border-rule bg-white px-2 py-1 font-mono text-sm" />
                    <span className="flex-1 text-xs text-abyss-500">{c.meaning} (default {c.defaultValue})</span>
                  </label>
                ))}
              </div>
              <button type="submit" disabled={busy} className="mt-3 rounded-md border border-tide-600 px-3 py-1 text-sm font-semibold text-tide-700 hover:bg-tide-100 disabled:opacity-50">Solve again with these constants</button>
            </form>
          ) : null}
          <DesignResultView result={result} />
          <div className="space-y-3 rounded-lg border border-rule bg-panel p-4">
            <p className="text-sm">{result.submitNote}</p>
            {result.yaml ? (
              <>
                <pre className="overflow-x-auto rounded-md bg-abyss-900 p-3 text-xs text-white" data-testid="design-yaml">{result.yaml}</pre>
                <div className="flex flex-wrap gap-3">
                  <a className="rounded-md border border-tide-600 px-3 py-1.5 text-sm font-semibold text-tide-700 hover:bg-tide-100" href={`data:application/yaml;charset=utf-8,${encodeURIComponent(result.yaml)}`} download={fileName}>
                    Download {fileName}
                  </a>
                  <button type="button" onClick={() => void submit()} disabled={busy || !result.submittable} className="rounded-md bg-tide-600 px-4 py-1.5 text-sm font-semibold text-white hover:bg-tide-700 disabled:opacity-50" data-testid="design-submit">
                    Submit as a family
                  </button>
                </div>
              </>
            ) : null}
            {stored ? (
              <p role="status" className="rounded-md bg-reed-100 px-3 py-2 text-sm text-reed-700">
                Batch created: {stored.families} family, {stored.variants} variant queued for screening.{" "}
                <Link className="font-semibold underline" href={`/batches/${stored.id}`}>Open the batch</Link>
              </p>
            ) : null}
          </div>
        </>
      ) : null}
    </div>
  );
}
