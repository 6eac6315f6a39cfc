// Entry of the sandbox child: evaluates block files sent over IPC, one request at a time.
// The parent kills it on a wall-clock timeout; --max-old-space-size bounds its memory.
import { evaluateBlock, evaluateBlockAsync } from "../engine/evaluate-block";
import type { SimExecutor, SimOutcome } from "../engine/executor";
import type { RunCap } from "../engine/plan";
import type { SimSide } from "../engine/variant";
import { retuneBlock } from "../engine/retune";
import type { ModelTexts } from "../spice/sanitize";
import { startupSnapshot } from "node:v8";
import { warmUp } from "./warm-up";

type Request = { id: number; op: "verify" | "preview" | "retune"; text: string; opts?: Record<string, unknown> };
type Outcomes = { kind: "outcomes"; call: number; outcomes?: SimOutcome[]; error?: string };

// Loaded on first use so previews never pay for the simulator side; one per request, as it carries the block's models.
const simulator = (models?: ModelTexts): SimSide => (require("./sim-side") as typeof import("./sim-side")).simSide(models);
const local = (cacheDir?: string): SimExecutor =>
  (require("../spice/local-executor") as typeof import("../spice/local-executor")).localExecutor({ cacheDir });

// The parent's executor (a queue spreading simulations over workers), reached over IPC.
const calls = new Map<number, { resolve: (o: SimOutcome[]) => void; reject: (e: Error) => void }>();
let nextCall = 1;
const remote = (id: number): SimExecutor => ({
  runMany: (reqs) =>
    new Promise((resolve, reject) => {
      const call = nextCall++;
      calls.set(call, { resolve, reject });
      process.send!({ id, kind: "runMany", call, reqs });
    }),
});

async function handle(req: Request): Promise<unknown> {
  const opts = req.opts ?? {};
  const models = opts.models as ModelTexts | undefined;
  switch (req.op) {
    case "verify": {
      const params = opts.params as Record<string, string> | undefined;
      if (opts.simulate === false) return evaluateBlock(req.text, { params, models });
      const executor = opts.remote ? remote(req.id) : local(opts.cacheDir as string | undefined);
      const progress = (done: number, total: number) => process.send!({ id: req.id, kind: "progress", done, total });
      return evaluateBlockAsync(req.text, { simulate: true, params, executor, side: simulator(models), progress, cap: opts.cap as RunCap | undefined, models });
    }
    case "preview":
      return evaluateBlock(req.text, { params: opts.params as Record<string, string>, models }).report;
    case "retune":
      return retuneBlock(req.text, opts as never);
  }
}

function serve() {
  process.on("message", async (m: Request | Outcomes) => {
    if ("kind" in m) {
      const c = calls.get(m.call);
      calls.delete(m.call);
      if (m.outcomes) c?.resolve(m.outcomes);
      else c?.reject(new Error(m.error ?? "the executor failed"));
      return;
    }
    let reply: { id: number; ok: boolean; value?: unknown; error?: string };
    try {
      reply = { id: m.id, ok: true, value: await handle(m) };
    } catch (e) {
      const err = e as Error;
      reply = { id: m.id, ok: false, error: err instanceof RangeError ? `the script ran too deep: ${err.message}` : err.message };
    }
    process.send!(reply);
  });
  process.send!({ id: 0, ok: true, value: "ready" });
  // The parent is gone (exited or killed): nothing will ask for more work.
  process.on("disconnect", () => process.exit(0));
}

// scripts/engine-build.mjs runs this file once to write a heap snapshot: the warm-up's work is then in the snapshot,
// and each child started from it begins at serve().
if (startupSnapshot.isBuildingSnapshot()) {
  warmUp();
  startupSnapshot.setDeserializeMainFunction(serve);
} else serve();
