import { Meilisearch } from "meilisearch";

// The same official client talks to a real Meilisearch (MEILI_URL) or to our local stand-in.
export const BLOCKS_INDEX = process.env.ASSAY_SEARCH_INDEX ?? "blocks";

let cached: { key: string; client: Meilisearch } | undefined;

export function searchClient(): Meilisearch {
  const host = process.env.MEILI_URL ?? `http://127.0.0.1:${process.env.LOCAL_SEARCH_PORT ?? "7700"}`;
  const apiKey = process.env.MEILI_MASTER_KEY ?? "";
  const key = `${host}|${apiKey}`;
  if (cached?.key !== key) cached = { key, client: new Meilisearch({ host, apiKey, timeout: 5000 }) };
  return cached.client;
}

export const blocksIndex = () => searchClient().index<BlockDocument>(BLOCKS_INDEX);

/** One document per block head; what search filters and shows. */
export interface BlockDocument {
  id: number;
  slug: string;
  title: string;
  summary: string;
  tags: string[];
  category: string;
  badge: string;
  approved: boolean;
  team: string;
  teamId: number;
  visibility: "team" | "public";
  version: number;
  params: string[];
  body: string;
  updatedAt: number;
}
