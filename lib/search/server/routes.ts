import { errors, MeiliError } from "./errors";
import type { Engine } from "./engine";
import { parseJson } from "./http-util";
import { intParam } from "./http-util";
import { executeSearch, filterPredicate, projectDocument } from "./search";
import { parseSearchParams, searchParamsFromQuery } from "./search-params";
import { applySettings, defaultSettings, settingRoutes } from "./settings";

export interface Request {
  method: string;
  path: string[];
  query: URLSearchParams;
  body: () => Promise<string>;
}

export type Reply = [status: number, body: unknown];

const INDEX_UID = /^[a-zA-Z0-9_-]{1,400}$/;
// What GET /version reports; the commit names this server, not a Meilisearch build.
const VERSION = { commitSha: "assay-local-search-server", commitDate: "unknown", pkgVersion: "1.16.0" };

function checkUid(uid: string) {
  if (!INDEX_UID.test(uid)) throw errors.invalidIndexUid(uid);
  return uid;
}

function fieldsParam(q: URLSearchParams) {
  const f = q.get("fields");
  return f ? f.split(",").map((s) => s.trim()) : undefined;
}

function objectBody(value: unknown): Record<string, unknown> {
  if (!value || typeof value !== "object" || Array.isArray(value)) throw errors.badRequest("Invalid value type: expected an object");
  return value as Record<string, unknown>;
}

export async function route(engine: Engine, r: Request): Promise<Reply> {
  const [head, uidRaw, sub, ...rest] = r.path;
  const m = r.method;
  if (head === "version" && r.path.length === 1 && m === "GET") return [200, VERSION];
  if (head === "tasks") return tasks(engine, r);
  if (head !== "indexes") throw errors.notFound();

  if (uidRaw === undefined) {
    if (m === "GET") {
      const offset = intParam(r.query, "offset", 0, "invalid_index_offset");
      const limit = intParam(r.query, "limit", 20, "invalid_index_limit");
      const all = [...engine.indexes.values()].sort((a, b) => (a.uid < b.uid ? -1 : 1)).map((i) => i.info());
      return [200, { results: all.slice(offset, offset + limit), offset, limit, total: all.length }];
    }
    if (m === "POST") {
      const body = objectBody(parseJson(await r.body()));
      if (typeof body.uid !== "string") throw new MeiliError(400, "missing_index_uid", "Missing field `uid`");
      const uid = checkUid(body.uid);
      const primaryKey = typeof body.primaryKey === "string" ? body.primaryKey : null;
      return [202, engine.enqueue(uid, "indexCreation", { kind: "createIndex", primaryKey }, { primaryKey })];
    }
    throw errors.notFound();
  }

  const uid = checkUid(decodeURIComponent(uidRaw));
  if (sub === undefined) {
    if (m === "GET") return [200, engine.index(uid).info()];
    if (m === "PATCH") {
      const body = objectBody(parseJson(await r.body()));
      const primaryKey = typeof body.primaryKey === "string" ? body.primaryKey : null;
      return [202, engine.enqueue(uid, "indexUpdate", { kind: "updateIndex", primaryKey }, { primaryKey })];
    }
    if (m === "DELETE") return [202, engine.enqueue(uid, "indexDeletion", { kind: "deleteIndex" }, { deletedDocuments: null })];
    throw errors.notFound();
  }
  if (sub === "settings") return settings(engine, uid, rest, r);
  if (sub === "documents") return documents(engine, uid, rest, r);
  if (sub === "search" && rest.length === 0) {
    const idx = engine.index(uid);
    if (m === "POST") return [200, executeSearch(idx, parseSearchParams(parseJson(await r.body())))];
    if (m === "GET") return [200, executeSearch(idx, parseSearchParams(searchParamsFromQuery(r.query)))];
  }
  if (sub === "stats" && m === "GET") {
    const idx = engine.index(uid);
    const fieldDistribution: Record<string, number> = {};
    for (const doc of idx.docs.values()) for (const k of Object.keys(doc)) fieldDistribution[k] = (fieldDistribution[k] ?? 0) + 1;
    return [200, { numberOfDocuments: idx.docs.size, isIndexing: false, fieldDistribution }];
  }
  throw errors.notFound();
}

async function settings(engine: Engine, uid: string, rest: string[], r: Request): Promise<Reply> {
  if (rest.length > 1) throw errors.notFound();
  const name = rest[0];
  const key = name === undefined ? null : settingRoutes[name];
  if (name !== undefined && !key) throw errors.notFound();
  if (r.method === "GET") {
    const s = engine.index(uid).settings;
    return [200, key ? s[key] : s];
  }
  let patch: Record<string, unknown>;
  if (r.method === "DELETE") patch = key ? { [key]: null } : Object.fromEntries(Object.keys(defaultSettings()).map((k) => [k, null]));
  else if (r.method === "PATCH" || r.method === "PUT") {
    const body = parseJson(await r.body());
    patch = key ? { [key]: body } : objectBody(body);
  } else throw errors.notFound();
  applySettings(defaultSettings(), patch); // refuse a malformed body now, as Meilisearch does
  return [202, engine.enqueue(uid, "settingsUpdate", { kind: "updateSettings", settings: patch }, { ...patch })];
}

async function documents(engine: Engine, uid: string, rest: string[], r: Request): Promise<Reply> {
  const m = r.method;
  if (rest.length === 0) {
    if (m === "GET") {
      const idx = engine.index(uid);
      const offset = intParam(r.query, "offset", 0, "invalid_document_offset");
      const limit = intParam(r.query, "limit", 20, "invalid_document_limit");
      return [200, listDocuments(engine, uid, { offset, limit, fields: fieldsParam(r.query), filter: r.query.get("filter") ?? undefined, idx })];
    }
    if (m === "POST" || m === "PUT") {
      const body = parseJson(await r.body(), "malformed_payload");
      const docs = Array.isArray(body) ? body : [body];
      if (docs.some((d) => !d || typeof d !== "object" || Array.isArray(d)))
        throw new MeiliError(400, "malformed_payload", "The json payload provided is malformed. `Couldn't serialize document value: expected an object or an array of objects`.");
      const primaryKey = r.query.get("primaryKey") ?? undefined;
      const mode = m === "POST" ? "replace" : "update";
      return [202, engine.enqueue(uid, "documentAdditionOrUpdate", { kind: "addDocuments", documents: docs, mode, primaryKey }, { receivedDocuments: docs.length, indexedDocuments: null })];
    }
    if (m === "DELETE")
      return [202, engine.enqueue(uid, "documentDeletion", { kind: "clearDocuments" }, { providedIds: 0, deletedDocuments: null, originalFilter: null })];
    throw errors.notFound();
  }
  const [action] = rest;
  if (rest.length === 1 && m === "POST" && action === "fetch") {
    const body = objectBody(parseJson(await r.body()));
    const idx = engine.index(uid);
    const num = (k: string, d: number) => (typeof body[k] === "number" ? (body[k] as number) : d);
    return [200, listDocuments(engine, uid, { offset: num("offset", 0), limit: num("limit", 20), fields: body.fields as string[] | undefined, filter: body.filter, idx })];
  }
  if (rest.length === 1 && m === "POST" && action === "delete-batch") {
    const body = parseJson(await r.body());
    if (!Array.isArray(body)) throw errors.badRequest("Invalid value type: expected an array of document ids", "bad_request");
    const ids = body.map(String);
    return [202, engine.enqueue(uid, "documentDeletion", { kind: "deleteDocuments", ids }, { providedIds: ids.length, deletedDocuments: null, originalFilter: null })];
  }
  if (rest.length === 1 && m === "POST" && action === "delete") {
    const body = objectBody(parseJson(await r.body()));
    if (body.filter === undefined) throw new MeiliError(400, "missing_document_filter", "Missing field `filter`");
    const idx = engine.indexes.get(uid);
    if (idx) documentFilter(idx, body.filter); // refuse an invalid filter now
    return [202, engine.enqueue(uid, "documentDeletion", { kind: "deleteByFilter", filter: body.filter }, { providedIds: 0, deletedDocuments: null, originalFilter: JSON.stringify(body.filter) })];
  }
  if (rest.length === 1) {
    const id = decodeURIComponent(action);
    if (m === "GET") {
      const idx = engine.index(uid);
      return [200, projectDocument(idx, idx.getDocument(id), fieldsParam(r.query))];
    }
    if (m === "DELETE")
      return [202, engine.enqueue(uid, "documentDeletion", { kind: "deleteDocuments", ids: [id] }, { providedIds: 1, deletedDocuments: null, originalFilter: null })];
  }
  throw errors.notFound();
}

// The documents routes report filter mistakes under their own error code.
function documentFilter(idx: ReturnType<Engine["index"]>, filter: unknown) {
  try {
    return filterPredicate(idx, filter);
  } catch (e) {
    if (e instanceof MeiliError && e.code === "invalid_search_filter") throw new MeiliError(400, "invalid_document_filter", e.message);
    throw e;
  }
}

function listDocuments(engine: Engine, uid: string, o: { offset: number; limit: number; fields?: string[]; filter?: unknown; idx: ReturnType<Engine["index"]> }) {
  const pred = documentFilter(o.idx, o.filter);
  const keys = pred ? [...o.idx.flats].filter(([, f]) => pred(f)).map(([k]) => k) : [...o.idx.docs.keys()];
  const results = keys.slice(o.offset, o.offset + o.limit).map((k) => projectDocument(o.idx, o.idx.docs.get(k)!, o.fields));
  return { results, offset: o.offset, limit: o.limit, total: keys.length };
}

function tasks(engine: Engine, r: Request): Reply {
  if (r.method !== "GET") throw errors.notFound();
  const id = r.path[1];
  if (id !== undefined) {
    if (!/^\d+$/.test(id)) throw errors.badRequest(`Invalid task uid: could not parse \`${id}\` as a positive integer`, "invalid_task_uids");
    return [200, engine.task(Number(id))];
  }
  const q = r.query;
  const list = (k: string) => q.get(k)?.split(",").filter(Boolean);
  const uids = list("uids")?.map(Number);
  const statuses = list("statuses");
  const types = list("types");
  const indexUids = list("indexUids");
  const limit = intParam(q, "limit", 20, "invalid_task_limit");
  const from = q.has("from") ? intParam(q, "from", 0, "invalid_task_from") : Infinity;
  const matching = engine.allTasks()
    .filter((t) => (!uids || uids.includes(t.uid)) && (!statuses || statuses.includes(t.status)) && (!types || types.includes(t.type)) && (!indexUids || indexUids.includes(t.indexUid ?? "")))
    .sort((a, b) => b.uid - a.uid);
  const page = matching.filter((t) => t.uid <= from);
  const results = page.slice(0, limit);
  const next = page.length > limit ? page[limit].uid : null;
  return [200, { results, total: matching.length, limit, from: results[0]?.uid ?? null, next }];
}
