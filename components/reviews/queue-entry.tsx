import Link from "next/link";
import { ReviewDecision } from "@/components/block/review-decision";
import { CheckList } from "@/components/check-list";
import { DiffLines, lineCounts, type DiffPart } from "@/components/diff-view";
import { Decimal } from "@/components/decimal";
import { when } from "@/components/eng";
import { Hallmark } from "@/components/hallmark";
import type { QueueEntry } from "@/lib/reviews/queue";

/** Diffs up to this many changed lines are shown open; longer ones fold behind their summary. */
const OPEN_LINES = 12;

const OUTCOME: Record<string, string> = { pass: "passes", fail: "fails", error: "could not be evaluated", skipped: "waits for a simulation" };
const outcome = (s: string | null) => (s === null ? "absent" : OUTCOME[s] ?? s);

/** One waiting version: who asked, its checks, what changed since the last approved version, and the decision form. */
export function QueueEntryView({ entry: r }: { entry: QueueEntry }) {
  const base = r.against;
  return (
    <li className="grid gap-4 rounded border border-rule bg-panel p-4 md:grid-cols-[minmax(0,1fr)_22rem]"
      data-testid="review-entry" data-slug={r.slug} data-version={r.version}>
      <div className="min-w-0 space-y-4">
        <header>
          <Link href={`/blocks/${r.slug}/versions/${r.version}`} className="font-serif text-lg font-semibold text-copper-dark hover:underline">{r.title}</Link>
          <p className="mt-1 flex flex-wrap items-center gap-2 text-sm text-graphite">
            <Hallmark badge={r.badge} version={r.version} id={`rq-${r.slug}`} /> team {r.team} · asked by {r.requestedBy ?? "—"} on {when(r.requestedAt)}
          </p>
          {r.message ? <p className="mt-1 max-w-prose text-sm">“{r.message}”</p> : null}
        </header>

        <section aria-label={`Checks of v${r.version}`} className="space-y-2">
          <h3 className="text-sm font-semibold">Checks of v{r.version}</h3>
          <Checks entry={r} />
        </section>

        <section aria-label={`Changes in v${r.version}`} className="space-y-2" data-testid="review-changes">
          <h3 className="text-sm font-semibold">
            {base === null ? "No approved version yet: everything below is new" : `Changed since v${base}, the last approved version`}
          </h3>
          <ParamChanges entry={r} />
          {r.changes.checks.length && base !== null ? (
            <ul className="space-y-0.5 text-sm" aria-label="Check outcomes that changed">
              {r.changes.checks.map((c) => (
                <li key={c.label}><span className="font-medium">{c.label}</span>: {outcome(c.from)} in v{base} → <strong>{outcome(c.to)}</strong></li>
              ))}
            </ul>
          ) : null}
          <TextChanges entry={r} />
          {base !== null ? (
            <p className="text-sm"><Link className="text-copper-dark underline" href={`/blocks/${r.slug}/compare?a=${base}&b=${r.version}`}>Compare v{base} with v{r.version} in full</Link></p>
          ) : null}
        </section>
      </div>
      {/* The decision stays in view while the reviewer reads a long entry. */}
      <div className="self-start md:sticky md:top-4"><ReviewDecision slug={r.slug} version={r.version} /></div>
    </li>
  );
}

function Checks({ entry: r }: { entry: QueueEntry }) {
  if (r.run === null) return <p className="text-sm text-graphite">v{r.version} has not been checked.</p>;
  if (r.run === "queued" || r.run === "running") return <p className="text-sm text-ochre">The checks of v{r.version} are still running; reload to see them.</p>;
  const allPass = r.checks.every((c) => c.status === "pass");
  return (
    <>
      {r.errors.length ? (
        <ul className="space-y-0.5 text-sm text-plum" aria-label="What could not be evaluated">
          {r.errors.map((e, i) => <li key={i}>{e.line ? `Line ${e.line}: ` : ""}{e.message}</li>)}
        </ul>
      ) : null}
      {r.checks.length === 0 ? (r.errors.length ? null : <CheckList checks={r.checks} />) : (
        // All passing and more than a few: folded behind the count; anything else is open.
        <details open={!allPass || r.checks.length <= 3}>
          <summary className="cursor-pointer text-sm">{tally(r.checks)}</summary>
          <div className="mt-2"><CheckList checks={r.checks} /></div>
        </details>
      )}
    </>
  );
}

function ParamChanges({ entry: r }: { entry: QueueEntry }) {
  const ps = r.changes.params;
  if (ps.length === 0) return <p className="text-sm text-graphite">No parameter changed.</p>;
  const before = r.against === null ? "before" : `v${r.against}`;
  return (
    <table className="text-sm" aria-label="Parameters changed">
      <thead className="text-left text-xs text-graphite">
        <tr><th className="pr-4 font-normal">parameter</th><th className="pr-4 font-normal">{before}</th><th className="font-normal">v{r.version}</th></tr>
      </thead>
      <tbody>
        {ps.map((p) => (
          <tr key={p.name} className="border-t border-rule/70" data-param={p.name}>
            <th scope="row" className="pr-4 text-left font-mono font-medium">{p.name}</th>
            <td className="pr-4 text-brick">{p.from === null ? <span className="text-graphite">—</span> : <del className="no-underline"><Decimal text={p.from} mark="line-through decoration-1" /></del>}</td>
            <td className="text-verdigris">{p.to === null ? <span className="text-graphite">removed</span> : <Decimal text={p.to} />}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

function TextChanges({ entry: r }: { entry: QueueEntry }) {
  const texts: [string, DiffPart[]][] = [["Netlist", r.changes.netlist], ["Check script", r.changes.script], ["Note", r.changes.note]];
  const changed = texts.filter(([, parts]) => parts.some((p) => p.added || p.removed));
  const same = texts.filter(([, parts]) => !parts.some((p) => p.added || p.removed)).map(([t]) => t.toLowerCase());
  return (
    <div className="space-y-2">
      {changed.map(([title, parts]) => {
        const { added, removed } = lineCounts(parts);
        return (
          <details key={title} open={added + removed <= OPEN_LINES} className="rounded border border-rule bg-paper">
            <summary className="cursor-pointer px-3 py-1 text-sm">
              <span className="font-medium">{title}</span>{" "}
              <span className="font-mono text-xs"><span className="text-verdigris">+{added}</span> <span className="text-brick">−{removed}</span></span>{" "}
              <span className="text-xs text-graphite">line{added + removed === 1 ? "" : "s"}</span>
            </summary>
            <DiffLines parts={parts} className="max-h-72 border-t border-rule bg-panel" />
          </details>
        );
      })}
      {same.length ? <p className="text-sm text-graphite">{capital(same.join(", "))} unchanged.</p> : null}
    </div>
  );
}

/** "6 checks: 5 pass, 1 fails". */
function tally(checks: QueueEntry["checks"]): string {
  const n = (s: string) => checks.filter((c) => c.status === s).length;
  const parts = [
    n("pass") && `${n("pass")} pass${n("pass") === 1 ? "es" : ""}`,
    n("fail") && `${n("fail")} fail${n("fail") === 1 ? "s" : ""}`,
    n("error") && `${n("error")} could not be evaluated`,
    n("skipped") && `${n("skipped")} wait for a simulation`,
  ].filter(Boolean);
  return `${checks.length} check${checks.length === 1 ? "" : "s"}: ${parts.join(", ")}`;
}

const capital = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);
