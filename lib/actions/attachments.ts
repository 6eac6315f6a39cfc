"use server";
import "server-only";
import { revalidatePath } from "next/cache";
import { z } from "zod";
import { slugSchema } from "@/lib/validation/api";
import { addAttachment, MAX_ATTACHMENT_BYTES } from "@/lib/attachments/attachments";
import { actionContext } from "@/lib/next-context";
import { failure, type FormState } from "@/lib/actions/form-state";

const TYPES: Record<string, string> = { "image/png": ".png", "image/svg+xml": ".svg" };
const fields = z.object({
  slug: slugSchema,
  name: z.string().trim().max(100).optional(),
});

/** schematic.PNG, "Wien bridge.svg" → schematic.png, wien-bridge.svg: the names the note can point at. */
function attachmentName(wanted: string, type: string): string {
  const ext = TYPES[type];
  const stem = wanted.toLowerCase().replace(/\.(png|svg)$/, "").replace(/[^a-z0-9._-]+/g, "-").replace(/^[^a-z0-9]+|-+$/g, "");
  return `${(stem || "schematic").slice(0, 90)}${ext}`;
}

export async function addAttachmentAction(_prev: FormState, form: FormData): Promise<FormState> {
  const parsed = fields.safeParse({ slug: form.get("slug"), name: form.get("name") || undefined });
  if (!parsed.success) return { ok: false, errors: { name: ["Use letters, digits, dots, dashes or underscores, at most 100."] } };
  const file = form.get("file");
  if (!(file instanceof File) || file.size === 0) return { ok: false, errors: { file: ["Choose a PNG or SVG file."] } };
  if (!TYPES[file.type]) return { ok: false, errors: { file: [`${file.name} is ${file.type || "of unknown type"}; attach a PNG or SVG image.`] } };
  if (file.size > MAX_ATTACHMENT_BYTES) return { ok: false, errors: { file: [`${file.name} is ${(file.size / 1048576).toFixed(2)} MiB; the limit is 1 MiB.`] } };
  const ctx = await actionContext();
  if (!ctx.caller.user) return { ok: false, message: "Sign in to attach images." };
  let state: FormState;
  try {
    const name = attachmentName(parsed.data.name || file.name, file.type);
    const saved = await addAttachment(ctx, { slug: parsed.data.slug, name, contentType: file.type, bytes: new Uint8Array(await file.arrayBuffer()) });
    state = { ok: true, message: `Attached ${saved.name}. Put ![schematic](${saved.name}) in the note to show it.`, data: { name: saved.name } };
  } catch (err) {
    return failure(err);
  }
  revalidatePath(`/blocks/${parsed.data.slug}`);
  return state;
}
