import "server-only";
import type { z } from "zod";
import type { BlockView, Lineage } from "@/lib/blocks/read";
import type { blockSchema, checkCountsSchema } from "@/lib/openapi/responses";

type Report = { checks?: { status: string }[] } | null;

function checkCounts(report: Report): z.infer<typeof checkCountsSchema> | null {
  if (!report?.checks) return null;
  const counts = { pass: 0, fail: 0, error: 0, skipped: 0 };
  for (const c of report.checks) if (c.status in counts) counts[c.status as keyof typeof counts]++;
  return counts;
}

/** A BlockView and its lineage as the API's Block JSON: fields picked one by one, so nothing internal leaks. */
export function toBlockJson(v: BlockView, lineage: Lineage): z.infer<typeof blockSchema> {
  return {
    slug: v.slug,
    title: v.title,
    category: v.category as never,
    tags: v.tags,
    summary: v.summary,
    hazard: v.hazard,
    team: v.team,
    visibility: v.visibility,
    version: v.version,
    headVersion: v.headVersion,
    archived: v.archived,
    badge: v.badge,
    approved: v.approved,
    params: v.params,
    markdown: v.markdown,
    note: v.note,
    netlist: v.netlist,
    script: v.script,
    contentHash: v.contentHash,
    report: v.report as never,
    checkCounts: checkCounts(v.report as Report),
    run: v.runId && v.runStatus ? { id: v.runId, status: v.runStatus as never } : null,
    forkedFrom: v.forkedFrom ? { slug: v.forkedFrom.slug, version: v.forkedFrom.version } : null,
    lineage: {
      forkedFrom: lineage.forkedFrom,
      parentNewerVersions: lineage.parentNewerVersions,
      forks: lineage.forks.map((f) => ({ slug: f.slug, title: f.title, fromVersion: f.fromVersion })),
    },
    createdAt: v.createdAt,
    author: v.author,
  };
}
