import type { Ctx } from "@/lib/context";
import type { SearchQuery } from "@/lib/validation/blocks";
import { blocksIndex, type BlockDocument } from "./client";
import { searchFilter, toMeiliFilter } from "./filter";
import { ensureBlocksIndex } from "./settings";
import type { BlockSummary, HighlightRun, SearchResult } from "./types";

export type { BlockSummary, HighlightRun, SearchResult };

// Control characters cannot occur in titles or summaries, so they mark matches unambiguously.
const PRE = "\u0002";
const POST = "\u0003";

export function splitHighlight(formatted: string): HighlightRun[] {
  const runs: HighlightRun[] = [];
  for (const part of formatted.split(PRE)) {
    const end = part.indexOf(POST);
    if (end < 0) {
      if (part) runs.push({ text: part, match: false });
      continue;
    }
    if (end > 0) runs.push({ text: part.slice(0, end), match: true });
    const rest = part.slice(end + 1);
    if (rest) runs.push({ text: rest, match: false });
  }
  return runs;
}

// Cursors are opaque offsets: stable enough for a library that changes slowly, and the API promises nothing more.
const encodeCursor = (offset: number) => Buffer.from(`o:${offset}`).toString("base64url");
function decodeCursor(cursor?: string): number {
  if (!cursor) return 0;
  const m = /^o:(\d+)$/.exec(Buffer.from(cursor, "base64url").toString());
  return m ? Number(m[1]) : 0;
}

export function toSummary(doc: BlockDocument & { _formatted?: Partial<Record<keyof BlockDocument, unknown>> }): BlockSummary {
  return {
    slug: doc.slug,
    title: doc.title,
    summary: doc.summary,
    category: doc.category,
    tags: doc.tags,
    team: doc.team,
    visibility: doc.visibility,
    version: doc.version,
    badge: doc.badge as BlockSummary["badge"],
    approved: doc.approved,
    updatedAt: new Date(doc.updatedAt).toISOString(),
    highlight: doc._formatted
      ? {
          title: splitHighlight(String(doc._formatted.title ?? doc.title)),
          summary: splitHighlight(String(doc._formatted.summary ?? doc.summary)),
        }
      : undefined,
  };
}

/** Blocks the caller may read that match the query, with facet counts; `input` is the API's parsed query. */
export async function searchBlocks({ caller }: Ctx, p: SearchQuery): Promise<SearchResult> {
  await ensureBlocksIndex();
  const limit = Math.min(Math.max(p.limit ?? 20, 1), 100);
  const offset = decodeCursor(p.cursor);
  const sort = p.sort === "updated" ? ["updatedAt:desc"] : p.sort === "title" ? ["title:asc"] : p.q ? undefined : ["updatedAt:desc"];
  const res = await blocksIndex().search(p.q ?? "", {
    filter: toMeiliFilter(searchFilter(caller, p)),
    facets: ["category", "badge", "tags", "team", "approved"],
    limit,
    offset,
    sort,
    attributesToHighlight: ["title", "summary"],
    highlightPreTag: PRE,
    highlightPostTag: POST,
  });
  const total = res.estimatedTotalHits ?? res.hits.length;
  return {
    items: res.hits.map((h) => toSummary(h as never)),
    nextCursor: offset + limit < total ? encodeCursor(offset + limit) : null,
    estimatedTotal: total,
    facets: (res.facetDistribution ?? {}) as Record<string, Record<string, number>>,
  };
}
