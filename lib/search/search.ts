import type { Caller } from "@/lib/auth/caller";
import { readableTeamIds } from "@/lib/auth/permissions";
import { blocksIndex, type BlockDocument } from "./client";
import { ensureBlocksIndex } from "./settings";

export interface SearchParams {
  q?: string;
  category?: string;
  badge?: string;
  tag?: string;
  team?: string;
  approved?: boolean;
  sort?: "relevance" | "updated" | "title";
  cursor?: string;
  limit?: number;
}

export interface BlockSummary {
  slug: string;
  title: string;
  summary: string;
  category: string;
  tags: string[];
  team: string;
  visibility: "team" | "public";
  version: number;
  badge: string;
  approved: boolean;
  updatedAt: string;
  /** Title and summary cut into plain and matched runs, so the page never renders stored text as HTML. */
  highlight?: { title: HighlightRun[]; summary: HighlightRun[] };
}

export interface HighlightRun {
  text: string;
  match: boolean;
}

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

export interface SearchResult {
  items: BlockSummary[];
  nextCursor: string | null;
  estimatedTotal: number;
  facets: Record<string, Record<string, number>>;
}

const quote = (v: string) => `"${v.replace(/\\/g, "\\\\").replace(/"/g, '\\"')}"`;

/** The reader's rights go inside the search filter itself, so hits and facet counts never show other teams' blocks. */
export function visibilityFilter(caller: Caller): string {
  const teams = readableTeamIds(caller);
  return teams.length ? `(visibility = public OR teamId IN [${teams.join(", ")}])` : "visibility = public";
}

export function buildFilter(caller: Caller, p: SearchParams): string[] {
  const filter = [visibilityFilter(caller)];
  if (p.category) filter.push(`category = ${quote(p.category)}`);
  if (p.badge) filter.push(`badge = ${quote(p.badge)}`);
  if (p.tag) filter.push(`tags = ${quote(p.tag)}`);
  if (p.team) filter.push(`team = ${quote(p.team)}`);
  if (p.approved !== undefined) filter.push(`approved = ${p.approved}`);
  return filter;
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
    badge: doc.badge,
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

export async function searchBlocks(caller: Caller, p: SearchParams): Promise<SearchResult> {
  await ensureBlocksIndex();
  const limit = Math.min(Math.max(p.limit ?? 20, 1), 100);
  const offset = decodeCursor(p.cursor);
  const sort = p.sort === "updated" ? ["updatedAt:desc"] : p.sort === "title" ? ["title:asc"] : p.q ? undefined : ["updatedAt:desc"];
  const res = await blocksIndex().search(p.q ?? "", {
    filter: buildFilter(caller, p),
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
