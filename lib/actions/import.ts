"use server";
import "server-only";
import { redirect } from "next/navigation";
import { revalidatePath } from "next/cache";
import { z } from "zod";
import { importNetlist } from "@/checks";
import { addAttachment, MAX_ATTACHMENT_BYTES } from "@/lib/attachments/attachments";
import { getCaller } from "@/lib/auth/session";
import { createBlock } from "@/lib/blocks/create";
import { actionContext } from "@/lib/next-context";
import { importFormSchema, MAX_BLOCK_FILE_BYTES } from "@/lib/validation/blocks";
import { failure, type FormState } from "@/lib/actions/form-state";

const NETLIST = /\.(cir|sp|net)$/i;
const IMAGE = /\.(png|svg)$/i;

const isFile = (v: FormDataEntryValue | null): v is File => typeof v === "object" && v !== null && "arrayBuffer" in v && v.size > 0;

/** Step one for a SPICE netlist: turn it into a block file and list what was dropped, nothing stored yet. */
export async function convertNetlistAction(_prev: FormState, form: FormData): Promise<FormState> {
  const caller = await getCaller();
  if (!caller.user) return { ok: false, message: "Sign in to import." };
  const file = form.get("file");
  if (!isFile(file)) return { ok: false, message: "Choose a file.", errors: { file: ["Choose a block file (.md) or a SPICE netlist (.cir, .sp, .net)."] } };
  if (file.size > MAX_BLOCK_FILE_BYTES) return { ok: false, message: "That file is too large.", errors: { file: [`Files are at most 256 KiB; this one is ${Math.ceil(file.size / 1024)} KiB.`] } };
  const text = (await file.text()).replace(/\r\n?/g, "\n");
  if (/\.md$/i.test(file.name)) return { ok: true, data: { blockText: text, dropped: [], fileName: file.name } };
  if (!NETLIST.test(file.name)) return { ok: false, message: "Unsupported file type.", errors: { file: [`"${file.name}" is neither a block file (.md) nor a SPICE netlist (.cir, .sp, .net).`] } };
  const res = importNetlist(text, file.name);
  if (res.errors.length && !res.blockText) return { ok: false, message: "The netlist could not be read.", lines: res.errors };
  return { ok: true, message: "Converted: each part value is a parameter. Check values and tolerances, add a note, then create it.", lines: res.errors, data: { blockText: res.blockText, dropped: res.dropped, fileName: file.name, params: res.params } };
}

/** Step two: create the block from the (possibly edited) file, then attach the schematic images. */
export async function createImportAction(_prev: FormState, form: FormData): Promise<FormState> {
  const parsed = importFormSchema.safeParse(Object.fromEntries([...form.entries()].filter(([, v]) => typeof v === "string")));
  if (!parsed.success) return { ok: false, message: "Some fields need attention.", errors: z.flattenError(parsed.error).fieldErrors as Record<string, string[]> };
  const images = form.getAll("images").filter(isFile);
  for (const img of images) {
    if (!IMAGE.test(img.name)) return { ok: false, message: "Unsupported image.", errors: { images: [`"${img.name}" is not a PNG or SVG image.`] } };
    if (img.size > MAX_ATTACHMENT_BYTES) return { ok: false, message: "An image is too large.", errors: { images: [`"${img.name}" is ${Math.ceil(img.size / 1024)} KiB; images are at most 1 MiB.`] } };
  }
  const ctx = await actionContext();
  if (!ctx.caller.user) return { ok: false, message: "Sign in to import." };
  let slug: string;
  try {
    slug = (await createBlock(ctx, { ...parsed.data, message: "imported" })).slug;
    for (const img of images) {
      const type = img.name.toLowerCase().endsWith(".svg") ? "image/svg+xml" : "image/png";
      await addAttachment(ctx, { slug, name: img.name.toLowerCase(), contentType: type, bytes: new Uint8Array(await img.arrayBuffer()) });
    }
  } catch (err) {
    return { ...failure(err), data: { blockText: parsed.data.text } };
  }
  revalidatePath("/");
  redirect(`/blocks/${slug}`);
}
