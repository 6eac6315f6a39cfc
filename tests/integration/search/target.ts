import { randomBytes, randomUUID } from "node:crypto";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { Meilisearch } from "meilisearch";
import { startSearchServer } from "@/lib/search/server";

// The server under contract: whatever MEILI_URL names (a real Meilisearch or a
// running stand-in), else the local server started in-process on a free port.
export interface SearchTarget {
  host: string;
  key: string;
  external: boolean;
  client(apiKey?: string): Meilisearch;
  stop(): Promise<void>;
}

export async function searchTarget(): Promise<SearchTarget> {
  const make = (host: string, key: string) => (apiKey: string | undefined = key) => new Meilisearch({ host, apiKey: apiKey || undefined });
  if (process.env.MEILI_URL) {
    const key = process.env.MEILI_MASTER_KEY ?? "";
    return { host: process.env.MEILI_URL, key, external: true, client: make(process.env.MEILI_URL, key), stop: async () => {} };
  }
  const dir = mkdtempSync(path.join(tmpdir(), "assay-search-contract-"));
  const key = randomBytes(16).toString("hex");
  const server = await startSearchServer({ port: 0, key, dir });
  return {
    host: server.url,
    key,
    external: false,
    client: make(server.url, key),
    stop: async () => {
      await server.close();
      rmSync(dir, { recursive: true, force: true });
    },
  };
}

// Each run works in indexes of its own, so the suite can share a real instance.
export const uniqueIndexUid = (name: string) => `assay-contract-${name}-${randomUUID().slice(0, 8)}`;
