import { route } from "@/lib/api/handler";
import { AppError } from "@/lib/errors";

export const dynamic = "force-dynamic";

const BODY = JSON.stringify({ slug: "bench", version: 1 });

// The floor for bench/api: the same wrapper and server with no caller, database or engine. Off unless ASSAY_BENCH=1.
export const GET = route(async () => {
  if (process.env.ASSAY_BENCH !== "1") throw new AppError("not_found", "no such resource");
  return new Response(BODY, { headers: { "Content-Type": "application/json", "Cache-Control": "no-store" } });
});
