import "server-only";
import { AppError } from "@/lib/errors";

// Cursor pages over a list already in memory (versions of one block: tens, not thousands).
// The cursor is the offset, base64url-wrapped so clients treat it as opaque.
const encode = (offset: number) => Buffer.from(`o:${offset}`).toString("base64url");

function decode(cursor: string | undefined): number {
  if (!cursor) return 0;
  const m = /^o:(\d{1,9})$/.exec(Buffer.from(cursor, "base64url").toString());
  if (!m) throw new AppError("validation", "the cursor is not one this API gave out", { errors: [{ message: "bad cursor", path: "cursor" }] });
  return Number(m[1]);
}

export function pageOf<T>(rows: T[], cursor: string | undefined, limit: number): { items: T[]; nextCursor: string | null } {
  const offset = decode(cursor);
  const items = rows.slice(offset, offset + limit);
  return { items, nextCursor: offset + limit < rows.length ? encode(offset + limit) : null };
}
