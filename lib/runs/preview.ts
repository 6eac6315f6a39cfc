import { parseBlock, previewBlock, retune, verifyBlock, withParams, type ModelTexts, type Report } from "@/checks";
import { resolveModels } from "@/lib/models/resolve";
import type { Caller } from "@/lib/auth/caller";
import { loadBlock, loadVersion } from "@/lib/blocks/common";
import { getEm } from "@/lib/db/orm";
import { AppError } from "@/lib/errors";

/** The head's file and the model files its circuit includes, resolved for the block's team. */
async function headWithModels(caller: Caller, slug: string): Promise<{ text: string; models: ModelTexts }> {
  const em = await getEm();
  const block = await loadBlock(em, caller, slug);
  if (!block.head) throw new AppError("not_found", "the block has no version");
  const models = await resolveModels(em, block.team.id, parseBlock(block.head.text).block?.netlist ?? "");
  return { text: block.head.text, models: models.texts };
}

/** The model files a file's circuit includes, resolved for a team (its own first, then the shared library). */
async function modelsFor(em: Awaited<ReturnType<typeof getEm>>, teamId: number, text: string): Promise<ModelTexts> {
  return (await resolveModels(em, teamId, parseBlock(text).block?.netlist ?? "")).texts;
}

const cleanParams = (params: unknown): Record<string, string> => {
  if (params == null) return {};
  if (typeof params !== "object" || Array.isArray(params)) throw new AppError("validation", "params is an object of name: value");
  return Object.fromEntries(Object.entries(params as Record<string, unknown>).map(([k, v]) => [k, String(v)]));
};

/** For each keystroke: quantities and every non-simulated check with its tolerance corners; nothing stored. */
export async function previewDraft(caller: Caller, slug: string, params: Record<string, string>): Promise<Report> {
  const head = await headWithModels(caller, slug);
  return previewBlock(head.text, cleanParams(params), head.models);
}

export interface EvaluateInput {
  params?: Record<string, string>;
  simulate?: boolean;
  /** A stored version to evaluate instead of the head. */
  version?: number;
  /** An edited block file of this block (what CI has before it pushes), instead of a stored version. */
  text?: string;
}

/** A full evaluation of draft values, a pinned version or an edited file; simulations only when asked; nothing stored. */
export async function evaluateBlock(caller: Caller, slug: string, input: EvaluateInput): Promise<Report> {
  const em = await getEm();
  const block = await loadBlock(em, caller, slug);
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
  const { report } = await verifyBlock(text, { params: cleanParams(input.params), simulate: input.simulate === true, models });
  return report;
}

/** A block file that is not in the library yet, checked in full with `teamId`'s model files; nothing stored. */
export async function evaluateFile(text: string, opts: { simulate: boolean; teamId: number }): Promise<Report> {
  const models = await modelsFor(await getEm(), opts.teamId, text);
  return (await verifyBlock(text, { simulate: opts.simulate, models })).report;
}

/** The value of one parameter that puts a quantity on target, snapped to an E-series, with the preview there. */
export async function retuneBlock(
  caller: Caller,
  slug: string,
  req: { param: string; target: { quantity: string; value: string }; series: string; params?: Record<string, string> },
): Promise<{ value: string; snapped: string; report: Report }> {
  const { text: head, models } = await headWithModels(caller, slug);
  try {
    // Draft values of the other parameters go into the file first, so the assistant solves from what is on screen.
    const text = req.params && Object.keys(req.params).length ? withParams(head, cleanParams(req.params)) : head;
    return await retune(text, { param: String(req.param), target: { quantity: String(req.target?.quantity), value: String(req.target?.value) }, series: String(req.series), models });
  } catch (err) {
    const message = (err as Error)?.message ?? String(err);
    throw new AppError("validation", message, { errors: [{ message }] });
  }
}

/** A draft file of a block, previewed with the model files of that block's team (the editor's live check). */
export async function previewDraftFile(caller: Caller, slug: string, draft: string): Promise<Report> {
  const em = await getEm();
  const block = await loadBlock(em, caller, slug);
  const models = await resolveModels(em, block.team.id, parseBlock(draft).block?.netlist ?? "");
  return previewBlock(draft, undefined, models.texts);
}
