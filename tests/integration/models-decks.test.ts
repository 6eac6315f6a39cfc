import { execFileSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, describe, expect, it, vi } from "vitest";

await vi.hoisted(async () => { await (await import("./blocks-db")).usePrivateDatabase(); });
import { parseBlock } from "@/checks";
import { evaluateBlockAsync } from "@/checks/engine/evaluate-block";
import type { SimExecutor } from "@/checks/engine/executor";
import { simSide } from "@/checks/sandbox/sim-side";
import { parseRawFile, resultFromPlots, type RawPlot } from "@/checks/spice";
import { BlockSchema, TeamSchema } from "@/entities";
import { spiceDeckText } from "@/lib/blocks/deck";
import { getBlock } from "@/lib/blocks/read";
import { contextFor } from "@/lib/context";
import { closeOrm, getEm } from "@/lib/db/orm";
import { resolveModels } from "@/lib/models/resolve";
import { processNext } from "@/lib/runs/execute";
import { loadCaller } from "@/lib/auth/load-caller";
import { seedLibrary } from "@/lib/seed/seed-library";
import { seedPeople } from "@/lib/seed/seed-people";

// Every seeded demo block's `?format=spice` deck, run by a bare `ngspice -b` (Debian's own start-up file, no
// Assay environment) in an empty temp dir with no model file beside it, reproduces the quantities the stored run
// measured: the block's own script is evaluated again on the plots that bare run wrote. ngspice is the reference.
const work = mkdtempSync(path.join(tmpdir(), "assay-bare-"));
afterAll(async () => { rmSync(work, { recursive: true, force: true }); await closeOrm(); });

function bareRun(slug: string, deck: string): RawPlot[] {
  const dir = mkdtempSync(path.join(work, `${slug}-`));
  writeFileSync(path.join(dir, "deck.cir"), deck);
  execFileSync("ngspice", ["-b", "-r", "out.raw", "deck.cir"], {
    cwd: dir, stdio: "pipe", timeout: 60_000, env: { PATH: process.env.PATH ?? "/usr/bin:/bin", HOME: dir, LANG: "C" } as unknown as NodeJS.ProcessEnv,
  });
  return parseRawFile(readFileSync(path.join(dir, "out.raw")));
}

/** The script again, its nominal simulations answered by the bare run's plots, card by card in deck order. */
async function replay(text: string, deck: string, plots: RawPlot[], models: Record<string, string>) {
  const cards = deck.split("\n").filter((l) => /^\.(tran|ac|op|dc|noise|tf)\b/.test(l));
  // ngspice writes one plot per analysis, two for .noise (spectral density, then integrated noise).
  const groups: RawPlot[][] = [];
  let at = 0;
  for (const c of cards) {
    const n = c.startsWith(".noise") ? 2 : 1;
    groups.push(plots.slice(at, at + n));
    at += n;
  }
  expect(at, `${cards.join(" | ")} → ${plots.map((p) => p.plotname).join(" | ")}`).toBe(plots.length);
  const base = simSide(models);
  const deckOf = new Map<string, string>();
  const executor: SimExecutor = {
    runMany: async (reqs) => reqs.map((r) => {
      // A request at nominal values has the deck's .param lines; corners and samples are not in the bare deck.
      const nominal = deck.split("\n").filter((l) => l.startsWith(".param")).every((l) => r.deck.includes(l));
      const card = cards.find((c) => r.deck.includes(`\n${c}\n`));
      if (!nominal || !card) return { key: r.key, ok: false as const, error: "not in the bare deck", ms: 0 };
      deckOf.set(r.key, card);
      return { key: r.key, ok: true as const, raw: new Uint8Array(0), ms: 0, cached: false };
    }),
  };
  const side = { ...base, parse: (req: { key: string; analysis: never }) => resultFromPlots(req.analysis, groups[cards.indexOf(deckOf.get(req.key)!)]) };
  return evaluateBlockAsync(text, { simulate: true, executor, side: side as never, models });
}

describe("?format=spice of every demo block", () => {
  it("runs in a bare ngspice and reproduces the stored measurements", { timeout: 900_000 }, async () => {
    await seedPeople(await getEm());
    await seedLibrary(await getEm());
    for (;;) if ((await processNext("decks-test")).outcome === "idle") break;
    const em = await getEm();
    const fenwick = await em.findOneOrFail(TeamSchema, { slug: "fenwick" });
    const blocks = await em.find(BlockSchema, { team: fenwick }, { populate: ["head", "head.author"], orderBy: { slug: "asc" } });
    expect(blocks.length).toBeGreaterThan(2);
    const viewer = await loadCaller(em, blocks[0].head!.author.id);
    let compared = 0;
    const comparedSlugs = new Set<string>();
    for (const b of blocks) {
      const ctx = await contextFor(viewer);
      const view = await getBlock(ctx, { slug: b.slug });
      const stored = view.report as { quantities: Record<string, { value: number; simulated?: boolean }> };
      const deck = await spiceDeckText(ctx, { slug: b.slug });
      expect(deck, b.slug).not.toMatch(/^\.include/im); // every model inlined, nothing to find beside it
      for (const m of view.models ?? []) expect(deck, b.slug).toContain(`* ---- model file ${m.name} sha256 ${m.sha256}`);
      const plots = bareRun(b.slug, deck);
      // A sweep() family's members differ in a .param or .temp line, which one batch deck cannot vary without a
      // .control block: its deck runs (above) with the nominal analyses only, so only plain blocks are compared.
      if (/\bsweep\(/.test(parseBlock(b.head!.text).block!.script)) {
        expect(plots.length, b.slug).toBeGreaterThan(0);
        continue;
      }
      const netlist = parseBlock(b.head!.text).block!.netlist;
      const models = (await resolveModels(em, fenwick.id, netlist)).texts;
      const { report } = await replay(b.head!.text, deck, plots, models);
      const simulated = Object.entries(stored.quantities).filter(([, q]) => q.simulated);
      for (const [name, q] of simulated) {
        const again = report.quantities[name];
        expect(again, `${b.slug}: ${name} ${JSON.stringify([report.errors, report.checks.map((c) => c.detail)]).slice(0, 1500)}`).toBeDefined();
        // Same deck text and the same ngspice: agreement to rounding (relative 1e-6).
        expect(Math.abs(again.value - q.value), `${b.slug}: ${name} = ${again.value} vs stored ${q.value}`).toBeLessThanOrEqual(Math.abs(q.value) * 1e-6 + 1e-15);
        compared++;
        comparedSlugs.add(b.slug);
      }
    }
    // Seen on this data: 18 simulated quantities; the two blocks on Fenwick's own models among them.
    expect(compared).toBeGreaterThanOrEqual(18);
    expect([...comparedSlugs]).toEqual(expect.arrayContaining(["noninverting-gain-10-fwk-opa1", "diode-vf-fwk-d1s"]));
  });
});
