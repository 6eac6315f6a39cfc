import { z } from "zod";
import { MODEL_FILE } from "@/checks";
import { teamSlugSchema, versionNumberSchema } from "./api";

// Model file routes (DESIGN.md "REST API v1"): names, queries and the upload form, shared by routes, page and OpenAPI.

export const modelNameSchema = z
  .string()
  .regex(MODEL_FILE, "letters, digits, - _ . and a .lib, .mod, .sub or .cir ending")
  .meta({ description: "Model file name as `.include` uses it", example: "opa-general.lib" });

/** A team slug, or `shared` for the shared model library (content/models). */
export const libraryParamSchema = teamSlugSchema.meta({ description: "Team slug, or `shared` for the shared model library", example: "fenwick" });

export const modelListQuerySchema = z.object({ team: libraryParamSchema.optional() }).strict();
export const libraryParamsSchema = z.object({ team: libraryParamSchema });
export const modelParamsSchema = z.object({ team: libraryParamSchema, name: modelNameSchema });
export const modelQuerySchema = z.object({ version: versionNumberSchema.optional() }).strict();
export const uploadQuerySchema = z.object({
  name: modelNameSchema.optional().meta({ description: "File name when the body is text/plain (multipart takes the file's own name)" }),
  message: z.string().max(2000).optional().meta({ description: "What changed" }),
});

/** The page's upload form: the same rules. */
export const uploadFormSchema = z.object({
  name: modelNameSchema,
  text: z.string().transform((t) => t.replace(/\r\n?/g, "\n")).pipe(z.string().min(1, "the model file is empty").max(512 * 1024, "a model file holds at most 512 KiB")),
  message: z.string().trim().max(2000).optional(),
});
export type UploadForm = z.infer<typeof uploadFormSchema>;

const definition = z.object({ kind: z.enum(["subckt", "model"]), name: z.string(), type: z.string().optional() });

export const modelSummarySchema = z.object({
  team: z.string().meta({ description: "Team slug, or `shared`" }),
  name: z.string(),
  version: z.number().int(),
  sha256: z.string(),
  defines: z.array(definition).meta({ description: "The .subckt and .model names the file defines" }),
  updatedAt: z.string().nullable(),
}).openapi("ModelSummary");

export const modelFileSchema = modelSummarySchema.extend({
  text: z.string(),
  head: z.number().int().meta({ description: "The newest version's number" }),
  versions: z.array(z.object({ number: z.number().int(), sha256: z.string(), author: z.string(), message: z.string(), createdAt: z.string() })),
  usedBy: z.array(z.object({ slug: z.string(), title: z.string(), team: z.string(), version: z.number().int(), badge: z.string() }))
    .meta({ description: "Heads of blocks the caller may read that include the file, with their badges" }),
}).openapi("ModelFile");

export const modelVersionSchema = modelSummarySchema.omit({ updatedAt: true }).extend({
  text: z.string(), author: z.string(), message: z.string(), createdAt: z.string(),
}).meta({ description: "One immutable version" }).openapi("ModelVersion");

export const uploadResultSchema = z.object({
  team: z.string(), name: z.string(), version: z.number().int(), sha256: z.string(),
  reverify: z.array(z.object({ slug: z.string(), version: z.number().int() })).meta({ description: "Heads that use the file: now stale and queued for verification" }),
}).openapi("ModelUpload");
