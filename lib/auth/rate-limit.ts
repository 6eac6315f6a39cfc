import { RateLimiterMemory, RateLimiterRes } from "rate-limiter-flexible";
import { AppError } from "@/lib/errors";

// Sign-in guesses and link requests, counted per address and per client IP (memory store: one app process).
// Per address: 5 tries in 15 minutes stops guessing one person's password; per IP: 30 covers a shared office.
const holder = globalThis as unknown as { __assayLimiters?: Record<string, RateLimiterMemory> };

function limiter(name: string, points: number, duration: number): RateLimiterMemory {
  holder.__assayLimiters ??= {};
  return (holder.__assayLimiters[name] ??= new RateLimiterMemory({ keyPrefix: name, points, duration }));
}

const limits = {
  "sign-in:address": () => limiter("sign-in:address", 5, 15 * 60),
  "sign-in:ip": () => limiter("sign-in:ip", 30, 15 * 60),
  "link:address": () => limiter("link:address", 3, 15 * 60),
  "link:ip": () => limiter("link:ip", 20, 15 * 60),
} as const;

export type LimitName = keyof typeof limits;

function minutes(ms: number): string {
  const m = Math.max(1, Math.ceil(ms / 60_000));
  return m === 1 ? "a minute" : `${m} minutes`;
}

/** Counts one attempt against each key; over the limit → AppError("rate_limited") with a readable wait. */
export async function consume(pairs: [LimitName, string][]): Promise<void> {
  for (const [name, key] of pairs) {
    try {
      await limits[name]().consume(key.toLowerCase());
    } catch (e) {
      if (!(e instanceof RateLimiterRes)) throw e;
      const who = name.endsWith(":ip") ? "from this network" : "for this address";
      throw new AppError("rate_limited", `Too many sign-in attempts ${who}. Try again in ${minutes(e.msBeforeNext)}.`, {
        retryAfter: Math.ceil(e.msBeforeNext / 1000),
      });
    }
  }
}

/** A successful sign-in forgives that address's failed attempts. */
export async function forgive(name: LimitName, key: string): Promise<void> {
  await limits[name]().delete(key.toLowerCase());
}

/**
 * The client address for per-IP limits. Next fills x-forwarded-for with the socket address only when the request
 * has none, and a proxy in front appends the address it saw, so the last entry is the one a client cannot choose
 * behind one appending proxy. Served directly, a client can send its own header: the per-address limit still holds.
 */
export function clientIp(headers: Headers | Record<string, string | string[] | undefined> | undefined): string {
  const get = (n: string): string | undefined => {
    if (!headers) return undefined;
    if (headers instanceof Headers) return headers.get(n) ?? undefined;
    const v = headers[n];
    return Array.isArray(v) ? v[0] : v;
  };
  const hops = (get("x-forwarded-for") ?? "").split(",").map((h) => h.trim()).filter(Boolean);
  return (hops.at(-1) || get("x-real-ip") || "unknown").toLowerCase();
}
