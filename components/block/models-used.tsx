import Link from "next/link";
import type { RunModel } from "@/entities";

/** The model files this version's latest run simulated with, each linked to the exact version, and the runnable deck. */
export function ModelsUsed({ slug, version, team, models }: { slug: string; version: number; team: string; models: RunModel[] | null }) {
  return (
    <div className="space-y-2 text-sm" data-testid="models-used">
      {models?.length ? (
        <ul className="space-y-1">
          {models.map((m) => (
            <li key={m.name}>
              <Link className="font-mono text-copper-dark underline"
                href={m.source === "team" ? `/models/${team}/${m.name}?version=${m.version}` : `/models/shared/${m.name}`}>{m.name}</Link>{" "}
              <span className="text-graphite">{m.source === "team" ? `v${m.version}` : "shared"} · <span className="font-mono text-xs">{m.sha256.slice(0, 12)}</span></span>
            </li>
          ))}
        </ul>
      ) : <p className="text-graphite">{models ? "The run included no model file." : "No run has recorded its model files yet."}</p>}
      <a className="text-copper-dark underline" href={`/api/v1/blocks/${slug}/versions/${version}?format=spice`}>Download the deck for ngspice</a>
    </div>
  );
}
