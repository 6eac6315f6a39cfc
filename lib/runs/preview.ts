import { previewBlock, retune, verifyBlock, withParams, type Report } from "@/checks";
import type { Caller } from "@/lib/auth/caller";
import { loadBlock } from "@/lib/blocks/common";
import { getEm } from "@/lib/db/orm";
import { AppError } from "@/lib/errors";

async function headText(caller: Caller, slug: string): Promise<string> {
  const em = await getEm();
  const block = await loadBlock(em, caller, slug);
  if (!block.head) throw new AppError("not_found", "the block has no version");
  return block.head.text;
}

const cleanParams = (params: unknown): Record<string, string> => {
  if (params == null) return {};
  if (typeof params !== "object" || Array.isArray(params)) throw new AppError("validation", "params is an object of name: value");
  return Object.fromEntries(Object.entries(params as Record<string, unknown>).map(([k, v]) => [k, String(v)]));
};

/** For each keystroke: quantities and every non-simulated check with its tolerance corners; nothing stored. */
export async function previewDraft(caller: Caller, slug: string, params: Record<string, string>): Promise<Report> {
  return previewBlock(await headText(caller, slug), cleanParams(params));
}

/** A full evaluation of draft values, simulations only when asked; nothing stored. */
export async function evaluateBlock(caller: Caller, slug: string, input: { params?: Record<string, string>; simulate?: boolean }): Promise<Report> {
  const { report } = await verifyBlock(await headText(caller, slug), { params: cleanParams(input.params), simulate: input.simulate === true });
  return report;
}

/** The value of one parameter that puts a quantity on target, snapped to an E-series, with the preview there. */
export async function retuneBlock(
  caller: Caller,
  slug: string,
  req: { param: string; target: { quantity: string; value: string }; series: string; params?: Record<string, string> },
): Promise<{ value: string; snapped: string; report: Report }> {
  const head = await headText(caller, slug);
  try {
    // Draft values of the other parameters go into the file first, so the assistant solves from what is on screen.
    const text = req.params && Object.keys(req.params).length ? withParams(head, cleanParams(req.params)) : head;
    return await retune(text, { param: String(req.param), target: { quantity: String(req.target?.quantity), value: String(req.target?.value) }, series: String(req.series) });
  } catch (err) {
    const message = (err as Error)?.message ?? String(err);
    throw new AppError("validation", message, { errors: [{ message }] });
  }
}
