import { createHash } from "node:crypto";
import { modelDefinitions, sharedModelFile, sharedModelNames, type ModelDefinition } from "@/checks";
import { ModelSchema, ModelVersionSchema, type Model } from "@/entities";
import { can } from "@/lib/auth/permissions";
import type { Ctx } from "@/lib/context";
import { AppError } from "@/lib/errors";
import { badgesFor, type Badge } from "@/lib/runs/badge";
import { loadTeam, readableTeams, SHARED } from "./common";
import { dependentHeads } from "./dependents";

export interface ModelSummary {
  team: string; // a team slug, or "shared"
  name: string;
  version: number;
  sha256: string;
  defines: ModelDefinition[];
  updatedAt: string | null;
}

export interface ModelVersionSummary {
  number: number; sha256: string; author: string; message: string; createdAt: string;
}

export interface ModelUser {
  slug: string; title: string; team: string; version: number; badge: Badge;
}

export interface ModelFile extends ModelSummary {
  text: string;
  /** Newest first; the shared library's one version is the file as shipped with the code. */
  versions: ModelVersionSummary[];
  head: number;
  /** Block heads that use this file, as the caller may see them, with their badges. */
  usedBy: ModelUser[];
}

const sha = (text: string) => createHash("sha256").update(text, "utf8").digest("hex");

function sharedSummary(name: string): ModelSummary & { text: string } {
  const text = sharedModelFile(name);
  if (text === null) throw new AppError("not_found", `no shared model file "${name}"`);
  return { team: SHARED, name, version: 1, sha256: sha(text), defines: modelDefinitions(text), updatedAt: null, text };
}

/** The team libraries the caller reads (one when `team` is given) and the shared library, each file's head. */
export async function listModels(ctx: Ctx, input: { team?: string } = {}): Promise<{ items: ModelSummary[] }> {
  const teams = input.team === SHARED ? [] : await readableTeams(ctx, input.team);
  const models = teams.length
    ? await ctx.em.find(ModelSchema, { team: { $in: teams.map((t) => t.id) } }, { populate: ["team", "head"], orderBy: { name: "asc" } })
    : [];
  const own = models.filter((m) => m.head).map((m): ModelSummary => ({
    team: m.team.slug, name: m.name, version: m.head!.number, sha256: m.head!.sha256, defines: m.head!.defines,
    updatedAt: m.updatedAt.toISOString(),
  }));
  const shared = sharedModelNames().map((n) => {
    const { text: _text, ...s } = sharedSummary(n);
    return s;
  });
  return { items: [...own, ...shared] };
}

/** One file: a version's text (the head by default), its versions, and the blocks that use it. */
export async function getModel(ctx: Ctx, input: { team: string; name: string; version?: number }): Promise<ModelFile> {
  if (input.team === SHARED) {
    const s = sharedSummary(input.name);
    if (input.version !== undefined && input.version !== 1) throw new AppError("not_found", `the shared ${s.name} has one version`);
    const versions = [{ number: 1, sha256: s.sha256, author: "shared library", message: "versioned with the code", createdAt: "" }];
    return { ...s, versions, head: 1, usedBy: await usersOf(ctx, s.name, null) };
  }
  const team = await loadTeam(ctx, input.team, "model.read");
  const model = await ctx.em.findOne(ModelSchema, { team, name: input.name }, { populate: ["head"] });
  if (!model?.head) throw new AppError("not_found", `no model file "${input.name}" in ${team.slug}`);
  const all = await ctx.em.find(ModelVersionSchema, { model }, { populate: ["author"], orderBy: { number: "desc" } });
  const version = input.version === undefined ? model.head : all.find((v) => v.number === input.version);
  if (!version) throw new AppError("not_found", `no version ${input.version} of ${model.name}`);
  return {
    team: team.slug, name: model.name, version: version.number, sha256: version.sha256, defines: version.defines, text: version.text,
    updatedAt: model.updatedAt.toISOString(), head: model.head.number, usedBy: await usersOf(ctx, model.name, model),
    versions: all.map((v) => ({ number: v.number, sha256: v.sha256, author: v.author.name, message: v.message, createdAt: v.createdAt.toISOString() })),
  };
}

/**
 * Heads that use the file: for a team file, that team's blocks; for a shared file, the blocks the caller may read
 * whose team has no file of that name of its own.
 */
async function usersOf(ctx: Ctx, name: string, model: Model | null): Promise<ModelUser[]> {
  let heads = await dependentHeads(ctx.em, name, model ? [model.team.id] : null);
  if (!model) {
    heads = heads.filter((h) => can(ctx.caller, "block.read", { kind: "block", teamId: h.teamId, visibility: h.visibility }));
    const shadowing = heads.length
      ? await ctx.em.find(ModelSchema, { name, team: { $in: [...new Set(heads.map((h) => h.teamId))] } }, { fields: ["team"] })
      : [];
    const shadowed = new Set(shadowing.map((m) => m.team.id));
    heads = heads.filter((h) => !shadowed.has(h.teamId));
  }
  const badges = await badgesFor(ctx.em, heads.map((h) => h.headId));
  return heads.map((h) => ({
    slug: h.slug, title: h.title, team: h.team, version: h.version, badge: badges.get(h.headId)!.badge,
  }));
}

/** Two versions' texts for a diff (page); both must exist. */
export async function modelVersionTexts(ctx: Ctx, input: { team: string; name: string; from: number; to: number }) {
  const [a, b] = await Promise.all([
    getModel(ctx, { team: input.team, name: input.name, version: input.from }),
    getModel(ctx, { team: input.team, name: input.name, version: input.to }),
  ]);
  return { from: a, to: b };
}

/** One immutable version, without what changes around it (versions list, users): what `?version=n` answers. */
export async function getModelVersion(ctx: Ctx, input: { team: string; name: string; version: number }) {
  const f = await getModel(ctx, input);
  const v = f.versions.find((x) => x.number === f.version)!;
  return { team: f.team, name: f.name, version: f.version, sha256: f.sha256, defines: f.defines, text: f.text, author: v.author, message: v.message, createdAt: v.createdAt };
}
