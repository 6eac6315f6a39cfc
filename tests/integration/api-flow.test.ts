import { XMLParser, XMLValidator } from "fast-xml-parser";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { BlockSchema } from "@/entities";
import { getEm } from "@/lib/db/orm";
import { STALE_BASE_TYPE } from "@/lib/api/problem";
import { blockSchema, createdSchema, reportSchema, retuneResultSchema, runSchema, searchResultSchema, versionListSchema } from "@/lib/openapi/responses";
import { bearer, makeWorld, rcBlockText, type ApiWorld } from "./api-fixtures";

// The REST API end to end over HTTP against the built app, a worker and a search server.
// Numbers are checked against the closed form of a first-order RC low-pass, fc = 1 / (2π R C)
// (Horowitz & Hill, The Art of Electronics, 3rd ed., §1.7, RC filters — from memory).

let w: ApiWorld;
let pub: string;
let priv: string;
const fc = (r: number, c: number) => 1 / (2 * Math.PI * r * c);

async function pollRun(id: string, token: string, timeoutMs = 120_000) {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const { data, response } = await w.client.GET("/api/v1/runs/{id}", { params: { path: { id } }, headers: bearer(token) });
    expect(response.status).toBe(200);
    const run = runSchema.parse(data);
    if (run.status === "done" || run.status === "error") return run;
    if (Date.now() > until) throw new Error(`run ${id} still ${run.status}`);
    await new Promise((r) => setTimeout(r, 300));
  }
}

beforeAll(async () => {
  w = await makeWorld({ worker: true });
  pub = `rc-pub-${w.tag}`;
  priv = `rc-team-${w.tag}`;
}, 900_000);
afterAll(async () => w?.stop(), 60_000);

describe("creating and reading blocks", () => {
  it("creates from a text/markdown body: 201, Location, { slug, version, run }", async () => {
    // Public from the start: a maintainer's decision (DESIGN.md, Roles), so a maintainer's token creates it.
    const res = await fetch(`${w.app.url}/api/v1/blocks?team=${w.teamA.slug}&visibility=public`, {
      method: "POST",
      headers: { ...bearer(w.people.maintainer.write), "Content-Type": "text/markdown" },
      body: rcBlockText(pub),
    });
    expect(res.status).toBe(201);
    expect(res.headers.get("location")).toBe(`${w.app.url}/api/v1/blocks/${pub}/versions/1`);
    const body = createdSchema.parse(await res.json());
    expect(body).toMatchObject({ slug: pub, version: 1, run: { status: "queued" } });
  });

  it("creates from the file part of a multipart form", async () => {
    const form = new FormData();
    form.set("file", new Blob([rcBlockText(priv)], { type: "text/markdown" }), `${priv}.md`);
    const { data, response } = await w.client.POST("/api/v1/blocks", {
      params: { query: { team: w.teamA.slug } },
      headers: bearer(w.people.author.write),
      body: form as never,
      bodySerializer: (b) => b as unknown as FormData,
    });
    expect(response.status).toBe(201);
    expect(data).toMatchObject({ slug: priv, version: 1 });
  });

  it("serves the head as Block JSON with params, units and tolerances, and a strong ETag", async () => {
    const { data, response } = await w.client.GET("/api/v1/blocks/{slug}", { params: { path: { slug: pub } } });
    expect(response.status).toBe(200);
    const block = blockSchema.parse(data);
    expect(block).toMatchObject({ slug: pub, version: 1, headVersion: 1, team: w.teamA.slug, visibility: "public", category: "filter" });
    expect(block.params).toEqual([
      { name: "R", value: "4.7 kohm", unit: "ohm", tol: "1%", note: "series resistor" },
      { name: "C", value: "10 nF", unit: "F", tol: "5%", note: "shunt capacitor (C0G)" },
    ]);
    expect(block.netlist).toContain("R1 in out {R}");
    expect(block.script).toContain("check(");
    expect(block.note).not.toContain("```spice");
    expect(response.headers.get("etag")).toMatch(/^"[^"]+"$/);
    expect(response.headers.get("cache-control")).toBe("public, no-cache");
  });

  it("answers 304 to a repeated version fetch with If-None-Match", async () => {
    const url = `${w.app.url}/api/v1/blocks/${pub}/versions/1`;
    const first = await fetch(url);
    expect(first.status).toBe(200);
    blockSchema.parse(await first.json());
    const etag = first.headers.get("etag")!;
    expect(etag).toMatch(/^"[^"]+"$/);
    const again = await fetch(url, { headers: { "If-None-Match": etag } });
    expect(again.status).toBe(304);
    expect(await again.text()).toBe("");
    expect(again.headers.get("etag")).toBe(etag);
  });

  it("gives the block file as text/markdown and the deck as an attachment; a version's text is cached for a year", async () => {
    const md = await fetch(`${w.app.url}/api/v1/blocks/${pub}/versions/1?format=md`);
    expect(md.headers.get("content-type")).toMatch(/^text\/markdown/);
    expect(await md.text()).toBe(rcBlockText(pub));
    expect(md.headers.get("cache-control")).toBe("public, max-age=31536000, immutable");
    const deck = await fetch(`${w.app.url}/api/v1/blocks/${pub}?format=spice`);
    expect(deck.headers.get("content-type")).toMatch(/^text\/plain/);
    expect(deck.headers.get("content-disposition")).toBe(`attachment; filename="${pub}-v1.cir"`);
    expect(deck.headers.get("cache-control")).toBe("public, no-cache");
    const text = await deck.text();
    expect(text).toMatch(/^\.param\s+R\s*=\s*4700\b/im);
    expect(text).toMatch(/^R1 in out \{R\}$/m);
    expect(text.trim().toLowerCase().endsWith(".end")).toBe(true);
  });

  it("keeps team blocks from callers outside the team and lets members in, by token or session cookie", async () => {
    const path = `${w.app.url}/api/v1/blocks/${priv}`;
    expect((await fetch(path)).status).toBe(404);
    expect((await fetch(path, { headers: bearer(w.outsider.write) })).status).toBe(404);
    expect((await fetch(path, { headers: bearer(w.people.viewer.read) })).status).toBe(200);
    const team = await fetch(path, { headers: { Cookie: await w.cookieFor(w.people.viewer.id) } });
    expect(team.status).toBe(200);
    expect(team.headers.get("cache-control")).toBe("private, no-cache");
  });
});

describe("versions, forks and runs", () => {
  it("runs the first checks to the end: verified, fc as the closed form gives", async () => {
    const { data } = await w.client.GET("/api/v1/blocks/{slug}", { params: { path: { slug: pub } } });
    const run = await pollRun(blockSchema.parse(data).run!.id, w.people.viewer.read);
    expect(run).toMatchObject({ status: "done", badge: "verified", slug: pub, version: 1 });
    expect(run.report!.quantities.fc.value).toBeCloseTo(fc(4.7e3, 10e-9), 0);
    // Once done, progress counts every simulation the run took (the report lists each one).
    expect(run.progress.done).toBe(run.progress.total);
    expect(run.progress.total).toBeGreaterThanOrEqual((run.report as unknown as { simulations: unknown[] }).simulations.length);
    expect(run.progress.total).toBeGreaterThan(0);
  });

  it("forks with new values, and the fork's run reaches its verdict", async () => {
    const fork = `rc-fork-${w.tag}`;
    const { data, response } = await w.client.POST("/api/v1/blocks/{slug}/forks", {
      params: { path: { slug: pub } },
      headers: bearer(w.people.author.write),
      body: { slug: fork, params: { R: "5.1 kohm", C: "9.1 nF" }, title: "RC anti-alias low-pass, 3.4 kHz (E24 values)" },
    });
    expect(response.status).toBe(201);
    expect(response.headers.get("location")).toContain(`/api/v1/blocks/${fork}/versions/1`);
    const run = await pollRun(data!.run.id, w.people.author.write);
    // 5.1 kΩ and 9.1 nF: fc = 3.43 kHz, inside 3.0–3.8 kHz at every ±1 %/±5 % corner.
    expect(run).toMatchObject({ status: "done", badge: "verified" });
    expect(run.report!.quantities.fc.value / fc(5.1e3, 9.1e-9)).toBeCloseTo(1, 3);
    const child = blockSchema.parse((await w.client.GET("/api/v1/blocks/{slug}", { params: { path: { slug: fork } }, headers: bearer(w.people.author.read) })).data);
    expect(child.forkedFrom).toEqual({ slug: pub, version: 1 });
    expect(child.badge).toBe("verified");
    expect(child.params.find((p) => p.name === "R")?.value).toBe("5.1 kohm");
    // The fork is a team block: its public parent lists it to members only.
    const parent = blockSchema.parse((await w.client.GET("/api/v1/blocks/{slug}", { params: { path: { slug: pub } }, headers: bearer(w.people.viewer.read) })).data);
    expect(parent.lineage.forks).toEqual([{ slug: fork, title: "RC anti-alias low-pass, 3.4 kHz (E24 values)", fromVersion: 1 }]);
    const seenByAnyone = blockSchema.parse((await w.client.GET("/api/v1/blocks/{slug}", { params: { path: { slug: pub } } })).data);
    expect(seenByAnyone.lineage.forks).toEqual([]);
  });

  it("adds a version from new values, then refuses a stale base with 409 and the head", async () => {
    const post = (baseVersion: number) =>
      fetch(`${w.app.url}/api/v1/blocks/${pub}/versions`, {
        method: "POST",
        headers: { ...bearer(w.people.maintainer.write), "Content-Type": "application/json" },
        body: JSON.stringify({ params: { R: "3.9 kohm" }, baseVersion, message: "faster corner" }),
      });
    const ok = await post(1);
    expect(ok.status).toBe(201);
    expect(await ok.json()).toMatchObject({ slug: pub, version: 2 });
    const stale = await post(1);
    expect(stale.status).toBe(409);
    expect(stale.headers.get("content-type")).toBe("application/problem+json");
    expect(await stale.json()).toMatchObject({ type: STALE_BASE_TYPE, status: 409, head: 2 });
    const file = await fetch(`${w.app.url}/api/v1/blocks/${pub}/versions?baseVersion=1`, {
      method: "POST",
      headers: { ...bearer(w.people.maintainer.write), "Content-Type": "text/markdown" },
      body: rcBlockText(pub).replace("4.7 kohm", "4.3 kohm"),
    });
    expect(file.status).toBe(409);
    expect((await file.json()).head).toBe(2);
  });

  it("judges the new version on its own: 3.9 kΩ puts fc at 4.08 kHz, above the band, so it fails", async () => {
    const head = blockSchema.parse((await w.client.GET("/api/v1/blocks/{slug}", { params: { path: { slug: pub } } })).data);
    expect(head.version).toBe(2);
    const run = await pollRun(head.run!.id, w.people.viewer.read);
    expect(run.badge).toBe("failing");
    const band = run.report!.checks.find((c) => c.label.startsWith("corner frequency"));
    expect(band?.status).toBe("fail");
    // Version 1 keeps its verdict: versions are immutable.
    const v1 = blockSchema.parse((await w.client.GET("/api/v1/blocks/{slug}/versions/{n}", { params: { path: { slug: pub, n: 1 } } })).data);
    expect(v1.badge).toBe("verified");
  });

  it("lists versions newest first, a page at a time", async () => {
    const first = await w.client.GET("/api/v1/blocks/{slug}/versions", { params: { path: { slug: pub }, query: { limit: 1 } } });
    const page1 = versionListSchema.parse(first.data);
    expect(page1.items.map((v) => v.version)).toEqual([2]);
    expect(page1.items[0].message).toBe("faster corner");
    const second = await w.client.GET("/api/v1/blocks/{slug}/versions", { params: { path: { slug: pub }, query: { limit: 1, cursor: page1.nextCursor! } } });
    const page2 = versionListSchema.parse(second.data);
    expect(page2.items.map((v) => v.version)).toEqual([1]);
    expect(page2.nextCursor).toBeNull();
  });

  it("evaluates draft values without storing anything, and retunes R to a target snapped to E24", async () => {
    const ev = await w.client.POST("/api/v1/blocks/{slug}/evaluate", { params: { path: { slug: priv } }, headers: bearer(w.people.viewer.read), body: { params: { R: "3.3 kohm" } } });
    expect(ev.response.status).toBe(200);
    const draft = reportSchema.parse(ev.data);
    expect(draft.quantities.fc.value / fc(3.3e3, 10e-9)).toBeCloseTo(1, 3);
    expect(draft.status).not.toBe("verified");
    expect(draft.checks.filter((c) => c.simulated).every((c) => c.status === "skipped")).toBe(true);
    const retune = await w.client.POST("/api/v1/blocks/{slug}/retune", {
      params: { path: { slug: priv } },
      headers: bearer(w.people.viewer.read),
      body: { param: "R", target: { quantity: "fc", value: "3.4 kHz" }, series: "E24" },
    });
    expect(retune.response.status).toBe(200);
    const solved = retuneResultSchema.parse(retune.data);
    // R = 1 / (2π · 3.4 kHz · 10 nF) = 4.68 kΩ; the nearest E24 value is 4.7 kΩ (IEC 60063 E24).
    expect(solved.value).toMatch(/^4\.6[89]\d* kohm$/);
    expect(solved.snapped).toBe("4.7 kohm");
    const still = blockSchema.parse((await w.client.GET("/api/v1/blocks/{slug}", { params: { path: { slug: priv } }, headers: bearer(w.people.viewer.read) })).data);
    expect(still.version).toBe(1);
  });
});

describe("badge, search and the document", () => {
  const parser = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: "" });

  it("serves the hallmark as SVG that parses as XML, anonymously for a public block", async () => {
    const res = await fetch(`${w.app.url}/api/v1/blocks/${pub}/badge.svg?version=1`);
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toMatch(/^image\/svg\+xml/);
    expect(res.headers.get("cache-control")).toBe("public, max-age=60");
    const svg = await res.text();
    expect(XMLValidator.validate(svg)).toBe(true);
    expect(parser.parse(svg).svg["aria-label"]).toBe("assay verified, version 1");
    expect((await fetch(`${w.app.url}/api/v1/blocks/${priv}/badge.svg`)).status).toBe(404);
    expect((await fetch(`${w.app.url}/api/v1/blocks/${priv}/badge.svg`, { headers: bearer(w.outsider.read) })).status).toBe(404);
    expect((await fetch(`${w.app.url}/api/v1/blocks/${priv}/badge.svg`, { headers: bearer(w.people.viewer.read) })).status).toBe(200);
  });

  it("searches what the caller may read, with cursor pages", async () => {
    // Index this test's blocks only (the outbox consumer is not running here).
    const { blocksIndex } = await import("@/lib/search/client");
    const { ensureBlocksIndex } = await import("@/lib/search/settings");
    const { blockDocuments } = await import("@/lib/search/document");
    const em = await getEm();
    await ensureBlocksIndex();
    const blocks = await em.find(BlockSchema, { team: w.teamA.id }, { populate: ["head", "team"] });
    await blocksIndex().addDocuments((await blockDocuments(em, blocks)).docs).waitTask({ timeout: 30_000 });

    const anon = await w.client.GET("/api/v1/blocks", { params: { query: { team: w.teamA.slug, limit: 20 } } });
    const anonSlugs = searchResultSchema.parse(anon.data).items.map((i) => i.slug);
    expect(anonSlugs).toContain(pub);
    expect(anonSlugs).not.toContain(priv);
    const member = await w.client.GET("/api/v1/blocks", { params: { query: { team: w.teamA.slug, limit: 1 } }, headers: bearer(w.people.viewer.read) });
    const page1 = searchResultSchema.parse(member.data);
    expect(page1.estimatedTotal).toBe(3);
    expect(page1.items).toHaveLength(1);
    const seen = [page1.items[0].slug];
    let cursor = page1.nextCursor;
    while (cursor) {
      const next = searchResultSchema.parse((await w.client.GET("/api/v1/blocks", { params: { query: { team: w.teamA.slug, limit: 1, cursor } }, headers: bearer(w.people.viewer.read) })).data);
      seen.push(...next.items.map((i) => i.slug));
      cursor = next.nextCursor;
    }
    expect(seen.sort()).toEqual([pub, priv, `rc-fork-${w.tag}`].sort());
    const failing = await w.client.GET("/api/v1/blocks", { params: { query: { team: w.teamA.slug, badge: "failing", limit: 20 } } });
    expect(searchResultSchema.parse(failing.data).items.map((i) => i.slug)).toEqual([pub]);
  });

  it("serves the OpenAPI document it was built from", async () => {
    const { openApiDocument } = await import("@/lib/openapi/document");
    const res = await fetch(`${w.app.url}/api/v1/openapi.json`);
    expect(res.status).toBe(200);
    expect(await res.json()).toEqual(JSON.parse(JSON.stringify(openApiDocument())));
  });

  it("renders the API reference page from that document, with no external assets", async () => {
    const res = await fetch(`${w.app.url}/api-docs`);
    expect(res.status).toBe(200);
    const html = await res.text();
    for (const op of ["getVersion", "addVersion", "forkBlock", "getBadge"]) expect(html).toContain(`id="${op}"`);
    expect(html).toContain("/api/v1/blocks/{slug}/versions/{n}");
    expect(html).toContain('id="schema-Block"');
    expect(html).not.toMatch(/<(script|link|img)[^>]+(src|href)="https?:\/\//i);
  });
});
