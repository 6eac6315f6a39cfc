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

/** A service's AppError becomes words for the form; anything else is logged and reported plainly. */
export function failure(err: unknown): FormState {
  if (isAppError(err)) {
    const extra = err.extra as { errors?: { message: string; line?: number }[]; head?: number };
    return { ok: false, message: err.message, lines: extra.errors, head: extra.head };
  }
  console.error(err);
  return { ok: false, message: "Something went wrong on the server; the change was not saved." };
}
