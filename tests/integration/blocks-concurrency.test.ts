import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";

await vi.hoisted(async () => { await (await import("./blocks-db")).usePrivateDatabase(); });
import { BlockVersionSchema, CheckRunSchema } from "@/entities";
import { createBlock } from "@/lib/blocks/create";
import { getBlock } from "@/lib/blocks/read";
import { addVersion } from "@/lib/blocks/versions";
import { closeOrm, getEm } from "@/lib/db/orm";
import type { AppError } from "@/lib/errors";
import { dividerBlock, drain, makeTeam, type TestTeam } from "./blocks-helpers";
import { contextFor } from "@/lib/context";

let team: TestTeam;
beforeAll(async () => { team = await makeTeam(); });
afterAll(closeOrm);

describe("optimistic concurrency on the head", () => {
  it("of concurrent saves on the same base exactly one wins; the others get a conflict naming the new head", async () => {
    const slug = `race-${team.tag}`;
    await createBlock(await contextFor(team.author), { team: team.slug, text: dividerBlock(slug) });
    const values = ["10.2 kohm", "10.5 kohm", "9.1 kohm", "9.5 kohm", "10.7 kohm", "9.7 kohm", "10.9 kohm", "9.3 kohm"];
    let base = 1;
    for (let round = 0; round < 4; round++) {
      const width = round === 3 ? 4 : 2;
      const tries = values.slice(round * 2, round * 2 + width).map(async (R2, i) =>
        addVersion(await contextFor(i % 2 ? team.maintainer : team.author), { slug, params: { R2 }, baseVersion: base }).then(
          (r) => ({ ok: true as const, version: r.version }),
          (e: AppError) => ({ ok: false as const, code: e.code, head: e.extra?.head }),
        ));
      const results = await Promise.all(tries);
      const wins = results.filter((r) => r.ok);
      const losses = results.filter((r) => !r.ok);
      expect(wins).toHaveLength(1);
      expect(wins[0]).toEqual({ ok: true, version: base + 1 });
      for (const l of losses) expect(l).toEqual({ ok: false, code: "conflict", head: base + 1 });
      base += 1;
    }
    const em = await getEm();
    const versions = await em.find(BlockVersionSchema, { block: { slug } } as never, { orderBy: { number: "asc" } });
    expect(versions.map((v) => v.number)).toEqual([1, 2, 3, 4, 5]);
    // Every stored version got exactly one run, in the same transaction.
    for (const v of versions) expect(await em.count(CheckRunSchema, { version: v })).toBe(1);
    expect((await getBlock(await contextFor(team.viewer), { slug })).version).toBe(5);
    const stale = await addVersion(await contextFor(team.author), { slug, params: { R2: "10 kohm" }, baseVersion: 3 }).catch((e: AppError) => e);
    expect((stale as AppError).code).toBe("conflict");
    expect((stale as AppError).extra.head).toBe(5);
    await drain(team);
  });
});
