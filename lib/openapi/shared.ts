import { z, type ZodType } from "zod";
import { cursorQuerySchema, problemSchema } from "@/lib/validation/api";

const STATUS_TEXT: Record<number, string> = {
  401: "Sign-in or a valid token is required (or the token is malformed, revoked or expired)",
  403: "The caller's role or token scope does not allow this",
  404: "No such resource, or a team block outside the caller's teams",
  409: "Conflict; on a stale base the body carries the current `head`",
  413: "The body is larger than allowed",
  415: "Unsupported Content-Type",
  422: "The request did not validate; `errors` lists the issues",
  429: "Too many engine runs for this caller (signed out: for this block, or for everyone signed out); wait `Retry-After` seconds (`retryAfter` in the body)",
};

const retryAfterHeaders = z.object({
  "Retry-After": z.string().meta({ description: "Seconds until the budget allows this call again (RFC 9110 §10.2.3)" }),
});

export const json = (schema: ZodType) => ({ "application/json": { schema } });

export function problems(...codes: number[]) {
  return Object.fromEntries(
    codes.map((c) => [c, {
      description: STATUS_TEXT[c],
      ...(c === 429 ? { headers: retryAfterHeaders } : {}),
      content: { "application/problem+json": { schema: problemSchema } },
    }]),
  );
}

export const etagHeaders = z.object({
  ETag: z.string().meta({ description: "Strong validator: changes whenever the body would" }),
  "Cache-Control": z.string(),
});

export const cursorQuery = cursorQuerySchema;

/** A block file upload: the body itself, or the `file` part of a form. */
export const blockFileBody = {
  "text/markdown": { schema: { type: "string" as const, description: "A block file (frontmatter, note, spice and check fences), at most 256 KiB" } },
  "multipart/form-data": {
    schema: { type: "object" as const, required: ["file"], properties: { file: { type: "string" as const, contentMediaType: "text/markdown" } } },
  },
};
