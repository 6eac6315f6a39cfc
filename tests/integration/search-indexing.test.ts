import { afterAll, describe, expect, it } from "vitest";
import { anonymous } from "@/lib/auth/caller";
import { archiveBlock, setVisibility } from "@/lib/blocks/archive";
import { createBlock } from "@/lib/blocks/create";
import { closeOrm, getEm } from "@/lib/db/orm";
import { indexBacklog } from "@/lib/search/backlog";
import { processIndexBacklog } from "@/lib/search/indexer";
import type { Caller } from "@/lib/auth/caller";
import { contextFor } from "@/lib/context";
import { searchBlocks } from "@/lib/search/search";
import { searchQuerySchema } from "@/lib/validation/blocks";
import { makeTeam, rcBlock } from "../support/people";

const search = async (caller: Caller, q: string) => searchBlocks(await contextFor(caller), searchQuerySchema.parse({ q }));

afterAll(closeOrm);

async function drain() {
  while ((await processIndexBacklog(await getEm())) > 0);
}

describe("indexing from the outbox", () => {
  it("brings a new block, a visibility change and an archive into search", async () => {
    const { callers, tag } = await makeTeam(["author", "maintainer"]);
    const slug = `quartzline-${tag}`;
    await createBlock(await contextFor(callers.author), { team: callers.author.memberships[0].teamSlug, text: rcBlock(slug, `Quartzline filter ${tag}`) });
    await drain();
    const mine = await search(callers.author, `quartzline ${tag}`);
    expect(mine.items.map((i) => i.slug)).toContain(slug);
    // Team visibility: nobody outside the team sees it, not even in facet counts.
    const outside = await search(anonymous, `quartzline ${tag}`);
    expect(outside.items.map((i) => i.slug)).not.toContain(slug);
    const other = await makeTeam(["admin"]);
    const otherHits = await search(other.callers.admin, tag);
    expect(otherHits.items).toHaveLength(0);
    expect(Object.values(otherHits.facets.category ?? {}).reduce((a, b) => a + b, 0)).toBe(0);

    await setVisibility(await contextFor(callers.maintainer), { slug, visibility: "public" });
    await drain();
    expect((await search(anonymous, `quartzline ${tag}`)).items.map((i) => i.slug)).toContain(slug);

    await archiveBlock(await contextFor(callers.maintainer), { slug });
    await drain();
    expect((await search(callers.author, `quartzline ${tag}`)).items).toHaveLength(0);
  });

  it("finds a block with a typo in a word of five letters or more", async () => {
    const { callers, tag } = await makeTeam(["author"]);
    const slug = `typo-${tag}`;
    await createBlock(await contextFor(callers.author), { team: callers.author.memberships[0].teamSlug, text: rcBlock(slug, `Soft limiter ${tag}`) });
    await drain();
    // Meilisearch's documented typo rule: one typo allowed from five letters ("limitr" for "limiter").
    const hits = await search(callers.author, `limitr ${tag}`);
    expect(hits.items.map((i) => i.slug)).toContain(slug);
    expect(hits.items.find((i) => i.slug === slug)?.highlight?.title.some((r) => r.match)).toBe(true);
  });

  it("keeps events while the search server is down and applies them when it is back", async () => {
    const { callers, tag } = await makeTeam(["author"]);
    const slug = `outage-${tag}`;
    const realUrl = process.env.MEILI_URL!;
    process.env.MEILI_URL = "http://127.0.0.1:9"; // nothing listens on the discard port
    try {
      await createBlock(await contextFor(callers.author), { team: callers.author.memberships[0].teamSlug, text: rcBlock(slug, `Outage filter ${tag}`) });
      await expect(processIndexBacklog(await getEm())).rejects.toThrow();
      expect(await indexBacklog(await getEm())).toBeGreaterThan(0);
    } finally {
      process.env.MEILI_URL = realUrl;
    }
    await drain();
    expect(await indexBacklog(await getEm())).toBe(0);
    expect((await search(callers.author, `outage ${tag}`)).items.map((i) => i.slug)).toContain(slug);
  });
});
