import type { EntityManager } from "@mikro-orm/postgresql";
import { parseBlock, previewBlock, retune, verifyBlock, withParams, type ModelTexts, type Report } from "@/checks";
import { loadBlock, loadVersion } from "@/lib/blocks/common";
import type { Ctx } from "@/lib/context";
import { AppError } from "@/lib/errors";
import { resolveModels } from "@/lib/models/resolve";
import type { DraftFileInput, EvaluateFileInput, EvaluateInput, PreviewInput, RetuneInput } from "@/lib/validation/runs";

// Engine calls on drafts: nothing here is stored. Inputs come parsed by lib/validation/runs.ts.

/** The model files a file's circuit includes, resolved for a team (its own first, then the shared library). */
async function modelsFor(em: EntityManager, teamId: number, text: string): Promise<ModelTexts> {
  return (await resolveModels(em, teamId, parseBlock(text).block?.netlist ?? "")).texts;
}

/** The head's file and the model files its circuit includes, resolved for the block's team. */
async function headWithModels({ em, caller }: Ctx, slug: string): Promise<{ text: string; models: ModelTexts }> {
  const block = await loadBlock(em, caller, slug);
  if (!block.head) throw new AppError("not_found", "the block has no version");
  return { text: block.head.text, models: await modelsFor(em, block.team.id, block.head.text) };
}

/** For each keystroke: quantities and every non-simulated check with its tolerance corners; nothing stored. */
export async function previewDraft(ctx: Ctx, { slug, params }: PreviewInput): Promise<Report> {
  const head = await headWithModels(ctx, slug);
  return previewBlock(head.text, params, head.models);
}

/** A full evaluation of draft values, a pinned version or an edited file; simulations only when asked; nothing stored. */
export async function evaluateBlock({ em, caller }: Ctx, input: EvaluateInput): Promise<Report> {
  const block = await loadBlock(em, caller, input.slug);
  let text: string;
  if (input.text !== undefined) {
    const fileSlug = /^slug:\s*["']?([^"'\s]+)/m.exec(input.text)?.[1];
    if (fileSlug && fileSlug !== block.slug) {
      throw new AppError("validation", `slug: the file is ${fileSlug}, not ${block.slug}; a file not in the library goes to POST /api/v1/evaluate`, { errors: [{ path: "slug", message: `expected ${block.slug}` }] });
    }
    text = input.text;
  } else {
    text = (await loadVersion(em, block, input.version)).text;
  }
  const models = await modelsFor(em, block.team.id, text);
  const { report } = await verifyBlock(text, { params: input.params ?? {}, simulate: input.simulate === true, models });
  return report;
}

/** A block file that is not in the library yet, checked in full with `teamId`'s model files; nothing stored. */
export async function evaluateFile({ em }: Ctx, { text, simulate, teamId }: EvaluateFileInput): Promise<Report> {
  const models = await modelsFor(em, teamId, text);
  return (await verifyBlock(text, { simulate, models })).report;
}

/** The value of one parameter that puts a quantity on target, snapped to an E-series, with the preview there. */
export async function retuneBlock(ctx: Ctx, input: RetuneInput): Promise<{ value: string; snapped: string; report: Report }> {
  const { text: head, models } = await headWithModels(ctx, input.slug);
  try {
    // Draft values of the other parameters go into the file first, so the assistant solves from what is on screen.
    const text = input.params && Object.keys(input.params).length ? withParams(head, input.params) : head;
    return await retune(text, { param: input.param, target: input.target, series: input.series, models });
  } catch (err) {
    const message = (err as Error)?.message ?? String(err);
    throw new AppError("validation", message, { errors: [{ message }] });
  }
}

/** A draft file of a block, previewed with the model files of that block's team (the editor's live check). */
export async function previewDraftFile({ em, caller }: Ctx, { slug, text }: DraftFileInput): Promise<Report> {
  const block = await loadBlock(em, caller, slug);
  return previewBlock(text, undefined, await modelsFor(em, block.team.id, text));
}
