import { z } from "zod";
import "@/lib/validation/api";
import { badgeSchema, categorySchema, visibilitySchema } from "@/lib/validation/blocks";

// The JSON the API answers with, as zod schemas: the OpenAPI document is generated from them,
// and the integration tests parse live responses with them so the document cannot drift from the code.

const blockError = z.object({ message: z.string(), line: z.number().int().optional() });

const quantity = z.object({
  value: z.number().meta({ description: "Plain number in the named unit, no prefix" }),
  unit: z.string().meta({ example: "Hz" }),
  text: z.string().meta({ example: "2.192 kHz" }),
  simulated: z.literal(true).optional().meta({ description: "Measured on a simulation result rather than computed by hand" }),
});

const checkResult = z.object({
  label: z.string(),
  status: z.enum(["pass", "fail", "error", "skipped"]),
  detail: z.string(),
  line: z.number().int().optional(),
  simulated: z.boolean().optional(),
  worst: z.object({ corner: z.record(z.string(), z.string()), detail: z.string() }).optional(),
  corners: z
    .object({ quantity: z.string(), unit: z.string(), values: z.array(z.number()), nominal: z.number(), limits: z.array(z.number()) })
    .optional(),
});

export const reportSchema = z
  .object({
    slug: z.string(),
    status: z.enum(["verified", "failing", "error", "unchecked"]),
    quantities: z.record(z.string(), quantity),
    checks: z.array(checkResult),
    simulations: z.array(
      z.object({ analysis: z.enum(["tran", "ac", "op", "dc", "noise", "tf"]), points: z.number().int(), ms: z.number(), cached: z.boolean().optional() }),
    ),
    errors: z.array(blockError),
  })
  .meta({ description: "Result of checking one block file" }).openapi("Report");

export const paramSchema = z.object({
  name: z.string(),
  value: z.string().meta({ example: "3.3 kohm" }),
  unit: z.string().meta({ description: "SI unit name, empty for plain numbers", example: "ohm" }),
  tol: z.string().nullable().meta({ description: "Percentage or absolute tolerance", example: "1%" }),
  note: z.string().nullable(),
}).openapi("Param");

const versionRef = z.object({ slug: z.string(), version: z.number().int() });
export const runRefSchema = z.object({
  id: z.uuid(),
  status: z.enum(["queued", "running", "done", "error"]),
}).openapi("RunRef");

export const lineageSchema = z.object({
  forkedFrom: versionRef.extend({ title: z.string() }).nullable(),
  parentNewerVersions: z.number().int().meta({ description: "Versions the parent gained since the fork" }),
  forks: z.array(z.object({ slug: z.string(), title: z.string(), fromVersion: z.number().int() })),
}).openapi("Lineage");

export const checkCountsSchema = z.object({
  pass: z.number().int(),
  fail: z.number().int(),
  error: z.number().int(),
  skipped: z.number().int(),
}).openapi("CheckCounts");

export const blockSchema = z.object({
  slug: z.string(),
  title: z.string(),
  category: categorySchema,
  tags: z.array(z.string()),
  summary: z.string(),
  hazard: z.array(z.string()).meta({ description: "mains, high-voltage, high-current, heat: the page shows cautions" }),
  team: z.string(),
  visibility: visibilitySchema,
  version: z.number().int(),
  headVersion: z.number().int(),
  archived: z.boolean().meta({ description: "Archived blocks stay readable but take no new versions" }),
  badge: badgeSchema,
  approved: z.boolean(),
  params: z.array(paramSchema),
  markdown: z.string().meta({ description: "The markdown body after the frontmatter, fences included" }),
  note: z.string().meta({ description: "The design note without the spice and check fences" }),
  netlist: z.string(),
  script: z.string(),
  contentHash: z.string(),
  report: reportSchema.nullable().meta({ description: "Report of the latest finished run of this version" }),
  checkCounts: checkCountsSchema.nullable(),
  run: runRefSchema.nullable().meta({ description: "Latest check run of this version" }),
  forkedFrom: versionRef.nullable(),
  lineage: lineageSchema,
  createdAt: z.iso.datetime(),
  author: z.string().meta({ description: "Name of the version's author" }),
}).openapi("Block");

const highlightRun = z.object({ text: z.string(), match: z.boolean() });
export const blockSummarySchema = z.object({
  slug: z.string(),
  title: z.string(),
  summary: z.string(),
  category: z.string(),
  tags: z.array(z.string()),
  team: z.string(),
  visibility: visibilitySchema,
  version: z.number().int(),
  badge: badgeSchema,
  approved: z.boolean(),
  updatedAt: z.string(),
  highlight: z.object({ title: z.array(highlightRun), summary: z.array(highlightRun) }).optional(),
}).openapi("BlockSummary");

export const searchResultSchema = z.object({
  items: z.array(blockSummarySchema),
  nextCursor: z.string().nullable(),
  estimatedTotal: z.number().int(),
  facets: z
    .record(z.string(), z.record(z.string(), z.number().int()))
    .meta({ description: "Counts per value of category, badge, tags, team and approved over all matches" }),
}).openapi("SearchResult");

export const createdSchema = z.object({ slug: z.string(), version: z.number().int(), run: runRefSchema }).openapi("Created");

export const runSchema = z.object({
  id: z.uuid(),
  slug: z.string(),
  version: z.number().int(),
  status: runRefSchema.shape.status,
  badge: badgeSchema,
  report: reportSchema.nullable(),
  durationMs: z.number().int().nullable(),
  progress: z.object({
    done: z.number().int().min(0).meta({ description: "Simulations finished" }),
    total: z.number().int().min(0).meta({ description: "Simulations the run needs, as far as the engine has planned them; it may grow while the run is in progress" }),
  }).meta({ description: "How far the run's simulations have come; done equals total once the run is done", example: { done: 12, total: 40 } }),
  error: z.string().nullable().meta({ description: "Why the run ended as error, or why an earlier attempt was retried" }),
  models: z.array(z.object({
    name: z.string(), sha256: z.string(), source: z.enum(["team", "shared"]), version: z.number().int().nullable(),
  })).nullable().optional().meta({ description: "The model files the run simulated with (team files by version, shared files by sha256)" }),
  createdAt: z.iso.datetime(),
  finishedAt: z.iso.datetime().nullable(),
}).openapi("Run");

export const draftRunSchema = z.object({
  id: z.uuid(),
  slug: z.string(),
  status: z.enum(["queued", "running", "done", "error", "cancelled"])
    .meta({ description: "queued behind another draft run of this server, running, done (report set), error (the engine could not run it) or cancelled" }),
  progress: z.object({
    done: z.number().int().min(0).meta({ description: "Simulations finished" }),
    total: z.number().int().min(0).meta({ description: "Simulations the draft needs, as far as the engine has planned them" }),
  }).meta({ example: { done: 3, total: 9 } }),
  report: reportSchema.nullable().meta({ description: "The full report once done; nothing of it is stored" }),
  error: z.string().nullable().meta({ description: "Why it ended as error or cancelled" }),
  createdAt: z.iso.datetime(),
  finishedAt: z.iso.datetime().nullable(),
}).openapi("DraftRun");

export const retuneResultSchema = z.object({
  value: z.string().meta({ description: "Solved value with its unit", example: "10.3 kohm" }),
  snapped: z.string().meta({ description: "Nearest value of the series", example: "10 kohm" }),
  report: reportSchema,
}).openapi("RetuneResult");

export const versionListSchema = z.object({
  items: z.array(
    z.object({
      version: z.number().int(),
      badge: badgeSchema,
      approved: z.boolean(),
      author: z.string(),
      message: z.string(),
      createdAt: z.iso.datetime(),
    }),
  ),
  nextCursor: z.string().nullable(),
}).openapi("VersionList");
