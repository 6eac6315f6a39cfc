import { z } from "zod";
import type { OpenAPIRegistry } from "@asteasolutions/zod-to-openapi";
import {
  libraryParamsSchema, modelFileSchema, modelListQuerySchema, modelParamsSchema, modelQuerySchema, modelSummarySchema,
  modelVersionSchema, uploadQuerySchema, uploadResultSchema,
} from "@/lib/validation/models";
import { etagHeaders, json, problems } from "./shared";

export function registerModelPaths(r: OpenAPIRegistry): void {
  r.registerPath({
    method: "get",
    path: "/api/v1/models",
    operationId: "listModels",
    tags: ["models"],
    summary: "The team's model files (every team of a signed-in user; a token's own team by default) and the shared library",
    request: { query: modelListQuerySchema },
    responses: { 200: { description: "Each file's newest version", content: json(z.object({ items: z.array(modelSummarySchema) })) }, ...problems(401, 404, 422) },
  });
  r.registerPath({
    method: "get",
    path: "/api/v1/models/{team}/{name}",
    operationId: "getModel",
    tags: ["models"],
    summary: "One model file: the newest version's text, its versions and the blocks that include it; `?version=n` gives one immutable version",
    description: "Without `version`: Cache-Control no-cache and an ETag over the body (its users' badges change). With `version`: "
      + "that version alone, cached for a year. Team `shared` is the shared model library, readable by anyone.",
    request: { params: modelParamsSchema, query: modelQuerySchema },
    responses: {
      200: { description: "The file (head), or one version", headers: etagHeaders, content: json(z.union([modelFileSchema, modelVersionSchema])) },
      304: { description: "If-None-Match matched the ETag" },
      ...problems(401, 404, 422),
    },
  });
  r.registerPath({
    method: "post",
    path: "/api/v1/models/{team}",
    operationId: "uploadModel",
    tags: ["models"],
    summary: "Upload a model file: a new immutable version (authors and above)",
    description: "Checked like a netlist before anything is stored (no .control, shell, analyses, includes outside the library, "
      + "file-reading code models); a refusal is a 422 whose `errors` carry the file's line. Heads of the team's blocks that "
      + "include the file turn stale and are queued for verification; `reverify` lists them. The same text as the newest version is a 409.",
    request: {
      params: libraryParamsSchema,
      query: uploadQuerySchema,
      body: {
        required: true,
        content: {
          "text/plain": { schema: z.string().meta({ description: "The model file; name it with ?name=" }) },
          "multipart/form-data": { schema: z.object({ file: z.string().meta({ format: "binary", description: "The model file, named by its file name" }) }) },
        },
      },
    },
    responses: { 201: { description: "The new version", content: json(uploadResultSchema) }, ...problems(401, 403, 404, 409, 413, 415, 422) },
  });
}
