import SwaggerParser from "@apidevtools/swagger-parser";
import { describe, expect, it } from "vitest";
import { openApiDocument } from "@/lib/openapi/document";
import openapiTS, { astToString } from "openapi-typescript";
import { asOpenApi, servedRoutes } from "../integration/api-routes";

const ROUTES = [
  "get /api/v1/health",
  "get /api/v1/openapi.json",
  "get /api/v1/blocks",
  "post /api/v1/blocks",
  "get /api/v1/blocks/{slug}",
  "get /api/v1/blocks/{slug}/versions",
  "post /api/v1/blocks/{slug}/versions",
  "get /api/v1/blocks/{slug}/versions/{n}",
  "post /api/v1/blocks/{slug}/forks",
  "post /api/v1/blocks/{slug}/evaluate",
  "post /api/v1/evaluate",
  "post /api/v1/blocks/{slug}/retune",
  "get /api/v1/runs/{id}",
  "post /api/v1/blocks/{slug}/draft-runs",
  "get /api/v1/draft-runs/{id}",
  "delete /api/v1/draft-runs/{id}",
  "get /api/v1/blocks/{slug}/badge.svg",
  "get /api/v1/models",
  "get /api/v1/models/{team}/{name}",
  "post /api/v1/models/{team}",
];

describe("the OpenAPI document", () => {
  it("is a valid OpenAPI 3.1 document (swagger-parser validates against the official schema)", async () => {
    const doc = structuredClone(openApiDocument());
    expect(doc.openapi).toBe("3.1.0");
    await expect(SwaggerParser.validate(doc as never)).resolves.toBeTruthy();
  });

  it("describes every route of DESIGN.md's table", () => {
    const paths = openApiDocument().paths ?? {};
    const ops = Object.entries(paths).flatMap(([p, item]) =>
      Object.keys(item as object).filter((m) => ["get", "post", "put", "patch", "delete"].includes(m)).map((m) => `${m} ${p}`),
    );
    expect(ops.sort()).toEqual([...ROUTES].sort());
  });

  it("describes every route handler under app/api/v1, so a new route must be documented", () => {
    const served = servedRoutes().map(asOpenApi).sort();
    expect(served).toEqual([...ROUTES].sort());
  });

  it("gives every operation an operationId and problem documents for its error statuses", () => {
    for (const item of Object.values(openApiDocument().paths ?? {})) {
      for (const op of Object.values(item as Record<string, { operationId?: string; responses: Record<string, { content?: object }> }>)) {
        expect(op.operationId).toBeTruthy();
        for (const [status, res] of Object.entries(op.responses)) {
          if (Number(status) >= 400 && Number(status) < 500) expect(Object.keys(res.content ?? {})).toEqual(["application/problem+json"]);
        }
      }
    }
  });

  it("renders to client types with openapi-typescript, one typed operation per operationId", async () => {
    const doc = openApiDocument();
    const types = astToString(await openapiTS(structuredClone(doc) as never, { alphabetize: true }));
    const ids = Object.values(doc.paths ?? {}).flatMap((item) => Object.values(item as Record<string, { operationId?: string }>).map((op) => op.operationId));
    for (const id of ids) expect(types).toContain(`operations["${id}"]`);
    for (const name of ["Block", "Run", "Report", "Problem"]) expect(types).toMatch(new RegExp(`\\b${name}: \\{`));
  });
});
