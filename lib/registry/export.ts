/**
 * Exports of the filtered registry (CSV, JSON), streamed page by page and capped at EXPORT_CAP
 * rows. The cap and whether it cut the set are stated in the response headers, in the JSON body
 * and (CSV) in the file name, so a truncated export is never mistaken for the whole set.
 */
import type { CurrentUser } from "@/lib/auth/current-user";
import { countRegistry, iterateRegistry, type RegistryRow } from "./queries";
import { EXPORT_CAP, type RegistryQuery } from "./filters";

export { EXPORT_CAP };

export const CSV_COLUMNS: { header: string; value: (r: RegistryRow) => string | number | boolean | null }[] = [
  { header: "id", value: (r) => r.id },
  { header: "slug", value: (r) => r.slug },
  { header: "title", value: (r) => r.title },
  { header: "class", value: (r) => r.class },
  { header: "reducibility", value: (r) => r.reducibility },
  { header: "painleve", value: (r) => r.painleve },
  { header: "agreement", value: (r) => r.agreement },
  { header: "curation_state", value: (r) => r.curationState },
  { header: "published", value: (r) => r.published },
  { header: "duplicate_of", value: (r) => r.duplicateOfId },
  { header: "tags", value: (r) => r.tags.join(" ") },
  { header: "submitter", value: (r) => r.submitter },
  { header: "batch", value: (r) => r.batchId },
  { header: "engine_version", value: (r) => r.engineVersion },
  { header: "variants_total", value: (r) => r.variants.total },
  { header: "variants_screened", value: (r) => r.variants.screened },
  { header: "variants_reducible", value: (r) => r.variants.reducible },
  { header: "created_at", value: (r) => r.createdAt },
  { header: "screened_at", value: (r) => r.screenedAt },
  { header: "published_at", value: (r) => r.publishedAt },
];

/**
 * One CSV field (RFC 4180 quoting). Text that a spreadsheet would run as a formula (leading = + - @,
 * tab or CR) gets a leading apostrophe (OWASP, "CSV Injection").
 */
export function csvField(value: string | number | boolean | null): string {
  if (value === null) return "";
  if (typeof value !== "string") return String(value);
  const safe = /^[=+\-@\t\r]/.test(value) ? `'${value}` : value;
  return /[",\r\n]/.test(safe) ? `"${safe.replace(/"/g, '""')}"` : safe;
}

export function csvLine(row: RegistryRow): string {
  return CSV_COLUMNS.map((c) => csvField(c.value(row))).join(",") + "\r\n";
}

export interface ExportStream {
  stream: ReadableStream<Uint8Array>;
  total: number;
  exported: number;
  truncated: boolean;
}

function streamOf(parts: () => AsyncGenerator<string>): ReadableStream<Uint8Array> {
  const encoder = new TextEncoder();
  const it = parts();
  return new ReadableStream<Uint8Array>({
    async pull(controller) {
      try {
        const { value, done } = await it.next();
        if (done) controller.close();
        else controller.enqueue(encoder.encode(value));
      } catch (err) {
        controller.error(err);
      }
    },
    async cancel() {
      await it.return(undefined);
    },
  });
}

export async function exportRegistry(user: CurrentUser, query: RegistryQuery, format: "csv" | "json", cap = EXPORT_CAP): Promise<ExportStream> {
  const total = await countRegistry(user, query.filters);
  const exported = Math.min(total, cap);
  const truncated = total > cap;
  const generatedAt = new Date().toISOString();
  const stream =
    format === "csv"
      ? streamOf(async function* () {
          yield CSV_COLUMNS.map((c) => c.header).join(",") + "\r\n";
          for await (const rows of iterateRegistry(user, query, cap)) yield rows.map(csvLine).join("");
        })
      : streamOf(async function* () {
          yield `{"generatedAt":${JSON.stringify(generatedAt)},"total":${total},"exported":${exported},"cap":${cap},"truncated":${truncated},"entries":[`;
          let first = true;
          for await (const rows of iterateRegistry(user, query, cap)) {
            yield rows.map((r) => (first ? ((first = false), "") : ",") + JSON.stringify(r)).join("");
          }
          yield "]}\n";
        });
  return { stream, total, exported, truncated };
}
