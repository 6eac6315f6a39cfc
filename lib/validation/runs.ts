import { z } from "zod";
import { draftRunParamsSchema, runParamsSchema, slugSchema } from "./api";
import { draftRunBodySchema, evaluateBodySchema, paramValuesSchema, retuneBodySchema } from "./blocks";

// What the run services take: a run by id, a block's runs, and the engine calls that store nothing.

/** One run by id (the route's path parameter). */
export const runInputSchema = runParamsSchema;

/** Every run of a block, newest first, at most `limit`. */
export const runListInputSchema = z.object({ slug: slugSchema, limit: z.number().int().min(1).max(500).optional() });

/** Draft values on screen, previewed without simulations. */
export const previewInputSchema = z.object({ slug: slugSchema, params: paramValuesSchema });

/** The JSON body of POST /blocks/{slug}/evaluate, or an edited block file of this block (`text`). */
export const evaluateInputSchema = evaluateBodySchema.partial({ params: true }).extend({
  slug: slugSchema,
  text: z.string().optional(),
});

/** POST /blocks/{slug}/retune: the body and the block. */
export const retuneInputSchema = retuneBodySchema.extend({ slug: slugSchema });

/** The editor's draft of a block file, checked live. */
export const draftFileInputSchema = z.object({ slug: slugSchema, text: z.string() });

/** A block file not in the library yet, checked with one team's model files. */
export const evaluateFileInputSchema = z.object({ text: z.string(), simulate: z.boolean(), teamId: z.number().int() });

/** POST /blocks/{slug}/draft-runs: values over the head or a pinned version, or an edited block file of this block. */
export const draftRunInputSchema = draftRunBodySchema.partial({ params: true }).extend({
  slug: slugSchema,
  text: z.string().optional(),
});

/** One draft run by id. */
export const draftRunIdInputSchema = draftRunParamsSchema;

export type RunInput = z.infer<typeof runInputSchema>;
export type DraftRunInput = z.infer<typeof draftRunInputSchema>;
export type DraftRunIdInput = z.infer<typeof draftRunIdInputSchema>;
export type RunListInput = z.infer<typeof runListInputSchema>;
export type PreviewInput = z.infer<typeof previewInputSchema>;
export type EvaluateInput = z.infer<typeof evaluateInputSchema>;
export type RetuneInput = z.infer<typeof retuneInputSchema>;
export type DraftFileInput = z.infer<typeof draftFileInputSchema>;
export type EvaluateFileInput = z.infer<typeof evaluateFileInputSchema>;
