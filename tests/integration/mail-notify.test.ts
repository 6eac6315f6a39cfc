import { afterAll, describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { BlockSchema, OutboxEventSchema } from "@/entities";
import { loadCaller } from "@/lib/auth/load-caller";
import { createBlock } from "@/lib/blocks/create";
import { addVersion } from "@/lib/blocks/versions";
import { blockEventBase } from "@/lib/blocks/events";
import { closeOrm, getEm } from "@/lib/db/orm";
import { processNotifications } from "@/lib/mail/notify";
import { writeEvent } from "@/lib/outbox/outbox";
import { decide, requestReview } from "@/lib/reviews/reviews";
import { watch } from "@/lib/watches/watches";
import { mailsTo, makeTeam } from "./auth-fixtures";
import { contextFor } from "@/lib/context";

afterAll(closeOrm);

async function drain() {
  while ((await processNotifications(await getEm(), 50)) > 0);
}

describe("mail notifications from the outbox", () => {
  it("mails reviewers on a request, the author and watchers on approval, watchers when the head turns failing", async () => {
    const { slug: team, people, tag } = await makeTeam(["author", "maintainer", "viewer", "admin"]);
    const [author, maintainer, watcher] = await Promise.all(people.map(async (p) => loadCaller(await getEm(), p.id)));
    const text = readFileSync("content/blocks/rc-lowpass-antialias.md", "utf8").replace(/^slug: .*$/m, `slug: notify-${tag}`);
    const { slug } = await createBlock(await contextFor(author), { team, text });
    await watch(await contextFor(watcher), { slug });
    await drain();

    await requestReview(await contextFor(author), { slug, version: 1 });
    await drain();
    for (const reviewer of [people[1], people[3]]) {
      const [m] = mailsTo(reviewer.email);
      expect(m.subject).toMatch(/^Review requested: .* v1$/);
      expect(m.text).toContain(`Person 0 ${tag} asked for a review of version 1`);
      expect(m.text).toContain(`/blocks/${slug}/versions/1`);
      expect(m.html).toContain(`/blocks/${slug}/versions/1`);
    }
    expect(mailsTo(people[0].email)).toHaveLength(0);
    expect(mailsTo(people[2].email)).toHaveLength(0);

    await decide(await contextFor(maintainer), { slug, version: 1, decision: "approved", comment: "corner at 3.39 kHz, margins checked" });
    await drain();
    expect(mailsTo(people[0].email).map((m) => m.subject)).toEqual([expect.stringMatching(/^Approved: .* v1$/)]);
    expect(mailsTo(people[0].email)[0].text).toContain("comment: corner at 3.39 kHz, margins checked");
    expect(mailsTo(people[2].email).map((m) => m.subject)).toEqual([expect.stringMatching(/^Approved: /)]);
    expect(mailsTo(people[1].email)).toHaveLength(1); // the reviewer is not told of their own approval

    // A run result as lib/runs writes it: verified → failing mails watchers once; failing → failing does not.
    const em = await getEm();
    const block = await em.findOneOrFail(BlockSchema, { slug }, { populate: ["team", "head"] });
    const base = await blockEventBase(em, block, block.head);
    writeEvent(em, "run.finished", { ...base, badge: "failing", previousBadge: "verified", isHead: true });
    writeEvent(em, "run.finished", { ...base, badge: "failing", previousBadge: "failing", isHead: true });
    await em.flush();
    await drain();
    const failing = mailsTo(people[2].email).filter((m) => m.subject.startsWith("Now failing"));
    expect(failing).toHaveLength(1);
    expect(failing[0].text).toContain("are now failing");
    expect(await (await getEm()).count(OutboxEventSchema, { notifiedAt: null, payload: { slug } } as never)).toBe(0);
  });

  it("tells watchers of a new version, but not the author who stored it", async () => {
    const { slug: team, people, tag } = await makeTeam(["author", "viewer"]);
    const [author, watcher] = await Promise.all(people.map(async (p) => loadCaller(await getEm(), p.id)));
    const text = readFileSync("content/blocks/rc-lowpass-antialias.md", "utf8").replace(/^slug: .*$/m, `slug: newver-${tag}`);
    const { slug } = await createBlock(await contextFor(author), { team, text });
    await watch(await contextFor(watcher), { slug });
    await watch(await contextFor(author), { slug });
    await drain();
    await addVersion(await contextFor(author), { slug, params: { R: "5.1 kohm" }, baseVersion: 1, message: "lower corner for the new ADC" });
    await drain();
    const [m, ...more] = mailsTo(people[1].email).filter((x) => x.subject.startsWith("New version"));
    expect(more).toHaveLength(0);
    expect(m.subject).toMatch(/^New version: .* v2$/);
    expect(m.text).toContain("lower corner for the new ADC");
    expect(m.text).toContain(`/blocks/${slug}/versions/2`);
    expect(mailsTo(people[0].email).filter((x) => x.subject.startsWith("New version"))).toHaveLength(0);
  });

  it("does not mail a watcher who has left the team of a team block", async () => {
    const { slug: team, people, tag } = await makeTeam(["admin", "viewer"]);
    const [admin, viewer] = await Promise.all(people.map(async (p) => loadCaller(await getEm(), p.id)));
    const text = readFileSync("content/blocks/rc-lowpass-antialias.md", "utf8").replace(/^slug: .*$/m, `slug: left-${tag}`);
    const { slug } = await createBlock(await contextFor(admin), { team, text });
    await watch(await contextFor(viewer), { slug });
    const em = await getEm();
    const block = await em.findOneOrFail(BlockSchema, { slug }, { populate: ["team", "head"] });
    const base = await blockEventBase(em, block, block.head);
    await em.getConnection().execute("delete from memberships where user_id = ?", [people[1].id]);
    writeEvent(em, "run.finished", { ...base, badge: "error", previousBadge: "verified", isHead: true });
    await em.flush();
    await drain();
    expect(mailsTo(people[1].email)).toHaveLength(0);
  });
});
