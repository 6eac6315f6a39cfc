import "server-only";
import { AppError } from "@/lib/errors";

const SAFE = new Set(["GET", "HEAD", "OPTIONS"]);

/**
 * A write carried by the session cookie must come from our own pages: a browser always sends Origin on a
 * cross-site POST, so a foreign one is refused (defence in depth beside the cookie's SameSite=Lax).
 * Token callers send no cookie and are not affected.
 */
export function refuseCrossSiteCookieWrite(req: Request): void {
  if (SAFE.has(req.method) || req.headers.has("authorization") || !req.headers.has("cookie")) return;
  const origin = req.headers.get("origin");
  if (origin && !sameHost(origin, req.headers.get("host")) && origin !== appOrigin()) {
    throw new AppError("forbidden", "cross-site request refused");
  }
}

// Next hands route handlers a URL whose host may be rewritten (e.g. localhost); the Host header is what the browser used.
const sameHost = (origin: string, host: string | null) => {
  try {
    return host !== null && new URL(origin).host === host;
  } catch {
    return false;
  }
};

const appOrigin = () => {
  try {
    return new URL(process.env.APP_URL ?? "").origin;
  } catch {
    return null;
  }
};
