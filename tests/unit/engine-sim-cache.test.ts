import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterEach, describe, expect, it } from "vitest";
import { cacheKey, cacheLimitBytes, pruneCache, readCached, writeCached } from "@/checks/spice/cache";

// The simulation cache is bounded and evicts least-recently-used raw files first
// (LRU replacement, common practice for caches).
const dirs: string[] = [];
const tmp = () => {
  const d = fs.mkdtempSync(path.join(os.tmpdir(), "assay-cache-test-"));
  dirs.push(d);
  return d;
};
afterEach(() => {
  for (const d of dirs.splice(0)) fs.rmSync(d, { recursive: true, force: true });
  delete process.env.ASSAY_SIM_CACHE_MB;
});

const KB = 1024;
const key = (n: number) => cacheKey(`deck ${n}`, "ngspice-test", "engine-test");
const fileOf = (dir: string, k: string) => path.join(dir, k.slice(0, 2), `${k}.raw`);
/** Put a file in the cache last used `ageS` seconds ago. */
function seed(dir: string, n: number, ageS: number, size = 10 * KB) {
  const k = key(n);
  writeCached(dir, k, Buffer.alloc(size, n), Number.MAX_SAFE_INTEGER);
  const t = new Date(Date.now() - ageS * 1000);
  fs.utimesSync(fileOf(dir, k), t, t);
  return k;
}

describe("simulation cache size bound", () => {
  it("reads ASSAY_SIM_CACHE_MB, 512 MB by default", () => {
    expect(cacheLimitBytes()).toBe(512 * KB * KB);
    process.env.ASSAY_SIM_CACHE_MB = "64";
    expect(cacheLimitBytes()).toBe(64 * KB * KB);
    process.env.ASSAY_SIM_CACHE_MB = "nonsense";
    expect(cacheLimitBytes()).toBe(512 * KB * KB);
  });

  it("leaves a cache under the bound alone", () => {
    const dir = tmp();
    const keys = [1, 2, 3].map((n) => seed(dir, n, 100 * n));
    expect(pruneCache(dir, 100 * KB)).toBe(30 * KB);
    for (const k of keys) expect(readCached(dir, k)).not.toBeNull();
  });

  it("evicts the least recently used files down to 90% of the bound", () => {
    const dir = tmp();
    const keys = Array.from({ length: 10 }, (_, n) => seed(dir, n, 1000 - 100 * n)); // key 0 is the oldest
    // Reading the oldest one makes it the most recently used.
    expect(readCached(dir, keys[0])).not.toBeNull();
    const kept = pruneCache(dir, 75 * KB); // 100 KB held: down to 67.5 KB, i.e. six files of 10 KB
    expect(kept).toBe(60 * KB);
    const present = keys.map((k) => fs.existsSync(fileOf(dir, k)));
    expect(present).toEqual([true, false, false, false, false, true, true, true, true, true]);
  });

  it("prunes on write once the bound is passed", () => {
    const dir = tmp();
    const old = [1, 2, 3, 4].map((n) => seed(dir, n, 1000 - n));
    writeCached(dir, key(99), Buffer.alloc(20 * KB, 9), 50 * KB); // 60 KB > 50 KB: keep at most 45 KB
    expect(fs.existsSync(fileOf(dir, key(99)))).toBe(true);
    expect(old.map((k) => fs.existsSync(fileOf(dir, k)))).toEqual([false, false, true, true]);
  });
});
