import { Fragment } from "react";
import { duration } from "@/components/eng";
import type { RunView } from "@/lib/runs/runs";

type Sim = { analysis: string; points?: number; ms?: number; cached?: boolean; corner?: unknown };
type ReportLike = { simulations?: Sim[]; warnings?: (string | { message: string })[]; models?: { name: string; sha256: string }[] };

const short = (h: string | null) => (h ? h.slice(0, 12) : "—");

/** What a run ran on and what it cost: versions, model hashes, each simulation's time and cache hit, warnings. */
export function RunDetails({ run, open = false }: { run: RunView; open?: boolean }) {
  const report = (run.report ?? {}) as ReportLike;
  const sims = report.simulations ?? [];
  const warnings = (report.warnings ?? []).map((w) => (typeof w === "string" ? w : w.message));
  const models = report.models ?? [];
  if (run.status !== "done" && run.status !== "error") return null;
  return (
    <details className="mt-1 text-xs" open={open}>
      <summary className="cursor-pointer text-graphite">How it ran</summary>
      <dl className="mt-1 grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5">
        <dt className="text-graphite">engine</dt><dd className="font-mono">{run.engineVersion ?? "—"}</dd>
        <dt className="text-graphite">ngspice</dt><dd className="font-mono">{run.ngspiceVersion ?? "—"}</dd>
        <dt className="text-graphite">shared models</dt><dd className="font-mono" title={run.modelLibraryHash ?? ""}>{short(run.modelLibraryHash)}</dd>
        {models.map((m) => (<Fragment key={m.name}><dt className="text-graphite">{m.name}</dt><dd className="font-mono" title={m.sha256}>{short(m.sha256)}</dd></Fragment>))}
      </dl>
      {sims.length ? (
        <table className="mt-1 w-full max-w-md text-left" data-testid="run-simulations">
          <thead className="text-graphite"><tr><th className="pr-3 font-normal">simulation</th><th className="pr-3 text-right font-normal">points</th><th className="pr-3 text-right font-normal">time</th><th className="font-normal">cache</th></tr></thead>
          <tbody className="font-mono">
            {sims.map((s, i) => (
              <tr key={i}><td className="pr-3">{s.analysis}{s.corner ? " (corner)" : ""}</td><td className="pr-3 text-right tabular-nums">{s.points ?? "—"}</td>
                <td className="pr-3 text-right tabular-nums">{duration(s.ms ?? null)}</td><td>{s.cached ? "hit" : "simulated"}</td></tr>
            ))}
          </tbody>
        </table>
      ) : <p className="mt-1 text-graphite">No simulation in this run.</p>}
      {warnings.length ? (
        <div className="mt-1"><p className="text-graphite">simulator warnings</p>
          <ul className="list-disc pl-4 font-mono text-ochre">{warnings.map((w, i) => <li key={i}>{w}</li>)}</ul></div>
      ) : <p className="mt-1 text-graphite">The simulator raised no warning.</p>}
    </details>
  );
}
