import { createHash } from "node:crypto";
import type { EntityManager } from "@mikro-orm/postgresql";
import { AttachmentSchema, UserSchema } from "@/entities";
import type { Ctx } from "@/lib/context";
import { loadBlock, requireUser } from "@/lib/blocks/common";
import type { AttachmentRef, NewAttachment } from "@/lib/validation/attachments";
import type { BlockInput } from "@/lib/validation/blocks";
import { AppError } from "@/lib/errors";
import { sanitiseSvg } from "./svg-sanitise";

export const MAX_ATTACHMENT_BYTES = 1024 * 1024;
const PNG_MAGIC = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
const NAME = /^[a-z0-9][a-z0-9._-]{0,98}\.(png|svg)$/;

export interface AttachmentInfo { name: string; contentType: string; size: number; sha256: string }

/** A schematic image for the note (PNG, or SVG reduced to drawing elements), at most 1 MiB; same name replaces. */
export async function addAttachment({ em, caller }: Ctx, input: NewAttachment): Promise<AttachmentInfo> {
  const user = requireUser(caller);
  const block = await loadBlock(em, caller, input.slug, "block.edit");
  const name = input.name.toLowerCase();
  if (!NAME.test(name)) throw new AppError("validation", "name the file like schematic.png or schematic.svg (a-z, 0-9, . _ -)");
  let bytes = Buffer.from(input.bytes);
  if (bytes.length > MAX_ATTACHMENT_BYTES) throw new AppError("payload_too_large", "attachments are at most 1 MiB");
  let contentType: string;
  if (input.contentType === "image/png" && name.endsWith(".png")) {
    if (!bytes.subarray(0, 8).equals(PNG_MAGIC)) throw new AppError("validation", "the file is not a PNG image");
    contentType = "image/png";
  } else if (input.contentType === "image/svg+xml" && name.endsWith(".svg")) {
    try {
      bytes = Buffer.from(sanitiseSvg(bytes.toString("utf8")), "utf8");
    } catch (err) {
      throw new AppError("validation", (err as Error).message);
    }
    contentType = "image/svg+xml";
  } else {
    throw new AppError("unsupported_media_type", "attachments are PNG (image/png) or SVG (image/svg+xml) with a matching name");
  }
  const sha256 = createHash("sha256").update(bytes).digest("hex");
  const existing = await em.findOne(AttachmentSchema, { block, name });
  if (existing) {
    Object.assign(existing, { contentType, size: bytes.length, sha256, bytes, uploadedBy: em.getReference(UserSchema, user.id) });
  } else {
    em.create(AttachmentSchema, { block, name, contentType, size: bytes.length, sha256, bytes, uploadedBy: em.getReference(UserSchema, user.id), createdAt: new Date() });
  }
  await em.flush();
  return { name, contentType, size: bytes.length, sha256 };
}

export async function getAttachment({ em, caller }: Ctx, input: AttachmentRef): Promise<AttachmentInfo & { bytes: Buffer }> {
  const block = await loadBlock(em, caller, input.slug);
  const a = await em.findOne(AttachmentSchema, { block, name: input.name.toLowerCase() }, { populate: ["bytes"] });
  if (!a) throw new AppError("not_found", "no such attachment");
  return { name: a.name, contentType: a.contentType, size: a.size, sha256: a.sha256, bytes: Buffer.from(a.bytes) };
}

export async function listAttachments({ em, caller }: Ctx, input: BlockInput): Promise<AttachmentInfo[]> {
  const block = await loadBlock(em, caller, input.slug);
  return attachmentsOf(em, block.id);
}

/** The attachments of a block the caller was already allowed to read. */
export async function attachmentsOf(em: EntityManager, blockId: number): Promise<AttachmentInfo[]> {
  const rows = await em.find(AttachmentSchema, { block: blockId }, { orderBy: { name: "asc" } });
  return rows.map((a) => ({ name: a.name, contentType: a.contentType, size: a.size, sha256: a.sha256 }));
}
