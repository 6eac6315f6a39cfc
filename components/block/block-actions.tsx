import Link from "next/link";
import type { ReactNode } from "react";
import type { BlockAllowed } from "@/lib/blocks/page";
import { ReviewRequest } from "./review-request";
import { ReviewDecision } from "./review-decision";
import { WatchButton } from "./watch-button";
import { workVerb } from "./work-verb";


function Verb({ href, glyph, children, hint }: { href: string; glyph: string; children: ReactNode; hint: string }) {
  return (
    <Link className={workVerb} href={href} title={hint}>
      <span aria-hidden className="font-mono text-xs text-copper">{glyph}</span>{children}
    </Link>
  );
}

/**
 * The bench: what one can do with this block's own work, grouped as making (retune, derive, revise) and
 * keeping (sign-off, following, the record). The server checks every one of these again.
 */
export function BlockActions({ slug, version, allowed, watching, versions }: {
  slug: string; version: number; allowed: BlockAllowed; watching: boolean; versions: number;
}) {
  return (
    <div className="space-y-3" data-testid="bench">
      <div className="flex w-fit max-w-full flex-wrap items-stretch divide-x divide-rule rounded-md border border-rule bg-panel shadow-[inset_0_-2px_0_var(--color-copper-pale)]">
        {allowed.fork ? <Verb href={`/blocks/${slug}/fork?from=${version}#retune`} glyph="⇄" hint="Move one value until a quantity hits its target">Retune</Verb> : null}
        {allowed.fork ? <Verb href={`/blocks/${slug}/fork?from=${version}`} glyph="↳" hint="A new block from this version, with its lineage recorded">Derive a variant</Verb> : null}
        {allowed.editThisVersion ? <Verb href={`/blocks/${slug}/edit`} glyph="✎" hint="Change the note, netlist or script as the next version">Revise</Verb> : null}
        {allowed.requestReview ? <ReviewRequest slug={slug} version={version} /> : null}
        {allowed.watch ? <WatchButton slug={slug} watching={watching} /> : null}
        {versions > 1 ? <Verb href={`/blocks/${slug}/compare?a=${Math.max(1, version - 1)}&b=${version}`} glyph="↔" hint="Two versions side by side">Set beside v{Math.max(1, version - 1)}</Verb> : null}
        <Verb href={`/blocks/${slug}/runs`} glyph="≡" hint="Every verification of every version">Verification record</Verb>
      </div>
      {allowed.decide ? (
        <details className="max-w-md rounded border border-rule bg-panel px-3 py-2">
          <summary className="cursor-pointer text-sm font-medium">Sign off v{version}, or send it back</summary>
          <div className="mt-2"><ReviewDecision slug={slug} version={version} refresh /></div>
        </details>
      ) : null}
    </div>
  );
}
