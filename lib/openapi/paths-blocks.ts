import { z } from "zod";
import type { OpenAPIRegistry } from "@asteasolutions/zod-to-openapi";
import { slugParamsSchema, versionParamsSchema } from "@/lib/validation/api";
import {
  badgeQuerySchema,
  createQuerySchema,
  fileVersionQuerySchema,
  forkBodySchema,
  formatQuerySchema,
  newVersionJsonSchema,
  searchQuerySchema,
} from "@/lib/validation/blocks";
import { blockSchema, createdSchema, searchResultSchema, versionListSchema } from "./responses";
import { blockFileBody, cursorQuery, etagHeaders, json, problems } from "./shared";


const createdResponse = {
  description: "Created; the first check run is queued",
  headers: z.object({ Location: z.string().meta({ description: "URL of the new version" }) }),
  content: json(createdSchema),
};

const blockRepresentations = {
  description: "The block: JSON, or with ?format=md the block file, with ?format=spice a runnable deck",
  headers: etagHeaders,
  content: {
    ...json(blockSchema),
    "text/markdown": { schema: { type: "string" as const } },
    "text/plain": { schema: { type: "string" as const } },
  },
};

export function registerBlockPaths(r: OpenAPIRegistry): void {
  r.registerPath({
    method: "get",
    path: "/api/v1/blocks",
    operationId: "searchBlocks",
    tags: ["blocks"],
    summary: "Search the library",
    description: "Full-text search over the blocks the caller may read, with filters. Pages follow nextCursor.",
    request: { query: searchQuerySchema },
    responses: { 200: { description: "One page of results", content: json(searchResultSchema) }, ...problems(401, 422) },
  });
  r.registerPath({
    method: "post",
    path: "/api/v1/blocks",
    operationId: "createBlock",
    tags: ["blocks"],
    summary: "Create a block from a block file",
    request: { query: createQuerySchema, body: { required: true, content: blockFileBody } },
    responses: { 201: createdResponse, ...problems(401, 403, 404, 409, 413, 415, 422) },
  });
  r.registerPath({
    method: "get",
    path: "/api/v1/blocks/{slug}",
    operationId: "getBlock",
    tags: ["blocks"],
    summary: "The head version of a block",
    description:
      "Strong ETag over the exact body; Cache-Control no-cache, so clients revalidate with If-None-Match and get 304 while nothing changed.",
    request: { params: slugParamsSchema, query: formatQuerySchema },
    responses: { 200: blockRepresentations, 304: { description: "Not modified", headers: etagHeaders }, ...problems(401, 404, 422) },
  });
  r.registerPath({
    method: "get",
    path: "/api/v1/blocks/{slug}/versions",
    operationId: "listVersions",
    tags: ["versions"],
    summary: "The versions of a block, newest first",
    request: { params: slugParamsSchema, query: cursorQuery },
    responses: { 200: { description: "One page of versions", content: json(versionListSchema) }, ...problems(401, 404, 422) },
  });
  r.registerPath({
    method: "post",
    path: "/api/v1/blocks/{slug}/versions",
    operationId: "addVersion",
    tags: ["versions"],
    summary: "Add a version: new parameter values as JSON, or a whole block file with ?baseVersion=n",
    request: {
      params: slugParamsSchema,
      query: fileVersionQuerySchema.partial(),
      body: { required: true, content: { ...json(newVersionJsonSchema), ...blockFileBody } },
    },
    responses: { 201: createdResponse, ...problems(401, 403, 404, 409, 413, 415, 422) },
  });
  r.registerPath({
    method: "get",
    path: "/api/v1/blocks/{slug}/versions/{n}",
    operationId: "getVersion",
    tags: ["versions"],
    summary: "One immutable version",
    description:
      "The text of a version never changes, but its badge, approval and report do: the JSON carries a strong ETag with no-cache. " +
      "?format=md and ?format=spice are immutable and cached for a year.",
    request: { params: versionParamsSchema, query: formatQuerySchema },
    responses: { 200: blockRepresentations, 304: { description: "Not modified", headers: etagHeaders }, ...problems(401, 404, 422) },
  });
  r.registerPath({
    method: "post",
    path: "/api/v1/blocks/{slug}/forks",
    operationId: "forkBlock",
    tags: ["blocks"],
    summary: "Fork a block, optionally with new values, title, slug or team",
    request: { params: slugParamsSchema, body: { required: false, content: json(forkBodySchema) } },
    responses: { 201: createdResponse, ...problems(401, 403, 404, 409, 413, 415, 422) },
  });
  r.registerPath({
    method: "get",
    path: "/api/v1/blocks/{slug}/badge.svg",
    operationId: "getBadge",
    tags: ["blocks"],
    summary: "The hallmark of the head (or ?version=n) as an embeddable SVG",
    security: [{}],
    request: { params: slugParamsSchema, query: badgeQuerySchema },
    responses: {
      200: { description: "SVG image, Cache-Control max-age=60", content: { "image/svg+xml": { schema: { type: "string" } } } },
      ...problems(404, 422),
    },
  });
}
