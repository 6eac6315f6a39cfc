// npm run bench:api — throughput and tail latency of the block read routes against a static route (the floor), and the library page's time to first byte.
// Everything runs on loopback: a throwaway PostgreSQL, the local search server and `next start` on free ports.
import { randomBytes } from "node:crypto";
import { readdirSync, readFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import autocannon from "autocannon";
import { withBenchServices } from "../support/services";
import { measurePage } from "./page-timing";

const DURATION_S = Number(process.env.BENCH_DURATION ?? 4);
const ROUNDS = Number(process.env.BENCH_ROUNDS ?? 3);
const CONNECTIONS = Number(process.env.BENCH_CONNECTIONS ?? 8);
const SLUG = "rc-lowpass-antialias";

interface Figure {
  rps: number;
  p50: number;
  p99: number;
  non2xx: number;
}

async function measure(url: string, headers: Record<string, string>, expectStatus: number): Promise<Figure> {
  const r = await autocannon({ url, headers, connections: CONNECTIONS, duration: DURATION_S });
  const wrong = expectStatus === 304 ? r["2xx"] + r["4xx"] + r["5xx"] : r.non2xx;
  return { rps: r.requests.average, p50: r.latency.p50, p99: r.latency.p99, non2xx: wrong + r.errors + r.timeouts };
}

let cookie = "";

async function seed(token: { set: (t: string) => void }) {
  const { getEm } = await import("../../lib/db/orm");
  const { TeamSchema, UserSchema, MembershipSchema } = await import("../../entities");
  const { loadCaller } = await import("../../lib/auth/load-caller");
  const { createBlock } = await import("../../lib/blocks/create");
  const { contextFor } = await import("../../lib/context");
  const { createToken } = await import("../../lib/tokens/tokens");
  const { reindexAll } = await import("../../lib/search/indexer");
  const em = await getEm();
  const team = em.create(TeamSchema, { slug: "fenwick", name: "Fenwick Analog Works" });
  const user = em.create(UserSchema, { email: "nadia.okafor@fenwick.test", name: "Nadia Okafor", passwordHash: null });
  await em.flush();
  em.create(MembershipSchema, { user, team, role: "author" });
  await em.flush();
  const caller = await loadCaller(await getEm(), user.id);
  const { sessionCookieFor } = await import("../../lib/auth/session-token");
  const c = await sessionCookieFor(user, new Date());
  cookie = `${c.name}=${c.value}`;
  const dir = path.resolve("content/blocks");
  let stored = 0;
  for (const f of readdirSync(dir).filter((n) => n.endsWith(".md"))) {
    try {
      await createBlock(await contextFor(caller), { team: "fenwick", text: readFileSync(path.join(dir, f), "utf8"), visibility: "team" });
      stored++;
    } catch (err) {
      console.warn(`skipped ${f}: ${(err as Error).message}`);
    }
  }
  const { token: t } = await createToken(await getEm(), { userId: user.id, teamId: team.id, name: "bench", scope: "read", expiresAt: null });
  token.set(t);
  const indexed = await reindexAll(await getEm());
  return { stored, indexed };
}

async function main() {
  process.env.NEXTAUTH_SECRET ??= randomBytes(32).toString("base64url");
  await withBenchServices("api", async ({ startApp }) => {
    let token = "";
    const { stored, indexed } = await seed({ set: (t) => (token = t) });
    const app = await startApp();
    const auth = { Authorization: `Bearer ${token}` };
    const version = await fetch(`${app.url}/api/v1/blocks/${SLUG}/versions/1`, { headers: auth });
    if (version.status !== 200) throw new Error(`version fetch answered ${version.status}: ${await version.text()}`);
    const etag = version.headers.get("etag")!;

    const targets: [string, string, Record<string, string>, number][] = [
      ["floor: GET /openapi.json", "/api/v1/openapi.json", {}, 200],
      [`GET /blocks/{slug} (head)`, `/api/v1/blocks/${SLUG}`, auth, 200],
      [`GET /blocks/{slug}/versions/1`, `/api/v1/blocks/${SLUG}/versions/1`, auth, 200],
      [`same, If-None-Match → 304`, `/api/v1/blocks/${SLUG}/versions/1`, { ...auth, "If-None-Match": etag }, 304],
      [`GET /blocks?q=low-pass`, `/api/v1/blocks?q=low-pass`, auth, 200],
    ];
    console.log(`${stored} demo blocks stored, ${indexed} indexed; read token; ${CONNECTIONS} connections, ${DURATION_S} s per route per round, ${ROUNDS} interleaved rounds, medians`);
    // A warm-up pass so first requests (route code loading, the pool, the sandbox) are not in the figures.
    for (const [, p, headers] of targets) await autocannon({ url: `${app.url}${p}`, headers, connections: 2, duration: 1 });
    // Rounds interleave the routes, so load from elsewhere on the machine falls on all of them alike.
    const runs: Figure[][] = targets.map(() => []);
    for (let round = 0; round < ROUNDS; round++) {
      for (const [i, [, p, headers, status]] of targets.entries()) runs[i].push(await measure(`${app.url}${p}`, headers, status));
    }
    const median = (xs: number[]) => xs.slice().sort((a, b) => a - b)[Math.floor(xs.length / 2)];
    const figures = runs.map((fs) => ({
      rps: median(fs.map((f) => f.rps)),
      p50: median(fs.map((f) => f.p50)),
      p99: median(fs.map((f) => f.p99)),
      non2xx: fs.reduce((a, f) => a + f.non2xx, 0),
    }));
    const bare = figures[0];
    console.log("route                              req/s    p50 ms   p99 ms  req/s ÷ floor  p99 × floor   bad");
    for (const [i, [name]] of targets.entries()) {
      const f = figures[i];
      console.log(
        `${name.padEnd(32)} ${f.rps.toFixed(0).padStart(7)} ${f.p50.toFixed(1).padStart(9)} ${f.p99.toFixed(1).padStart(8)} ` +
          `${(f.rps / bare.rps).toFixed(3).padStart(14)} ${(f.p99 / Math.max(bare.p99, 1)).toFixed(1).padStart(12)} ${String(f.non2xx).padStart(5)}`,
      );
    }
    // The library page a person lands on while searching (server-rendered with ?q=), signed in.
    const pages: [string, string][] = [["library page /?q=low-pass", "/?q=low-pass"], ["library page / (no query)", "/"]];
    for (const [, p] of pages) await measurePage(`${app.url}${p}`, { Cookie: cookie }, 2, 1);
    const pageRuns = pages.map(() => [] as Awaited<ReturnType<typeof measurePage>>[]);
    for (let round = 0; round < ROUNDS; round++) {
      for (const [i, [, p]] of pages.entries()) pageRuns[i].push(await measurePage(`${app.url}${p}`, { Cookie: cookie }, CONNECTIONS, DURATION_S));
    }
    console.log("page                             requests  TTFB p50 ms  TTFB p99 ms  full p50 ms   bad");
    for (const [i, [name]] of pages.entries()) {
      const fs = pageRuns[i];
      const m = (k: "ttfbP50" | "ttfbP99" | "fullP50") => median(fs.map((f) => f[k]));
      console.log(
        `${name.padEnd(32)} ${String(median(fs.map((f) => f.requests))).padStart(8)} ${m("ttfbP50").toFixed(1).padStart(12)} ` +
          `${m("ttfbP99").toFixed(1).padStart(12)} ${m("fullP50").toFixed(1).padStart(12)} ${String(fs.reduce((a, f) => a + f.bad, 0)).padStart(5)}`,
      );
    }
    console.log(`load average during the run: ${os.loadavg().map((x) => x.toFixed(1)).join(" ")} on ${os.cpus().length} cores`);
  });
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
