import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";

await vi.hoisted(async () => { await (await import("./blocks-db")).usePrivateDatabase(); });
import { ENGINE_VERSION, modelLibraryHash, ngspiceVersion, withParams } from "@/checks";
import { CheckRunSchema, OutboxEventSchema } from "@/entities";
import { compareVersions } from "@/lib/blocks/compare";
import { changePercent } from "@/components/quantity-compare";
import { createBlock } from "@/lib/blocks/create";
import { forkBlock } from "@/lib/blocks/fork";
import { contextFor } from "@/lib/context";
import { loadBlockPage } from "@/lib/blocks/page";
import { spiceDeckText } from "@/lib/blocks/deck";
import { getBlock, getLineage, listVersions } from "@/lib/blocks/read";
import { addVersion } from "@/lib/blocks/versions";
import { closeOrm, getEm } from "@/lib/db/orm";
import { AppError } from "@/lib/errors";
import { getRun, getWaveforms, listRuns } from "@/lib/runs/runs";
import { contentBlock, drain, makeTeam, wienFixture, type TestTeam } from "./blocks-helpers";

let team: TestTeam;
beforeAll(async () => { team = await makeTeam(); });
afterAll(closeOrm);

const events = async (kind: string, slug: string) =>
  (await (await getEm()).find(OutboxEventSchema, { kind: kind as never, payload: { slug } } as never, { orderBy: { id: "asc" } }));

describe("create, fork, run, badge", () => {
  it("a Wien bridge with loop gain above one verifies; a fork that pushes it below one fails", async () => {
    const slug = `wien-${team.tag}`;
    const created = await createBlock(await contextFor(team.author), { team: team.slug, text: wienFixture(slug) });
    expect(created).toMatchObject({ slug, version: 1, run: { status: "queued" } });
    expect((await getBlock(await contextFor(team.author), { slug })).badge).toBe("pending");

    expect(await drain(team)).toBe(1);
    const parent = await getBlock(await contextFor(team.author), { slug });
    expect(parent.badge).toBe("verified");
    expect(parent.report?.status).toBe("verified");
    const run = await getRun(await contextFor(team.viewer), { id: created.run.id });
    expect(run).toMatchObject({ status: "done", badge: "verified", engineVersion: ENGINE_VERSION, ngspiceVersion: ngspiceVersion(), modelLibraryHash: modelLibraryHash(), attempts: 1 });
    expect(run.durationMs).toBeGreaterThan(0);
    const waves = (await getWaveforms(await contextFor(team.viewer), { id: created.run.id })) as { analysis: string; series: { node: string }[] }[];
    expect(waves[0].analysis).toBe("tran");
    expect(waves[0].series.map((s) => s.node)).toContain("out");

    // Rf = 18 k: A = 1 + Rf/Rg = 2.8 and loop gain A/3 = 0.933 < 1 (Barkhausen; Sedra & Smith, 7th ed., Wien bridge, from memory).
    const fork = await forkBlock(await contextFor(team.author), { source: slug, slug: `${slug}-low`, params: { Rf: "18 kohm" }, title: "Wien fixture, gain 2.8" });
    expect(fork.version).toBe(1);
    await drain(team);
    const forked = await getBlock(await contextFor(team.author), { slug: fork.slug });
    expect(forked.forkedFrom).toEqual({ slug, version: 1, title: parent.title });
    expect(forked.title).toBe("Wien fixture, gain 2.8");
    expect(forked.params.find((p) => p.name === "Rf")?.value).toBe("18 kohm");
    expect(forked.badge).toBe("failing");
    expect(forked.badge).toBe(forked.report?.status);
    const q = (forked.report as { quantities: Record<string, { value: number }> }).quantities;
    expect(q.loop_gain.value).toBeCloseTo((1 + 18 / 10) / 3, 6);
    const checks = (forked.report as { checks: { label: string; status: string }[] }).checks;
    expect(checks.map((c) => c.status)).toEqual(["fail", "fail"]);

    // Outbox: every stored version and every result, with what the mailer needs.
    const [created1] = await events("version.created", fork.slug);
    expect(created1.payload).toMatchObject({ slug: fork.slug, version: 1, team: team.slug, badge: "pending", forkedFrom: { slug, version: 1 } });
    expect(created1.payload.authorEmail).toBe(team.author.user!.email);
    const [finished] = await events("run.finished", fork.slug);
    expect(finished.payload).toMatchObject({ badge: "failing", previousBadge: null, isHead: true, status: "done" });
  });

  it("the content phase-shift oscillator forked below the Barkhausen gain of 29 turns failing", async () => {
    // Three-section RC ladder: the inverting amplifier needs |A| = Rf/R >= 29 (Sedra & Smith, 7th ed., phase-shift oscillator, from memory).
    const slug = `phase-${team.tag}`;
    await createBlock(await contextFor(team.author), { team: team.slug, text: contentBlock("rc-phase-shift-oscillator.md", slug) });
    const fork = await forkBlock(await contextFor(team.author), { source: slug, slug: `${slug}-270k`, params: { Rf: "270 kohm" } });
    await drain(team);
    expect((await getBlock(await contextFor(team.viewer), { slug })).badge).toBe("verified");
    const f = await getBlock(await contextFor(team.viewer), { slug: fork.slug });
    expect(f.badge).toBe("failing");
    const q = (f.report as { quantities: Record<string, { value: number }> }).quantities;
    expect(q.gain.value).toBeCloseTo(270 / 10, 6);
    expect(q.gain.value).toBeLessThan(29);
  });
});

describe("versions, lineage and comparison", () => {
  it("numbers versions, moves the head forward, tells a fork its parent moved on, and compares", async () => {
    const slug = `wien2-${team.tag}`;
    await createBlock(await contextFor(team.author), { team: team.slug, text: wienFixture(slug) });
    const fork = await forkBlock(await contextFor(team.author), { source: slug });
    expect(fork.slug).toBe(`${slug}-fork`);
    const v2 = await addVersion(await contextFor(team.author), { slug, params: { Rf: "18 kohm" }, baseVersion: 1, message: "lower gain" });
    expect(v2.version).toBe(2);
    await drain(team);

    const lineage = await getLineage(await contextFor(team.viewer), { slug: fork.slug });
    expect(lineage.forkedFrom).toMatchObject({ slug, version: 1 });
    expect(lineage.parentNewerVersions).toBe(1);
    expect((await getLineage(await contextFor(team.viewer), { slug })).forks).toEqual([{ slug: fork.slug, title: expect.any(String), fromVersion: 1 }]);

    const versions = await listVersions(await contextFor(team.viewer), { slug });
    expect(versions.map((v) => [v.version, v.badge, v.message])).toEqual([[2, "failing", "lower gain"], [1, "verified", "created"]]);
    expect(versions[0].contentHash).not.toBe(versions[1].contentHash);

    const cmp = await compareVersions(await contextFor(team.viewer), { slug, a: 1, b: 2 });
    expect(cmp.params).toEqual([{ name: "Rf", from: "22 kohm ± 1%", to: "18 kohm ± 1%" }]);
    expect(cmp.netlist.some((p) => p.added || p.removed)).toBe(false);
    expect(cmp.script.some((p) => p.added || p.removed)).toBe(false);
    expect(cmp.checks.map((c) => [c.from, c.to])).toEqual([["pass", "fail"], ["pass", "fail"]]);
    // Quantities side by side: loop gain (1 + Rf/Rg)/3 goes from 3.2/3 to 2.8/3, a change of −12.5 % (arithmetic).
    const gain = cmp.quantities.find((q) => q.name === "loop_gain")!;
    expect(gain.from).toBeCloseTo(3.2 / 3, 9);
    expect(gain.to).toBeCloseTo(2.8 / 3, 9);
    expect(changePercent(gain.from, gain.to)).toBeCloseTo(-12.5, 9);
    expect(cmp.quantities.find((q) => q.name === "f0")).toMatchObject({ unit: "Hz" });

    // A new file: the script changes, and the text diff shows exactly that line.
    const text = withParams(wienFixture(slug), { Rf: "24 kohm" }).replace("loop_gain > 1.02", "loop_gain > 1.05");
    const v3 = await addVersion(await contextFor(team.author), { slug, text, baseVersion: 2 });
    expect(v3.version).toBe(3);
    const cmp2 = await compareVersions(await contextFor(team.viewer), { slug, a: 2, b: 3 });
    expect(cmp2.script.filter((p) => p.added).map((p) => p.value)).toEqual(['check("loop gain above one at every corner", loop_gain > 1.05)\n']);
    expect((await listRuns(await contextFor(team.viewer), { slug })).length).toBe(3);
    expect(await spiceDeckText(await contextFor(team.viewer), { slug, version: 3 })).toMatch(/\.param\s+rf\s*=\s*24000|\.param\s+Rf\s*=\s*24000/i);
    await drain(team);
  });

  it("refuses bad values and bad files before storing anything", async () => {
    const slug = `div-${team.tag}`;
    await createBlock(await contextFor(team.author), { team: team.slug, text: wienFixture(slug) });
    const count = async () => (await getEm()).count(CheckRunSchema, { version: { block: { slug } } } as never);
    const before = await count();
    const bads: { params?: Record<string, string>; text?: string }[] = [{ params: { Rf: "22 parsecs" } }, { params: { Nope: "1 kohm" } }, { params: { Rf: "22 V" } }, { text: "---\nslug: x\n---\nno frontmatter fields" },
      // DESIGN.md "Block file format": R/C/L positive; a whole new file may not change a parameter's dimension.
      { params: { Rf: "-5 kohm" } }, { text: wienFixture(slug).replace("{ name: Rf, value: 22 kohm", "{ name: Rf, value: 22 V") }];
    for (const bad of bads) {
      const err = await addVersion(await contextFor(team.author), { slug, ...bad, baseVersion: 1 }).catch((e) => e);
      expect(err).toBeInstanceOf(AppError);
      expect((err as AppError).code).toBe("validation");
      expect(((err as AppError).extra.errors as unknown[]).length).toBeGreaterThan(0);
    }
    expect(await count()).toBe(before);
    const redimensioned = await addVersion(await contextFor(team.author), { slug, text: wienFixture(slug).replace("{ name: Rf, value: 22 kohm", "{ name: Rf, value: 22 V"), baseVersion: 1 }).catch((e) => e);
    expect((redimensioned as AppError).message).toMatch(/parameter "Rf" was in ohm; "22 V" is in V \(line \d+\)/);
    // A script line that does not parse could only earn an `error` badge: refused at its line, nothing stored.
    const broken = wienFixture(slug).replace("```check\n", "```check\nloop = (1 + Rf / Rg\n");
    const unreadable = await addVersion(await contextFor(team.author), { slug, text: broken, baseVersion: 1 }).catch((e) => e);
    expect((unreadable as AppError).code).toBe("validation");
    const line = broken.split("\n").indexOf("loop = (1 + Rf / Rg") + 1;
    expect((unreadable as AppError).extra.errors).toEqual([expect.objectContaining({ line })]);
    expect(await count()).toBe(before);
    const same = await addVersion(await contextFor(team.author), { slug, params: { Rf: "22 kohm" }, baseVersion: 1 }).catch((e) => e);
    expect((same as AppError).code).toBe("validation");
    const dup = await createBlock(await contextFor(team.author), { team: team.slug, text: wienFixture(slug) }).catch((e) => e);
    expect((dup as AppError).code).toBe("conflict");
    await drain(team);
  });

  it("checks roles: viewers and other authors cannot edit, outsiders do not see team blocks", async () => {
    const slug = `roles-${team.tag}`;
    await createBlock(await contextFor(team.author), { team: team.slug, text: wienFixture(slug) });
    const code = (p: Promise<unknown>) => p.then(() => "ok", (e: AppError) => e.code);
    expect(await code(addVersion(await contextFor(team.viewer), { slug, params: { Rf: "24 kohm" }, baseVersion: 1 }))).toBe("forbidden");
    expect(await code(addVersion(await contextFor(team.author2), { slug, params: { Rf: "24 kohm" }, baseVersion: 1 }))).toBe("forbidden");
    expect(await code(getBlock(await contextFor(team.outsider), { slug }))).toBe("not_found");
    expect(await code(createBlock(await contextFor(team.viewer), { team: team.slug, text: wienFixture(`v-${slug}`) }))).toBe("forbidden");
    // The block page offers Edit exactly to those the service above lets write a version.
    const offered = async (c: typeof team.author) => (await loadBlockPage(await contextFor(c), { slug })).allowed;
    expect(await offered(team.author)).toMatchObject({ edit: true, editThisVersion: true, attach: true, decide: false });
    expect(await offered(team.author2)).toMatchObject({ edit: false, editThisVersion: false, attach: false, fork: true });
    expect(await offered(team.viewer)).toMatchObject({ edit: false, requestReview: false, decide: false });
    expect(await offered(team.maintainer)).toMatchObject({ edit: true, decide: true });
    expect(await code(loadBlockPage(await contextFor(team.outsider), { slug }))).toBe("not_found");
    expect(await code(addVersion(await contextFor(team.maintainer), { slug, params: { Rf: "24 kohm" }, baseVersion: 1 }))).toBe("ok");
    const page = await loadBlockPage(await contextFor(team.author), { slug, version: 1 });
    expect(page).toMatchObject({ isHead: false, allowed: { edit: true, editThisVersion: false } });
    expect(page.versions.map((v) => v.version)).toEqual([2, 1]);
    await drain(team);
  });
});
