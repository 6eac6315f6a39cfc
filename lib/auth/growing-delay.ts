import { AppError } from "@/lib/errors";

// Failed attempts per key (an account, a client): the first few are free, then each further attempt must wait
// twice as long as the one before, up to 15 minutes; a success forgives. Nobody is locked out by someone else's
// guesses at other accounts, and one account's or client's guessing slows only itself.
// Memory store: one app process (npm start runs one).
const MAX_WAIT_MS = 15 * 60_000;
const FORGET_AFTER_MS = 24 * 3600_000;
const MAX_KEYS = 100_000;

interface Entry { failures: number; nextAt: number; lastAt: number }

export class GrowingDelay {
  private entries = new Map<string, Entry>();
  constructor(readonly free: number, readonly firstWaitMs = 1000) {}

  /** Milliseconds this key must still wait before its next attempt (0: it may try now). */
  waitMs(key: string, now = Date.now()): number {
    const e = this.entries.get(key);
    return e ? Math.max(0, e.nextAt - now) : 0;
  }

  /**
   * Counts an attempt as failed before it is checked (a success forgives it), so parallel guesses cannot all
   * slip through before the first one is judged.
   */
  charge(key: string, now = Date.now()): void {
    const e = this.entries.get(key) ?? { failures: 0, nextAt: 0, lastAt: 0 };
    e.failures += 1;
    e.lastAt = now;
    if (e.failures >= this.free) e.nextAt = now + Math.min(this.firstWaitMs * 2 ** (e.failures - this.free), MAX_WAIT_MS);
    this.entries.delete(key); // re-inserted last: the map's order is oldest first, for pruning
    this.entries.set(key, e);
    this.prune(now);
  }

  forgive(key: string): void {
    this.entries.delete(key);
  }

  private prune(now: number) {
    for (const [key, e] of this.entries) {
      if (this.entries.size <= MAX_KEYS && now - e.lastAt < FORGET_AFTER_MS) break;
      this.entries.delete(key);
    }
  }
}

export function waitText(ms: number): string {
  const s = Math.max(1, Math.ceil(ms / 1000));
  if (s < 60) return s === 1 ? "a second" : `${s} seconds`;
  const m = Math.ceil(s / 60);
  return m === 1 ? "a minute" : `${m} minutes`;
}

/** Refuses (429-style AppError) when any of the keys must still wait; otherwise charges every one of them. */
export function attempt(checks: { delay: GrowingDelay; key: string; who: string }[], what = "sign-in attempts"): void {
  for (const c of checks) {
    const wait = c.delay.waitMs(c.key);
    if (wait > 0) {
      throw new AppError("rate_limited", `Too many ${what} ${c.who}. Try again in ${waitText(wait)}.`, { retryAfter: Math.ceil(wait / 1000) });
    }
  }
  for (const c of checks) c.delay.charge(c.key);
}
