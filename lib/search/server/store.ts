import { mkdirSync, readdirSync, readFileSync, renameSync, rmSync, writeFileSync } from "node:fs";
import { open, rename, rm, writeFile } from "node:fs/promises";
import path from "node:path";
import type { IndexSnapshot } from "./index-state";

// The on-disk layout under the data directory:
//   indexes/<uid>.json   documents, settings and primary key of one index
//   queue/<taskUid>.json a task accepted but not yet processed, with its payload
//   tasks.json           finished and pending task records, and the next task uid
// Every file is written to a temporary name and renamed, so a crash leaves
// either the old or the new version.
export class Store {
  constructor(readonly dir: string) {
    mkdirSync(path.join(dir, "indexes"), { recursive: true });
    mkdirSync(path.join(dir, "queue"), { recursive: true });
  }

  private tmp(file: string) {
    return `${file}.${process.pid}.${Math.random().toString(36).slice(2)}.tmp`;
  }

  async writeJson(rel: string, value: unknown) {
    const file = path.join(this.dir, rel);
    const tmp = this.tmp(file);
    await writeFile(tmp, JSON.stringify(value));
    await rename(tmp, file);
  }

  writeJsonSync(rel: string, value: unknown) {
    const file = path.join(this.dir, rel);
    const tmp = this.tmp(file);
    writeFileSync(tmp, JSON.stringify(value));
    renameSync(tmp, file);
  }

  readJson<T>(rel: string): T | null {
    try {
      return JSON.parse(readFileSync(path.join(this.dir, rel), "utf8")) as T;
    } catch (e) {
      if ((e as NodeJS.ErrnoException).code === "ENOENT") return null;
      throw e;
    }
  }

  async remove(rel: string) {
    await rm(path.join(this.dir, rel), { force: true });
  }

  // Written a slice of documents at a time, yielding between slices, so a large
  // index does not hold up searches while it is saved.
  async saveIndex(snapshot: IndexSnapshot) {
    const file = path.join(this.dir, "indexes", `${snapshot.uid}.json`);
    const tmp = this.tmp(file);
    const { documents, ...head } = snapshot;
    const fh = await open(tmp, "w");
    try {
      await fh.write(`${JSON.stringify(head).slice(0, -1)},"documents":[`);
      for (let i = 0; i < documents.length; i += 250) {
        const slice = documents.slice(i, i + 250).map((d) => JSON.stringify(d)).join(",");
        await fh.write(i === 0 ? slice : `,${slice}`);
      }
      await fh.write("]}");
      await fh.sync();
    } finally {
      await fh.close();
    }
    await rename(tmp, file);
  }

  deleteIndex(uid: string) {
    return this.remove(path.join("indexes", `${uid}.json`));
  }

  loadIndexes(): IndexSnapshot[] {
    return this.list("indexes").map((f) => this.readJson<IndexSnapshot>(path.join("indexes", f))!);
  }

  list(sub: string): string[] {
    return readdirSync(path.join(this.dir, sub)).filter((f) => f.endsWith(".json")).sort((a, b) => parseInt(a) - parseInt(b) || (a < b ? -1 : 1));
  }

  removeStrayTemps() {
    for (const sub of ["", "indexes", "queue"])
      for (const f of readdirSync(path.join(this.dir, sub))) if (f.endsWith(".tmp")) rmSync(path.join(this.dir, sub, f), { force: true });
  }
}
