import { UniqueConstraintViolationException } from "@mikro-orm/core";
import { unitChanges, withParams } from "@/checks";
import { BlockSchema, BlockVersionSchema } from "@/entities";
import type { Ctx } from "@/lib/context";
import { AppError } from "@/lib/errors";
import type { NewVersionInput } from "@/lib/validation/blocks";
import { engineInputError, loadBlock, parseOrThrow, requireUser, sha256 } from "./common";
import { storeVersion, type StoredResult } from "./store";

export type { NewVersionInput };

/**
 * A new version on top of `baseVersion`. Optimistic concurrency, made race-proof: the block row is locked
 * (SELECT … FOR UPDATE) inside the transaction, so of two saves on the same base exactly one moves the head and
 * the other sees the new head and gets a conflict; the unique (block, number) index is the backstop.
 */
export async function addVersion({ em, caller }: Ctx, input: NewVersionInput): Promise<StoredResult> {
  const user = requireUser(caller);
  const block = await loadBlock(em, caller, input.slug, "block.edit");
  if (block.archived) throw new AppError("conflict", "the block is archived", { type: "archived", head: block.head?.number ?? 0 });
  const base = input.baseVersion;
  // Each edge sends one of the two (the JSON route and the fork page values, the file route and the edit page a file).
  if (input.text === undefined && !input.params) throw new AppError("validation", "send a block file or new parameter values");
  const baseRow = await em.findOne(BlockVersionSchema, { block, number: base });
  if (!baseRow) throw stale(block.head?.number ?? 0);

  let text: string;
  try {
    text = input.text ?? baseRow.text;
    if (input.params && Object.keys(input.params).length > 0) text = withParams(text, input.params);
  } catch (err) {
    throw engineInputError(err);
  }
  const parsed = parseOrThrow(text);
  const changed = unitChanges(baseRow.params, parsed.params);
  if (changed.length) throw new AppError("validation", `${changed[0].message} (line ${changed[0].line})`, { errors: changed });
  if (parsed.slug !== block.slug)
    throw new AppError("validation", `the file's slug "${parsed.slug}" is not this block's ("${block.slug}"); fork to rename`, {
      errors: [{ message: "slug differs from the block's" }],
    });

  try {
    return await em.transactional(async (tx) => {
      const conn = tx.getConnection();
      const ctx = tx.getTransactionContext();
      await conn.execute(`select id from blocks where id = ? for update`, [block.id], "all", ctx);
      // A separate statement after the lock: in READ COMMITTED it sees the version the previous holder committed
      // (a join in the locking statement would still read the old snapshot of block_versions).
      const [locked] = await conn.execute<{ head: number | null }[]>(
        `select v.number as head from blocks b left join block_versions v on v.id = b.head_id where b.id = ?`,
        [block.id], "all", ctx);
      const head = Number(locked?.head ?? 0);
      if (head !== base) throw stale(head);
      const fresh = await tx.findOneOrFail(BlockSchema, { id: block.id }, { populate: ["team", "head"], refresh: true });
      if (fresh.head && fresh.head.contentHash === sha256(text))
        throw new AppError("validation", `nothing changed: the file is identical to version ${head}`, { errors: [{ message: "no change" }] });
      const { result } = await storeVersion(tx, {
        block: fresh, number: head + 1, text, parsed, authorId: user.id,
        message: input.message ?? (input.text === undefined ? describeParams(input.params!) : "new file"),
      });
      return result;
    });
  } catch (err) {
    if (err instanceof UniqueConstraintViolationException) {
      const now = await em.findOne(BlockSchema, { id: block.id }, { populate: ["head"], refresh: true });
      throw stale(now?.head?.number ?? base);
    }
    throw err;
  }
}

const stale = (head: number) =>
  new AppError("conflict", `the block has moved on: the head is version ${head}; reload and apply your change to it`, { head });

const describeParams = (p: Record<string, string>) =>
  "retuned " + Object.entries(p).map(([k, v]) => `${k} = ${v}`).join(", ");
