"use client";
import type { ParamRow } from "@/components/param-table";

const UNIT_WORDS: Record<string, string> = { ohm: "Ω, e.g. 4.7 kohm", F: "farad, e.g. 4.7 nF", H: "henry, e.g. 10 uH", V: "volt", A: "ampere, e.g. 2 mA", Hz: "hertz, e.g. 1 kHz", s: "second" };

// A quantity as mathjs reads it: a number, optional exponent, optional unit with prefix.
const QUANTITY = /^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?\s*[A-Za-zµΩ%]*$/;

/** A value with its unit in one field (`4.7 nF`), as the block file writes it. */
/** `error` is the server's refusal of this value (a negative resistance, a unit of another dimension), shown here. */
export function ParamInput({ param, value, onChange, error }: { param: ParamRow; value: string; onChange: (v: string) => void; error?: string }) {
  const id = `param-${param.name}`;
  const unreadable = value.trim() !== "" && !QUANTITY.test(value.trim());
  const bad = unreadable || Boolean(error);
  const changed = value !== param.value;
  return (
    <div className="grid grid-cols-[5rem_minmax(0,1fr)] items-start gap-2 sm:grid-cols-[6rem_minmax(0,12rem)_minmax(0,1fr)]">
      <label htmlFor={id} className="pt-1 font-mono text-sm font-medium">{param.name}</label>
      <input id={id} value={value} onChange={(e) => onChange(e.target.value)} spellCheck={false} inputMode="text"
        aria-invalid={bad} aria-describedby={`${id}-hint`} data-param={param.name}
        className={`w-full rounded border px-2 py-1 font-mono text-sm ${bad ? "border-brick" : changed ? "border-copper bg-copper-pale/40" : "border-rule bg-paper"}`} />
      <p id={`${id}-hint`} className="col-span-2 text-xs text-graphite sm:col-span-1 sm:pt-1.5">
        {unreadable ? <span className="text-brick">write a number and a unit, like 4.7 nF</span> : error ? <span className="text-brick" role="alert" data-testid={`param-error-${param.name}`}>{error.replace(/^parameter "[^"]+":?\s*/, "")}</span> : (
          <>
            {param.unit ? `${UNIT_WORDS[param.unit] ?? param.unit}` : "plain number"}
            {param.tol ? ` · ± ${param.tol}` : ""}
            {changed ? ` · was ${param.value}` : ""}
            {param.note ? ` · ${param.note}` : ""}
          </>
        )}
      </p>
    </div>
  );
}
