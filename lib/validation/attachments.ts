import { z } from "zod";
import { slugSchema } from "./api";

// Attachments of a block: the upload form, the import form and the services take these.
export const attachmentRefSchema = z.object({ slug: slugSchema, name: z.string().min(1).max(200) });
export const newAttachmentSchema = attachmentRefSchema.extend({ contentType: z.string().max(100), bytes: z.instanceof(Uint8Array) });

export type AttachmentRef = z.infer<typeof attachmentRefSchema>;
export type NewAttachment = z.infer<typeof newAttachmentSchema>;
