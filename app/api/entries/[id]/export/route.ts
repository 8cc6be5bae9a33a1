import { withRole, jsonError } from "@/lib/auth/api";
import { exportEntry, type EntryExportFormat } from "@/lib/registry/entry-export";

type Ctx = { params: Promise<{ id: string }> };

const FORMATS: EntryExportFormat[] = ["json", "yaml", "latex"];

/** One entry as JSON (all variants' reports), its family YAML, or a LaTeX fragment (?variant=N picks the member). */
export const GET = withRole("viewer", async (req, ctx: Ctx, user) => {
  const format = (req.nextUrl.searchParams.get("format") ?? "json") as EntryExportFormat;
  if (!FORMATS.includes(format)) return jsonError(400, "format must be json, yaml or latex");
  const v = req.nextUrl.searchParams.get("variant");
  const variant = v !== null && /^\d+$/.test(v) ? Number(v) : undefined;
  const out = await exportEntry(user, (await ctx.params).id, format, variant);
  if (!out) return jsonError(404, "no such entry");
  return new Response(out.body, {
    headers: { "content-type": out.contentType, "content-disposition": `attachment; filename="${out.fileName}"`, "cache-control": "no-store" },
  });
});
