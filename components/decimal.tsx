import { splitDecimal, typesetUnits } from "./eng";

/** A value aligned on its decimal point (the integer part right-aligned in a fixed width), its unit typeset. */
export function Decimal({ text, intWidth = 4 }: { text: string; intWidth?: number }) {
  const { int, frac } = splitDecimal(typesetUnits(text));
  return (
    <span className="whitespace-nowrap font-mono tabular-nums">
      <span className="inline-block text-right" style={{ width: `${intWidth}ch` }}>{int}</span>
      <span>{frac}</span>
    </span>
  );
}
