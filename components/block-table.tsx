import Link from "next/link";
import { Hallmark } from "./hallmark";
import { when } from "./eng";
import type { BlockSummary, HighlightRun } from "@/lib/search/types";

/** A row is the search result itself (lib/search/types.ts), whichever list it comes from. */
export type BlockRow = Pick<BlockSummary, "slug" | "title" | "category" | "team" | "version" | "badge" | "approved" | "updatedAt" | "summary" | "highlight">;

/** Search highlights arrive as plain and matched runs of text; React escapes every run. */
function Marked({ runs, fallback }: { runs?: HighlightRun[]; fallback: string }) {
  if (!runs?.length) return <>{fallback}</>;
  return (
    <>
      {runs.map((r, i) =>
        r.match ? <mark key={i} className="rounded-sm bg-copper-pale text-ink">{r.text}</mark> : <span key={i}>{r.text}</span>,
      )}
    </>
  );
}

export function BlockTable({ rows, caption, compact = false }: { rows: BlockRow[]; caption: string; compact?: boolean }) {
  // The short lists beside each other keep only the block and its mark; the full table shows everything.
  const wide = compact ? "hidden" : "hidden sm:table-cell";
  const wider = compact ? "hidden" : "hidden md:table-cell";
  return (
    <div className="overflow-x-auto rounded border border-rule bg-panel">
      <table className="w-full text-sm">
        <caption className="sr-only">{caption}</caption>
        <thead className="border-b border-rule text-left text-xs uppercase tracking-wide text-graphite">
          <tr>
            <th scope="col" className="px-3 py-2 font-medium">Block</th>
            <th scope="col" className="px-3 py-2 font-medium">State</th>
            <th scope="col" className={`${wide} px-3 py-2 font-medium`}>Category</th>
            <th scope="col" className={`${wider} px-3 py-2 font-medium`}>Team</th>
            <th scope="col" className={`${wider} px-3 py-2 font-medium`}>Last change</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((b) => (
            <tr key={b.slug} className="border-b border-rule/60 last:border-0 hover:bg-paper/70">
              <td className="px-3 py-2 align-top">
                <Link href={`/blocks/${b.slug}`} className="font-medium text-copper-dark hover:underline">
                  <Marked runs={b.highlight?.title} fallback={b.title} />
                </Link>
                <p className={`mt-0.5 line-clamp-2 text-xs text-graphite ${compact ? "hidden" : ""}`}><Marked runs={b.highlight?.summary} fallback={b.summary} /></p>
              </td>
              <td className="px-3 py-2 align-top"><Hallmark badge={b.badge} version={b.version} approved={b.approved} id={`row-${b.slug}`} /></td>
              <td className={`${wide} px-3 py-2 align-top`}>{b.category}</td>
              <td className={`${wider} px-3 py-2 align-top`}>{b.team}</td>
              <td className={`${wider} whitespace-nowrap px-3 py-2 align-top text-xs tabular-nums`}>{when(b.updatedAt)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
