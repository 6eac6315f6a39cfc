import "server-only";
import { ZodError } from "zod";
import { AppError, ERROR_STATUS, type ErrorCode } from "@/lib/errors";

// One URI base for every problem type; the paths are stable and documented in the OpenAPI document.
export const PROBLEM_BASE = "https://assay.test/problems/";

const TITLES: Record<ErrorCode | "internal", { slug: string; title: string }> = {
  unauthenticated: { slug: "unauthenticated", title: "Sign-in or a valid token is required" },
  forbidden: { slug: "forbidden", title: "Your role does not allow this" },
  not_found: { slug: "not-found", title: "Not found" },
  conflict: { slug: "conflict", title: "Conflict" },
  payload_too_large: { slug: "payload-too-large", title: "Request body too large" },
  unsupported_media_type: { slug: "unsupported-media-type", title: "Unsupported content type" },
  validation: { slug: "validation", title: "The request did not validate" },
  rate_limited: { slug: "rate-limited", title: "Too many requests" },
  unavailable: { slug: "unavailable", title: "Service unavailable" },
  internal: { slug: "internal", title: "Internal error" },
};

const STATUS: Record<ErrorCode | "internal", number> = { ...ERROR_STATUS, internal: 500 };

export const problemTypes = Object.fromEntries(
  Object.entries(TITLES).map(([code, t]) => [code, PROBLEM_BASE + t.slug]),
) as Record<ErrorCode | "internal", string>;
/** A conflict that carries the current head is a stale base: its own type so clients can rebase on it. */
export const STALE_BASE_TYPE = PROBLEM_BASE + "stale-base";
/** Finer kinds in use (services name them with `type` in AppError's extra), listed on the API reference page. */
export const FINER_PROBLEM_TYPES: Record<string, string> = {
  [STALE_BASE_TYPE]: "409 — the base version is not the head; carries `head`",
  [PROBLEM_BASE + "archived"]: "409 — the block is archived and takes no new versions",
};

export interface ProblemDocument {
  type: string;
  title: string;
  status: number;
  detail: string;
  [extra: string]: unknown;
}

export interface Issue {
  message: string;
  path?: string;
  line?: number;
}

/** zod issues as flat { path, message } pairs: what a form or a script needs to point at the bad field. */
export function zodIssues(err: ZodError): Issue[] {
  return err.issues.map((i) => ({ path: i.path.map(String).join(".") || "(body)", message: i.message }));
}

export function problemDocument(err: unknown): ProblemDocument {
  if (err instanceof ZodError) {
    return { type: problemTypes.validation, title: TITLES.validation.title, status: 422, detail: "the request did not validate", errors: zodIssues(err) };
  }
  if (err instanceof AppError) {
    const { type: subtype, title: _ti, status: _s, detail: _d, ...extra } = err.extra;
    // A service may name a finer kind (e.g. "archived"); it stays under our base, never a URI of its own.
    const named = typeof subtype === "string" && /^[a-z]+(-[a-z]+)*$/.test(subtype) ? PROBLEM_BASE + subtype : null;
    const stale = !named && err.code === "conflict" && typeof err.extra.head === "number";
    const doc: ProblemDocument = {
      type: named ?? (stale ? STALE_BASE_TYPE : problemTypes[err.code]),
      title: stale ? "The base version is not the head" : TITLES[err.code].title,
      status: STATUS[err.code],
      detail: err.message,
      ...extra,
    };
    if (err.code === "validation" && !Array.isArray(doc.errors)) doc.errors = [];
    return doc;
  }
  return { type: problemTypes.internal, title: TITLES.internal.title, status: 500, detail: "the server could not complete the request" };
}

/** RFC 9457 response. Anything that is not an AppError or ZodError is logged here and answered with a bare 500. */
export function problem(err: unknown, headers: HeadersInit = {}): Response {
  if (!(err instanceof AppError) && !(err instanceof ZodError)) console.error("[api] unexpected error", err);
  const doc = problemDocument(err);
  const h = new Headers(headers);
  h.set("Content-Type", "application/problem+json");
  h.set("Cache-Control", "no-store");
  if (doc.status === 401) h.set("WWW-Authenticate", 'Bearer realm="assay"');
  // RFC 9110 §10.2.3: a 429 or 503 says in seconds when to come back (the body repeats it as `retryAfter`).
  // The rest of an oversized body is never read: end the connection instead of leaving the client to send it.
  if (doc.status === 413) h.set("Connection", "close");
  if ((doc.status === 429 || doc.status === 503) && typeof doc.retryAfter === "number") h.set("Retry-After", String(doc.retryAfter));
  return new Response(JSON.stringify(doc), { status: doc.status, headers: h });
}
