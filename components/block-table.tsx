import Link from "next/link";
import { Hallmark } from "./hallmark";
import { when } from "./eng";
import type { HighlightRun } from "@/lib/search/search";

export interface BlockRow {
  slug: string; title: string; category: string; team: string; version: number; badge: string; approved: boolean;
  updatedAt: string; summary: string; highlight?: { title: HighlightRun[]; summary: HighlightRun[] };
}

/** Search highlights arrive as plain and matched runs of text; React escapes every run. */
function Marked({ runs, fallback }: { runs?: HighlightRun[]; fallback: string }) {
  if (!runs?.length) return <>{fallback}</>;
  return (
    <>
      {runs.map((r, i) =>
        r.match ? <mark key={i} className="rounded-sm bg-copper-pale px-0.5 text-ink">{r.text}</mark> : <span key={i}>{r.text}</span>,
      )}
    </>
  );
}

export function BlockTable({ rows, caption }: { rows: BlockRow[]; caption: string }) {
  return (
    <div className="overflow-x-auto rounded border border-rule bg-panel">
      <table className="w-full text-sm">
        <caption className="sr-only">{caption}</caption>
        <thead className="border-b border-rule text-left text-xs uppercase tracking-wide text-graphite">
          <tr>
            <th scope="col" className="px-3 py-2 font-medium">Block</th>
            <th scope="col" className="px-3 py-2 font-medium">State</th>
            <th scope="col" className="hidden px-3 py-2 font-medium sm:table-cell">Category</th>
            <th scope="col" className="hidden px-3 py-2 font-medium md:table-cell">Team</th>
            <th scope="col" className="hidden px-3 py-2 font-medium md:table-cell">Last change</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((b) => (
            <tr key={b.slug} className="border-b border-rule/60 last:border-0 hover:bg-paper/70">
              <td className="px-3 py-2 align-top">
                <Link href={`/blocks/${b.slug}`} className="font-medium text-copper-dark hover:underline">
                  <Marked runs={b.highlight?.title} fallback={b.title} />
                </Link>
                <p className="mt-0.5 line-clamp-2 text-xs text-graphite"><Marked runs={b.highlight?.summary} fallback={b.summary} /></p>
              </td>
              <td className="px-3 py-2 align-top"><Hallmark badge={b.badge} version={b.version} approved={b.approved} id={`row-${b.slug}`} /></td>
              <td className="hidden px-3 py-2 align-top sm:table-cell">{b.category}</td>
              <td className="hidden px-3 py-2 align-top md:table-cell">{b.team}</td>
              <td className="hidden whitespace-nowrap px-3 py-2 align-top font-mono text-xs md:table-cell">{when(b.updatedAt)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
