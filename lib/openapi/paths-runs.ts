import { z } from "zod";
import type { OpenAPIRegistry } from "@asteasolutions/zod-to-openapi";
import { runParamsSchema, slugParamsSchema } from "@/lib/validation/api";
import { evaluateBodySchema, retuneBodySchema } from "@/lib/validation/blocks";
import { reportSchema, retuneResultSchema, runSchema } from "./responses";
import { json, problems } from "./shared";

export function registerRunPaths(r: OpenAPIRegistry): void {
  r.registerPath({
    method: "post",
    path: "/api/v1/blocks/{slug}/evaluate",
    operationId: "evaluateBlock",
    tags: ["checks"],
    summary: "Check the head with draft parameter values; nothing is stored",
    description: "Without simulate the checks that need a simulation are skipped and the status is never verified. "
      + "Engine calls are budgeted per minute: per token or signed-in user, and for signed-out callers per block and overall; "
      + "an evaluation costs 1 point, with simulate 6, a retune 2 (defaults 60 points per caller, 20 per block and 60 overall signed out).",
    request: { params: slugParamsSchema, body: { required: true, content: json(evaluateBodySchema) } },
    responses: { 200: { description: "The report", content: json(reportSchema) }, ...problems(401, 403, 404, 413, 415, 422, 429) },
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
