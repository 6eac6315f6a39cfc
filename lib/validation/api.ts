import { extendZodWithOpenApi } from "@asteasolutions/zod-to-openapi";
import { z } from "zod";
import { SLUG_RULE } from "@/checks";

// zod 4 copies methods onto each schema when it is made, so `.openapi()` must exist before any schema here is built.
extendZodWithOpenApi(z);

// Shapes shared by every /api/v1 route: identifiers in paths and queries, pagination, problem documents.

// The engine's rule for a block file's slug, so a path, a form and the file agree; team slugs follow it too.
export const SLUG_RE = SLUG_RULE;
export const slugSchema = z
  .string()
  .min(1)
  .max(100)
  .regex(SLUG_RE, "lowercase letters, digits and single hyphens")
  .meta({ description: "Block slug, unique across the instance", example: "rc-lowpass-antialias" });
export const teamSlugSchema = z
  .string()
  .min(1)
  .max(64)
  .regex(SLUG_RE, "lowercase letters, digits and single hyphens")
  .meta({ description: "Team slug", example: "fenwick" });

/** Free text the database stores: PostgreSQL text cannot hold U+0000, so it is refused here, naming the field. */
export const storedText = (max: number) =>
  z.string().max(max).refine((s) => !s.includes("\u0000"), "must not contain the NUL character (U+0000)");

/** A version number in a path or query: a positive integer written in decimal. */
export const versionNumberSchema = z.coerce
  .number()
  .int()
  .min(1)
  .max(1_000_000)
  .meta({ description: "Version number, counted from 1", example: 3 });

export const cursorSchema = z.string().min(1).max(200).meta({ description: "Opaque cursor from a previous page's nextCursor" });
export const limitSchema = z.coerce.number().int().min(1).max(100).default(20).meta({ description: "Page size (1–100)" });

export const cursorQuerySchema = z.object({ cursor: cursorSchema.optional(), limit: limitSchema });

export const issueSchema = z
  .object({
    message: z.string(),
    path: z.string().optional().meta({ description: "Dotted path of the offending request field" }),
    line: z.number().int().optional().meta({ description: "Line in the block file, counted from 1" }),
  })
  .meta({ description: "One validation issue" })
  .openapi("Issue");

export const problemSchema = z
  .object({
    type: z.url().meta({ description: "Stable URI naming the kind of problem", example: "https://assay.test/problems/not-found" }),
    title: z.string(),
    status: z.number().int(),
    detail: z.string(),
    head: z.number().int().optional().meta({ description: "On a stale base (409): the current head version" }),
    errors: z.array(issueSchema).optional().meta({ description: "On 422: the validation issues" }),
  })
  .meta({ description: "RFC 9457 problem details" })
  .openapi("Problem");

/** Path segments that cannot name anything answer 404, like a missing resource, not 422. */
export const slugParamsSchema = z.object({ slug: slugSchema });
export const versionParamsSchema = z.object({ slug: slugSchema, n: versionNumberSchema });
export const runParamsSchema = z.object({ id: z.uuid().meta({ description: "Check run id" }) });
export const draftRunParamsSchema = z.object({ id: z.uuid().meta({ description: "Draft run id" }) });

/** URLSearchParams → plain object, dropping empty values so `?q=` means "no q". */
export function queryObject(url: string | URL): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [k, v] of new URL(url).searchParams) if (v !== "") out[k] = v;
  return out;
}

export type Problem = z.infer<typeof problemSchema>;
