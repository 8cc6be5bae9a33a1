import { withRole, jsonError } from "@/lib/auth/api";
import { exportRegistry, parseRegistryQuery, EXPORT_CAP } from "@/lib/registry";

/** The filtered registry as CSV or JSON (same filters as GET /api/registry), at most EXPORT_CAP rows. */
export const GET = withRole("viewer", async (req, _ctx, user) => {
  const format = req.nextUrl.searchParams.get("format") ?? "csv";
  if (format !== "csv" && format !== "json") return jsonError(400, "format must be csv or json");
  const query = parseRegistryQuery(req.nextUrl.searchParams);
  const out = await exportRegistry(user, query, format);
  const stamp = new Date().toISOString().slice(0, 10);
  const name = `wavesieve-registry-${stamp}${out.truncated ? `-first-${EXPORT_CAP}` : ""}.${format}`;
  return new Response(out.stream, {
    headers: {
      "content-type": format === "csv" ? "text/csv; charset=utf-8" : "application/json; charset=utf-8",
      "content-disposition": `attachment; filename="${name}"`,
      "cache-control": "no-store",
      "x-total-count": String(out.total),
      "x-export-count": String(out.exported),
      "x-export-cap": String(EXPORT_CAP),
      "x-export-truncated": String(out.truncated),
    },
  });
});
