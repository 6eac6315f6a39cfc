import type { EntityManager } from "@mikro-orm/postgresql";
import type { ParsedBlock } from "@/checks";
import { BlockVersionSchema, UserSchema, type Block, type BlockVersion, type Category, type CheckRun } from "@/entities";
import { writeEvent } from "@/lib/outbox/outbox";
import { badgesFor } from "@/lib/runs/badge";
import { enqueueRun } from "@/lib/runs/enqueue";
import { sha256, storedParams } from "./common";
import { blockEventBase } from "./events";

export interface StoredResult {
  slug: string;
  version: number;
  run: { id: string; status: CheckRun["status"] };
}

/**
 * Inside the caller's transaction: the new immutable version, the head moved to it, the block's list fields
 * copied from it, its check run queued and a `version.created` event — all in one commit.
 */
export async function storeVersion(
  tx: EntityManager,
  args: { block: Block; number: number; text: string; parsed: ParsedBlock; authorId: number; message: string; extra?: Record<string, unknown> },
): Promise<{ version: BlockVersion; run: CheckRun; result: StoredResult }> {
  const { block, number, text, parsed } = args;
  const previousHead = block.head;
  const version = tx.create(BlockVersionSchema, {
    block, number, text, params: storedParams(parsed.params), contentHash: sha256(text),
    author: tx.getReference(UserSchema, args.authorId), message: args.message.slice(0, 2000), createdAt: new Date(),
  });
  block.head = version;
  block.title = parsed.title;
  block.summary = parsed.summary;
  block.category = parsed.category as Category;
  block.tags = parsed.tags;
  block.hazard = parsed.hazard;
  const run = await enqueueRun(tx, version, "new-version");
  await tx.flush();
  const previousBadge = previousHead ? (await badgesFor(tx, [previousHead.id])).get(previousHead.id)!.badge : null;
  writeEvent(tx, "version.created", {
    ...(await blockEventBase(tx, block, version)),
    message: version.message,
    badge: "pending",
    previousBadge,
    previousVersion: previousHead?.number ?? null,
    forkedFrom: null,
    runId: run.id,
    ...args.extra,
  });
  await tx.flush();
  return { version, run, result: { slug: block.slug, version: number, run: { id: run.id, status: run.status } } };
}
