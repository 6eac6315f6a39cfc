import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { Meilisearch, type Index } from "meilisearch";
import { startSearchServer } from "@/lib/search/server";
import { blockSettings } from "./fixtures";

// Ranking as Meilisearch documents its default rules, in order: words, typo, proximity, attribute, sort,
// exactness (https://www.meilisearch.com/docs/learn/relevancy/ranking_rules). Cases of our own; each says which
// rule decides it. Driven through the official client, as the app drives it.
const docs = [
  { id: 1, slug: "noise-generator", title: "Noise generator", summary: "White noise from a reverse-biased junction, low output impedance after the amplifier stage", tags: ["noise"], body: "A low noise floor is not the goal here: the amplifier makes the junction's noise large." },
  { id: 2, slug: "lna-50-ohm", title: "Low noise amplifier", summary: "Common-emitter gain stage for a 50 ohm antenna input", tags: ["rf"], body: "Input match and noise figure at 10 MHz." },
  { id: 3, slug: "diode-clamp", title: "Amplitude clamp", summary: "A hard limiter: two diodes hold a signal to the rails", tags: ["clamp"], body: "Limiter action is abrupt; the amplitude is flat-topped." },
  { id: 4, slug: "soft-limiter", title: "Amplitude limiter", summary: "Rounds peaks with a soft knee", tags: ["limiter"], body: "Diodes in the feedback path." },
  { id: 5, slug: "noise-shaper", title: "Noise shaping filter", summary: "Pushes quantisation noise out of the audio band", tags: ["audio"], body: "Low order loop filter." },
];

let dir: string;
let server: { url: string; close: () => Promise<void> };
let index: Index;

beforeAll(async () => {
  dir = mkdtempSync(path.join(tmpdir(), "assay-search-ranking-"));
  server = await startSearchServer({ port: 0, key: "rank-key", dir });
  const client = new Meilisearch({ host: server.url, apiKey: "rank-key" });
  await client.createIndex("ranking", { primaryKey: "id" }).waitTask();
  index = client.index("ranking");
  await index.updateSettings(blockSettings).waitTask();
  await index.addDocuments(docs).waitTask();
});

afterAll(async () => {
  await server?.close();
  rmSync(dir, { recursive: true, force: true });
});

const slugs = async (q: string) => (await index.search(q)).hits.map((h) => h.slug as string);
const above = (list: string[], a: string, b: string) => expect(list.indexOf(a), list.join(", ")).toBeLessThan(list.indexOf(b));

describe("the local search server ranks by Meilisearch's default rules", () => {
  it("proximity: the title that is the query comes before one that holds its words apart", async () => {
    const list = await slugs("low noise amplifier");
    expect(list[0]).toBe("lna-50-ohm");
    above(list, "lna-50-ohm", "noise-generator");
  });

  it("the same with a typo in the last word (typo ties, proximity decides)", async () => {
    const list = await slugs("low noise amplifer");
    expect(list[0]).toBe("lna-50-ohm");
    above(list, "lna-50-ohm", "noise-generator");
  });

  it("attribute and proximity: amplitude limitr finds the limiter above the clamp", async () => {
    const list = await slugs("amplitude limitr");
    expect(list[0]).toBe("soft-limiter");
    above(list, "soft-limiter", "diode-clamp");
  });

  it("words first: a document with every query word beats one with only the first", async () => {
    const list = await slugs("noise shaping");
    expect(list[0]).toBe("noise-shaper");
  });
});
