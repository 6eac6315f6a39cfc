import type { Caller } from "@/lib/auth/caller";
import { readableTeamIds } from "@/lib/auth/permissions";
import type { SearchQuery } from "@/lib/validation/blocks";

/** What a search may return, as data: the reader's rights and the facets asked for. */
export interface SearchFilter {
  /** Teams whose team-visible blocks the reader may see; public blocks are always in. */
  readableTeams: number[];
  category?: string;
  badge?: string;
  tag?: string;
  team?: string;
  approved?: boolean;
}

/** The reader's rights go inside the filter itself, so hits and facet counts never show other teams' blocks. */
export function searchFilter(caller: Caller, q: Pick<SearchQuery, "category" | "badge" | "tag" | "team" | "approved">): SearchFilter {
  return { readableTeams: readableTeamIds(caller), category: q.category, badge: q.badge, tag: q.tag, team: q.team, approved: q.approved };
}

const quote = (v: string) => `"${v.replace(/\\/g, "\\\\").replace(/"/g, '\\"')}"`;

/** Meilisearch's filter expressions (AND-ed), made only here, where the search client is called. */
export function toMeiliFilter(f: SearchFilter): string[] {
  const out = [f.readableTeams.length ? `(visibility = public OR teamId IN [${f.readableTeams.join(", ")}])` : "visibility = public"];
  if (f.category) out.push(`category = ${quote(f.category)}`);
  if (f.badge) out.push(`badge = ${quote(f.badge)}`);
  if (f.tag) out.push(`tags = ${quote(f.tag)}`);
  if (f.team) out.push(`team = ${quote(f.team)}`);
  if (f.approved !== undefined) out.push(`approved = ${f.approved}`);
  return out;
}
