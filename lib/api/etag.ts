import "server-only";
import { createHash } from "node:crypto";

/** A strong validator over the exact bytes sent: it covers badge, approval and report, which change after a version is written. */
export function strongEtag(body: string | Uint8Array): string {
  return `"${createHash("sha256").update(body).digest("base64url").slice(0, 32)}"`;
}

/** RFC 9110 §13.1.2: If-None-Match uses the weak comparison, so W/"x" matches "x"; `*` matches any current representation. */
export function matchesIfNoneMatch(req: Request, etag: string): boolean {
  const header = req.headers.get("if-none-match");
  if (!header) return false;
  if (header.trim() === "*") return true;
  const opaque = (t: string) => t.trim().replace(/^W\//, "");
  return header.split(",").some((t) => opaque(t) === opaque(etag));
}

/** 304 repeats ETag, Cache-Control and Vary (RFC 9110 §15.4.5) so caches can refresh their stored copy. */
function notModified(h: Record<string, string>): Response {
  const { "Content-Type": _ct, "Content-Disposition": _cd, ...rest } = h;
  return new Response(null, { status: 304, headers: rest });
}

/** Answers with the body, or 304 when the client already holds it; the validator is a hash of the body. */
export function conditional(req: Request, body: string, headers: Record<string, string>): Response {
  const h: Record<string, string> = { ...headers, ETag: strongEtag(body) };
  if (matchesIfNoneMatch(req, h.ETag)) return notModified(h);
  return new Response(body, { status: 200, headers: h });
}

/**
 * The same with a validator computed beforehand from everything the body is a function of (the caller vouches
 * that it changes whenever the body would): a match answers 304 without building the body at all.
 */
export async function conditionalBuilt(req: Request, etag: string, build: () => Promise<string>, headers: Record<string, string>): Promise<Response> {
  const h: Record<string, string> = { ...headers, ETag: etag };
  if (matchesIfNoneMatch(req, etag)) return notModified(h);
  return new Response(await build(), { status: 200, headers: h });
}
