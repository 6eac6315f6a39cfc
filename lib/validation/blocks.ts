import { z } from "zod";
import { CATEGORIES, VISIBILITIES } from "@/entities/block.entity";
import { BADGES } from "@/lib/badges/badges";
import { cursorSchema, limitSchema, slugSchema, storedText, teamSlugSchema, versionNumberSchema } from "./api";

// Request bodies and the JSON the API answers with. These schemas are also the source of /api/v1/openapi.json.

export const badgeSchema = z.enum(BADGES).meta({ description: "State of one version's checks" }).openapi("Badge");
export const categorySchema = z.enum(CATEGORIES);
export const visibilitySchema = z.enum(VISIBILITIES);
/** A block file is at most 256 KiB (the API counts bytes; a form, characters). */
export const MAX_BLOCK_FILE_BYTES = 256 * 1024;
export const E_SERIES = ["E3", "E6", "E12", "E24", "E48", "E96", "E192"] as const;

const identifier = z
  .string()
  .min(1)
  .max(64)
  .regex(/^[A-Za-z_][A-Za-z0-9_]*$/, "an identifier: letters, digits, underscore");
/** Parameter values as mathjs reads them, e.g. "3.3 kohm"; the engine checks them, zod only bounds them. */
const quantityText = z.string().trim().min(1).max(100).meta({ example: "10 kohm" });
export const paramValuesSchema = z
  .record(identifier, quantityText)
  .refine((r) => Object.keys(r).length <= 64, "at most 64 parameters")
  .meta({ description: "New parameter values by name", example: { R: "3.9 kohm", C: "22 nF" } });

export const newVersionJsonSchema = z.strictObject({
  params: paramValuesSchema,
  baseVersion: versionNumberSchema.meta({ description: "The head version the change was made against" }),
  message: storedText(2000).optional().meta({ description: "What changed and why" }),
});

export const forkBodySchema = z.strictObject({
  fromVersion: versionNumberSchema.optional().meta({ description: "Version to fork (default: the head)" }),
  slug: slugSchema.optional().meta({ description: "Slug of the new block (default: derived from the parent's)" }),
  title: storedText(200).trim().min(1).optional(),
  params: paramValuesSchema.optional(),
  team: teamSlugSchema.optional().meta({ description: "Team that owns the fork (default: the caller's team)" }),
  message: storedText(2000).optional().meta({ description: "Why the fork was made (default: where it came from)" }),
});

/** One block by slug. */
export const blockInputSchema = z.object({ slug: slugSchema });
/** One version of a block (the head when version is left out): what read services take. */
export const blockVersionInputSchema = z.object({ slug: slugSchema, version: versionNumberSchema.optional() });

/** Two versions of one block, side by side. */
export const compareInputSchema = z.object({ slug: slugSchema, a: versionNumberSchema, b: versionNumberSchema });

/** What forkBlock takes: the API body plus the source block's slug from the path or the form. */
export const forkInputSchema = forkBodySchema.extend({ source: slugSchema });

/** The fork page's form: save the values on screen as a fork or as the next version of this block. */
export const retuneFormSchema = z.object({
  source: slugSchema,
  fromVersion: versionNumberSchema,
  saveAs: z.enum(["fork", "version"]),
  newSlug: slugSchema.optional().or(z.literal("")),
  title: z.string().trim().max(200).optional(),
  team: z.string().trim().max(64).optional(),
  message: z.string().trim().max(2000).optional(),
  params: z.string().transform((s, ctx) => {
    try {
      return JSON.parse(s) as unknown;
    } catch {
      ctx.addIssue({ code: "custom", message: "the parameter values could not be read" });
      return z.NEVER;
    }
  }).pipe(paramValuesSchema),
});

export const evaluateBodySchema = z.strictObject({
  params: paramValuesSchema.default({}),
  simulate: z.boolean().optional().meta({ description: "Run the simulations too; without it simulated checks are skipped" }),
  version: versionNumberSchema.optional().meta({ description: "Evaluate this stored version instead of the head" }),
});
/** A draft to simulate from the live preview: values over the head (or a pinned version); the file itself as text/markdown. */
export const draftRunBodySchema = z.strictObject({
  params: paramValuesSchema.default({}),
  version: versionNumberSchema.optional().meta({ description: "Start from this stored version instead of the head" }),
});
/** With a block file body (text/markdown): simulations run unless `simulate=false`. */
export const evaluateFileQuerySchema = z.object({
  simulate: z.enum(["true", "false"]).default("true").transform((v) => v === "true")
    .meta({ description: "Run the simulations (default true for a file: CI wants the simulated quantities)" }),
  team: teamSlugSchema.optional().meta({ description: "Team whose engine budget and models apply (default: a token's own team, or the caller's only team)" }),
});

export const retuneBodySchema = z.strictObject({
  param: identifier.meta({ description: "Parameter to solve for", example: "R" }),
  target: z.strictObject({
    quantity: identifier.meta({ description: "Reported quantity to hit", example: "fc" }),
    value: quantityText.meta({ description: "Target value with its unit", example: "1 kHz" }),
  }),
  series: z.enum(E_SERIES).meta({ description: "IEC 60063 series to snap the result to" }),
  params: paramValuesSchema.optional().meta({ description: "Draft values of the other parameters to solve from (default: the head's)" }),
});

export const createQuerySchema = z.object({
  team: teamSlugSchema.optional().meta({ description: "Team that owns the block (default: a token's own team, or the caller's only team)" }),
  visibility: visibilitySchema.optional(),
});
export const fileVersionQuerySchema = z.object({
  baseVersion: versionNumberSchema,
  message: storedText(2000).optional(),
});

/** What createBlock takes: the create route's query, the block file (the engine judges it) and why it was made. */
export const newBlockSchema = createQuerySchema.extend({
  text: z.string(),
  message: storedText(2000).optional(),
});

/**
 * What addVersion takes: a whole new file (the file route: its query and body), or new values put into the base
 * version's file (the JSON route, the fork page's "as the next version"), on top of `baseVersion`.
 */
export const newVersionSchema = fileVersionQuerySchema.extend({
  slug: slugSchema,
  text: z.string().optional(),
  params: paramValuesSchema.optional(),
});

/** Team-only or readable by anyone: what setVisibility takes. */
export const visibilityInputSchema = blockInputSchema.extend({ visibility: visibilitySchema });

/** A block file typed into a form: browsers send a textarea's line ends as CRLF; block files use LF. */
const formBlockFile = z
  .string()
  .transform((t) => t.replace(/\r\n?/g, "\n"))
  .pipe(z.string().min(1, "the block file is empty").max(MAX_BLOCK_FILE_BYTES, "the block file is larger than 256 KiB"));

/** The import page's last step: create the block from the (possibly edited) file. */
export const importFormSchema = newBlockSchema.extend({
  team: z.string().trim().min(1, "choose a team"),
  visibility: visibilitySchema,
  text: formBlockFile,
});

/** The edit page's form: a whole new file on top of the version it was opened at. */
export const editFormSchema = z.object({
  slug: slugSchema,
  baseVersion: z.coerce.number().int().min(1),
  text: formBlockFile,
  message: z.string().trim().max(2000).optional(),
});
export const formatQuerySchema = z.object({
  format: z.enum(["json", "md", "spice"]).default("json").meta({ description: "json (default), md = the block file, spice = a runnable deck" }),
});
export const badgeQuerySchema = z.object({ version: versionNumberSchema.optional() });

export const searchQuerySchema = z.object({
  q: z.string().max(200).optional(),
  category: categorySchema.optional(),
  badge: badgeSchema.optional(),
  tag: z.string().max(64).optional(),
  team: teamSlugSchema.optional(),
  approved: z.enum(["true", "false"]).transform((v) => v === "true").optional(),
  sort: z.enum(["relevance", "updated", "title"]).optional(),
  cursor: cursorSchema.optional(),
  limit: limitSchema,
});

export type NewVersionJson = z.infer<typeof newVersionJsonSchema>;
export type ForkBody = z.infer<typeof forkBodySchema>;
export type CompareInput = z.infer<typeof compareInputSchema>;
export type BlockInput = z.infer<typeof blockInputSchema>;
export type BlockVersionInput = z.infer<typeof blockVersionInputSchema>;
export type ForkInput = z.infer<typeof forkInputSchema>;
export type RetuneForm = z.infer<typeof retuneFormSchema>;
export type EvaluateBody = z.infer<typeof evaluateBodySchema>;
export type DraftRunBody = z.infer<typeof draftRunBodySchema>;
export type RetuneBody = z.infer<typeof retuneBodySchema>;
export type SearchQuery = z.infer<typeof searchQuerySchema>;
export type NewBlockInput = z.infer<typeof newBlockSchema>;
export type NewVersionInput = z.infer<typeof newVersionSchema>;
export type VisibilityInput = z.infer<typeof visibilityInputSchema>;
/** The search as a form or an address holds it (strings), before the schema coerces it. */
export type SearchFilters = Omit<z.input<typeof searchQuerySchema>, "limit" | "cursor">;
