import "server-only";
import { AppError } from "@/lib/errors";
import { MAX_BLOCK_FILE_BYTES } from "@/lib/validation/blocks";

export { MAX_BLOCK_FILE_BYTES };
export const MAX_JSON_BYTES = 64 * 1024;

const MARKDOWN_TYPES = new Set(["text/markdown", "text/x-markdown"]);

export function mediaType(req: Request): string {
  return (req.headers.get("content-type") ?? "").split(";")[0].trim().toLowerCase();
}

/** Reads at most `limit` bytes: the Content-Length is checked first, and a body streamed without one is cut off. */
export async function readLimited(req: Request, limit: number): Promise<Uint8Array<ArrayBuffer>> {
  const declared = Number(req.headers.get("content-length") ?? NaN);
  if (Number.isFinite(declared) && declared > limit) throw tooLarge(limit);
  if (!req.body) return new Uint8Array(new ArrayBuffer(0));
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > limit) {
      await reader.cancel();
      throw tooLarge(limit);
    }
    chunks.push(value);
  }
  const out = new Uint8Array(new ArrayBuffer(size));
  let at = 0;
  for (const c of chunks) {
    out.set(c, at);
    at += c.byteLength;
  }
  return out;
}

const tooLarge = (limit: number) => new AppError("payload_too_large", `the body is larger than ${limit / 1024} KiB`);

/** Uploaded text must be UTF-8; `what` names the file in the refusal ("block file", "model file"). */
export function decodeUtf8(bytes: Uint8Array, what = "block file"): string {
  try {
    return new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    throw new AppError("validation", `the ${what} is not UTF-8 text`, { errors: [{ message: "not UTF-8 text" }] });
  }
}

/** The `file` part of a multipart upload, read within `limit` (multipart framing adds a little on top). */
export async function readFilePart(req: Request, limit: number): Promise<File> {
  const bytes = await readLimited(req, limit + 16 * 1024);
  let form: FormData;
  try {
    form = await new Response(bytes, { headers: { "content-type": req.headers.get("content-type")! } }).formData();
  } catch {
    throw new AppError("validation", "the multipart body could not be read", { errors: [{ message: "malformed multipart body", path: "file" }] });
  }
  const file = form.get("file");
  if (!file || typeof file === "string") {
    throw new AppError("validation", "the form has no `file` part", { errors: [{ message: "required", path: "file" }] });
  }
  return file;
}

export const isBlockFileRequest = (req: Request) => MARKDOWN_TYPES.has(mediaType(req)) || mediaType(req) === "multipart/form-data";

/** The block file of an upload: a text/markdown body, or the `file` part of a multipart form. */
export async function readBlockFile(req: Request): Promise<string> {
  const type = mediaType(req);
  if (MARKDOWN_TYPES.has(type)) return decodeUtf8(await readLimited(req, MAX_BLOCK_FILE_BYTES));
  if (type !== "multipart/form-data") {
    throw new AppError("unsupported_media_type", "send the block file as text/markdown or as the `file` part of multipart/form-data");
  }
  const file = await readFilePart(req, MAX_BLOCK_FILE_BYTES);
  if (file.size > MAX_BLOCK_FILE_BYTES) throw tooLarge(MAX_BLOCK_FILE_BYTES);
  return decodeUtf8(new Uint8Array(await file.arrayBuffer()));
}

/** A JSON body; the schema check is the caller's. */
export async function readJson(req: Request): Promise<unknown> {
  if (mediaType(req) !== "application/json") throw new AppError("unsupported_media_type", "send application/json");
  const text = new TextDecoder().decode(await readLimited(req, MAX_JSON_BYTES));
  try {
    return JSON.parse(text);
  } catch {
    throw new AppError("validation", "the body is not valid JSON", { errors: [{ message: "malformed JSON", path: "(body)" }] });
  }
}
