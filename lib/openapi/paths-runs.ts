import { z } from "zod";
import type { OpenAPIRegistry } from "@asteasolutions/zod-to-openapi";
import { draftRunParamsSchema, runParamsSchema, slugParamsSchema } from "@/lib/validation/api";
import { draftRunBodySchema, evaluateBodySchema, evaluateFileQuerySchema, retuneBodySchema } from "@/lib/validation/blocks";
import { draftRunSchema, reportSchema, retuneResultSchema, runSchema } from "./responses";
import { blockFileBody, json, problems } from "./shared";

export function registerRunPaths(r: OpenAPIRegistry): void {
  r.registerPath({
    method: "post",
    path: "/api/v1/blocks/{slug}/evaluate",
    operationId: "evaluateBlock",
    tags: ["checks"],
    summary: "Check the head (or a pinned version) with draft values, or an edited block file of this block; nothing is stored",
    description: "JSON: without simulate the checks that need a simulation are skipped and the status is never verified. "
      + "A block file (text/markdown or multipart `file`) of this block is checked as it is, with simulations unless ?simulate=false. "
      + "Engine calls are budgeted per minute: per token or signed-in user, and for signed-out callers per block and overall; "
      + "an evaluation costs 1 point, with simulate 6, a retune 2 (defaults 60 points per caller, 20 per block and 60 overall signed out).",
    request: {
      params: slugParamsSchema,
      query: evaluateFileQuerySchema.pick({ simulate: true }),
      body: { required: true, content: { ...json(evaluateBodySchema), ...blockFileBody } },
    },
    responses: { 200: { description: "The report", content: json(reportSchema) }, ...problems(401, 403, 404, 413, 415, 422, 429) },
  });
  r.registerPath({
    method: "post",
    path: "/api/v1/evaluate",
    operationId: "evaluateFile",
    tags: ["checks"],
    summary: "Check a block file that is not in the library yet (CI, before a push); nothing is stored",
    description: "For a member of the team (any role, any token scope); simulations run unless ?simulate=false. Budgeted like evaluate.",
    request: { query: evaluateFileQuerySchema, body: { required: true, content: blockFileBody } },
    responses: { 200: { description: "The report", content: json(reportSchema) }, ...problems(401, 404, 413, 415, 422, 429) },
  });
  r.registerPath({
    method: "post",
    path: "/api/v1/blocks/{slug}/retune",
    operationId: "retuneBlock",
    tags: ["checks"],
    summary: "Solve one parameter so a quantity reaches a target, snapped to an E-series value",
    request: { params: slugParamsSchema, body: { required: true, content: json(retuneBodySchema) } },
    responses: { 200: { description: "Solved and snapped values with the report at the snapped value", content: json(retuneResultSchema) }, ...problems(401, 403, 404, 413, 415, 422, 429) },
  });
  r.registerPath({
    method: "post",
    path: "/api/v1/blocks/{slug}/draft-runs",
    operationId: "startDraftRun",
    tags: ["checks"],
    summary: "Simulate a draft (values over the head or a pinned version, or an edited block file of this block) without saving it",
    description: "For a signed-in caller who may read the block. Answers at once; poll GET /api/v1/draft-runs/{id}. Each person has one "
      + "draft run at a time: starting another cancels the running one. Nothing is stored, so no badge changes. The per-run caps "
      + "(ASSAY_RUN_MAX_SIMULATIONS, ASSAY_RUN_MAX_SIM_SECONDS) apply; an over-large draft ends done with an error report. "
      + "Budgeted like evaluate with simulate (6 points).",
    request: { params: slugParamsSchema, body: { required: true, content: { ...json(draftRunBodySchema), ...blockFileBody } } },
    responses: { 202: { description: "Started (or queued)", content: json(draftRunSchema) }, ...problems(401, 403, 404, 413, 415, 422, 429) },
  });
  r.registerPath({
    method: "get",
    path: "/api/v1/draft-runs/{id}",
    operationId: "getDraftRun",
    tags: ["checks"],
    summary: "One of the caller's draft runs, with its progress; poll until status is done, error or cancelled",
    request: { params: draftRunParamsSchema },
    responses: { 200: { description: "The draft run", content: json(draftRunSchema) }, ...problems(401, 404) },
  });
  r.registerPath({
    method: "delete",
    path: "/api/v1/draft-runs/{id}",
    operationId: "cancelDraftRun",
    tags: ["checks"],
    summary: "Cancel one of the caller's draft runs: its simulations are stopped and no report is kept",
    description: "Answers once its simulator processes have ended; a draft run that already ended is answered as it is.",
    request: { params: draftRunParamsSchema },
    responses: { 200: { description: "The draft run, cancelled", content: json(draftRunSchema) }, ...problems(401, 404) },
  });
  r.registerPath({
    method: "get",
    path: "/api/v1/runs/{id}",
    operationId: "getRun",
    tags: ["checks"],
    summary: "One check run; poll until status is done or error",
    request: { params: runParamsSchema },
    responses: { 200: { description: "The run", content: json(runSchema) }, ...problems(401, 404) },
  });
  r.registerPath({
    method: "get",
    path: "/api/v1/health",
    operationId: "getHealth",
    tags: ["service"],
    summary: "Health of the database, search and workers",
    security: [{}],
    responses: {
      200: {
        description: "Each part ok or a reason",
        content: json(z.object({ db: z.string(), search: z.string(), worker: z.string(), indexBacklog: z.number().int(),
          parts: z.record(z.string(), z.string()).optional().describe("Under npm start: each part it runs, ok or why it is down and when it restarts") })),
      },
      503: { description: "The database is down" },
    },
  });
  r.registerPath({
    method: "get",
    path: "/api/v1/openapi.json",
    operationId: "getOpenApi",
    tags: ["service"],
    summary: "This document",
    security: [{}],
    responses: { 200: { description: "OpenAPI 3.1", content: { "application/json": { schema: { type: "object" } } } } },
  });
}
