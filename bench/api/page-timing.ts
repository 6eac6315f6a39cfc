// Time to first byte and to the last byte of a rendered page, with N concurrent loops for a fixed time.
// autocannon reports whole-response latency only; a streamed page's first byte is what a person waits for.
import http from "node:http";

export interface PageFigure {
  requests: number;
  ttfbP50: number;
  ttfbP99: number;
  fullP50: number;
  bad: number;
}

function once(agent: http.Agent, url: string, headers: Record<string, string>): Promise<{ ttfb: number; full: number; status: number }> {
  return new Promise((resolve, reject) => {
    const t0 = performance.now();
    let ttfb = 0;
    const req = http.get(url, { agent, headers }, (res) => {
      res.once("data", () => (ttfb = performance.now() - t0));
      res.on("data", () => {});
      res.on("end", () => resolve({ ttfb, full: performance.now() - t0, status: res.statusCode ?? 0 }));
      res.on("error", reject);
    });
    req.on("error", reject);
  });
}

const pct = (xs: number[], p: number) => (xs.length ? xs.slice().sort((a, b) => a - b)[Math.min(xs.length - 1, Math.floor(xs.length * p))] : NaN);

export async function measurePage(url: string, headers: Record<string, string>, connections: number, durationS: number): Promise<PageFigure> {
  const agent = new http.Agent({ keepAlive: true, maxSockets: connections });
  const ttfbs: number[] = [];
  const fulls: number[] = [];
  let bad = 0;
  const until = performance.now() + durationS * 1000;
  const loop = async () => {
    while (performance.now() < until) {
      const r = await once(agent, url, headers).catch(() => ({ ttfb: 0, full: 0, status: 0 }));
      if (r.status !== 200) bad++;
      else {
        ttfbs.push(r.ttfb);
        fulls.push(r.full);
      }
    }
  };
  await Promise.all(Array.from({ length: connections }, loop));
  agent.destroy();
  return { requests: ttfbs.length, ttfbP50: pct(ttfbs, 0.5), ttfbP99: pct(ttfbs, 0.99), fullP50: pct(fulls, 0.5), bad };
}
