// npm run bench:search — 5,000 generated blocks; latency of GET /api/v1/blocks?q=… through the built app.
// Everything runs on loopback: a throwaway PostgreSQL, the local search server and `next start` on free ports.
import os from "node:os";
import { withBenchServices } from "../support/services";
import { generateBlocks } from "./generate";

const COUNT = Number(process.env.BENCH_BLOCKS ?? 5000);
const REQUESTS = Number(process.env.BENCH_REQUESTS ?? 200);

const queries: Record<string, string[]> = {
  "one word": ["limiter", "oscillator", "notch", "reference", "clamp"],
  "two words": ["soft limiter", "diode clamp", "bridge oscillator", "1 kHz notch", "zener reference"],
  typo: ["limitr", "oscilator", "refrence", "clamb", "bridg oscillator"],
  filtered: ["limiter&category=limiter", "oscillator&badge=verified", "filter&tag=passive", "&category=reference&team=bench"],
};

const pct = (xs: number[], p: number) => xs.slice().sort((a, b) => a - b)[Math.min(xs.length - 1, Math.floor((p / 100) * xs.length))];

async function main() {
  await withBenchServices("search", async ({ startApp }) => {
    const { getEm } = await import("../../lib/db/orm");
    const { reindexAll } = await import("../../lib/search/indexer");
    const { createToken } = await import("../../lib/tokens/tokens");
    const t0 = performance.now();
    const owner = await generateBlocks(await getEm(), COUNT);
    // A member's read token, so every query carries the team filter as a signed-in engineer's would.
    const { token } = await createToken(await getEm(), { userId: owner.userId, teamId: owner.teamId, name: "bench", scope: "read", expiresAt: null });
    const t1 = performance.now();
    const indexed = await reindexAll(await getEm());
    const t2 = performance.now();
    console.log(`blocks stored: ${COUNT} in ${((t1 - t0) / 1000).toFixed(1)} s`);
    console.log(`indexing: ${indexed} documents in ${((t2 - t1) / 1000).toFixed(1)} s = ${Math.round(indexed / ((t2 - t1) / 1000))} documents/s`);

    const app = await startApp();
    const get = async (q: string) => {
      const [word, ...filters] = q.split("&");
      const url = `${app.url}/api/v1/blocks?q=${encodeURIComponent(word)}${filters.length ? "&" + filters.join("&") : ""}`;
      const s = performance.now();
      const res = await fetch(url, { headers: { Authorization: `Bearer ${token}` } });
      const body = (await res.json()) as { estimatedTotal: number };
      if (res.status !== 200) throw new Error(`${url} answered ${res.status}`);
      return { ms: performance.now() - s, hits: body.estimatedTotal };
    };
    for (const q of queries["one word"]) await get(q); // warm the route and the index
    console.log(`\nGET /api/v1/blocks?q=… over ${COUNT} blocks, ${REQUESTS} sequential requests per kind (target p95 < 50 ms)`);
    console.log("kind        p50 ms   p95 ms   mean hits   p95/target");
    for (const [kind, qs] of Object.entries(queries)) {
      const ms: number[] = [];
      let hits = 0;
      for (let i = 0; i < REQUESTS; i++) {
        const r = await get(qs[i % qs.length]);
        ms.push(r.ms);
        hits += r.hits;
      }
      const p95 = pct(ms, 95);
      console.log(`${kind.padEnd(10)} ${pct(ms, 50).toFixed(1).padStart(7)} ${p95.toFixed(1).padStart(8)} ${(hits / REQUESTS).toFixed(0).padStart(11)} ${(p95 / 50).toFixed(2).padStart(12)}`);
    }
    console.log(`load average during the run: ${os.loadavg().map((x) => x.toFixed(1)).join(" ")} on ${os.cpus().length} cores`);
  });
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
