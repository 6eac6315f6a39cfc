import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import type { StoredMail } from "./sink";

// Reading the local sink's messages: the mailbox page and the tests.
export const sinkDir = (): string | null =>
  process.env.ASSAY_MAIL_SINK_DIR ? path.resolve(process.env.ASSAY_MAIL_SINK_DIR) : null;

/** Newest first. */
export function readSink(dir: string, limit = 200): StoredMail[] {
  let names: string[];
  try {
    names = readdirSync(dir).filter((n) => n.endsWith(".json"));
  } catch {
    return [];
  }
  names.sort().reverse();
  const out: StoredMail[] = [];
  for (const n of names.slice(0, limit)) {
    try {
      out.push(JSON.parse(readFileSync(path.join(dir, n), "utf8")) as StoredMail);
    } catch {
      // a file someone else put there: not ours to show
    }
  }
  return out;
}
