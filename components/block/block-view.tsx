import Link from "next/link";
import type { Report } from "@/checks";
import { ApiPanel } from "@/components/api-panel";
import { CheckList } from "@/components/check-list";
import { CodePanel } from "@/components/code-panel";
import { HazardCaution } from "@/components/hazard-caution";
import { NoteView } from "@/components/note-view";
import { ParamTable } from "@/components/param-table";
import { QuantityList } from "@/components/quantity-list";
import type { BlockPageModel } from "@/lib/blocks/page";
import { AttachmentsPanel } from "./attachments-panel";
import { BlockActions } from "./block-actions";
import { HistoryPanel } from "./history-panel";
import { LineagePanel } from "./lineage-panel";
import { ModelsUsed } from "./models-used";
import { LiveBadgeProvider } from "./live-badge";
import { Panel } from "./panel";
import { RunPlots } from "./run-plots";
import { RunWatcher } from "./run-watcher";
import { VersionPicker } from "./version-picker";

const emptyReport: Report = { slug: "", status: "unchecked", quantities: {}, checks: [], simulations: [], errors: [] };

/** One version of a block: the note in the reading column, what was proven beside it. */
export function BlockView({ model }: { model: BlockPageModel }) {
  const { block, versions, lineage, watching, waveforms, runs, reviews, attachments, isHead, allowed } = model;
  const slug = block.slug;
  const report = (block.report as Report | null) ?? emptyReport;

  return (
    <div className="space-y-6">
      <header className="space-y-3">
        <p className="text-sm text-graphite">
          <Link href="/" className="hover:underline">Library</Link> / {block.category} / <span className="font-mono">{block.slug}</span>
        </p>
        <h1 className="font-serif text-3xl font-semibold leading-tight">{block.title}</h1>
        <LiveBadgeProvider><div className="flex flex-wrap items-center gap-x-5 gap-y-2">
          <RunWatcher runId={block.runId} runStatus={block.runStatus} badge={block.badge} version={block.version} approved={block.approved} />
          <VersionPicker slug={slug} versions={versions} current={block.version} head={block.headVersion} />
          <span className="text-sm text-graphite">team <span className="font-medium text-ink">{block.team}</span> · by {block.author}</span>
          {lineage.forkedFrom ? (
            <span className="text-sm text-graphite">
              forked from <Link className="text-copper-dark underline" href={`/blocks/${lineage.forkedFrom.slug}/versions/${lineage.forkedFrom.version}`}>{lineage.forkedFrom.slug} v{lineage.forkedFrom.version}</Link>
              {lineage.parentNewerVersions > 0 ? `; parent has ${lineage.parentNewerVersions} newer version${lineage.parentNewerVersions === 1 ? "" : "s"}` : ""}
            </span>
          ) : null}
        </div></LiveBadgeProvider>
        {!isHead ? (
          <p className="rounded border border-ochre/60 bg-[#fff8e8] px-3 py-1 text-sm">
            You are reading v{block.version}; the head is <Link className="underline" href={`/blocks/${slug}`}>v{block.headVersion}</Link>.
          </p>
        ) : null}
        {block.archived ? <p className="text-sm text-slate">This block is archived: it stays readable but takes no new versions.</p> : null}
        <p className="max-w-prose text-graphite">{block.summary}</p>
        <BlockActions slug={slug} version={block.version} allowed={allowed} watching={watching} versions={versions.length} />
      </header>

      <HazardCaution hazard={block.hazard} />

      <div className="grid gap-8 lg:grid-cols-[minmax(0,70ch)_minmax(0,1fr)]">
        <div className="min-w-0 space-y-8">
          <NoteView markdown={block.note} slug={slug} />
          <section aria-label="Plots" className="space-y-2">
            <h2 className="font-serif text-xl font-semibold">Plots</h2>
            {block.runStatus === "done" ? <RunPlots waveforms={waveforms} checks={report.checks} quantities={report.quantities} /> : <p className="text-sm text-graphite">Plots appear when this version's run has finished.</p>}
          </section>
          <section aria-label="Netlist and script" className="space-y-3">
            <h2 className="font-serif text-xl font-semibold">Netlist and script</h2>
            <CodePanel title="Netlist" text={block.netlist} fileName={`${slug}-v${block.version}.cir`} />
            <CodePanel title="Check script" text={block.script} fileName={`${slug}-v${block.version}.check`} />
            <CodePanel title="Block file" text={block.text} fileName={`${slug}.md`} type="text/markdown" />
          </section>
        </div>
        <aside aria-label="What was proven" className="min-w-0 space-y-4">
          <Panel title="Parameters"><ParamTable params={block.params} /></Panel>
          <Panel title="Checks">
            {report.errors.length ? (
              <ul className="mb-2 space-y-1 text-sm text-plum">{report.errors.map((e, i) => <li key={i}>{e.line ? `line ${e.line}: ` : ""}{e.message}</li>)}</ul>
            ) : null}
            {block.report ? <CheckList checks={report.checks} /> : <p className="text-sm text-graphite">No finished run for this version yet.</p>}
          </Panel>
          <Panel title="Quantities"><QuantityList quantities={report.quantities} /></Panel>
          <AttachmentsPanel slug={slug} attachments={attachments} canAttach={allowed.attach} />
          <Panel title="Model files"><ModelsUsed slug={slug} version={block.version} team={block.team} models={block.models} /></Panel>
          <Panel title="Lineage"><LineagePanel lineage={lineage} /></Panel>
          <HistoryPanel slug={slug} runs={runs} reviews={reviews.slice(0, 6)} />
          <ApiPanel slug={slug} version={block.version} isHead={isHead} visibility={block.visibility} />
        </aside>
      </div>
    </div>
  );
}
