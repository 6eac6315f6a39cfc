import "server-only";
import type { Waveform } from "@/checks";
import { attachmentsOf, type AttachmentInfo } from "@/lib/attachments/attachments";
import type { Role } from "@/entities";
import { can, roleIn, type BlockResource } from "@/lib/auth/permissions";
import type { Ctx } from "@/lib/context";
import { reviewRowsOf, type ReviewRow } from "@/lib/reviews/reviews";
import { runsOfBlock, waveformsOfRun, type RunView } from "@/lib/runs/runs";
import type { BlockVersionInput } from "@/lib/validation/blocks";
import { watchesBlock } from "@/lib/watches/watches";
import { lineageOf, versionRowsOf, viewOf, type BlockView, type Lineage, type VersionRow } from "./read";
import { readCore } from "./read-core";

/** What the reader may do with the version on screen; the server checks each again when it is done. */
export interface BlockAllowed {
  fork: boolean;
  /** May write new versions of this block (authors their own, maintainers and admins any of the team). */
  edit: boolean;
  /** …and this version is the head, so an edit can start from it. */
  editThisVersion: boolean;
  requestReview: boolean;
  decide: boolean;
  /** May queue this version's checks again (a maintainer's call, as approving is). */
  rerun: boolean;
  attach: boolean;
  watch: boolean;
}

export interface BlockPageModel {
  block: BlockView;
  versions: VersionRow[];
  lineage: Lineage;
  runs: RunView[];
  reviews: ReviewRow[];
  attachments: AttachmentInfo[];
  waveforms: Waveform[];
  watching: boolean;
  isHead: boolean;
  allowed: BlockAllowed;
}

/** The permissions of the block page, all from can(): the one place that answers "may this caller…". */
export function allowedOn(caller: Ctx["caller"], resource: BlockResource, state: { isHead: boolean; archived: boolean }): BlockAllowed {
  const signedIn = caller.user !== null;
  const edit = can(caller, "block.edit", resource);
  return {
    fork: signedIn,
    edit,
    editThisVersion: edit && state.isHead,
    requestReview: can(caller, "review.request", resource) && state.isHead,
    decide: can(caller, "version.approve", resource) && state.isHead,
    rerun: can(caller, "version.approve", resource),
    attach: edit && !state.archived,
    watch: signedIn,
  };
}

/** The block page in one load: block, version, badge, approval, run and lineage read and checked once, then the rest by id. */
export async function loadBlockPage({ em, caller }: Ctx, input: BlockVersionInput): Promise<BlockPageModel> {
  const core = await readCore(em, caller, input.slug, input.version, { forks: true });
  const blockId = core.block.id;
  const [block, versions, runs, reviews, attachments, waveforms, watching] = await Promise.all([
    viewOf(em, core),
    versionRowsOf(em, blockId),
    runsOfBlock(em, blockId, 6),
    reviewRowsOf(em, blockId),
    attachmentsOf(em, blockId),
    core.run && core.run.status === "done" ? (waveformsOfRun(em, core.run.id) as Promise<Waveform[]>) : Promise.resolve([]),
    caller.user ? watchesBlock(em, caller.user.id, blockId) : Promise.resolve(false),
  ]);
  const isHead = block.version === block.headVersion;
  const resource: BlockResource = { kind: "block", teamId: core.block.teamId, visibility: core.block.visibility, authorId: core.block.creatorId };
  return {
    block, versions, lineage: lineageOf(core), runs, reviews, attachments, waveforms, watching, isHead,
    allowed: allowedOn(caller, resource, { isHead, archived: core.block.archived }),
  };
}

/** One version with what the caller may do with it, for the edit and fork pages (one read, one permission check). */
export async function loadBlockVersion({ em, caller }: Ctx, input: BlockVersionInput): Promise<{ block: BlockView; allowed: BlockAllowed; role: Role | null }> {
  const core = await readCore(em, caller, input.slug, input.version, { forks: false });
  const block = await viewOf(em, core);
  const resource: BlockResource = { kind: "block", teamId: core.block.teamId, visibility: core.block.visibility, authorId: core.block.creatorId };
  const allowed = allowedOn(caller, resource, { isHead: block.version === block.headVersion, archived: core.block.archived });
  return { block, allowed, role: roleIn(caller, core.block.teamId) };
}

/** Teams where the caller may create blocks (a fork's or an import's destination). */
export const creatableTeams = (caller: Ctx["caller"]): string[] =>
  caller.memberships.filter((m) => can(caller, "block.create", { kind: "team", teamId: m.teamId })).map((m) => m.teamSlug);
