import { randomUUID } from "node:crypto";
import { defaultConcurrency, draftLane, localExecutor, parseBlock, runCapFromEnv, verifyBlock, type ModelTexts, type Report, type SimExecutor } from "@/checks";
import { loadBlock, loadVersion, requireUser } from "@/lib/blocks/common";
import type { Ctx } from "@/lib/context";
import { AppError } from "@/lib/errors";
import { resolveModels } from "@/lib/models/resolve";
import type { DraftRunIdInput, DraftRunInput } from "@/lib/validation/runs";

/**
 * Draft runs: the live preview's "simulate" button. The draft (the head's file with the values on screen, a pinned
 * version with them, or an edited file of the block) is verified in full, simulations included, in this process's
 * draft sandbox lane with a local executor, so Cancel can kill its ngspice processes. Nothing is written to the
 * database: no version, no check run, so no badge can move. The record lives in this process's memory for ten
 * minutes after it ends; callers poll it by id. Each person has at most one draft run going: starting another
 * replaces it (the values on screen changed), and the per-run caps of saved versions apply.
 */

export type DraftStatus = "queued" | "running" | "done" | "error" | "cancelled";

export interface DraftRunView {
  id: string;
  slug: string;
  status: DraftStatus;
  progress: { done: number; total: number };
  /** The report once done; null while it runs, after a cancel and after an error. */
  report: Report | null;
  error: string | null;
  createdAt: string;
  finishedAt: string | null;
}

interface DraftRun {
  id: string;
  userId: number;
  slug: string;
  status: DraftStatus;
  done: number;
  total: number;
  report: Report | null;
  error: string | null;
  createdAt: Date;
  finishedAt: Date | null;
  abort: AbortController;
  /** Settles when nothing of this run is left running (its sandbox call has returned). */
  settled: Promise<void>;
}

/** Ended runs stay readable this long, so a poll that was in flight still finds the outcome. */
const KEEP_MS = 10 * 60_000;
/** The same limit a worker gives a saved version's verification. */
const TIMEOUT_MS = Number(process.env.ASSAY_RUN_TIMEOUT_MS ?? 120_000);

// One registry per process: Next bundles this module into several routes, and they must share it.
const holder = globalThis as unknown as { __assayDraftRuns?: { runs: Map<string, DraftRun>; chain: Promise<unknown> } };
const registry = (holder.__assayDraftRuns ??= { runs: new Map(), chain: Promise.resolve() });

const view = (r: DraftRun): DraftRunView => ({
  id: r.id, slug: r.slug, status: r.status, progress: { done: r.done, total: r.total }, report: r.report, error: r.error,
  createdAt: r.createdAt.toISOString(), finishedAt: r.finishedAt?.toISOString() ?? null,
});

const active = (r: DraftRun) => r.status === "queued" || r.status === "running";

function prune(now = Date.now()): void {
  for (const [id, r] of registry.runs) if (r.finishedAt && now - r.finishedAt.getTime() > KEEP_MS) registry.runs.delete(id);
}

function end(r: DraftRun, status: DraftStatus, fields: { report?: Report | null; error?: string | null } = {}): void {
  if (!active(r)) return; // a run ends once: a cancel that wins keeps its word over a late report
  r.status = status;
  r.report = fields.report ?? null;
  r.error = fields.error ?? null;
  r.finishedAt = new Date();
}

/** The file a draft stands for, and the model files its circuit includes for the block's team. */
async function draftFile(ctx: Ctx, { slug, ...input }: DraftRunInput) {
  const block = await loadBlock(ctx.em, ctx.caller, slug);
  const text = input.text ?? (await loadVersion(ctx.em, block, input.version)).text;
  const parsed = parseBlock(text).block; // a file the engine cannot read is verified anyway, for its errors
  if (input.text !== undefined && parsed?.slug && parsed.slug !== block.slug) {
    throw new AppError("validation", `slug: the file is ${parsed.slug}, not ${block.slug}`, { errors: [{ path: "slug", message: `expected ${block.slug}` }] });
  }
  const models = await resolveModels(ctx.em, block.team.id, parsed?.netlist ?? "");
  return { slug: block.slug, text, models: models.texts };
}

/** Starts simulating a draft for the caller (who must be signed in and able to read the block); answers at once. */
export async function startDraftRun(ctx: Ctx, input: DraftRunInput): Promise<DraftRunView> {
  const user = requireUser(ctx.caller);
  const draft = await draftFile(ctx, input);
  prune();
  for (const r of registry.runs.values()) {
    if (r.userId === user.id && active(r)) cancel(r, "replaced by a newer draft simulation");
  }
  const abort = new AbortController();
  const run: DraftRun = {
    id: randomUUID(), userId: user.id, slug: draft.slug, status: "queued", done: 0, total: 0, report: null, error: null,
    createdAt: new Date(), finishedAt: null, abort, settled: Promise.resolve(),
  };
  registry.runs.set(run.id, run);
  // The lane runs one request at a time; waiting here instead lets a run cancelled while queued never start.
  const work = registry.chain.then(() => simulate(run, draft.text, draft.models, input.params ?? {}));
  registry.chain = work.catch(() => undefined);
  run.settled = work.then(() => undefined, () => undefined);
  return view(run);
}

async function simulate(run: DraftRun, text: string, models: ModelTexts, params: Record<string, string>): Promise<void> {
  if (!active(run)) return;
  run.status = "running";
  const executor = tracked(localExecutor({ concurrency: defaultConcurrency(), signal: run.abort.signal }));
  try {
    const { report } = await verifyBlock(text, {
      params, models, executor, lane: draftLane, cap: runCapFromEnv(), timeoutMs: TIMEOUT_MS,
      onProgress: (done, total) => {
        if (!active(run)) return; // a cancelled run's count stays where the cancel found it
        run.done = Math.max(run.done, done);
        run.total = Math.max(run.total, total, run.done);
      },
    });
    await executor.idle();
    if (executor.failure) end(run, "error", { error: executor.failure.message });
    else end(run, "done", { report });
  } catch (err) {
    end(run, "error", { error: (err as Error)?.message ?? String(err) });
  }
}

/** The executor with a count of its calls in flight, so the run ends only after its ngspice processes have. */
function tracked(inner: SimExecutor): SimExecutor & { failure: Error | null; idle(): Promise<void> } {
  let inFlight = 0;
  let wake: (() => void) | null = null;
  const self = {
    failure: null as Error | null,
    async runMany(...args: Parameters<SimExecutor["runMany"]>) {
      inFlight++;
      try {
        return await inner.runMany(...args);
      } catch (err) {
        self.failure ??= err as Error;
        throw err;
      } finally {
        if (--inFlight === 0) wake?.();
      }
    },
    idle: () => (inFlight === 0 ? Promise.resolve() : new Promise<void>((resolve) => (wake = resolve))),
  };
  return self;
}

function cancel(run: DraftRun, why: string): void {
  end(run, "cancelled", { error: why });
  run.abort.abort();
}

/** A draft run is its starter's alone: anyone else is told there is no such run. */
function own(ctx: Ctx, { id }: DraftRunIdInput): DraftRun {
  const user = requireUser(ctx.caller);
  prune();
  const run = registry.runs.get(String(id));
  if (!run || run.userId !== user.id) throw new AppError("not_found", "no such draft run");
  return run;
}

export async function getDraftRun(ctx: Ctx, input: DraftRunIdInput): Promise<DraftRunView> {
  return view(own(ctx, input));
}

/**
 * Stops a draft run: its ngspice processes are killed and no report is kept. Answers once they have exited
 * (a few seconds at most); a run that had already ended is answered as it is.
 */
export async function cancelDraftRun(ctx: Ctx, input: DraftRunIdInput): Promise<DraftRunView> {
  const run = own(ctx, input);
  const running = run.status === "running"; // a queued run never starts: nothing to wait for
  if (active(run)) cancel(run, "cancelled");
  if (running) await Promise.race([run.settled, new Promise((r) => setTimeout(r, 5_000).unref())]);
  return view(run);
}
