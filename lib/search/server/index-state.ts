import { flatten, searchableText, type FlatDoc } from "./doc-values";
import { tokenize } from "./tokenize";
import { errors, MeiliError } from "./errors";
import { FacetCounter } from "./facets";
import { applySettings, defaultSettings, type IndexSettings } from "./settings";
import { TermIndex, type TypoSettings } from "./term-index";

export type Doc = Record<string, unknown>;

export interface IndexSnapshot {
  uid: string;
  primaryKey: string | null;
  createdAt: string;
  updatedAt: string;
  settings: IndexSettings;
  documents: Doc[];
}

const DOC_ID = /^[a-zA-Z0-9_-]{1,511}$/;

// One index: its documents in insertion order (Meilisearch's order for a
// placeholder search), their precomputed filter values, and the term index.
export class IndexState {
  primaryKey: string | null;
  createdAt: string;
  updatedAt: string;
  settings: IndexSettings;
  readonly docs = new Map<string, Doc>();
  readonly flats = new Map<string, FlatDoc>();
  private fieldOrder: string[] = [];
  private tokenCache = new Map<string, Map<string, string[]>>();
  private sequence: Map<string, number> | null = null;
  terms: TermIndex;
  readonly facets = new FacetCounter();

  constructor(readonly uid: string, primaryKey: string | null = null, now = new Date().toISOString()) {
    this.primaryKey = primaryKey;
    this.createdAt = now;
    this.updatedAt = now;
    this.settings = defaultSettings();
    this.terms = new TermIndex([]);
  }

  static fromSnapshot(s: IndexSnapshot): IndexState {
    const idx = new IndexState(s.uid, s.primaryKey, s.createdAt);
    idx.updatedAt = s.updatedAt;
    idx.settings = { ...defaultSettings(), ...s.settings };
    for (const doc of s.documents) {
      const key = String(doc[idx.primaryKey!]);
      idx.docs.set(key, doc);
      idx.flats.set(key, flatten(doc));
      idx.noteFields(doc);
    }
    idx.rebuild();
    return idx;
  }

  snapshot(): IndexSnapshot {
    return { uid: this.uid, primaryKey: this.primaryKey, createdAt: this.createdAt, updatedAt: this.updatedAt, settings: this.settings, documents: [...this.docs.values()] };
  }

  info() {
    return { uid: this.uid, createdAt: this.createdAt, updatedAt: this.updatedAt, primaryKey: this.primaryKey };
  }

  searchFields(): string[] {
    const s = this.settings.searchableAttributes;
    return s.includes("*") ? [...this.fieldOrder] : [...s];
  }

  typoSettings(): TypoSettings {
    const t = this.settings.typoTolerance;
    return {
      enabled: t.enabled,
      oneTypo: t.minWordSizeForTypos.oneTypo,
      twoTypos: t.minWordSizeForTypos.twoTypos,
      disableOnWords: new Set(t.disableOnWords.map((w) => w.toLowerCase())),
      disableOnAttributes: new Set(t.disableOnAttributes),
      disableOnNumbers: t.disableOnNumbers,
    };
  }

  private noteFields(doc: Doc): boolean {
    let added = false;
    for (const k of Object.keys(doc)) if (!this.fieldOrder.includes(k)) { this.fieldOrder.push(k); added = true; }
    return added;
  }

  private rebuild() {
    this.tokenCache.clear();
    this.terms = new TermIndex(this.searchFields());
    for (const [key, doc] of this.docs) this.terms.put(key, doc);
  }

  private touch() {
    this.updatedAt = new Date().toISOString();
  }

  private resolvePrimaryKey(docs: Doc[], requested: string | undefined) {
    if (requested !== undefined) {
      if (this.primaryKey !== null && this.primaryKey !== requested)
        throw new MeiliError(400, "index_primary_key_already_exists", `Index \`${this.uid}\`: Index already has a primary key: \`${this.primaryKey}\`.`);
      this.primaryKey = requested;
      return;
    }
    if (this.primaryKey !== null || docs.length === 0) return;
    const candidates = Object.keys(docs[0]).filter((k) => k.toLowerCase().endsWith("id"));
    if (candidates.length === 0)
      throw new MeiliError(400, "index_primary_key_no_candidate_found", `Index \`${this.uid}\`: The primary key inference failed as the engine did not find any field ending with \`id\` in its name. Please specify the primary key manually using the \`primaryKey\` query parameter.`);
    if (candidates.length > 1)
      throw new MeiliError(400, "index_primary_key_multiple_candidates_found", `Index \`${this.uid}\`: The primary key inference failed as the engine found ${candidates.length} fields ending with \`id\` in their names: ${candidates.map((c) => `'${c}'`).join(" and ")}. Please specify the primary key manually using the \`primaryKey\` query parameter.`);
    this.primaryKey = candidates[0];
  }

  // POST replaces whole documents, PUT merges fields into the stored ones.
  addDocuments(docs: Doc[], mode: "replace" | "update", primaryKey?: string): number {
    const previousKey = this.primaryKey;
    this.resolvePrimaryKey(docs, primaryKey);
    const pk = this.primaryKey!;
    try {
      const keyed = docs.map((doc) => {
        const id = doc[pk];
        if (id === undefined || id === null) throw new MeiliError(400, "missing_document_id", `Document doesn't have a \`${pk}\` attribute: \`${JSON.stringify(doc)}\`.`);
        const key = typeof id === "number" && Number.isInteger(id) ? String(id) : typeof id === "string" && DOC_ID.test(id) ? id : null;
        if (key === null)
          throw new MeiliError(400, "invalid_document_id", `Document identifier \`${JSON.stringify(id)}\` is invalid. A document identifier can be of type integer or string, only composed of alphanumeric characters (a-z A-Z 0-9), hyphens (-) and underscores (_), and can not be more than 511 bytes.`);
        return [key, doc] as const;
      });
      let newFields = false;
      for (const [key, doc] of keyed) {
        const stored = mode === "update" && this.docs.has(key) ? { ...this.docs.get(key), ...doc } : doc;
        if (!this.docs.has(key)) this.sequence = null;
        this.docs.set(key, stored);
        this.tokenCache.delete(key);
        this.flats.set(key, flatten(stored));
        if (this.noteFields(stored)) newFields = true;
        if (!newFields || !this.settings.searchableAttributes.includes("*")) this.terms.put(key, stored);
      }
      if (newFields && this.settings.searchableAttributes.includes("*")) this.rebuild();
      this.touch();
      return keyed.length;
    } catch (e) {
      this.primaryKey = previousKey;
      throw e;
    }
  }

  deleteDocuments(keys: string[]): number {
    let n = 0;
    for (const key of keys) {
      if (!this.docs.delete(key)) continue;
      this.sequence = null;
      this.tokenCache.delete(key);
      this.flats.delete(key);
      this.terms.remove(key);
      n++;
    }
    this.touch();
    return n;
  }

  clear(): number {
    const n = this.docs.size;
    this.docs.clear();
    this.sequence = null;
    this.tokenCache.clear();
    this.flats.clear();
    this.rebuild();
    this.touch();
    return n;
  }

  updateSettings(patch: Record<string, unknown>) {
    const before = this.searchFields().join("\u0000");
    this.settings = applySettings(this.settings, patch);
    // Only the searchable attributes shape the term index; the rest is read per search.
    if (this.searchFields().join("\u0000") !== before) this.rebuild();
    this.touch();
  }

  setPrimaryKey(pk: string | null | undefined) {
    if (pk === undefined || pk === null || pk === this.primaryKey) return;
    if (this.docs.size > 0) throw new MeiliError(400, "index_primary_key_already_exists", `Index \`${this.uid}\`: Index already has a primary key: \`${this.primaryKey}\`.`);
    this.primaryKey = pk;
    this.touch();
  }

  // Each document's place in insertion order, the order of a placeholder search.
  positions(): Map<string, number> {
    if (!this.sequence) {
      this.sequence = new Map();
      let i = 0;
      for (const key of this.docs.keys()) this.sequence.set(key, i++);
    }
    return this.sequence;
  }

  // Words of one attribute of one document, kept until the document changes.
  tokensOf(key: string, field: string): string[] {
    let byField = this.tokenCache.get(key);
    if (!byField) this.tokenCache.set(key, (byField = new Map()));
    let tokens = byField.get(field);
    if (!tokens) byField.set(field, (tokens = tokenize(searchableText(this.docs.get(key)!, field))));
    return tokens;
  }

  getDocument(key: string): Doc {
    const doc = this.docs.get(key);
    if (!doc) throw errors.documentNotFound(key);
    return doc;
  }
}
