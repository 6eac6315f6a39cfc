import path from "node:path";
import openapiTS, { astToString } from "openapi-typescript";
import { openApiDocument } from "./document";

// lib/openapi/write-types.ts writes the file; a unit test fails when the committed copy drifts from the document.
export const SCHEMA_TYPES_PATH = path.resolve(process.cwd(), "lib/openapi/schema.d.ts");

const HEADER = "// Generated from /api/v1/openapi.json by `npm run -s openapi:types`. Do not edit.\n";

export async function renderSchemaTypes(doc: object = openApiDocument()): Promise<string> {
  const ast = await openapiTS(structuredClone(doc) as never, { alphabetize: true });
  return HEADER + astToString(ast);
}
