import { errors, MeiliError } from "./errors";
import type { Engine } from "./engine";
import { intParam, objectBody, parseJson } from "./http-util";
import type { IndexState } from "./index-state";
import type { Reply, Request } from "./routes";
import { filterPredicate, projectDocument } from "./search";

function fieldsParam(q: URLSearchParams) {
  const f = q.get("fields");
  return f ? f.split(",").map((s) => s.trim()) : undefined;
}

// /indexes/{uid}/documents and below.
export async function documents(engine: Engine, uid: string, rest: string[], r: Request): Promise<Reply> {
  const m = r.method;
  if (rest.length === 0) {
    if (m === "GET") {
      const idx = engine.index(uid);
      const offset = intParam(r.query, "offset", 0, "invalid_document_offset");
      const limit = intParam(r.query, "limit", 20, "invalid_document_limit");
      return [200, listDocuments({ offset, limit, fields: fieldsParam(r.query), filter: r.query.get("filter") ?? undefined, idx })];
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
    return [200, listDocuments({ offset: num("offset", 0), limit: num("limit", 20), fields: body.fields as string[] | undefined, filter: body.filter, idx })];
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
function documentFilter(idx: IndexState, filter: unknown) {
  try {
    return filterPredicate(idx, filter);
  } catch (e) {
    if (e instanceof MeiliError && e.code === "invalid_search_filter") throw new MeiliError(400, "invalid_document_filter", e.message);
    throw e;
  }
}

function listDocuments(o: { offset: number; limit: number; fields?: string[]; filter?: unknown; idx: IndexState }) {
  const pred = documentFilter(o.idx, o.filter);
  const keys = pred ? [...o.idx.flats].filter(([, f]) => pred(f)).map(([k]) => k) : [...o.idx.docs.keys()];
  const results = keys.slice(o.offset, o.offset + o.limit).map((k) => projectDocument(o.idx, o.idx.docs.get(k)!, o.fields));
  return { results, offset: o.offset, limit: o.limit, total: keys.length };
}
