import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";

await vi.hoisted(async () => { await (await import("./blocks-db")).usePrivateDatabase(); });
import { OutboxEventSchema } from "@/entities";
import { createBlock } from "@/lib/blocks/create";
import { getBlock, listVersions } from "@/lib/blocks/read";
import { addVersion } from "@/lib/blocks/versions";
import { archiveBlock, setVisibility } from "@/lib/blocks/archive";
import { failingInMyTeams, myBlocks, recentlyVerified } from "@/lib/blocks/lists";
import { contextFor } from "@/lib/context";
import { anonymous } from "@/lib/auth/caller";
import { closeOrm, getEm } from "@/lib/db/orm";
import type { AppError } from "@/lib/errors";
import { decide, requestReview, reviewQueue, reviewsOf } from "@/lib/reviews/reviews";
import { isWatching, unwatch, watch } from "@/lib/watches/watches";
import { drain, makeTeam, wienFixture, type TestTeam } from "./blocks-helpers";

let team: TestTeam;
beforeAll(async () => { team = await makeTeam(); });
afterAll(closeOrm);

const lastEvent = async (kind: string, slug: string) =>
  (await (await getEm()).find(OutboxEventSchema, { kind: kind as never, payload: { slug } } as never, { orderBy: { id: "desc" }, limit: 1 }))[0];
const code = (p: Promise<unknown>) => p.then(() => "ok", (e: AppError) => e.code);

describe("reviews", () => {
  it("approval belongs to one version, is reset by a new version, and nobody approves their own", async () => {
    const slug = `rev-${team.tag}`;
    await createBlock(await contextFor(team.author), { team: team.slug, text: wienFixture(slug) });
    await drain(team);
    const req = await requestReview(await contextFor(team.author), { slug, version: 1 });
    expect(req.created).toBe(true);
    expect((await requestReview(await contextFor(team.author), { slug, version: 1 })).created).toBe(false);
    const asked = await lastEvent("review.requested", slug);
    expect(asked.payload).toMatchObject({ slug, version: 1, requestedBy: team.author.user!.email, reviewers: [team.maintainer.user!.email] });

    const queue = await reviewQueue(await contextFor(team.maintainer));
    expect(queue.map((q) => [q.slug, q.version, q.badge])).toContainEqual([slug, 1, "verified"]);
    expect(await reviewQueue(await contextFor(team.author))).toEqual([]);

    expect(await code(decide(await contextFor(team.author), { slug, version: 1, decision: "approved", comment: "" }))).toBe("forbidden"); // author role cannot approve
    expect(await code(decide(await contextFor(team.viewer), { slug, version: 1, decision: "approved", comment: "" }))).toBe("forbidden");
    expect(await code(decide(await contextFor(team.maintainer), { slug, version: 1, decision: "changes-requested", comment: " " }))).toBe("validation");
    await decide(await contextFor(team.maintainer), { slug, version: 1, decision: "approved", comment: "margins look right" });
    expect((await getBlock(await contextFor(team.viewer), { slug })).approved).toBe(true);
    expect((await lastEvent("review.decided", slug)).payload).toMatchObject({ decision: "approved", reviewer: team.maintainer.user!.email, requestedBy: [team.author.user!.email] });
    expect((await reviewQueue(await contextFor(team.maintainer))).some((q) => q.slug === slug)).toBe(false);

    // The maintainer writes version 2: it starts unapproved and they may not approve it themselves.
    await addVersion(await contextFor(team.maintainer), { slug, params: { Rf: "24 kohm" }, baseVersion: 1 });
    const head = await getBlock(await contextFor(team.viewer), { slug });
    expect([head.version, head.approved]).toEqual([2, false]);
    expect((await getBlock(await contextFor(team.viewer), { slug, version: 1 })).approved).toBe(true);
    expect(await code(decide(await contextFor(team.maintainer), { slug, version: 2, decision: "approved", comment: "" }))).toBe("forbidden");
    expect((await listVersions(await contextFor(team.viewer), { slug })).map((v) => v.approved)).toEqual([false, true]);

    // A later request for changes withdraws an approval of the same version.
    await decide(await contextFor(team.maintainer), { slug, version: 1, decision: "changes-requested", comment: "Rg tolerance too loose" });
    expect((await getBlock(await contextFor(team.viewer), { slug, version: 1 })).approved).toBe(false);
    expect((await reviewsOf(await contextFor(team.viewer), { slug })).map((r) => [r.version, r.decision])).toEqual([
      [1, "changes-requested"], [1, "approved"], [1, "requested"],
    ]);
    await drain(team);
  });
});

describe("watches and the outbox", () => {
  it("watchers are named on new versions and on a head that turns failing", async () => {
    const slug = `watch-${team.tag}`;
    await createBlock(await contextFor(team.author), { team: team.slug, text: wienFixture(slug) });
    await drain(team);
    expect(await code(watch(await contextFor(team.outsider), { slug }))).toBe("not_found");
    await watch(await contextFor(team.viewer), { slug });
    await watch(await contextFor(team.viewer), { slug });
    expect(await isWatching(await contextFor(team.viewer), { slug })).toBe(true);

    await addVersion(await contextFor(team.author), { slug, params: { Rf: "18 kohm" }, baseVersion: 1, message: "try less gain" });
    const created = await lastEvent("version.created", slug);
    expect(created.payload).toMatchObject({
      slug, version: 2, team: team.slug, authorEmail: team.author.user!.email, badge: "pending", previousBadge: "verified",
      message: "try less gain", watchers: [team.viewer.user!.email],
    });
    await drain(team);
    const finished = await lastEvent("run.finished", slug);
    expect(finished.payload).toMatchObject({ version: 2, badge: "failing", previousBadge: "verified", isHead: true, watchers: [team.viewer.user!.email] });
    expect((await failingInMyTeams(await contextFor(team.viewer))).map((b) => b.slug)).toContain(slug);
    expect((await recentlyVerified(await contextFor(team.viewer), 50)).map((b) => b.slug)).not.toContain(slug);
    expect((await myBlocks(await contextFor(team.author))).map((b) => b.slug)).toContain(slug);

    await unwatch(await contextFor(team.viewer), { slug });
    expect(await isWatching(await contextFor(team.viewer), { slug })).toBe(false);
  });

  it("archiving and publishing write events; public blocks are readable signed out", async () => {
    const slug = `pub-${team.tag}`;
    await createBlock(await contextFor(team.author), { team: team.slug, text: wienFixture(slug) });
    expect(await code(getBlock(await contextFor(anonymous), { slug }))).toBe("not_found");
    expect(await code(setVisibility(await contextFor(team.author), { slug, visibility: "public" }))).toBe("forbidden");
    await setVisibility(await contextFor(team.maintainer), { slug, visibility: "public" });
    expect((await lastEvent("block.updated", slug)).payload).toMatchObject({ change: "visibility", visibility: "public", previous: "team" });
    expect((await getBlock(await contextFor(anonymous), { slug })).visibility).toBe("public");
    await drain(team);
    expect((await recentlyVerified(await contextFor(anonymous), 100)).map((b) => b.slug)).toContain(slug);
    await archiveBlock(await contextFor(team.maintainer), { slug });
    expect((await lastEvent("block.archived", slug)).payload).toMatchObject({ slug, archived: true });
    expect(await code(addVersion(await contextFor(team.author), { slug, params: { Rf: "24 kohm" }, baseVersion: 1 }))).toBe("conflict");
    expect((await getBlock(await contextFor(team.viewer), { slug })).archived).toBe(true);
  });
});
