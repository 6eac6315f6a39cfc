import type { IncomingMessage, ServerResponse } from "node:http";
import { errors, MeiliError } from "./errors";

const MAX_PAYLOAD = 100 * 1024 * 1024; // Meilisearch's default http payload limit

export async function readBody(req: IncomingMessage): Promise<string> {
  const chunks: Buffer[] = [];
  let size = 0;
  for await (const chunk of req) {
    size += (chunk as Buffer).length;
    if (size > MAX_PAYLOAD) throw errors.payloadTooLarge();
    chunks.push(chunk as Buffer);
  }
  return Buffer.concat(chunks).toString("utf8");
}

export function parseJson(text: string, code = "bad_request"): unknown {
  if (text.trim() === "") throw new MeiliError(400, code === "malformed_payload" ? "missing_payload" : "bad_request", "A json payload is missing.");
  try {
    return JSON.parse(text);
  } catch (e) {
    throw new MeiliError(400, code, `The json payload provided is malformed. \`${(e as Error).message}\`.`);
  }
}

export function send(res: ServerResponse, status: number, body: unknown) {
  const text = JSON.stringify(body);
  res.writeHead(status, { "content-type": "application/json", "content-length": Buffer.byteLength(text) });
  res.end(text);
}

// The master key as a Bearer token: 401 without an Authorization header, 403
// with any other value.
export function authorize(req: IncomingMessage, key: string) {
  const header = req.headers.authorization;
  if (header === undefined) throw errors.missingAuthorization();
  const m = /^Bearer (.+)$/.exec(header.trim());
  if (!m || m[1] !== key) throw errors.invalidApiKey();
}

export function intParam(q: URLSearchParams, name: string, fallback: number, code: string): number {
  const v = q.get(name);
  if (v === null) return fallback;
  if (!/^\d+$/.test(v)) throw errors.badRequest(`Invalid value in parameter \`${name}\`: could not parse \`${v}\` as a positive integer`, code);
  return Number(v);
}

export function objectBody(value: unknown): Record<string, unknown> {
  if (!value || typeof value !== "object" || Array.isArray(value)) throw errors.badRequest("Invalid value type: expected an object");
  return value as Record<string, unknown>;
}
