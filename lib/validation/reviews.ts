import { z } from "zod";
import { slugSchema, versionNumberSchema } from "./api";

// Reviews and watches: the forms on the block page and the services parse with these.

/** One version of one block, as the review and watch forms post it. */
export const reviewTargetSchema = z.object({ slug: slugSchema, version: versionNumberSchema });

export const decisionInputSchema = reviewTargetSchema.extend({
  decision: z.enum(["approved", "changes-requested"]),
  comment: z.string().trim().max(5000).default(""),
});

export const watchFormSchema = z.object({ slug: slugSchema, watching: z.enum(["true", "false"]) });

export type ReviewTarget = z.infer<typeof reviewTargetSchema>;
export type DecisionInput = z.infer<typeof decisionInputSchema>;
