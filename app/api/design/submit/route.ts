import { NextResponse } from "next/server";
import { withRole, jsonError, readJson } from "@/lib/auth/api";
import { designModel } from "@/lib/screening/design";
import { storeBatch, validateFiles, validationView } from "@/lib/batches";
import { allow } from "@/lib/rate-limit";

export const SUBMITS_PER_MINUTE = 30;

/**
 * "Submit as a family": the design is computed again here (what is stored is what was screened,
 * never a client's copy), its YAML goes through the same validation and store as an upload, and
 * the new batch's id comes back. Only closed forms can be submitted.
 */
export const POST = withRole("researcher", async (req, _ctx, user) => {
  if (!allow(`design-submit:${user.id}`, SUBMITS_PER_MINUTE, 60_000)) return jsonError(429, "too many submissions; wait a minute");
  const body = await readJson(req);
  if (!body) return jsonError(400, "send the design request as a JSON object (at most 64 KB)");
  const out = await designModel(body, { signal: req.signal, transformation: false });
  if (!out.ok) return jsonError(422, out.errors[0].message, { errors: out.errors });
  const { result } = out;
  if (!result.submittable || !result.yaml) return jsonError(422, result.submitNote);
  const file = `${result.yaml.match(/- id: (\S+)/)?.[1] ?? "designed"}.yaml`;
  const validations = validateFiles([{ name: file, text: result.yaml }]);
  if (validations[0].families.length === 0) {
    return jsonError(422, "the designed family did not validate; nothing was stored", { files: validationView(validations) });
  }
  const title = typeof body.batchTitle === "string" && body.batchTitle.trim() ? body.batchTitle.trim() : `Design: ${validations[0].families[0].title}`;
  try {
    const batch = await storeBatch(user, validations, title);
    return NextResponse.json({ batch, file, yaml: result.yaml }, { status: 201 });
  } catch (err) {
    console.error("[design] store failed:", err);
    return jsonError(503, "the design could not be stored (storage error); nothing was stored — try again");
  }
});
