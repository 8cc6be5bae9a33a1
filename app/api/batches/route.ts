import { NextResponse } from "next/server";
import { withRole, jsonError } from "@/lib/auth/api";
import { readUpload, checkUploadShape, validateFiles, validationView, storeBatch, listBatches } from "@/lib/batches";
import { allow } from "@/lib/rate-limit";

export const UPLOADS_PER_MINUTE = 30;

export const GET = withRole("researcher", async (_req, _ctx, user) => NextResponse.json({ batches: await listBatches(user) }));

/** Validate and store an upload as a batch; valid families are kept even when others in a file fail. */
export const POST = withRole("researcher", async (req, _ctx, user) => {
  if (!allow(`upload:${user.id}`, UPLOADS_PER_MINUTE, 60_000)) return jsonError(429, "too many uploads; wait a minute");
  const upload = await readUpload(req);
  if (!upload.ok) return jsonError(upload.status, upload.error);
  const shape = checkUploadShape(upload.files);
  if (!shape.ok) return jsonError(shape.status, shape.error);
  const validations = validateFiles(upload.files);
  const files = validationView(validations);
  if (validations.every((v) => v.families.length === 0)) return jsonError(422, "no valid family in the upload; nothing was stored", { files });
  try {
    const batch = await storeBatch(user, validations, upload.title);
    return NextResponse.json({ batch, files }, { status: 201 });
  } catch (err) {
    console.error("[upload] store failed:", err);
    return jsonError(503, "the upload could not be stored (storage error); nothing was stored — try again", { files });
  }
});
