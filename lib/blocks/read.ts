import type { EntityManager } from "@mikro-orm/postgresql";
import { BlockVersionSchema, type RunModel } from "@/entities";
import type { Ctx } from "@/lib/context";
import type { BlockInput, BlockVersionInput } from "@/lib/validation/blocks";
import { approvedVersionIds } from "@/lib/reviews/approval";
import { badgesFor, type Badge } from "@/lib/runs/badge";
import { loadBlock } from "./common";
import { blockValidator, readCore, versionFile, type ReadCore } from "./read-core";

export interface BlockView {
  slug: string; title: string; category: string; tags: string[]; summary: string; team: string;
  visibility: "team" | "public"; version: number; badge: Badge; approved: boolean;
  params: { name: string; value: string; unit: string; tol: string | null; note: string | null }[];
  markdown: string; netlist: string; script: string; report: Record<string, unknown> | null;
  forkedFrom: { slug: string; version: number; title: string } | null; createdAt: string; author: string;
  hazard: string[]; contentHash: string; headVersion: number; archived: boolean; note: string; text: string;
  message: string; runId: string | null; runStatus: string | null;
  /** The model files the latest run simulated with (null before team models were recorded). */
  models: RunModel[] | null;
}

export interface Lineage {
  forkedFrom: { slug: string; version: number; title: string } | null;
  /** How many versions the parent has gained since the fork was taken. */
  parentNewerVersions: number;
  forks: { slug: string; title: string; fromVersion: number }[];
}

export async function viewOf(em: EntityManager, core: ReadCore): Promise<BlockView> {
  const { block, version: v, run } = core;
  const { text, parsed } = await versionFile(em, v.id, v.contentHash);
  return {
    slug: block.slug,
    title: parsed?.title ?? block.title,
    category: parsed?.category ?? block.category,
    tags: parsed?.tags ?? block.tags,
    summary: parsed?.summary ?? block.summary,
    team: block.teamSlug,
    visibility: block.visibility,
    version: v.number,
    badge: core.badge,
    approved: core.approved,
    params: v.params.map((p) => ({ name: p.name, value: p.value, unit: p.unit, tol: p.tol ?? null, note: p.note ?? null })),
    markdown: parsed?.body ?? "",
    netlist: parsed?.netlist ?? "",
    script: parsed?.script ?? "",
    report: run?.report ?? null,
    forkedFrom: core.parent ? { slug: core.parent.slug, version: core.parent.version, title: core.parent.title } : null,
    createdAt: v.createdAt.toISOString(),
    author: v.author,
    hazard: parsed?.hazard ?? block.hazard,
    contentHash: v.contentHash,
    headVersion: block.headNumber ?? v.number,
    archived: block.archived,
    note: parsed?.note ?? "",
    text,
    message: v.message,
    runId: run?.id ?? null,
    runStatus: run?.status ?? null,
    models: run?.models ?? null,
  };
}

export function lineageOf(core: ReadCore): Lineage {
  const p = core.parent;
  return {
    forkedFrom: p ? { slug: p.slug, version: p.version, title: p.title } : null,
    parentNewerVersions: p ? Math.max(0, (p.headNumber ?? 0) - p.version) : 0,
    forks: core.forks ?? [],
  };
}

/** One version of a block (the head by default) as DESIGN.md's Block JSON plus what the pages need. */
export async function getBlock({ em, caller }: Ctx, input: BlockVersionInput): Promise<BlockView> {
  return viewOf(em, await readCore(em, caller, input.slug, input.version, { forks: false }));
}

export async function getLineage({ em, caller }: Ctx, input: BlockInput): Promise<Lineage> {
  return lineageOf(await readCore(em, caller, input.slug, undefined, { forks: true, versionOptional: true }));
}

/**
 * Block and lineage from one load, with the validator of their JSON. `view()` reads the version file (cached per
 * process), so a revalidation that matches the validator builds nothing.
 */
export async function getBlockWithLineage({ em, caller }: Ctx, input: BlockVersionInput) {
  const core = await readCore(em, caller, input.slug, input.version, { forks: true });
  const lineage = lineageOf(core);
  return { lineage, visibility: core.block.visibility, etag: blockValidator(core, lineage.parentNewerVersions), view: () => viewOf(em, core) };
}

export interface VersionRow {
  version: number; badge: Badge; approved: boolean; author: string; message: string; createdAt: string; contentHash: string;
}

export async function listVersions({ em, caller }: Ctx, input: BlockInput): Promise<VersionRow[]> {
  const block = await loadBlock(em, caller, input.slug);
  return versionRowsOf(em, block.id);
}

/** Every version of a block the caller was already allowed to read, newest first, with badge and approval. */
export async function versionRowsOf(em: EntityManager, blockId: number): Promise<VersionRow[]> {
  const versions = await em.find(BlockVersionSchema, { block: blockId }, { populate: ["author"], orderBy: { number: "desc" } });
  const ids = versions.map((v) => v.id);
  const [badges, approved] = await Promise.all([badgesFor(em, ids), approvedVersionIds(em, ids)]);
  return versions.map((v) => ({
    version: v.number, badge: badges.get(v.id)!.badge, approved: approved.has(v.id), author: v.author.name,
    message: v.message, createdAt: v.createdAt.toISOString(), contentHash: v.contentHash,
  }));
}

export async function blockFileText({ em, caller }: Ctx, input: BlockVersionInput): Promise<string> {
  const core = await readCore(em, caller, input.slug, input.version, { forks: false });
  return (await versionFile(em, core.version.id, core.version.contentHash)).text;
}

// The runnable deck inlines model files, so it lives with the model resolution.
export { spiceDeckText } from "./deck";
