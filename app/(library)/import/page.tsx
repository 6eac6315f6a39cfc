import type { Metadata } from "next";
import { ImportForm } from "@/components/import/import-form";
import { requireUser } from "@/lib/auth/session";
import { creatableTeams } from "@/lib/blocks/page";

export const metadata: Metadata = { title: "Import" };
export const dynamic = "force-dynamic";

export default async function ImportPage() {
  const caller = await requireUser("/import");
  const teams = creatableTeams(caller);
  return (
    <div className="space-y-4">
      <h1 className="font-serif text-2xl font-semibold">Import a block</h1>
      <p className="max-w-prose text-sm text-graphite">
        Upload a block file (.md), or a SPICE netlist (.cir, .sp, .net) that becomes one: its <code>.param</code> lines become
        parameters, and analysis and control lines are dropped and listed. Schematic images (PNG or SVG, at most 1 MiB each)
        show in the note where it names them, as in <code>![divider](divider.png)</code>.
      </p>
      {teams.length ? <ImportForm teams={teams} /> : <p className="text-sm text-brick">You are a viewer in every team you belong to; ask a team admin for the author role to import blocks.</p>}
    </div>
  );
}
