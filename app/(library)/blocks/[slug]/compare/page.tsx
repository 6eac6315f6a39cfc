import type { Metadata } from "next";
import Link from "next/link";
import { DiffView } from "@/components/diff-view";
import { EmptyState } from "@/components/empty-state";
import { typesetUnits } from "@/components/eng";
import { QuantityCompare } from "@/components/quantity-compare";
import { compareVersions } from "@/lib/blocks/compare";
import { listVersions } from "@/lib/blocks/read";
import { pageContext } from "@/lib/next-context";
import { orNotFound } from "../../../or-not-found";

export const metadata: Metadata = { title: "Compare versions" };
export const dynamic = "force-dynamic";

export default async function ComparePage({ params, searchParams }: {
  params: Promise<{ slug: string }>; searchParams: Promise<{ a?: string; b?: string }>;
}) {
  const { slug } = await params;
  const ctx = await pageContext();
  const versions = await orNotFound(listVersions(ctx, { slug }));
  const head = versions[0]?.version ?? 1;
  const sp = await searchParams;
  const b = Math.min(head, Math.max(1, Number(sp.b) || head));
  const a = Math.min(head, Math.max(1, Number(sp.a) || Math.max(1, b - 1)));
  const cmp = await orNotFound(compareVersions(ctx, { slug, a, b }));
  const select = "rounded border border-rule bg-panel px-2 py-1 font-mono text-sm";
  return (
    <div className="space-y-6">
      <header className="space-y-2">
        <p className="text-sm"><Link href={`/blocks/${slug}`} className="text-copper-dark underline">{slug}</Link></p>
        <h1 className="font-serif text-2xl font-semibold">Compare v{cmp.from} with v{cmp.to}</h1>
        <form className="flex flex-wrap items-end gap-3" method="get">
          <label className="text-sm" htmlFor="cmp-a">From <select id="cmp-a" name="a" defaultValue={a} className={select}>{versions.map((v) => <option key={v.version} value={v.version}>v{v.version}</option>)}</select></label>
          <label className="text-sm" htmlFor="cmp-b">To <select id="cmp-b" name="b" defaultValue={b} className={select}>{versions.map((v) => <option key={v.version} value={v.version}>v{v.version}</option>)}</select></label>
          <button type="submit" className="rounded border border-rule bg-panel px-3 py-1 text-sm hover:border-copper">Compare</button>
        </form>
      </header>
      <section aria-label="Parameter changes">
        <h2 className="mb-2 font-serif text-lg font-semibold">Parameters</h2>
        {cmp.params.length ? (
          <table className="rounded border border-rule bg-panel text-sm">
            <thead className="text-left text-xs uppercase text-graphite"><tr><th className="px-3 py-1">Name</th><th className="px-3 py-1 normal-case">v{cmp.from}</th><th className="px-3 py-1 normal-case">v{cmp.to}</th></tr></thead>
            <tbody>{cmp.params.map((p) => (
              <tr key={p.name} className="border-t border-rule"><th scope="row" className="px-3 py-1 text-left font-mono">{p.name}</th>
                <td className="px-3 py-1 font-mono text-brick line-through decoration-1">{p.from ? typesetUnits(p.from) : "—"}</td>
                <td className="px-3 py-1 font-mono text-verdigris">{p.to ? typesetUnits(p.to) : "—"}</td></tr>))}
            </tbody>
          </table>
        ) : <EmptyState title="No parameter changed." />}
      </section>
      <section aria-label="Quantities side by side">
        <h2 className="mb-2 font-serif text-lg font-semibold">Quantities</h2>
        <QuantityCompare rows={cmp.quantities} from={cmp.from} to={cmp.to} />
      </section>
      <section aria-label="Check outcome changes">
        <h2 className="mb-2 font-serif text-lg font-semibold">Checks whose outcome changed</h2>
        {cmp.checks.length ? (
          <ul className="space-y-1 text-sm">{cmp.checks.map((c) => <li key={c.label}><span className="font-medium">{c.label}</span>: {c.from ?? "absent"} → <strong>{c.to ?? "absent"}</strong></li>)}</ul>
        ) : <EmptyState title="Every check ends the same way in both versions." />}
      </section>
      <DiffView title="Note" parts={cmp.note} />
      <DiffView title="Netlist" parts={cmp.netlist} />
      <DiffView title="Check script" parts={cmp.script} />
    </div>
  );
}
