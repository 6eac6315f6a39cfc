// npm run bench:runs — how long from storing a version to its badge, and how many runs a second one or two
// workers verify. Uses a throwaway PostgreSQL cluster and real worker processes; prints figures and ratios.
import { spawn, type ChildProcess } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { startCluster } from "../../tests/support/pg-cluster";
import { dividerBlock, wienBlock, wienMonteCarloBlock } from "./blocks";

const LATENCY_SAMPLES = 20;
const QUEUED = 200;
const PHASE_LIMIT_MS = 120_000;
const FANOUT_ONLY = process.argv.includes("--fanout"); // npm run bench:runs -- --fanout: section 3 alone // keeps the bench bounded on a slow machine: the figure then covers what finished

async function main() {
  const cluster = await startCluster();
  process.env.DATABASE_URL = cluster.url;
  const cache = mkdtempSync(path.join(os.tmpdir(), "assay-bench-cache-"));
  const workers: ChildProcess[] = [];
  const { migrateUp } = await import("../../lib/db/migrate");
  const { closeOrm, getEm } = await import("../../lib/db/orm");
  const { loadCaller } = await import("../../lib/auth/load-caller");
  const { createBlock } = await import("../../lib/blocks/create");
  const { addVersion } = await import("../../lib/blocks/versions");
  const { contextFor } = await import("../../lib/context");
  const { MembershipSchema, TeamSchema, UserSchema } = await import("../../entities");
  try {
    await migrateUp();
    const em = await getEm();
    const team = em.create(TeamSchema, { slug: "bench", name: "Bench", createdAt: new Date() });
    const user = em.create(UserSchema, { email: "bench@bench.test", name: "Bench", passwordHash: null, createdAt: new Date() });
    em.create(MembershipSchema, { user, team, role: "author", createdAt: new Date() });
    await em.flush();
    const caller = await loadCaller(await getEm(), user.id);

    const startWorker = (id: string) => new Promise<ChildProcess>((resolve, reject) => {
      const child = spawn(process.execPath, ["--import", "tsx", "scripts/worker.ts", "--team", "bench"], {
        stdio: ["ignore", "pipe", "inherit"], detached: true,
        env: { ...process.env, ASSAY_WORKER_ID: id, ASSAY_SIM_CACHE: cache, ASSAY_SIM_CONCURRENCY: "1" },
      });
      workers.push(child);
      child.stdout!.on("data", (d: Buffer) => { if (d.toString().includes("ready")) resolve(child); });
      child.once("exit", (code) => reject(new Error(`worker ${id} exited (${code})`)));
    });
    const stopWorkers = async () => {
      for (const w of workers.splice(0)) {
        process.kill(-w.pid!, "SIGTERM");
        await new Promise((r) => w.once("exit", r));
      }
    };
    const runStatus = async (id: string) =>
      ((await (await getEm()).getConnection().execute(`select status from check_runs where id = ?`, [id]))[0] as { status: string }).status;
    // Latency samples look every 5 ms. The fan-out looks every 50 ms: over its seconds, looking every 5 ms took a
    // quarter of a core (this process and its PostgreSQL backend) from the workers it measures.
    const waitDone = async (id: string, everyMs = 5) => {
      for (;;) {
        if (["done", "error"].includes(await runStatus(id))) return;
        await new Promise((r) => setTimeout(r, everyMs));
      }
    };
    const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
    const p90 = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length * 0.9)];

    if (!FANOUT_ONLY) {
    // 1. Store-to-badge latency, one worker idle and waiting (woken by NOTIFY on commit).
    await startWorker("latency");
    for (const [kind, make, values] of [
      ["expression-only divider", (s: string, v: string) => dividerBlock(s, v), (i: number) => `${(10 + i * 0.01).toFixed(2)} kohm`],
      ["simulated Wien oscillator (20 ms tran, no cache hits)", (s: string, v: string) => wienBlock(s, v), (i: number) => `${(22 + i * 0.01).toFixed(2)} kohm`],
    ] as const) {
      const slug = kind.startsWith("expr") ? "lat-divider" : "lat-wien";
      const first = await createBlock(await contextFor(caller), { team: "bench", text: make(slug, values(0)) });
      await waitDone(first.run.id);
      const times: number[] = [];
      for (let i = 1; i <= LATENCY_SAMPLES; i++) {
        const t0 = performance.now();
        const r = await addVersion(await contextFor(caller), { slug, params: kind.startsWith("expr") ? { R2: values(i) } : { Rf: values(i) }, baseVersion: i });
        await waitDone(r.run.id);
        times.push(performance.now() - t0);
      }
      console.log(`store → badge, ${kind}: median ${median(times).toFixed(0)} ms, p90 ${p90(times).toFixed(0)} ms (n=${LATENCY_SAMPLES})`);
    }
    await stopWorkers();

    // 1b. Live preview through the service (head read + engine preview lane), one per keystroke, nothing stored.
    const { previewDraft } = await import("../../lib/runs/preview");
    // A context per call, as each keystroke's request makes its own.
    await previewDraft(await contextFor(caller), { slug: "lat-wien", params: { Rf: "22 kohm" } });
    const previews: number[] = [];
    for (let i = 0; i < LATENCY_SAMPLES; i++) {
      const t0 = performance.now();
      await previewDraft(await contextFor(caller), { slug: "lat-wien", params: { Rf: `${(18 + i * 0.3).toFixed(1)} kohm` } });
      previews.push(performance.now() - t0);
    }
    console.log(`previewDraft (Wien, 2^4 tolerance corners, no simulation): median ${median(previews).toFixed(0)} ms, p90 ${p90(previews).toFixed(0)} ms (n=${LATENCY_SAMPLES})`);

    // 2. Throughput on a queue of 200 stored versions (expression-only), one worker, then two.
    const rates: number[] = [];
    for (const n of [1, 2]) {
      for (let i = 0; i < QUEUED; i++) await createBlock(await contextFor(caller), { team: "bench", text: dividerBlock(`q${n}-${i}`, `${(9 + (i % 100) * 0.02).toFixed(2)} kohm`) });
      await Promise.all(Array.from({ length: n }, (_, k) => startWorker(`tp-${n}-${k}`)));
      const t0 = performance.now();
      let done = 0;
      while (performance.now() - t0 < PHASE_LIMIT_MS) {
        const [row] = await (await getEm()).getConnection().execute(`select count(*) as n from check_runs where status in ('queued','running')`);
        done = QUEUED - Number((row as { n: string }).n);
        if (done >= QUEUED) break;
        await new Promise((r) => setTimeout(r, 50));
      }
      const s = (performance.now() - t0) / 1000;
      rates.push(done / s);
      console.log(`throughput, ${n} worker${n > 1 ? "s" : ""}: ${done}/${QUEUED} runs in ${s.toFixed(1)} s = ${(done / s).toFixed(1)} runs/s (includes worker warm-up after "ready")`);
      await stopWorkers();
    }
    console.log(`two workers / one worker: ${(rates[1] / rates[0]).toFixed(2)}x on ${os.cpus().length} CPU cores`);
    }

    // 3. One verification fanned out: a 64-sample Monte Carlo of the Wien oscillator's 20 ms transient, whose
    // simulations are `simulate` jobs for any worker; one worker, then two (one simulation at a time each).
    // Three timed runs per setting (new values each, so no cache hits), medians: one run swings by a fifth here.
    const FAN_RUNS = 3;
    const fanRates: number[] = [];
    for (const n of [1, 2]) {
      await Promise.all(Array.from({ length: n }, (_, k) => startWorker(`fan-${n}-${k}`)));
      // One short run per worker first, so every worker and its sandbox child is warm when the timed run arrives.
      const warm = await Promise.all(Array.from({ length: n }, async (_, k) =>
        createBlock(await contextFor(caller), { team: "bench", text: wienBlock(`fan-warm-${n}-${k}`, `${(21 + n * 0.01 + k * 0.001).toFixed(3)} kohm`) })));
      for (const w of warm) await waitDone(w.run.id);
      const rates: number[] = [];
      for (let k = 0; k < FAN_RUNS; k++) {
        const t0 = performance.now();
        const cpu0 = cpuBusy();
        const r = await createBlock(await contextFor(caller), { team: "bench", text: wienMonteCarloBlock(`fan-${n}-${k}`, `${(22 + n * 0.1 + k * 0.01).toFixed(2)} kohm`, 64) });
        await waitDone(r.run.id, 50);
        const s = (performance.now() - t0) / 1000;
        const busyCores = (cpuBusy() - cpu0) / s;
        const conn = (await getEm()).getConnection();
        const [run] = await conn.execute(`select progress_total as total, report->>'status' as status,
          (select avg((e->>'ms')::float) from jsonb_array_elements(report->'simulations') e) as ms from check_runs where id = ?`, [r.run.id]) as { total: number; status: string; ms: number }[];
        const by = await conn.execute(`select worker_id, count(*) as n from sim_results where run_id = ? group by worker_id order by worker_id`, [r.run.id]) as { worker_id: string; n: string }[];
        const [span] = await conn.execute(`select extract(epoch from min(s.created_at) - r.started_at) as first, extract(epoch from max(s.created_at) - r.started_at) as last,
          extract(epoch from r.finished_at - r.started_at) as done, sum(s.ms) / 1000 as busy
          from sim_results s join check_runs r on r.id = s.run_id where r.id = ? group by r.started_at, r.finished_at`, [r.run.id]) as Record<string, number>[];
        console.log(`  timeline from the run's start: first result ${(+span.first).toFixed(1)} s, last ${(+span.last).toFixed(1)} s, run done ${(+span.done).toFixed(1)} s; ngspice busy ${(+span.busy).toFixed(1)} s in all; `
          + `the machine's CPUs busy ${busyCores.toFixed(2)} of ${os.cpus().length} on average (every process, this bench's own polling included)`);
        rates.push(run.total / s);
        console.log(`one verification fanned out, ${n} worker${n > 1 ? "s" : ""}: ${run.total} simulations in ${s.toFixed(1)} s = ${(run.total / s).toFixed(1)} simulations/s `
          + `(report ${run.status}; ngspice ${Number(run.ms).toFixed(0)} ms per simulation on average; by worker: ${by.map((b) => `${b.worker_id} ${b.n}`).join(", ")})`);
      }
      fanRates.push(median(rates));
      await stopWorkers();
    }
    console.log(`fan-out, medians of ${FAN_RUNS}: 1 worker ${fanRates[0].toFixed(1)}, 2 workers ${fanRates[1].toFixed(1)} simulations/s; `
      + `two workers / one worker: ${(fanRates[1] / fanRates[0]).toFixed(2)}x on ${os.cpus().length} CPU cores`);
    await ngspiceCeiling();
  } finally {
    for (const w of workers) try { process.kill(-w.pid!, "SIGKILL"); } catch { /* gone */ }
    await closeOrm();
    cluster.stop();
    rmSync(cache, { recursive: true, force: true });
  }
}

/**
 * What two cores give ngspice itself, with nothing of ours around it: the fan-out's samples (the same deck, 64 values
 * of Rf) in ngspice processes kept as the workers keep theirs, in groups of four, one process and then two at once.
 * The workers' ratio is to be read against it. (It can come out a little above it: with one worker, the gaps between
 * its groups leave ngspice idle, and a second worker fills them.)
 */
async function ngspiceCeiling() {
  const { spiceDeck } = await import("../../checks");
  const { NgspiceSession } = await import("../../checks/spice/session");
  const decks = Array.from({ length: 64 }, (_, i) => spiceDeck(wienBlock("ceiling", `${(22 + i * 0.01).toFixed(2)} kohm`))
    .replace(/^\.include\s+(\S+\.lib)\s*$/gm, (_, name) => `.include "${path.join(process.cwd(), "content/models", name)}"`)
    .replace(/^\.end\s*$/m, ".tran 1e-05 0.02\n.end")); // the script's tran(20 ms, 10 us)
  const drain = async (mine: string[]) => {
    const session = new NgspiceSession();
    try {
      for (let i = 0; i < mine.length; i += 4) {
        if ((await session.run(mine.slice(i, i + 4))).some((raw) => !raw)) throw new Error("a bare ngspice run failed");
      }
    } finally {
      session.close();
    }
  };
  await drain(decks.slice(0, 8)); // page cache and ngspice's own files warm
  const time = async (work: () => Promise<unknown>) => {
    const t0 = performance.now();
    await work();
    return (performance.now() - t0) / 1000;
  };
  // Five of each, alternating, medians: a single pair swings by a quarter on a shared machine.
  const ones: number[] = [];
  const twos: number[] = [];
  for (let k = 0; k < 5; k++) {
    ones.push(await time(() => drain(decks)));
    twos.push(await time(() => Promise.all([drain(decks.filter((_, i) => i % 2 === 0)), drain(decks.filter((_, i) => i % 2 === 1))])));
  }
  const med = (xs: number[]) => [...xs].sort((a, b) => a - b)[2];
  const [one, two] = [med(ones), med(twos)];
  console.log(`bare ngspice, the same 64 samples in kept processes, medians of 5: one process ${one.toFixed(2)} s (${(one / 64 * 1000).toFixed(0)} ms each), `
    + `two at once ${two.toFixed(2)} s; two/one ${(one / two).toFixed(2)}x: what the second core gives ngspice itself on this machine`);
}

/** CPU seconds every process of the machine has used since boot, from /proc/stat (user, nice, system, irq, softirq). */
function cpuBusy(): number {
  const [user, nice, system, , , irq, softirq] = readFileSync("/proc/stat", "utf8").split("\n")[0].trim().split(/\s+/).slice(1).map(Number);
  return (user + nice + system + irq + softirq) / 100; // USER_HZ is 100 on Linux
}

main().catch((err: Error) => {
  console.error(`bench failed: ${err.stack ?? err.message}`);
  process.exitCode = 1;
});
