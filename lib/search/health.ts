import { getEm } from "@/lib/db/orm";
import { searchClient } from "./client";
import { indexBacklog } from "./backlog";

export async function searchHealth(): Promise<string> {
  const h = await searchClient().health();
  return h.status === "available" ? "ok" : `search server says ${h.status}`;
}

export async function searchBacklog(): Promise<number> {
  return indexBacklog(await getEm());
}
