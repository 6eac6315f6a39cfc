import { createHash } from "node:crypto";
import type { EntityManager } from "@mikro-orm/postgresql";
import { SpiceError, circuitRefusal, parseBlock, scriptRefusal, spiceDeck, type ParamSpec, type ParsedBlock } from "@/checks";
import { BlockSchema, BlockVersionSchema, type Block, type BlockVersion, type StoredParam } from "@/entities";
import type { Caller } from "@/lib/auth/caller";
import { assertCan, type Action, type BlockResource } from "@/lib/auth/permissions";
import { AppError } from "@/lib/errors";
import { assertStorable } from "./stored-fields";

export const sha256 = (text: string): string => createHash("sha256").update(text, "utf8").digest("hex");

/** The engine's parser decides whether a file (and its parameter values) may be stored at all. */
export function parseOrThrow(text: string): ParsedBlock {
  const { block, errors } = parseBlock(text);
  if (!block || errors.length > 0) {
    const first = errors[0];
    const where = first?.line ? ` (line ${first.line})` : "";
    throw new AppError("validation", `the block file is not valid: ${first?.message ?? "unreadable"}${where}`, { errors });
  }
  assertStorable(block, text);
  // A netlist the engine would refuse (.control, shell, analysis cards…) is refused now, not served later.
  const refused = circuitRefusal(block.netlist);
  if (refused) {
    const line = refused.line === undefined ? undefined : block.netlistLine + refused.line - 1;
    const error = { message: `netlist: ${refused.message}`, ...(line ? { line } : {}) };
    throw new AppError("validation", `the block file is not valid: ${error.message}${line ? ` (line ${line})` : ""}`, { errors: [error] });
  }
  // A script line that does not parse is refused too; what only a simulation can judge is left to the run.
  const unreadable = scriptRefusal(block);
  if (unreadable) {
    const where = unreadable.line ? ` (line ${unreadable.line})` : "";
    throw new AppError("validation", `the block file is not valid: ${unreadable.message}${where}`, { errors: [unreadable] });
  }
  return block;
}

/** The runnable deck of a stored file, or 422 with the sanitiser's line for one stored before it was refused. */
export function deckOrThrow(text: string): string {
  try {
    return spiceDeck(text);
  } catch (e) {
    if (!(e instanceof SpiceError)) throw e;
    const where = e.line ? ` (line ${e.line})` : "";
    throw new AppError("validation", `this version cannot be served as a SPICE deck: ${e.message}${where}`, {
      errors: [{ message: e.message, ...(e.line ? { line: e.line } : {}) }],
    });
  }
}

export const storedParams = (params: ParamSpec[]): StoredParam[] =>
  params.map(({ name, value, tol, note, si, unit }) => ({ name, value, ...(tol ? { tol } : {}), ...(note ? { note } : {}), si, unit }));

export function requireUser(caller: Caller): { id: number; email: string; name: string } {
  if (!caller.user) throw new AppError("unauthenticated", "sign in first");
  return caller.user;
}

export function resourceOf(block: Block, authorId?: number | null): BlockResource {
  return { kind: "block", teamId: block.team.id, visibility: block.visibility, authorId: authorId ?? null };
}

/** The block by slug with team and head loaded, after checking `action` (404 when the caller may not read it). */
export async function loadBlock(em: EntityManager, caller: Caller, slug: string, action: Action = "block.read"): Promise<Block> {
  const block = await em.findOne(BlockSchema, { slug }, { populate: ["team", "head", "head.author"] });
  if (!block) throw new AppError("not_found", "no such block");
  assertCan(caller, "block.read", resourceOf(block));
  if (action !== "block.read") assertCan(caller, action, resourceOf(block, await creatorOf(em, block)));
  return block;
}

/** "Own block" for the author role: the author of version 1. */
async function creatorOf(em: EntityManager, block: Block): Promise<number | null> {
  const first = await em.findOne(BlockVersionSchema, { block, number: 1 }, { fields: ["author"] });
  return first ? first.author.id : null;
}

export async function loadVersion(em: EntityManager, block: Block, number?: number): Promise<BlockVersion> {
  if (number === undefined) {
    if (!block.head) throw new AppError("not_found", "the block has no version");
    return block.head;
  }
  const v = await em.findOne(BlockVersionSchema, { block, number }, { populate: ["author"] });
  if (!v) throw new AppError("not_found", `no version ${number} of ${block.slug}`);
  return v;
}

/** withParams throws plain Errors for unknown names or unreadable values; callers see a validation problem. */
export function engineInputError(err: unknown): AppError {
  const message = (err as Error)?.message ?? String(err);
  return new AppError("validation", message, { errors: [{ message }] });
}
