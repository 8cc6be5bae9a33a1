/** Reads an upload from a request: multipart files, a raw YAML body, or JSON {files:[{name,text}]}. */
import type { NextRequest } from "next/server";
import { MAX_UPLOAD_TOTAL_BYTES } from "./limits";
import type { UploadFile } from "./validate";

export type UploadRequest = { ok: true; files: UploadFile[]; title?: string } | { ok: false; status: number; error: string };

const OVERHEAD = 256 * 1024; // multipart boundaries and headers

/** Read the body but stop at `max` bytes, whatever Content-Length claims. */
async function readCapped(req: NextRequest, max: number): Promise<Uint8Array | null> {
  const declared = Number(req.headers.get("content-length") ?? "0");
  if (declared > max) return null;
  if (!req.body) return new Uint8Array();
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > max) {
      await reader.cancel();
      return null;
    }
    chunks.push(value);
  }
  const out = new Uint8Array(size);
  let at = 0;
  for (const c of chunks) {
    out.set(c, at);
    at += c.byteLength;
  }
  return out;
}

const decoder = new TextDecoder("utf-8", { fatal: true });

function decode(bytes: Uint8Array, name: string): string | { error: string } {
  try {
    return decoder.decode(bytes);
  } catch {
    return { error: `${name}: the file is not UTF-8 text` };
  }
}

export async function readUpload(req: NextRequest): Promise<UploadRequest> {
  const limit = MAX_UPLOAD_TOTAL_BYTES + OVERHEAD;
  const bytes = await readCapped(req, limit);
  if (!bytes) return { ok: false, status: 413, error: `upload too large (limit ${MAX_UPLOAD_TOTAL_BYTES / 1048576} MB in all)` };
  // Lower-case only for matching: the multipart boundary itself is case-sensitive.
  const rawType = req.headers.get("content-type") ?? "";
  const type = rawType.toLowerCase();
  const title = req.nextUrl.searchParams.get("title") ?? undefined;

  if (type.startsWith("multipart/form-data")) {
    let form: FormData;
    try {
      form = await new Request("http://upload.local", { method: "POST", headers: { "content-type": rawType }, body: bytes as BodyInit }).formData();
    } catch {
      return { ok: false, status: 400, error: "malformed multipart body" };
    }
    const files: UploadFile[] = [];
    for (const value of form.getAll("files")) {
      if (typeof value === "string") continue;
      const text = decode(new Uint8Array(await value.arrayBuffer()), value.name);
      if (typeof text !== "string") return { ok: false, status: 400, error: text.error };
      files.push({ name: value.name || "upload.yaml", text });
    }
    const pasted = form.get("text");
    if (typeof pasted === "string" && pasted.trim()) files.push({ name: String(form.get("name") || "pasted.yaml"), text: pasted });
    const formTitle = form.get("title");
    return { ok: true, files, title: typeof formTitle === "string" ? formTitle : title };
  }

  const text = decode(bytes, "body");
  if (typeof text !== "string") return { ok: false, status: 400, error: text.error };
  if (type.startsWith("application/json")) {
    let body: unknown;
    try {
      body = JSON.parse(text);
    } catch {
      return { ok: false, status: 400, error: "malformed JSON body" };
    }
    const list = (body as { files?: unknown })?.files;
    if (!Array.isArray(list)) return { ok: false, status: 400, error: 'expected {"files": [{"name": "...", "text": "..."}]}' };
    const files: UploadFile[] = [];
    for (const [i, f] of list.entries()) {
      const { name, text: t } = (f ?? {}) as { name?: unknown; text?: unknown };
      if (typeof t !== "string") return { ok: false, status: 400, error: `files[${i}].text must be a string` };
      files.push({ name: typeof name === "string" && name ? name : `file-${i + 1}.yaml`, text: t });
    }
    const jsonTitle = (body as { title?: unknown }).title;
    return { ok: true, files, title: typeof jsonTitle === "string" ? jsonTitle : title };
  }
  // A raw YAML body (application/yaml, text/yaml, text/plain, or none).
  const name = req.nextUrl.searchParams.get("name") || "upload.yaml";
  return { ok: true, files: [{ name, text }], title };
}
