import { createHash } from "node:crypto";
import fs from "node:fs";
import path from "node:path";

// Content-addressed: the deck text names everything a raw file depends on except the
// simulator and the engine, so those two join the key.
export function cacheKey(deck: string, ngspice: string, engine: string): string {
  return createHash("sha256").update(`${deck}\0${ngspice}\0${engine}`).digest("hex");
}

const fileFor = (dir: string, key: string) => path.join(dir, key.slice(0, 2), `${key}.raw`);

export function readCached(dir: string, key: string): Buffer | null {
  try {
    return fs.readFileSync(fileFor(dir, key));
  } catch {
    return null;
  }
}

/** Write through a temp name and rename, so a concurrent reader never sees half a file. */
export function writeCached(dir: string, key: string, raw: Buffer): void {
  const file = fileFor(dir, key);
  try {
    fs.mkdirSync(path.dirname(file), { recursive: true });
    const tmp = `${file}.${process.pid}.tmp`;
    fs.writeFileSync(tmp, raw);
    fs.renameSync(tmp, file);
  } catch {
    // A cache that cannot be written only costs a rerun later.
  }
}
