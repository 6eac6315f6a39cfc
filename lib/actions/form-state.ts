import "server-only";
import { isAppError } from "@/lib/errors";

/** What a server action hands back to its form: per-field errors and one message, shown in an aria-live region. */
export interface FormState {
  ok?: boolean;
  message?: string;
  errors?: Record<string, string[]>;
  /** Engine errors with their line in the block file. */
  lines?: { message: string; line?: number }[];
  head?: number;
  data?: Record<string, unknown>;
}

/**
 * The form field a refusal belongs to: `parameter "R": …` is the field `param.R`; a taken slug is the form's slug
 * field (its name given in `names`). Unplaced refusals stay in the message under the form.
 */
export function fieldErrorsOf(messages: string[], extra: { slug?: unknown }, names: { slug?: string } = {}): Record<string, string[]> {
  const errors: Record<string, string[]> = {};
  const add = (field: string, m: string) => (errors[field] ??= []).push(m);
  for (const m of messages) {
    const param = /^parameter "([A-Za-z_][A-Za-z0-9_]*)"/.exec(m);
    if (param) add(`param.${param[1]}`, m);
  }
  if (extra.slug && names.slug) add(names.slug, messages[0] ?? "taken");
  return errors;
}

/** A service's AppError becomes words for the form, at their fields where one is named; anything else is logged. */
export function failure(err: unknown, names: { slug?: string } = {}): FormState {
  if (isAppError(err)) {
    const extra = err.extra as { errors?: { message: string; line?: number }[]; head?: number; slug?: unknown };
    const messages = [err.message, ...(extra.errors ?? []).map((e) => e.message)];
    const errors = fieldErrorsOf([...new Set(messages)], extra, names);
    const placed = Object.keys(errors).length > 0;
    const lines = placed ? extra.errors?.filter((e) => !/^parameter "/.test(e.message)) : extra.errors;
    // Errors with a line are shown at the block file's field, beside that line; the message only says where to look.
    const atLine = lines?.find((e) => e.line);
    const message = placed
      ? "Some fields need attention; the rest is kept as you typed it."
      : atLine ? `Nothing was saved: the block file needs a fix at line ${atLine.line}; the rest is kept as you typed it.` : err.message;
    return { ok: false, message, lines, head: extra.head, errors: placed ? errors : undefined };
  }
  console.error(err);
  return { ok: false, message: "Something went wrong on the server; the change was not saved." };
}
