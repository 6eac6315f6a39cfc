import { RateLimiterMemory, RateLimiterRes } from "rate-limiter-flexible";
import { AppError } from "@/lib/errors";
import { GrowingDelay, attempt, waitText } from "./growing-delay";

// Password guesses slow down per account and per client (the client only when a trusted proxy names it, see
// clientIp) with growing delays; there is no bucket shared by everybody, so guesses at other addresses never
// lock the real owner out. Link requests are counted per address and per client (memory store: one app process).
const holder = globalThis as unknown as { __assayLimits?: { delays: Record<string, GrowingDelay>; links: Record<string, RateLimiterMemory> } };
function store() {
  return (holder.__assayLimits ??= {
    delays: { account: new GrowingDelay(5), client: new GrowingDelay(20, 5000), "password-change": new GrowingDelay(5) },
    links: {
      address: new RateLimiterMemory({ keyPrefix: "link:address", points: 3, duration: 15 * 60 }),
      client: new RateLimiterMemory({ keyPrefix: "link:client", points: 20, duration: 15 * 60 }),
    },
  });
}

/** Before a password is checked: refused while this address or this client must wait; else counted. */
export function passwordAttempt(address: string, ip: string | null): void {
  const { delays } = store();
  attempt([
    { delay: delays.account, key: address.toLowerCase(), who: "for this address" },
    ...(ip ? [{ delay: delays.client, key: ip, who: "from this network" }] : []),
  ]);
}

/** The right password forgives its account's failed attempts (the client's stay counted). */
export function passwordAccepted(address: string): void {
  store().delays.account.forgive(address.toLowerCase());
}

/** A sign-in link redeemed from a client: link tokens cannot be guessed, so only a named client is slowed. */
export function linkRedeemAttempt(ip: string | null): void {
  if (ip) attempt([{ delay: store().delays.client, key: ip, who: "from this network" }]);
}

/** The current password on the password-change form: guesses slow down per account like sign-in ones. */
export function currentPasswordAttempt(userId: number): void {
  attempt([{ delay: store().delays["password-change"], key: String(userId), who: "at the current password" }], "wrong guesses");
}
export function currentPasswordAccepted(userId: number): void {
  store().delays["password-change"].forgive(String(userId));
}

/** At most three links to one address and twenty from one client per quarter hour. */
export async function linkRequest(address: string, ip: string | null): Promise<void> {
  const { links } = store();
  const pairs: [RateLimiterMemory, string, string][] = [[links.address, address.toLowerCase(), "for this address"]];
  if (ip) pairs.push([links.client, ip, "from this network"]);
  for (const [limiter, key, who] of pairs) {
    try {
      await limiter.consume(key);
    } catch (e) {
      if (!(e instanceof RateLimiterRes)) throw e;
      throw new AppError("rate_limited", `Too many sign-in attempts ${who}. Try again in ${waitText(e.msBeforeNext)}.`, {
        retryAfter: Math.ceil(e.msBeforeNext / 1000),
      });
    }
  }
}

/** ASSAY_TRUSTED_PROXY=1: the app is reached only through a proxy that appends the peer to x-forwarded-for. */
export const trustsProxy = (): boolean => process.env.ASSAY_TRUSTED_PROXY === "1";

/**
 * The client IP for per-IP limits, or null when there is none to believe. Next 16 gives a route handler, a server
 * action and next-auth's authorize no peer address (NextRequest.ip is gone), and sets x-forwarded-for to the socket
 * address only when the request has none — so a client talking to `next start` directly writes that header itself,
 * and no header is one Next refuses to take from the client. Only behind a trusted proxy, which appends the address it
 * saw, is the last x-forwarded-for entry the client's; otherwise only per-account limits apply.
 */
export function clientIp(headers: Headers | Record<string, string | string[] | undefined> | undefined): string | null {
  if (!trustsProxy() || !headers) return null;
  const raw = headers instanceof Headers ? headers.get("x-forwarded-for") : headers["x-forwarded-for"];
  const value = Array.isArray(raw) ? raw.join(",") : raw ?? "";
  const last = value.split(",").map((h) => h.trim()).filter(Boolean).at(-1);
  return last ? last.toLowerCase() : null;
}
