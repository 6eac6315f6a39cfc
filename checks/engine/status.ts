import type { Report } from "./types";

/** error outranks failing; a report with no checks, or with skipped ones, is unchecked (DESIGN.md). */
export function reportStatus(r: Pick<Report, "checks" | "errors">): Report["status"] {
  if (r.errors.length || r.checks.some((c) => c.status === "error")) return "error";
  if (r.checks.some((c) => c.status === "fail")) return "failing";
  if (r.checks.length === 0 || r.checks.some((c) => c.status === "skipped")) return "unchecked";
  return "verified";
}
