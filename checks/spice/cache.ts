import { createHash, randomUUID } from "node:crypto";
import fs from "node:fs";
import path from "node:path";

// Content-addressed: the deck text names everything a raw file depends on except the
// simulator and the engine, so those two join the key.
export function cacheKey(deck: string, ngspice: string, engine: string): string {
  return createHash("sha256").update(`${deck}\0${ngspice}\0${engine}`).digest("hex");
}

export const DEFAULT_CACHE_MB = 512;

/** The cache's size bound in bytes: ASSAY_SIM_CACHE_MB (megabytes), else 512 MB. */
export function cacheLimitBytes(): number {
  const mb = Number(process.env.ASSAY_SIM_CACHE_MB);
  return (Number.isFinite(mb) && mb > 0 ? mb : DEFAULT_CACHE_MB) * 1024 * 1024;
}

const fileFor = (dir: string, key: string) => path.join(dir, key.slice(0, 2), `${key}.raw`);

/** A hit also touches the file: its mtime is the last use, which the pruning below goes by. */
export function readCached(dir: string, key: string): Buffer | null {
  const file = fileFor(dir, key);
  try {
    const raw = fs.readFileSync(file);
    try {
      const now = new Date();
      fs.utimesSync(file, now, now);
    } catch {
      // Pruned or read-only meanwhile: the bytes are already read.
    }
    return raw;
  } catch {
    return null;
  }
}

/**
 * Write through a temp name and rename, so a concurrent reader never sees half a file; then keep the size bound.
 * False when the file could not be written (a cache that cannot be written only costs a rerun later).
 */
export function writeCached(dir: string, key: string, raw: Uint8Array, maxBytes = cacheLimitBytes()): boolean {
  const file = fileFor(dir, key);
  try {
    fs.mkdirSync(path.dirname(file), { recursive: true });
    const tmp = `${file}.${process.pid}.tmp`;
    fs.writeFileSync(tmp, raw);
    fs.renameSync(tmp, file);
  } catch {
    return false;
  }
  noteWrite(dir, raw.length, maxBytes);
  return true;
}

/** The raw file is in the cache now. */
export const holdsCached = (dir: string, key: string): boolean => fs.existsSync(fileFor(dir, key));

/**
 * Which cache a process uses, as another process can recognise it: the folder and a random id kept in it, made on
 * first use. A process that reads the same id in that folder sees the same files (the same machine, or a shared
 * volume), so a raw file can pass from one to the other through the cache instead of through the database.
 * Null when the folder cannot be written.
 */
export type CacheIdentity = { dir: string; id: string };
const identities = new Map<string, CacheIdentity | null>();
export function cacheIdentity(dir: string): CacheIdentity | null {
  if (identities.has(dir)) return identities.get(dir)!;
  const file = path.join(dir, ".id");
  let id: string | null = null;
  try {
    fs.mkdirSync(dir, { recursive: true });
    // wx: the first process to make the id wins; the others read it.
    try { fs.writeFileSync(file, randomUUID(), { flag: "wx" }); } catch { /* already made */ }
    id = fs.readFileSync(file, "utf8").trim();
  } catch {
    id = null;
  }
  const identity = id ? { dir, id } : null;
  identities.set(dir, identity);
  return identity;
}

/** This process sees the cache `identity` names (its id is in its folder here). */
export function seesCache(identity: CacheIdentity): boolean {
  try {
    return fs.readFileSync(path.join(identity.dir, ".id"), "utf8").trim() === identity.id;
  } catch {
    return false;
  }
}

// Each process keeps a running estimate of the cache's size and rescans the folder when the
// estimate passes the bound or is old (other processes write too), so a write rarely walks it.
const RESCAN_MS = 10 * 60_000;
const estimates = new Map<string, { bytes: number; at: number }>();

function noteWrite(dir: string, added: number, maxBytes: number) {
  const e = estimates.get(dir);
  if (e && Date.now() - e.at < RESCAN_MS) {
    e.bytes += added;
    if (e.bytes <= maxBytes) return;
  }
  estimates.set(dir, { bytes: pruneCache(dir, maxBytes), at: Date.now() });
}

/**
 * Delete least-recently-used raw files (oldest of mtime and atime's later one) until the cache
 * holds at most 90% of maxBytes, when it holds more than maxBytes; returns the bytes kept.
 * The 10% headroom keeps the next few writes from pruning again at once.
 */
export function pruneCache(dir: string, maxBytes: number): number {
  const files: { file: string; size: number; used: number }[] = [];
  let shards: string[] = [];
  try {
    shards = fs.readdirSync(dir);
  } catch {
    return 0;
  }
  for (const shard of shards) {
    let names: string[] = [];
    try {
      names = fs.readdirSync(path.join(dir, shard));
    } catch {
      continue; // not a folder
    }
    for (const name of names) {
      if (!name.endsWith(".raw")) continue;
      const file = path.join(dir, shard, name);
      try {
        const st = fs.statSync(file);
        files.push({ file, size: st.size, used: Math.max(st.mtimeMs, st.atimeMs) });
      } catch {
        // removed by another process meanwhile
      }
    }
  }
  let total = files.reduce((s, f) => s + f.size, 0);
  if (total <= maxBytes) return total;
  files.sort((a, b) => a.used - b.used);
  for (const f of files) {
    if (total <= maxBytes * 0.9) break;
    try {
      fs.unlinkSync(f.file);
      total -= f.size;
    } catch {
      // already gone
    }
  }
  return total;
}
