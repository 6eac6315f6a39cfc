import { afterAll, describe, expect, it } from "vitest";
import { randomUUID } from "node:crypto";
import {
  ApiTokenSchema, AttachmentSchema, BlockSchema, BlockVersionSchema, CheckRunSchema, InvitationSchema,
  MembershipSchema, OutboxEventSchema, ReviewSchema, SignInLinkSchema, TeamSchema, UserSchema, WatchSchema,
} from "@/entities";
import { closeOrm, getEm } from "@/lib/db/orm";

afterAll(closeOrm);

// The migrations were applied to an empty database by global-setup; every entity must round-trip through them.
describe("schema round-trip", () => {
  it("stores and reads back every entity", async () => {
    const em = await getEm();
    const tag = randomUUID().slice(0, 8);
    const user = em.create(UserSchema, { email: `rt-${tag}@schema.test`, name: "Round Trip", passwordHash: null });
    const team = em.create(TeamSchema, { slug: `rt-${tag}`, name: "Round trip team" });
    em.create(MembershipSchema, { user, team, role: "author" });
    em.create(InvitationSchema, { team, email: `inv-${tag}@schema.test`, role: "viewer", tokenHash: `i${tag}`.padEnd(64, "0"), invitedBy: user, expiresAt: new Date(Date.now() + 3600e3), acceptedAt: null });
    em.create(SignInLinkSchema, { email: user.email, tokenHash: `s${tag}`.padEnd(64, "0"), expiresAt: new Date(), usedAt: null });
    const block = em.create(BlockSchema, { slug: `rt-block-${tag}`, team, title: "RC low-pass", summary: "", category: "filter", tags: ["passive"], hazard: [], visibility: "team", head: null, forkedFrom: null, archived: false });
    const version = em.create(BlockVersionSchema, { block, number: 1, text: "---\n---\n", params: [{ name: "R", value: "1 kohm", si: 1000, unit: "ohm" }], contentHash: "a".repeat(64), author: user, message: "first" });
    await em.flush();
    block.head = version;
    em.create(CheckRunSchema, { version, status: "queued", report: null, waveforms: null, engineVersion: null, ngspiceVersion: null, modelLibraryHash: null, durationMs: null, attempts: 0, trigger: "new-version", error: null, startedAt: null, finishedAt: null });
    em.create(ReviewSchema, { version, reviewer: null, requestedBy: user, decision: "requested", comment: "please look" });
    em.create(AttachmentSchema, { block, name: "schematic.png", contentType: "image/png", size: 3, sha256: "b".repeat(64), bytes: Buffer.from([1, 2, 3]), uploadedBy: user });
    em.create(WatchSchema, { user, block });
    em.create(ApiTokenSchema, { user, team, name: "ci", hash: tag.padEnd(64, "c"), prefix: "asy_x", scope: "read", expiresAt: null, lastUsedAt: null, revokedAt: null });
    em.create(OutboxEventSchema, { kind: "version.created", payload: { slug: block.slug }, indexedAt: null, notifiedAt: null });
    await em.flush();

    const fresh = await getEm();
    const b = await fresh.findOneOrFail(BlockSchema, { slug: `rt-block-${tag}` }, { populate: ["head", "team"] });
    expect(b.head?.params[0]).toEqual({ name: "R", value: "1 kohm", si: 1000, unit: "ohm" });
    expect(b.tags).toEqual(["passive"]);
    const att = await fresh.findOneOrFail(AttachmentSchema, { block: b }, { populate: ["bytes"] });
    expect(Buffer.from(att.bytes)).toEqual(Buffer.from([1, 2, 3]));
    const run = await fresh.findOneOrFail(CheckRunSchema, { version: b.head! });
    expect(run.id).toMatch(/^[0-9a-f-]{36}$/);
    for (const schema of [MembershipSchema, InvitationSchema, ReviewSchema, WatchSchema, ApiTokenSchema]) {
      expect(await fresh.count(schema as never, { id: { $gt: 0 } })).toBeGreaterThan(0);
    }
    expect(await fresh.count(OutboxEventSchema, { payload: { slug: b.slug } } as never)).toBe(1);
  });
});
