import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";

await vi.hoisted(async () => { await (await import("./blocks-db")).usePrivateDatabase(); });
import { createBlock } from "@/lib/blocks/create";
import { addVersion } from "@/lib/blocks/versions";
import { contextFor } from "@/lib/context";
import { closeOrm } from "@/lib/db/orm";
import { reviewQueueWithChanges } from "@/lib/reviews/queue";
import { decide, requestReview } from "@/lib/reviews/reviews";
import { dividerBlock, drain, makeTeam, type TestTeam } from "./blocks-helpers";

let team: TestTeam;
beforeAll(async () => { team = await makeTeam(); });
afterAll(closeOrm);

const LABEL = "output within 2.3 V to 2.7 V at every corner";

describe("the review queue, read inline", () => {
  it("shows a waiting version's checks and what changed since the previous approved version", async () => {
    const slug = `rq-div-${team.tag}`;
    await createBlock(await contextFor(team.author), { team: team.slug, text: dividerBlock(slug) });
    await drain(team);
    await requestReview(await contextFor(team.author), { slug, version: 1 });
    await decide(await contextFor(team.maintainer), { slug, version: 1, decision: "approved", comment: "" });
    // v2 moves R2 from 10 kohm to 12 kohm: Vout = Vin R2 / (R1 + R2) = 5 V · 12/22 = 2.727 V, above the 2.7 V limit
    // already at nominal values (voltage divider, common practice).
    await addVersion(await contextFor(team.author), { slug, params: { R2: "12 kohm" }, baseVersion: 1, message: "more output" });
    await drain(team);
    await requestReview(await contextFor(team.author), { slug, version: 2 });

    // A second block nobody approved yet: its changes read against nothing.
    const fresh = `rq-new-${team.tag}`;
    await createBlock(await contextFor(team.author), { team: team.slug, text: dividerBlock(fresh) });
    await drain(team);
    await requestReview(await contextFor(team.author), { slug: fresh, version: 1 });

    const queue = await reviewQueueWithChanges(await contextFor(team.maintainer));
    const entry = queue.find((q) => q.slug === slug)!;
    expect(entry).toMatchObject({ version: 2, against: 1, message: "more output", run: "done", badge: "failing" });
    expect(entry.changes.params).toEqual([{ name: "R2", from: "10 kohm ± 1%", to: "12 kohm ± 1%" }]);
    expect(entry.changes.netlist.some((p) => p.added || p.removed)).toBe(false);
    expect(entry.changes.checks).toEqual([{ label: LABEL, from: "pass", to: "fail" }]);
    expect(entry.checks.map((c) => [c.label, c.status, c.over])).toEqual([[LABEL, "fail", "corners"]]);
    const compared = entry.checks[0].compared!;
    expect(compared.unit).toBe("V");
    expect(compared.limits).toEqual([2.3, 2.7]);
    // The worst corner is at or above the nominal 2.727 V.
    expect(compared.value).toBeGreaterThanOrEqual((5 * 12) / 22 - 1e-9);
    expect(entry.checks[0]).not.toHaveProperty("corners");

    const first = queue.find((q) => q.slug === fresh)!;
    expect(first).toMatchObject({ version: 1, against: null, run: "done", badge: "verified" });
    expect(first.changes.params.map((p) => [p.name, p.from, p.to])).toEqual([
      ["R1", null, "10 kohm ± 1%"], ["R2", null, "10 kohm ± 1%"], ["Vin", null, "5 V ± 2%"],
    ]);
    expect(first.changes.netlist.every((p) => p.added)).toBe(true);
    expect(first.checks.map((c) => [c.label, c.status])).toEqual([[LABEL, "pass"]]);

    // The author sees nothing to decide; an outsider neither.
    expect(await reviewQueueWithChanges(await contextFor(team.author))).toEqual([]);
    expect(await reviewQueueWithChanges(await contextFor(team.outsider))).toEqual([]);
  });
});
