import { splitDecimal, typesetUnits } from "./eng";

/**
 * A value aligned on its decimal point (the integer part right-aligned in a fixed width), its unit typeset.
 * `mark` styles both parts: a decoration such as line-through does not reach into the inline-block integer part.
 */
export function Decimal({ text, intWidth = 4, mark = "" }: { text: string; intWidth?: number; mark?: string }) {
  const { int, frac } = splitDecimal(typesetUnits(text));
  return (
    <span className="whitespace-nowrap font-mono tabular-nums">
      <span className={`inline-block text-right ${mark}`} style={{ width: `${intWidth}ch` }}>{int}</span>
      <span className={mark}>{frac}</span>
    </span>
  );
}
