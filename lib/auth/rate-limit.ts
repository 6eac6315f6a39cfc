import { RateLimiterMemory, RateLimiterRes } from "rate-limiter-flexible";
import { AppError } from "@/lib/errors";

// Sign-in guesses and link requests, counted per address and per network (memory store: one app process).
// Per address: 5 tries in 15 minutes stops guessing one person's password; per IP: 30 covers a shared office.
// Without a trusted proxy there is no client IP we can believe (see clientIp), so each route falls back to one
// bucket shared by everybody: it caps how fast anyone can spray guesses over many addresses, at the price that
// such a spray also slows everyone's sign-in for a quarter hour (sessions already open are not touched).
const holder = globalThis as unknown as { __assayLimiters?: Record<string, RateLimiterMemory> };

function limiter(name: string, points: number, duration: number): RateLimiterMemory {
  holder.__assayLimiters ??= {};
  return (holder.__assayLimiters[name] ??= new RateLimiterMemory({ keyPrefix: name, points, duration }));
}

const limits = {
  "sign-in:address": () => limiter("sign-in:address", 5, 15 * 60),
  "sign-in:ip": () => limiter("sign-in:ip", 30, 15 * 60),
  "sign-in:all": () => limiter("sign-in:all", 100, 15 * 60),
  "link:address": () => limiter("link:address", 3, 15 * 60),
  "link:ip": () => limiter("link:ip", 20, 15 * 60),
  "link:all": () => limiter("link:all", 50, 15 * 60),
} as const;

export type LimitName = keyof typeof limits;

/** The per-network limit of a route: the client's IP when a trusted proxy names it, else the route's shared bucket. */
export function network(route: "sign-in" | "link", ip: string | null): [LimitName, string] {
  return ip ? [`${route}:ip`, ip] : [`${route}:all`, "all"];
}

function minutes(ms: number): string {
  const m = Math.max(1, Math.ceil(ms / 60_000));
  return m === 1 ? "a minute" : `${m} minutes`;
}

const who = (name: LimitName): string =>
  name.endsWith(":ip") ? "from this network" : name.endsWith(":all") ? "just now" : "for this address";

/** Counts one attempt against each key; over the limit → AppError("rate_limited") with a readable wait. */
export async function consume(pairs: [LimitName, string][]): Promise<void> {
  for (const [name, key] of pairs) {
    try {
      await limits[name]().consume(key.toLowerCase());
    } catch (e) {
      if (!(e instanceof RateLimiterRes)) throw e;
      throw new AppError("rate_limited", `Too many sign-in attempts ${who(name)}. Try again in ${minutes(e.msBeforeNext)}.`, {
        retryAfter: Math.ceil(e.msBeforeNext / 1000),
      });
    }
  }
}

/** A successful sign-in forgives that address's failed attempts. */
export async function forgive(name: LimitName, key: string): Promise<void> {
  await limits[name]().delete(key.toLowerCase());
}

/** ASSAY_TRUSTED_PROXY=1: the app is reached only through a proxy that appends the peer to x-forwarded-for. */
export const trustsProxy = (): boolean => process.env.ASSAY_TRUSTED_PROXY === "1";

/**
 * The client IP for per-IP limits, or null when there is none to believe. Next 16 gives a route handler, a server
 * action and next-auth's authorize no peer address (NextRequest.ip is gone), and sets x-forwarded-for to the socket
 * address only when the request has none — so a client talking to `next start` directly writes that header itself,
 * and no header is one Next refuses to take from the client. Only behind a trusted proxy, which appends the address it
 * saw, is the last x-forwarded-for entry the client's; otherwise the caller uses the route's shared bucket.
 */
export function clientIp(headers: Headers | Record<string, string | string[] | undefined> | undefined): string | null {
  if (!trustsProxy() || !headers) return null;
  const raw = headers instanceof Headers ? headers.get("x-forwarded-for") : headers["x-forwarded-for"];
  const value = Array.isArray(raw) ? raw.join(",") : raw ?? "";
  const last = value.split(",").map((h) => h.trim()).filter(Boolean).at(-1);
  return last ? last.toLowerCase() : null;
}
