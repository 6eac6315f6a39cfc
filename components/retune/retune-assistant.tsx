"use client";
import { useId, useState } from "react";
import { Decimal } from "@/components/decimal";
import { useRetuneBlock } from "@/lib/queries/retune-block";

const SERIES = ["E3", "E6", "E12", "E24", "E48", "E96", "E192"];

/** Solve one parameter for a target quantity, snapped to a preferred-value series (IEC 60063). */
export function RetuneAssistant({ slug, params, quantities, onUse, values, head }: {
  slug: string; params: string[]; quantities: string[]; onUse: (param: string, value: string) => void;
  values: Record<string, string>; head: { version: number; values: Record<string, string> };
}) {
  const id = useId();
  const [param, setParam] = useState(params[0] ?? "");
  const [quantity, setQuantity] = useState(quantities[0] ?? "");
  const [value, setValue] = useState("");
  const [series, setSeries] = useState("E24");
  const retune = useRetuneBlock(slug);
  const field = "w-full rounded border border-rule bg-paper px-2 py-1 text-sm";
  // The other values on this form go with the request, so the assistant solves from what is on screen;
  // a parameter the head's file lacks cannot be sent into it.
  const drafts = Object.fromEntries(Object.entries(values).filter(([k, v]) => k !== param && head.values[k] !== undefined && v.trim() !== ""));
  const notInHead = Object.keys(values).filter((k) => head.values[k] === undefined);
  return (
    <section aria-label="Retune assistant" className="space-y-2 rounded border border-rule bg-panel p-3" data-testid="retune-assistant">
      <h2 className="text-xs font-semibold uppercase tracking-wide text-graphite">Retune assistant</h2>
      <p className="text-xs text-graphite">Pick a parameter to solve for, a quantity and the value it should reach.</p>
      <div className="grid grid-cols-2 gap-2">
        <label className="text-sm" htmlFor={`${id}-p`}>Parameter
          <select id={`${id}-p`} value={param} onChange={(e) => setParam(e.target.value)} className={`${field} font-mono`}>
            {params.map((p) => <option key={p}>{p}</option>)}
          </select>
        </label>
        <label className="text-sm" htmlFor={`${id}-s`}>Series
          <select id={`${id}-s`} value={series} onChange={(e) => setSeries(e.target.value)} className={field}>
            {SERIES.map((s) => <option key={s}>{s}</option>)}
          </select>
        </label>
        <label className="text-sm" htmlFor={`${id}-q`}>Quantity
          <select id={`${id}-q`} value={quantity} onChange={(e) => setQuantity(e.target.value)} className={`${field} font-mono`}>
            {quantities.map((q) => <option key={q}>{q}</option>)}
          </select>
        </label>
        <label className="text-sm" htmlFor={`${id}-v`}>Target
          <input id={`${id}-v`} value={value} onChange={(e) => setValue(e.target.value)} placeholder="1.03 or 1 kHz" className={`${field} font-mono`} />
        </label>
      </div>
      {notInHead.length ? (
        <p className="text-xs text-brick" data-testid="retune-base-note">
          The assistant solves in the file of v{head.version}, the head, which has no{" "}
          <span className="font-mono">{notInHead.join(", ")}</span>. Check its answer in the live preview after using it.
        </p>
      ) : null}
      <button type="button" disabled={!param || !quantity || !value.trim() || retune.isPending}
        onClick={() => retune.mutate({ param, target: { quantity, value: value.trim() }, series, params: drafts })}
        className="rounded bg-copper px-3 py-1 text-sm font-medium text-white hover:bg-copper-dark disabled:opacity-50">
        {retune.isPending ? "Solving…" : "Solve"}
      </button>
      <div aria-live="polite" className="text-sm">
        {retune.isError ? <p className="text-brick">{retune.error.message}</p> : null}
        {retune.data ? (
          <div className="space-y-1" data-testid="retune-result">
            <p>Exact: <Decimal text={retune.data.value} intWidth={3} /> · {series}: <strong><Decimal text={retune.data.snapped} intWidth={3} /></strong></p>
            <p className="text-xs text-graphite">
              At the {series} value the checks {retune.data.report.checks.some((c) => c.status === "fail") ? "still fail somewhere" : "that need no simulation pass"}.
            </p>
            <button type="button" onClick={() => onUse(param, retune.data!.snapped)} className="rounded border border-copper px-3 py-1 text-sm text-copper-dark hover:bg-copper-pale">
              Use {retune.data.snapped} for {param}
            </button>
          </div>
        ) : null}
      </div>
    </section>
  );
}
