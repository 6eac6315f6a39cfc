import type { Report } from "@/checks";
import { typesetUnits } from "./eng";
import { marginSentence } from "./limit-margin";

type Check = Report["checks"][number];

const VERDICT: Record<Check["status"], { word: string; mark: string; tone: string }> = {
  pass: { word: "passes", mark: "✓", tone: "text-verdigris" },
  fail: { word: "fails", mark: "✗", tone: "text-brick" },
  error: { word: "could not be evaluated", mark: "!", tone: "text-plum" },
  skipped: { word: "waits for a simulation", mark: "…", tone: "text-slate" },
};

const OVER: Record<string, string> = {
  nominal: "at nominal values",
  corners: "at every tolerance corner",
  "worst-case": "at nominal and the predicted worst corners",
  montecarlo: "over Monte Carlo samples",
};

/** How a check was evaluated and what it cost: "at every tolerance corner, 5 simulations", and its yield after Monte Carlo. */
function howEvaluated(c: Check): string {
  const parts = [OVER[c.over] ?? c.over];
  if (c.simulated && c.simulations !== undefined) parts.push(`${c.simulations} simulation${c.simulations === 1 ? "" : "s"}`);
  if (c.yield) {
    const pct = (x: number) => `${(100 * x).toFixed(x > 0.999 || x < 0.001 ? 2 : 1)} %`;
    parts.push(`yield ${pct(c.yield.value)} (${pct(c.yield.lo)}–${pct(c.yield.hi)}, ${c.yield.interval}, ${c.yield.samples} samples${c.yield.target !== undefined ? `, target ${pct(c.yield.target)}` : ""})`);
  }
  return parts.join(" · ");
}

const corner = (c: Record<string, string>) => Object.entries(c).map(([k, v]) => `${k} ${typesetUnits(v)}`).join(", ");

/** Each check as a sentence: its label and verdict, the comparison with its numbers, the worst corner beneath. */
export function CheckList({ checks, lines }: { checks: Check[]; lines?: boolean }) {
  if (checks.length === 0) return <p className="text-sm text-graphite">The script states no checks.</p>;
  return (
    <ol className="space-y-2" data-testid="check-list">
      {checks.map((c, i) => {
        const v = VERDICT[c.status] ?? VERDICT.error;
        return (
          <li key={`${c.label}-${i}`} className="rounded border border-rule/70 bg-panel px-3 py-2 text-sm" data-status={c.status}>
            <p>
              <span className={`mr-1 font-mono font-semibold ${v.tone}`} aria-hidden>{v.mark}</span>
              <span className="font-medium">{c.label}</span>{" "}
              <span className={v.tone}>{v.word}</span>
              {c.simulated ? <span className="ml-1 text-xs text-graphite">(simulated)</span> : null}
              {lines && c.line ? <span className="ml-1 text-xs text-graphite">line {c.line}</span> : null}
            </p>
            {c.over && c.status !== "skipped" ? <p className="mt-0.5 text-xs text-graphite" data-testid="check-over">evaluated {howEvaluated(c)}</p> : null}
            {c.detail ? <p className="mt-0.5 break-words font-mono text-xs text-graphite">{typesetUnits(c.detail)}</p> : null}
            {c.compared && (c.status === "pass" || c.status === "fail") && marginSentence(c.compared) ? (
              <p className="mt-0.5 text-xs" data-testid="check-margin">{typesetUnits(marginSentence(c.compared) ?? "")}</p>
            ) : null}
            {c.worst ? (
              <p className="mt-0.5 break-words text-xs text-graphite">
                worst corner {corner(c.worst.corner)}: <span className="font-mono">{typesetUnits(c.worst.detail)}</span>
              </p>
            ) : null}
          </li>
        );
      })}
    </ol>
  );
}
