import { errors, MeiliError } from "./errors";
import type { Engine } from "./engine";
import { intParam, objectBody, parseJson } from "./http-util";
import { documents } from "./routes-documents";
import { executeSearch } from "./search";
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
