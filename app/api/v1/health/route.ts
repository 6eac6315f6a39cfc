import { checkHealth } from "@/lib/health/health";
import "@/lib/health/probes";

export const dynamic = "force-dynamic";

// 503 only when the database is down: search and worker trouble is reported, not fatal.
export async function GET() {
  const health = await checkHealth();
  return Response.json(health, {
    status: health.db === "ok" ? 200 : 503,
    headers: { "Cache-Control": "no-store" },
  });
}
