import { ConnectionException } from "@mikro-orm/core";
import { MeilisearchApiError, MeilisearchRequestError, MeilisearchRequestTimeOutError } from "meilisearch";

// A part the app depends on is down: the request may succeed later, so it is a 503 with Retry-After, not a 500.
export type Outage = "database" | "search";

// PostgreSQL SQLSTATE class 08 (connection exception) and 57P0x (operator intervention: shutdown, cannot connect
// now); Node socket errors; the pool's own time-out. (PostgreSQL 15 manual, Appendix A "Error Codes".)
const DB_CODES = /^(08\d{3}|57P0[1-3]|ECONNREFUSED|ECONNRESET|ETIMEDOUT|EPIPE|ENOTFOUND|EHOSTUNREACH)$/;
const DB_MESSAGES = /Connection terminated|Timeout acquiring a connection|the database system is (starting up|shutting down)|connect ECONNREFUSED|Client has encountered a connection error|Connection ended unexpectedly/i;

function chain(err: unknown): unknown[] {
  const out: unknown[] = [];
  for (let e = err, i = 0; e && i < 6; e = (e as { cause?: unknown }).cause, i++) out.push(e);
  return out;
}

export function outageOf(err: unknown): Outage | null {
  for (const e of chain(err)) {
    if (e instanceof MeilisearchRequestError || e instanceof MeilisearchRequestTimeOutError) return "search";
    if (e instanceof MeilisearchApiError && (e.response?.status ?? 0) >= 500) return "search";
  }
  for (const e of chain(err)) {
    if (e instanceof ConnectionException) return "database";
    const code = String((e as { code?: unknown }).code ?? "");
    if (DB_CODES.test(code) || DB_MESSAGES.test(String((e as Error).message ?? ""))) return "database";
  }
  return null;
}

/** Seconds a client should wait before trying again: a restart of either part takes a few seconds. */
export const RETRY_AFTER_S = 5;
