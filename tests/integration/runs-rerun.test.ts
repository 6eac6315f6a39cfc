import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";

await vi.hoisted(async () => { await (await import("./blocks-db")).usePrivateDatabase(); });
import { createBlock } from "@/lib/blocks/create";
import { contextFor } from "@/lib/context";
import { closeOrm } from "@/lib/db/orm";
import type { AppError } from "@/lib/errors";
import { rerunVersion } from "@/lib/runs/rerun";
import { listRuns } from "@/lib/runs/runs";
import { dividerBlock, drain, makeTeam, type TestTeam } from "./blocks-helpers";

let team: TestTeam;
beforeAll(async () => { team = await makeTeam(); });
afterAll(closeOrm);

const code = (p: Promise<unknown>) => p.then(() => "ok", (e: AppError) => e.code);

describe("verify again", () => {
  it("queues a manual run for a maintainer, once at a time, and refuses authors and viewers", async () => {
    const slug = `rerun-${team.tag}`;
    await createBlock(await contextFor(team.author), { team: team.slug, text: dividerBlock(slug) });
    await drain(team);
    expect(await code(rerunVersion(await contextFor(team.author), { slug, version: 1 }))).toBe("forbidden");
    expect(await code(rerunVersion(await contextFor(team.viewer), { slug, version: 1 }))).toBe("forbidden");
    const run = await rerunVersion(await contextFor(team.maintainer), { slug, version: 1 });
    expect(run.status).toBe("queued");
    // A second request while the first waits is refused rather than queued twice.
    expect(await code(rerunVersion(await contextFor(team.maintainer), { slug, version: 1 }))).toBe("conflict");
    expect(await code(rerunVersion(await contextFor(team.maintainer), { slug, version: 9 }))).toBe("not_found");
    await drain(team);
    const runs = await listRuns(await contextFor(team.viewer), { slug });
    expect(runs.map((r) => [r.trigger, r.status])).toEqual([["manual", "done"], ["new-version", "done"]]);
    expect(runs[0].badge).toBe(runs[1].badge);
  });
});
