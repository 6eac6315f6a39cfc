import { UniqueConstraintViolationException } from "@mikro-orm/core";
import { createHash } from "node:crypto";
import { defaultModelsDir, MODEL_FILE, modelDefinitions, sanitizeModelFile, SpiceError } from "@/checks";
import { ModelSchema, ModelVersionSchema, UserSchema, type Team } from "@/entities";
import type { Ctx } from "@/lib/context";
import { AppError } from "@/lib/errors";
import { enqueueStaleHeads } from "@/lib/runs/reverify";
import { loadTeam, MAX_MODEL_FILE_BYTES } from "./common";
import { dependentHeads, markRunsOutdated } from "./dependents";
import { resolveModels } from "./resolve";

export interface UploadInput {
  team: string;
  name: string;
  text: string;
  message?: string;
}

export interface UploadResult {
  team: string;
  name: string;
  version: number;
  sha256: string;
  /** Heads of the team's blocks that use the file: now stale, queued for verification. */
  reverify: { slug: string; version: number }[];
}

/**
 * A new immutable version of a team's model file (the first upload of a name creates it). The file is checked like
 * a netlist before anything is stored; the heads that use it turn stale and are queued for the worker in the same
 * transaction.
 */
export async function uploadModel(ctx: Ctx, input: UploadInput): Promise<UploadResult> {
  const team = await mayUpload(ctx, input.team);
  const name = input.name;
  const text = input.text.replace(/\r\n?/g, "\n"); // the API's text/plain body; the form's schema has done this already
  await checkModelFile(ctx, team, name, text);
  const sha256 = createHash("sha256").update(text, "utf8").digest("hex");
  try {
    return await ctx.em.transactional(async (tx) => {
      const model = (await tx.findOne(ModelSchema, { team, name }, { populate: ["head"] }))
        ?? tx.create(ModelSchema, { team, name, head: null, createdAt: new Date(), updatedAt: new Date() });
      if (model.head?.sha256 === sha256)
        throw new AppError("conflict", `${name} version ${model.head.number} already has this text`, { version: model.head.number });
      const version = tx.create(ModelVersionSchema, {
        model, number: (model.head?.number ?? 0) + 1, text, sha256, defines: modelDefinitions(text),
        author: tx.getReference(UserSchema, ctx.caller.user!.id), message: (input.message ?? "").slice(0, 2000), createdAt: new Date(),
      });
      model.head = version;
      await tx.flush();
      const heads = await dependentHeads(tx, name, [team.id]);
      await markRunsOutdated(tx, team.id, name, heads.map((h) => h.headId));
      await enqueueStaleHeads(tx, { teamIds: [team.id] });
      return { team: team.slug, name, version: version.number, sha256, reverify: heads.map((h) => ({ slug: h.slug, version: h.version })) };
    });
  } catch (err) {
    if (err instanceof UniqueConstraintViolationException) throw new AppError("conflict", `${name} was uploaded by someone else at the same moment; try again`);
    throw err;
  }
}

/** The team whose library the caller may add to: 401 signed out, 404 outside the team, 403 below author. */
export async function mayUpload(ctx: Ctx, teamSlug: string): Promise<Team> {
  if (!ctx.caller.user) throw new AppError("unauthenticated", "sign in first");
  return loadTeam(ctx, teamSlug, "model.upload");
}

/** Name, size and content, as the engine's sanitiser sees them; a refusal names the file's line. */
async function checkModelFile(ctx: Ctx, team: Team, name: string, text: string): Promise<void> {
  const invalid = (message: string, line?: number) =>
    new AppError("validation", `${name || "the model file"}${line ? ` line ${line}` : ""}: ${message}`, { errors: [{ message, ...(line ? { line } : {}) }] });
  if (!MODEL_FILE.test(name)) throw invalid("a model file is named like opamp-x.lib: letters, digits, - _ . and a .lib, .mod, .sub or .cir ending");
  if (Buffer.byteLength(text, "utf8") > MAX_MODEL_FILE_BYTES) throw new AppError("payload_too_large", `a model file holds at most ${MAX_MODEL_FILE_BYTES / 1024} KiB`);
  if (text.includes("\u0000")) throw invalid("the file is not text");
  // Its own includes resolve like a block's: the team's files (this upload in place of its older version), then shared.
  const resolved = await resolveModels(ctx.em, team.id, text);
  try {
    sanitizeModelFile(name, text, { modelsDir: defaultModelsDir(), models: { ...resolved.texts, [name]: text } });
  } catch (err) {
    if (err instanceof SpiceError) throw invalid(err.message, err.line);
    throw err;
  }
  if (modelDefinitions(text).length === 0) throw invalid("the file defines no .model and no .subckt");
}
