import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { MeilisearchApiError, type Meilisearch } from "meilisearch";
import { blockDocs, blockSettings } from "./search/fixtures";
import { searchTarget, uniqueIndexUid, type SearchTarget } from "./search/target";

// The contract between Assay and its search server, written against
// Meilisearch's documented behaviour: the Meilisearch documentation pages
// "Typo tolerance settings" and "Typo tolerance vs fuzzy search"
// (meilisearch.com/docs), "Concatenated and split queries"
// (meilisearch.com/docs/learn/advanced/concat), and — from memory — "Filter
// expression reference", "Search", "Tasks", "Documents" and "Errors" of the API
// reference. It drives only the official client, so it runs unchanged against a
// real Meilisearch: MEILI_URL=… MEILI_MASTER_KEY=… npx vitest run tests/integration/search-contract.test.ts

let target: SearchTarget;
let client: Meilisearch;
const blocksUid = uniqueIndexUid("blocks");
const created: string[] = [blocksUid];

async function apiError(p: Promise<unknown>): Promise<MeilisearchApiError> {
  try {
    await p;
  } catch (e) {
    if (e instanceof MeilisearchApiError) return e;
    throw e;
  }
  throw new Error("expected the call to fail");
}

const ids = (hits: Record<string, unknown>[]) => hits.map((h) => h.id as number).sort((a, b) => a - b);
const blocks = () => client.index(blocksUid);
const found = async (q: string, opts: Record<string, unknown> = {}) => ids((await blocks().search(q, opts)).hits);
const filtered = (filter: string | (string | string[])[]) => found("", { filter, limit: 100 });

beforeAll(async () => {
  target = await searchTarget();
  client = target.client();
  const task = await client.createIndex(blocksUid, { primaryKey: "id" }).waitTask();
  expect(task.status).toBe("succeeded");
  expect((await blocks().updateSettings(blockSettings).waitTask()).status).toBe("succeeded");
  expect((await blocks().addDocuments(blockDocs).waitTask()).status).toBe("succeeded");
});

afterAll(async () => {
  if (client) for (const uid of created) await client.deleteIndex(uid).waitTask();
  await target?.stop();
});

describe("server", () => {
  it("reports health without a key and its version with one", async () => {
    expect(await target.client("").health()).toEqual({ status: "available" });
    const v = await client.getVersion();
    expect(v.pkgVersion).toMatch(/^\d+\.\d+\.\d+/);
    expect(typeof v.commitSha).toBe("string");
  });

  it("refuses a missing key with 401 and a wrong key with 403", async () => {
    const missing = await apiError(target.client("").getIndex(blocksUid));
    expect(missing.response.status).toBe(401);
    expect(missing.cause).toMatchObject({ code: "missing_authorization_header", type: "auth" });
    expect(missing.cause?.link).toMatch(/missing_authorization_header$/);
    const wrong = await apiError(target.client("not-the-master-key").index(blocksUid).search("diode"));
    expect(wrong.response.status).toBe(403);
    expect(wrong.cause).toMatchObject({ code: "invalid_api_key", type: "auth" });
  });
});

describe("indexes and tasks", () => {
  it("creates, describes, lists and deletes an index through tasks", async () => {
    const uid = uniqueIndexUid("life");
    const enqueued = await client.createIndex(uid, { primaryKey: "slug" });
    expect(enqueued).toMatchObject({ indexUid: uid, status: "enqueued", type: "indexCreation" });
    expect(typeof enqueued.taskUid).toBe("number");
    const done = await client.tasks.waitForTask(enqueued.taskUid);
    expect(done).toMatchObject({ uid: enqueued.taskUid, indexUid: uid, status: "succeeded", type: "indexCreation", error: null });
    expect(done.enqueuedAt && done.startedAt && done.finishedAt).toBeTruthy();
    expect(await client.tasks.getTask(enqueued.taskUid)).toMatchObject({ status: "succeeded" });

    const index = await client.getIndex(uid);
    expect(index.uid).toBe(uid);
    expect(index.primaryKey).toBe("slug");
    const raw = await client.getRawIndex(uid);
    expect(raw).toMatchObject({ uid, primaryKey: "slug" });
    expect(Number.isNaN(Date.parse(raw.createdAt))).toBe(false);
    const list = await client.getRawIndexes({ limit: 1000 });
    expect(list.results.map((i) => i.uid)).toContain(uid);

    const again = await client.createIndex(uid).waitTask();
    expect(again.status).toBe("failed");
    expect(again.error).toMatchObject({ code: "index_already_exists", type: "invalid_request" });

    expect((await client.deleteIndex(uid).waitTask()).status).toBe("succeeded");
    const gone = await apiError(client.getIndex(uid));
    expect(gone.response.status).toBe(404);
    expect(gone.cause).toMatchObject({ code: "index_not_found", type: "invalid_request" });
    expect(gone.cause?.link).toMatch(/^https:\/\/.*index_not_found$/);
    expect(typeof gone.cause?.message).toBe("string");
    const deleteAgain = await client.deleteIndex(uid).waitTask();
    expect(deleteAgain.status).toBe("failed");
    expect(deleteAgain.error?.code).toBe("index_not_found");
  });

  it("refuses an invalid index uid and an unknown task", async () => {
    const bad = await apiError(client.createIndex("not a valid uid!"));
    expect(bad.response.status).toBe(400);
    expect(bad.cause?.code).toBe("invalid_index_uid");
    const task = await apiError(client.tasks.getTask(2_000_000_000));
    expect(task.response.status).toBe(404);
    expect(task.cause?.code).toBe("task_not_found");
  });

  it("answers index_not_found for searches and documents of a missing index", async () => {
    const uid = uniqueIndexUid("missing");
    for (const call of [client.index(uid).search("x"), client.index(uid).getDocument(1), client.index(uid).getDocuments(), client.index(uid).getSettings()]) {
      const e = await apiError(call);
      expect(e.response.status).toBe(404);
      expect(e.cause?.code).toBe("index_not_found");
    }
  });
});

describe("settings", () => {
  it("returns what updateSettings stored, with defaults for the rest", async () => {
    const s = await blocks().getSettings();
    expect(s.searchableAttributes).toEqual(blockSettings.searchableAttributes);
    expect([...(s.filterableAttributes ?? [])].sort()).toEqual([...blockSettings.filterableAttributes].sort());
    expect([...(s.sortableAttributes ?? [])].sort()).toEqual([...blockSettings.sortableAttributes].sort());
    expect(s.displayedAttributes).toEqual(["*"]);
    expect(s.typoTolerance).toMatchObject({ enabled: true, minWordSizeForTypos: { oneTypo: 5, twoTypos: 9 } });
    expect(s.pagination).toEqual({ maxTotalHits: 1000 });
    expect(s.rankingRules).toEqual(expect.arrayContaining(["words", "typo", "attribute", "sort", "exactness"]));
  });

  it("reads and writes single settings through their own routes", async () => {
    const uid = uniqueIndexUid("settings");
    created.push(uid);
    await client.createIndex(uid, { primaryKey: "id" }).waitTask();
    const index = client.index(uid);
    expect(await index.getFilterableAttributes()).toEqual([]);
    expect((await index.updateFilterableAttributes(["team", "category"]).waitTask()).status).toBe("succeeded");
    expect([...((await index.getFilterableAttributes()) ?? [])].sort()).toEqual(["category", "team"]);
    await index.updateSortableAttributes(["updatedAt"]).waitTask();
    expect(await index.getSortableAttributes()).toEqual(["updatedAt"]);
    await index.updateSearchableAttributes(["title", "summary"]).waitTask();
    expect(await index.getSearchableAttributes()).toEqual(["title", "summary"]);
    await index.resetSearchableAttributes().waitTask();
    expect(await index.getSearchableAttributes()).toEqual(["*"]);
    await index.updateTypoTolerance({ minWordSizeForTypos: { oneTypo: 4 } }).waitTask();
    expect((await index.getTypoTolerance())?.minWordSizeForTypos).toEqual({ oneTypo: 4, twoTypos: 9 });
  });
});

describe("documents", () => {
  it("adds, replaces, merges, fetches and deletes documents", async () => {
    const uid = uniqueIndexUid("docs");
    created.push(uid);
    await client.createIndex(uid, { primaryKey: "id" }).waitTask();
    const index = client.index(uid);
    const added = await index.addDocuments(blockDocs).waitTask();
    expect(added).toMatchObject({ status: "succeeded", type: "documentAdditionOrUpdate", details: { receivedDocuments: 6, indexedDocuments: 6 } });

    expect(await index.getDocument(3)).toEqual(blockDocs[2]);
    expect(await index.getDocument(3, { fields: ["id", "title"] })).toEqual({ id: 3, title: "Sallen-Key low-pass filter" });
    const page = await index.getDocuments({ limit: 2, offset: 1 });
    expect(page).toMatchObject({ limit: 2, offset: 1, total: 6 });
    expect(page.results).toHaveLength(2);
    const trimmed = await index.getDocuments({ fields: ["id", "slug"], limit: 100 });
    expect(trimmed.results.map((d) => Object.keys(d).sort())).toEqual(Array(6).fill(["id", "slug"]));

    await index.updateDocuments([{ id: 2, badge: "verified" }]).waitTask();
    expect(await index.getDocument(2)).toMatchObject({ title: "Precision diode clamp", badge: "verified" });
    await index.addDocuments([{ id: 2, title: "Precision diode clamp, rev B" }]).waitTask();
    expect(await index.getDocument(2)).toEqual({ id: 2, title: "Precision diode clamp, rev B" });

    const one = await index.deleteDocument(6).waitTask();
    expect(one).toMatchObject({ status: "succeeded", type: "documentDeletion", details: { deletedDocuments: 1 } });
    const missing = await apiError(index.getDocument(6));
    expect(missing.response.status).toBe(404);
    expect(missing.cause).toMatchObject({ code: "document_not_found", type: "invalid_request" });

    const batch = await index.deleteDocuments([4, 5, 99]).waitTask();
    expect(batch.details).toMatchObject({ providedIds: 3, deletedDocuments: 2 });
    expect((await index.getDocuments({ limit: 100 })).results.map((d) => d.id).sort()).toEqual([1, 2, 3]);

    const all = await index.deleteAllDocuments().waitTask();
    expect(all).toMatchObject({ status: "succeeded", details: { deletedDocuments: 3 } });
    expect((await index.getDocuments()).total).toBe(0);
    expect((await index.search("")).hits).toEqual([]);
  });

  it("infers the primary key and refuses bad document ids", async () => {
    const uid = uniqueIndexUid("pk");
    created.push(uid);
    const task = await client.index(uid).addDocuments([{ blockId: "rc-lowpass-1", title: "First-order RC low-pass" }]).waitTask();
    expect(task.status).toBe("succeeded");
    expect((await client.getIndex(uid)).primaryKey).toBe("blockId");
    const bad = await client.index(uid).addDocuments([{ blockId: "has a space", title: "x" }]).waitTask();
    expect(bad.status).toBe("failed");
    expect(bad.error?.code).toBe("invalid_document_id");
    const none = uniqueIndexUid("nopk");
    created.push(none);
    await client.createIndex(none).waitTask();
    const noKey = await client.index(none).addDocuments([{ title: "no identifier here" }]).waitTask();
    expect(noKey.status).toBe("failed");
    expect(noKey.error?.code).toBe("index_primary_key_no_candidate_found");
  });
});

describe("search", () => {
  it("matches words in any searchable attribute, every word with matchingStrategy all", async () => {
    expect(await found("oscillator")).toEqual([1, 5]);
    expect(await found("diode clamp")).toEqual([2]);
    expect(await found("oscillator lamp", { matchingStrategy: "all" })).toEqual([1]);
    expect(await found("converters")).toEqual([4]);
    expect(await found("anti-alias")).toEqual([3]);
    expect(await found("")).toEqual([1, 2, 3, 4, 5, 6]);
  });

  it("searches a quoted phrase as adjacent words in order, without typos", async () => {
    // Meilisearch documentation, "Search" API reference, phrase search (from memory).
    expect(await found('"sine source"')).toEqual([1]);
    expect(await found('"source sine"')).toEqual([]);
    expect(await found('"sine sourse"')).toEqual([]);
    expect(await found('"sensor input" rails', { matchingStrategy: "all" })).toEqual([2]);
  });

  it("keeps documents holding the leading words under the default strategy", async () => {
    // "last" drops query words from the end until documents match.
    expect(await found("oscillator lamp")).toEqual([1, 5]);
  });

  it("pages with limit and offset and reports estimatedTotalHits", async () => {
    const res = await blocks().search("", { sort: ["version:asc"], limit: 2, offset: 2 });
    expect(res).toMatchObject({ limit: 2, offset: 2, estimatedTotalHits: 6, query: "" });
    expect(res.hits.map((h) => h.id)).toEqual([1, 6]);
    expect(typeof res.processingTimeMs).toBe("number");
    expect(res.facetDistribution).toBeUndefined();
    expect(await blocks().search("", { limit: 0 })).toMatchObject({ hits: [], estimatedTotalHits: 6 });
    expect(await blocks().search("oscillator", { offset: 10 })).toMatchObject({ hits: [], estimatedTotalHits: 2 });
    const top = await blocks().search("", { sort: ["version:desc"], limit: 1 });
    expect(top.hits.map((h) => h.id)).toEqual([3]);
  });

  it("sorts when asked, alone or after a filter", async () => {
    const order = async (opts: Record<string, unknown>) => (await blocks().search("", opts)).hits.map((h) => h.id);
    expect(await order({ sort: ["version:asc"] })).toEqual([2, 4, 1, 6, 5, 3]);
    expect(await order({ sort: ["version:desc"] })).toEqual([3, 5, 6, 1, 4, 2]);
    expect(await order({ sort: ["updatedAt:desc"] })).toEqual([2, 4, 6, 1, 5, 3]);
    expect(await order({ sort: ["title:asc"] })).toEqual([4, 5, 2, 3, 6, 1]);
    expect(await order({ sort: ["version:desc"], filter: "category = oscillator" })).toEqual([5, 1]);
    expect((await blocks().search("oscillator", { sort: ["version:desc"] })).hits.map((h) => h.id)).toEqual([5, 1]);
    const e = await apiError(blocks().search("", { sort: ["owner:asc"] }));
    expect(e.response.status).toBe(400);
    expect(e.cause?.code).toBe("invalid_search_sort");
  });
});

describe("filters", () => {
  it("compares with = != > >= < <= and TO", async () => {
    expect(await filtered("category = oscillator")).toEqual([1, 5]);
    expect(await filtered("category != oscillator")).toEqual([2, 3, 4, 6]);
    expect(await filtered("version > 3")).toEqual([3, 5, 6]);
    expect(await filtered("version >= 3")).toEqual([1, 3, 5, 6]);
    expect(await filtered("version < 3")).toEqual([2, 4]);
    expect(await filtered("version <= 3")).toEqual([1, 2, 4]);
    expect(await filtered("version 2 TO 4")).toEqual([1, 4, 6]);
    expect(await filtered("teamId = 2")).toEqual([3, 4, 6]);
    expect(await filtered("approved = true")).toEqual([1, 3, 6]);
  });

  it("matches strings case-insensitively, quoted or bare, and arrays by any element", async () => {
    expect(await filtered("category = OSCILLATOR")).toEqual([1, 5]);
    expect(await filtered('owner = "mara quill"')).toEqual([1, 3]);
    expect(await filtered("owner = 'Teodor Vance'")).toEqual([2, 5]);
    expect(await filtered("tags = sine")).toEqual([1, 5]);
    expect(await filtered("tags = precision")).toEqual([4]);
    expect(await filtered("hazard = high-current")).toEqual([6]);
    expect(await filtered('hazard = "high-voltage"')).toEqual([5]);
    expect(await filtered("tags != sine")).toEqual([2, 3, 4, 6]);
  });

  it("handles IN, NOT IN, EXISTS, IS NULL and IS EMPTY", async () => {
    expect(await filtered("category IN [filter, reference]")).toEqual([3, 4]);
    expect(await filtered("category NOT IN [oscillator, limiter]")).toEqual([3, 4]);
    expect(await filtered("teamId IN [1]")).toEqual([1, 2, 5]);
    expect(await filtered("hazard EXISTS")).toEqual([2, 3, 4, 5, 6]);
    expect(await filtered("hazard NOT EXISTS")).toEqual([1]);
    expect(await filtered("hazard IS NULL")).toEqual([3]);
    expect(await filtered("hazard IS NOT NULL")).toEqual([1, 2, 4, 5, 6]);
    expect(await filtered("hazard IS EMPTY")).toEqual([2]);
    expect(await filtered("hazard IS NOT EMPTY")).toEqual([1, 3, 4, 5, 6]);
    expect(await filtered("tags IS EMPTY")).toEqual([6]);
  });

  it("binds NOT tighter than AND, and AND tighter than OR", async () => {
    expect(await filtered("category = limiter OR category = filter AND approved = true")).toEqual([2, 3, 6]);
    expect(await filtered("(category = limiter OR category = filter) AND approved = true")).toEqual([3, 6]);
    expect(await filtered("NOT category = oscillator AND approved = true")).toEqual([3, 6]);
    expect(await filtered("NOT (category = oscillator OR category = limiter)")).toEqual([3, 4]);
    expect(await filtered("approved = true AND NOT team = fenwick OR version = 5")).toEqual([3, 5, 6]);
  });

  it("takes the array form: outer entries ANDed, inner arrays ORed", async () => {
    expect(await filtered(["visibility = public", ["category = oscillator", "category = limiter"]])).toEqual([1, 5, 6]);
    // The shape Assay's search sends: the reader's rights first, then the facets picked.
    expect(await filtered(["(visibility = public OR teamId IN [1])", 'category = "oscillator"'])).toEqual([1, 5]);
    expect(await found("oscillator", { filter: ["approved = true"] })).toEqual([1]);
  });

  it("refuses undeclared attributes and malformed expressions with invalid_search_filter", async () => {
    for (const bad of ["slug = wien-bridge-sine", "title = x", "category =", "category = oscillator AND", "(category = filter", "version 2 TO"]) {
      const e = await apiError(blocks().search("", { filter: bad }));
      expect(e.response.status, bad).toBe(400);
      expect(e.cause, bad).toMatchObject({ code: "invalid_search_filter", type: "invalid_request" });
    }
  });
});

describe("typo tolerance and prefixes", () => {
  // Meilisearch documentation, "Typo tolerance settings" and "Typo tolerance vs
  // fuzzy search": no typo for words under 5 letters, one from 5, two from 9;
  // a swap of adjacent letters counts as one typo (Damerau–Levenshtein); a
  // typo on the first letter counts as two.
  it("allows no typo under 5 letters", async () => {
    expect(await found("gain")).toEqual([5]);
    expect(await found("gian")).toEqual([]);
    expect(await found("gaim")).toEqual([]);
  });

  it("allows one typo from 5 letters, a transposition being one", async () => {
    expect(await found("diodr")).toEqual([2]);
    expect(await found("dioed")).toEqual([2]);
    expect(await found("dode", { matchingStrategy: "all" })).toEqual([]);
    expect(await found("daodr")).toEqual([]);
  });

  it("allows two typos from 9 letters", async () => {
    expect(await found("rafarence")).toEqual([4]);
    expect(await found("oscillatro")).toEqual([1, 5]);
    expect(await found("rafaranca")).toEqual([]);
  });

  it("counts a typo on the first letter as two", async () => {
    expect(await found("xiode")).toEqual([]);
    expect(await found("xeference")).toEqual([4]);
  });

  it("matches the last word as a prefix, the others only whole", async () => {
    expect(await found("oscil")).toEqual([1, 5]);
    expect(await found("bandg")).toEqual([4]);
    expect(await found("osc bridge", { matchingStrategy: "all" })).toEqual([]);
    expect(await found("bridge osc", { matchingStrategy: "all" })).toEqual([1]);
  });
});

describe("concatenated and split words", () => {
  // Meilisearch documentation, "Concatenated and split queries": consecutive
  // query words are also searched joined, and a word is also searched as two
  // words that must stand next to each other.
  it("finds a joined word from its parts", async () => {
    expect(await found("band gap")).toEqual([4]);
  });

  it("finds adjacent words from their concatenation", async () => {
    expect(await found("lowpass filter", { matchingStrategy: "all" })).toEqual([3]);
    expect(await found("phaseshift oscillator", { matchingStrategy: "all" })).toEqual([5]);
    expect(await found("sensorinput rails", { matchingStrategy: "all" })).toEqual([2]);
    expect(await found("sourcesine lamp", { matchingStrategy: "all" })).toEqual([]);
  });
});

describe("facets", () => {
  it("counts values over every matching document, not just the page", async () => {
    const res = await blocks().search("", { filter: "visibility = public", facets: ["category", "approved", "tags"], limit: 1 });
    expect(res.hits).toHaveLength(1);
    expect(res.estimatedTotalHits).toBe(4);
    expect(res.facetDistribution).toEqual({
      category: { filter: 1, limiter: 1, oscillator: 2 },
      approved: { false: 1, true: 3 },
      tags: { active: 1, "anti-alias": 1, audio: 1, sine: 2 },
    });
  });

  it("follows the query and the filter", async () => {
    const res = await blocks().search("oscillator", { facets: ["team", "badge"] });
    expect(res.facetDistribution).toEqual({ team: { fenwick: 2 }, badge: { stale: 1, verified: 1 } });
  });

  it("refuses a facet that is not filterable", async () => {
    const e = await apiError(blocks().search("", { facets: ["slug"] }));
    expect(e.response.status).toBe(400);
    expect(e.cause?.code).toBe("invalid_search_facets");
  });
});

describe("the calls Assay's library search makes", () => {
  // The request shape of lib/search/search.ts: rights and picked facets in the
  // filter, five facets, a page, highlight tags that cannot occur in text.
  const assaySearch = (q: string, extra: string[], sort?: string[]) =>
    blocks().search(q, {
      filter: ["(visibility = public OR teamId IN [2])", ...extra],
      facets: ["category", "badge", "tags", "team", "approved"],
      limit: 2,
      offset: 0,
      sort,
      attributesToHighlight: ["title", "summary"],
      highlightPreTag: "\u0002",
      highlightPostTag: "\u0003",
    });

  it("browses newest first with facet counts over every readable block", async () => {
    const res = await assaySearch("", [], ["updatedAt:desc"]);
    expect(res.hits.map((h) => h.id)).toEqual([4, 6]);
    expect(res.estimatedTotalHits).toBe(5);
    expect(res.facetDistribution?.team).toEqual({ fenwick: 2, larkspur: 3 });
    expect(res.facetDistribution?.approved).toEqual({ false: 2, true: 3 });
    expect(res.hits[0]._formatted?.title).toBe("Bandgap voltage reference");
  });

  it("narrows by picked facets and marks matches in title and summary", async () => {
    const res = await assaySearch("limiter", ['category = "limiter"', "approved = true"]);
    expect(ids(res.hits)).toEqual([6]);
    expect(res.hits[0]._formatted?.title).toBe("Soft zener \u0002limiter\u0003");
    expect(res.facetDistribution?.category).toEqual({ limiter: 1 });
  });
});

describe("highlighting", () => {
  it("wraps matched words of the asked attributes in _formatted", async () => {
    const res = await blocks().search("diode", { attributesToHighlight: ["title"] });
    expect(res.hits).toHaveLength(1);
    const hit = res.hits[0];
    expect(hit.title).toBe("Precision diode clamp");
    expect(hit._formatted?.title).toBe("Precision <em>diode</em> clamp");
    expect(hit._formatted?.summary).toBe(hit.summary);
  });

  it("uses the given pre and post tags, as Assay does with control characters", async () => {
    const res = await blocks().search("reference", { attributesToHighlight: ["title", "summary"], highlightPreTag: "\u0002", highlightPostTag: "\u0003" });
    expect(ids(res.hits)).toEqual([4]);
    expect(res.hits[0]._formatted).toMatchObject({
      title: "Bandgap voltage \u0002reference\u0003",
      summary: "Temperature-stable \u0002reference\u0003 for data converters",
    });
  });

  it("leaves hits without _formatted when nothing is asked to highlight", async () => {
    const res = await blocks().search("diode");
    expect(res.hits[0]._formatted).toBeUndefined();
  });
});
