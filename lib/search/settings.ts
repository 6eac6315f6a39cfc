import { BLOCKS_INDEX, searchClient } from "./client";

export const blockIndexSettings = {
  searchableAttributes: ["title", "summary", "tags", "params", "body"],
  filterableAttributes: ["category", "badge", "tags", "team", "teamId", "visibility", "approved"],
  sortableAttributes: ["updatedAt", "title"],
  displayedAttributes: ["*"],
};

let ensured: string | undefined;

/** Create the index and apply its settings once per process (both are idempotent on the server). */
export async function ensureBlocksIndex(): Promise<void> {
  if (ensured === BLOCKS_INDEX) return;
  const client = searchClient();
  try {
    await client.getIndex(BLOCKS_INDEX);
  } catch {
    await client.createIndex(BLOCKS_INDEX, { primaryKey: "id" }).waitTask();
  }
  await client.index(BLOCKS_INDEX).updateSettings(blockIndexSettings).waitTask();
  ensured = BLOCKS_INDEX;
}
