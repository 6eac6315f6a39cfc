import { OpenAPIRegistry, OpenApiGeneratorV31 } from "@asteasolutions/zod-to-openapi";
import { tokenRules } from "@/lib/tokens/rules";
import { registerBlockPaths } from "./paths-blocks";
import { registerModelPaths } from "./paths-models";
import { registerRunPaths } from "./paths-runs";

function buildRegistry(): OpenAPIRegistry {
  const r = new OpenAPIRegistry();
  r.registerComponent("securitySchemes", "bearerToken", {
    type: "http",
    scheme: "bearer",
    description: `An API token (asy_…) bound to one team, scope read or write; its rights are its scope intersected with the user's role. ${tokenRules().create} ${tokenRules().manage}`,
  });
  r.registerComponent("securitySchemes", "sessionCookie", {
    type: "apiKey",
    in: "cookie",
    name: "next-auth.session-token",
    description: "The browser session of a signed-in user.",
  });
  registerBlockPaths(r);
  registerRunPaths(r);
  registerModelPaths(r);
  return r;
}

let cached: ReturnType<OpenApiGeneratorV31["generateDocument"]> | undefined;

/** The OpenAPI 3.1 document of /api/v1, generated from the same zod schemas the routes validate with. */
export function openApiDocument() {
  cached ??= new OpenApiGeneratorV31(buildRegistry().definitions).generateDocument({
    openapi: "3.1.0",
    info: {
      title: "Assay REST API",
      version: "1.0.0",
      description:
        "Read, create, fork and check verified circuit blocks. Errors are RFC 9457 problem documents (application/problem+json) " +
        "whose `type` is a stable URI under https://assay.test/problems/.",
    },
    servers: [{ url: "/" }],
    // Anonymous callers may read public blocks, so every operation also allows no credentials.
    security: [{ bearerToken: [] }, { sessionCookie: [] }, {}],
    tags: [
      { name: "blocks", description: "Blocks and their head versions" },
      { name: "versions", description: "Immutable versions" },
      { name: "checks", description: "Check runs, evaluation and retuning" },
      { name: "models", description: "Team and shared model files that blocks include" },
      { name: "service", description: "Health and this description" },
    ],
  });
  return cached;
}
