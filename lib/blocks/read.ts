import { parseBlock, spiceDeck } from "@/checks";
import { BlockSchema, BlockVersionSchema, type Block, type BlockVersion } from "@/entities";
import type { Caller } from "@/lib/auth/caller";
import { can } from "@/lib/auth/permissions";
import { getEm } from "@/lib/db/orm";
import { approvedVersionIds } from "@/lib/reviews/approval";
import { badgesFor, type Badge } from "@/lib/runs/badge";
import { loadBlock, loadVersion, resourceOf } from "./common";

export interface BlockView {
  slug: string; title: string; category: string; tags: string[]; summary: string; team: string;
  visibility: "team" | "public"; version: number; badge: Badge; approved: boolean;
  params: { name: string; value: string; unit: string; tol: string | null; note: string | null }[];
  markdown: string; netlist: string; script: string; report: Record<string, unknown> | null;
  forkedFrom: { slug: string; version: number } | null; createdAt: string; author: string;
  hazard: string[]; contentHash: string; headVersion: number; archived: boolean; note: string; text: string;
  message: string; runId: string | null; runStatus: string | null;
}

/** One version of a block (the head by default) as DESIGN.md's Block JSON plus what the pages need. */
export async function getBlock(caller: Caller, slug: string, version?: number): Promise<BlockView> {
  const em = await getEm();
  const block = await loadBlock(em, caller, slug);
  const v = await loadVersion(em, block, version);
  await em.populate(v, ["author"]);
  const { badge, run } = (await badgesFor(em, [v.id])).get(v.id)!;
  const approved = (await approvedVersionIds(em, [v.id])).has(v.id);
  const parsed = parsedOf(v);
  return {
    slug: block.slug,
    title: parsed?.title ?? block.title,
    category: parsed?.category ?? block.category,
    tags: parsed?.tags ?? block.tags,
    summary: parsed?.summary ?? block.summary,
    team: block.team.slug,
    visibility: block.visibility,
    version: v.number,
    badge,
    approved,
    params: v.params.map((p) => ({ name: p.name, value: p.value, unit: p.unit, tol: p.tol ?? null, note: p.note ?? null })),
    markdown: parsed?.body ?? "",
    netlist: parsed?.netlist ?? "",
    script: parsed?.script ?? "",
    report: run?.report ?? null,
    forkedFrom: await forkedFromRef(caller, block),
    createdAt: v.createdAt.toISOString(),
    author: v.author.name,
    hazard: parsed?.hazard ?? block.hazard,
    contentHash: v.contentHash,
    headVersion: block.head?.number ?? v.number,
    archived: block.archived,
    note: parsed?.note ?? "",
    text: v.text,
    message: v.message,
    runId: run?.id ?? null,
    runStatus: run?.status ?? null,
  };
}

// A version's text never changes: parse it once per process (keyed by content hash), not on every read.
const parsedCache = new Map<string, ReturnType<typeof parseBlock>["block"]>();
function parsedOf(v: BlockVersion): ReturnType<typeof parseBlock>["block"] {
  let parsed = parsedCache.get(v.contentHash);
  if (parsed === undefined) {
    parsed = parseBlock(v.text).block;
    if (parsedCache.size >= 500) parsedCache.delete(parsedCache.keys().next().value!);
    parsedCache.set(v.contentHash, parsed);
  }
  return parsed;
}

async function forkedFromRef(caller: Caller, block: Block): Promise<{ slug: string; version: number; title: string } | null> {
  if (!block.forkedFrom) return null;
  const em = await getEm();
  const parent = await em.findOne(BlockVersionSchema, { id: block.forkedFrom.id }, { populate: ["block", "block.team"] });
  // The parent of a public fork may be a team block: name it only to those who may read it.
  if (!parent || !can(caller, "block.read", resourceOf(parent.block))) return null;
  return { slug: parent.block.slug, version: parent.number, title: parent.block.title };
}

export interface VersionRow {
  version: number; badge: Badge; approved: boolean; author: string; message: string; createdAt: string; contentHash: string;
}

export async function listVersions(caller: Caller, slug: string): Promise<VersionRow[]> {
  const em = await getEm();
  const block = await loadBlock(em, caller, slug);
  const versions = await em.find(BlockVersionSchema, { block }, { populate: ["author"], orderBy: { number: "desc" } });
  const ids = versions.map((v) => v.id);
  const badges = await badgesFor(em, ids);
  const approved = await approvedVersionIds(em, ids);
  return versions.map((v) => ({
    version: v.number, badge: badges.get(v.id)!.badge, approved: approved.has(v.id), author: v.author.name,
    message: v.message, createdAt: v.createdAt.toISOString(), contentHash: v.contentHash,
  }));
}

export interface Lineage {
  forkedFrom: { slug: string; version: number; title: string } | null;
  /** How many versions the parent has gained since the fork was taken. */
  parentNewerVersions: number;
  forks: { slug: string; title: string; fromVersion: number }[];
}

export async function getLineage(caller: Caller, slug: string): Promise<Lineage> {
  const em = await getEm();
  const block = await loadBlock(em, caller, slug);
  const forkedFrom = await forkedFromRef(caller, block);
  let parentNewerVersions = 0;
  if (forkedFrom) {
    const parent = await em.findOne(BlockSchema, { slug: forkedFrom.slug }, { populate: ["head"] });
    parentNewerVersions = Math.max(0, (parent?.head?.number ?? 0) - forkedFrom.version);
  }
  const children = await em.find(BlockSchema, { forkedFrom: { block }, archived: false }, { populate: ["team", "forkedFrom"], orderBy: { createdAt: "asc" } });
  const forks = children
    .filter((c) => can(caller, "block.read", resourceOf(c)))
    .map((c) => ({ slug: c.slug, title: c.title, fromVersion: (c.forkedFrom as BlockVersion).number }));
  return { forkedFrom, parentNewerVersions, forks };
}

export async function blockFileText(caller: Caller, slug: string, version?: number): Promise<string> {
  const em = await getEm();
  const block = await loadBlock(em, caller, slug);
  return (await loadVersion(em, block, version)).text;
}

/** A runnable deck: title, .param lines, the circuit (the engine writes it). */
export async function spiceDeckText(caller: Caller, slug: string, version?: number): Promise<string> {
  return spiceDeck(await blockFileText(caller, slug, version));
}
