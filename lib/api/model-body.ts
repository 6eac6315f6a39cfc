import { AppError } from "@/lib/errors";
import { decodeUtf8, mediaType, readFilePart, readLimited } from "./body";

export const MAX_MODEL_BODY_BYTES = 512 * 1024;

const utf8 = (bytes: Uint8Array) => decodeUtf8(bytes, "model file");

/** A model file upload: a text/plain body named by `?name=`, or the `file` part of a multipart form (its own name). */
export async function readModelFile(req: Request, name?: string): Promise<{ name: string; text: string }> {
  const type = mediaType(req);
  if (type === "text/plain") {
    if (!name) throw new AppError("validation", "name the file with ?name=", { errors: [{ message: "required", path: "name" }] });
    return { name, text: utf8(await readLimited(req, MAX_MODEL_BODY_BYTES)) };
  }
  if (type !== "multipart/form-data") throw new AppError("unsupported_media_type", "send the model file as text/plain with ?name=, or as the `file` part of multipart/form-data");
  const file = await readFilePart(req, MAX_MODEL_BODY_BYTES);
  if (file.size > MAX_MODEL_BODY_BYTES) throw new AppError("payload_too_large", `a model file holds at most ${MAX_MODEL_BODY_BYTES / 1024} KiB`);
  return { name: name ?? file.name, text: utf8(new Uint8Array(await file.arrayBuffer())) };
}
