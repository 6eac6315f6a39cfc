import { AppError } from "@/lib/errors";
import { mediaType, readLimited } from "./body";

export const MAX_MODEL_BODY_BYTES = 512 * 1024;

function utf8(bytes: Uint8Array): string {
  try {
    return new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    throw new AppError("validation", "the model file is not UTF-8 text", { errors: [{ message: "not UTF-8 text" }] });
  }
}

/** A model file upload: a text/plain body named by `?name=`, or the `file` part of a multipart form (its own name). */
export async function readModelFile(req: Request, name?: string): Promise<{ name: string; text: string }> {
  const type = mediaType(req);
  if (type === "text/plain") {
    if (!name) throw new AppError("validation", "name the file with ?name=", { errors: [{ message: "required", path: "name" }] });
    return { name, text: utf8(await readLimited(req, MAX_MODEL_BODY_BYTES)) };
  }
  if (type !== "multipart/form-data") throw new AppError("unsupported_media_type", "send the model file as text/plain with ?name=, or as the `file` part of multipart/form-data");
  const bytes = await readLimited(req, MAX_MODEL_BODY_BYTES + 16 * 1024);
  let form: FormData;
  try {
    form = await new Response(bytes, { headers: { "content-type": req.headers.get("content-type")! } }).formData();
  } catch {
    throw new AppError("validation", "the multipart body could not be read", { errors: [{ message: "malformed multipart body", path: "file" }] });
  }
  const file = form.get("file");
  if (!file || typeof file === "string") throw new AppError("validation", "the form has no `file` part", { errors: [{ message: "required", path: "file" }] });
  if (file.size > MAX_MODEL_BODY_BYTES) throw new AppError("payload_too_large", `a model file holds at most ${MAX_MODEL_BODY_BYTES / 1024} KiB`);
  return { name: name ?? file.name, text: utf8(new Uint8Array(await file.arrayBuffer())) };
}
