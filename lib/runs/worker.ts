import { randomUUID } from "node:crypto";
import os from "node:os";
import { warmEngine } from "@/checks";
import { getEm } from "@/lib/db/orm";
import { RUN_CHANNEL } from "./enqueue";
import { processNext } from "./execute";
import { beat, forget, pruneSilent } from "./heartbeat";
import { listenFor } from "./listen";
import { stopBoss } from "@/lib/queue/boss";
import { LEASE_SECONDS, reapExpired, releaseRun, requeueLost } from "./lease";
import { enqueueStaleHeads } from "./reverify";
import { SIM_CHANNEL } from "./sim-jobs";
import { resultArrived } from "./sim-executor";
import { pruneSimResults, simulating } from "./sim-worker";

export interface WorkerOptions {
  id?: string;
  /** At start, queue stale or unchecked heads of these teams only; all teams by default. Runs come from one shared queue. */
  teamIds?: number[];
  /** Poll interval when idle; a NOTIFY on commit wakes the worker sooner. */
  idlePollMs?: number;
  log?: (line: string) => void;
}

/** One worker process: one run at a time; start more processes (or machines) to verify more in parallel. */
export function startWorker(opts: WorkerOptions = {}): { id: string; stop: () => Promise<void>; done: Promise<void> } {
  const id = opts.id ?? `${os.hostname()}-${process.pid}-${randomUUID().slice(0, 8)}`;
  const log = opts.log ?? ((line: string) => console.log(`[worker ${id}] ${line}`));
  const startedAt = new Date();
  let stopping = false;
  let current: string | null = null;
  let wake: (() => void) | null = null;
  const sleep = (ms: number) => new Promise<void>((resolve) => {
    const t = setTimeout(() => { wake = null; resolve(); }, ms);
    wake = () => { clearTimeout(t); wake = null; resolve(); };
  });

  let listener: { stop: () => Promise<void> } | null = null;
  // New runs wake the verify loop; new simulate jobs (an empty payload) the simulate loop; a stored result its coordinator.
  const onNotify = (n: { channel: string; payload?: string }) => {
    if (n.channel !== SIM_CHANNEL) wake?.();
    else if (n.payload) resultArrived(n.payload);
    else if (!stopping) simulating(id, log).wake();
  };

  const timers: NodeJS.Timeout[] = [];
  const every = (ms: number, fn: () => Promise<unknown>) =>
    timers.push(setInterval(() => { fn().catch((err: Error) => log(`background step failed: ${err.message}`)); }, ms));

  const done = (async () => {
    const em = await getEm();
    await beat(em, id, null, startedAt);
    // Reconnects after a database restart; whatever was sent meanwhile is looked for once.
    listener = listenFor({
      channels: [RUN_CHANNEL, SIM_CHANNEL], onNotify, log,
      onRestored: () => { wake?.(); if (!stopping) simulating(id, log).wake(); },
    });
    every(5000, async () => beat(await getEm(), id, current, startedAt));
    every(Math.min(10_000, LEASE_SECONDS * 500), async () => {
      const back = await requeueLost(await getEm());
      if (back) log(`${back} run(s) of silent workers went back to the queue`);
      const n = await reapExpired(await getEm());
      if (n) log(`${n} run(s) ended as error after their last attempt`);
    });
    every(3_600_000, async () => pruneSilent(await getEm()));
    every(60_000, pruneSimResults);
    simulating(id, log);
    warmEngine(); // the sandbox child loads while the worker waits, not when its first run arrives
    const stale = await enqueueStaleHeads(await getEm(), { teamIds: opts.teamIds });
    if (stale.queued) log(`queued ${stale.queued} stale or unchecked head(s) for verification`);
    log("ready");
    while (!stopping) {
      try {
        const r = await processNext(id, { onClaim: (runId) => { current = runId; } });
        current = null;
        if (r.outcome !== "idle") log(`run ${r.runId}: ${r.outcome}`);
        else await sleep(opts.idlePollMs ?? 1000);
      } catch (err) {
        current = null;
        log(`error: ${(err as Error).message}`);
        await sleep(2000);
      }
    }
  })();

  const stop = async () => {
    stopping = true;
    wake?.();
    for (const t of timers) clearInterval(t);
    const em = await getEm();
    if (current) await releaseRun(em, current, id).catch(() => undefined);
    await forget(em, id).catch(() => undefined);
    await stopBoss();
    await listener?.stop();
  };
  return { id, stop, done };
}
