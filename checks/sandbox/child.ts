// Entry of the sandbox child: evaluates block files sent over IPC, one request at a time.
// The parent kills it on a wall-clock timeout; --max-old-space-size bounds its memory.
import { evaluateBlock } from "../engine/evaluate-block";
import { retuneBlock } from "../engine/retune";
import type { SimBackend } from "../engine/types";

type Request = { id: number; op: "verify" | "preview" | "retune"; text: string; opts?: Record<string, unknown> };

const backends = new Map<string, SimBackend>();
function simulator(cacheDir?: string): SimBackend {
  // Loaded on first use so previews never pay for the simulator side.
  const key = cacheDir ?? "";
  if (!backends.has(key)) {
    const { simBackend } = require("./sim-backend") as { simBackend: (o: { cacheDir?: string }) => SimBackend };
    backends.set(key, simBackend({ cacheDir }));
  }
  return backends.get(key)!;
}

function handle(req: Request): unknown {
  const opts = req.opts ?? {};
  switch (req.op) {
    case "verify": {
      const simulate = opts.simulate !== false;
      return evaluateBlock(req.text, { simulate, params: opts.params as Record<string, string>, backend: simulate ? simulator(opts.cacheDir as string | undefined) : undefined });
    }
    case "preview":
      return evaluateBlock(req.text, { simulate: false, params: opts.params as Record<string, string> }).report;
    case "retune":
      return retuneBlock(req.text, opts as never);
  }
}

process.on("message", (req: Request) => {
  let reply: { id: number; ok: boolean; value?: unknown; error?: string };
  try {
    reply = { id: req.id, ok: true, value: handle(req) };
  } catch (e) {
    const err = e as Error;
    reply = { id: req.id, ok: false, error: err instanceof RangeError ? `the script ran too deep: ${err.message}` : err.message };
  }
  process.send!(reply);
});
process.send!({ id: 0, ok: true, value: "ready" });
// The parent is gone (exited or killed): nothing will ask for more work.
process.on("disconnect", () => process.exit(0));
