import Link from "next/link";
import { ReviewRequest } from "./review-request";
import { ReviewDecision } from "./review-decision";
import { WatchButton } from "./watch-button";

const btn = "rounded border border-rule bg-panel px-3 py-1 text-sm hover:border-copper";

/** What the reader may do with this version; the server checks every one of these again. */
export function BlockActions({ slug, version, role, signedIn, watching, isHead, versions }: {
  slug: string; version: number; role: string | null; signedIn: boolean; watching: boolean; isHead: boolean; versions: number;
}) {
  const author = role === "author" || role === "maintainer" || role === "admin";
  const maintainer = role === "maintainer" || role === "admin";
  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-center gap-2">
        {signedIn ? <Link className={btn} href={`/blocks/${slug}/fork?from=${version}`}>Fork and retune</Link> : null}
        {author && isHead ? <Link className={btn} href={`/blocks/${slug}/edit`}>Edit</Link> : null}
        {versions > 1 ? <Link className={btn} href={`/blocks/${slug}/compare?a=${Math.max(1, version - 1)}&b=${version}`}>Compare</Link> : null}
        <Link className={btn} href={`/blocks/${slug}/runs`}>Runs</Link>
        {signedIn ? <WatchButton slug={slug} watching={watching} /> : null}
        {author && isHead ? <ReviewRequest slug={slug} version={version} /> : null}
      </div>
      {maintainer && isHead ? (
        <details className="max-w-md rounded border border-rule bg-panel px-3 py-2">
          <summary className="cursor-pointer text-sm font-medium">Review this version</summary>
          <div className="mt-2"><ReviewDecision slug={slug} version={version} refresh /></div>
        </details>
      ) : null}
    </div>
  );
}
