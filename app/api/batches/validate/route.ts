import { NextResponse } from "next/server";
import { withRole, jsonError } from "@/lib/auth/api";
import { readUpload, checkUploadShape, validateFiles, validationView } from "@/lib/batches";

/** The Submit page's preview: validate without storing anything. */
export const POST = withRole("researcher", async (req) => {
  const upload = await readUpload(req);
  if (!upload.ok) return jsonError(upload.status, upload.error);
  const shape = checkUploadShape(upload.files);
  if (!shape.ok) return jsonError(shape.status, shape.error);
  return NextResponse.json({ files: validationView(validateFiles(upload.files)) });
});
