import type { BlockError, ParamSpec } from "./types";

/**
 * DESIGN.md "Block file format": a new version may not give a parameter a value of another
 * dimension than the earlier version had (a 10 kohm resistor turned into 10 V is a typo that
 * would silently change every formula). One error per such parameter, at its line.
 */
export function unitChanges(before: { name: string; unit: string }[], after: ParamSpec[]): BlockError[] {
  const was = new Map(before.map((p) => [p.name, p.unit]));
  const out: BlockError[] = [];
  for (const p of after) {
    const unit = was.get(p.name);
    if (unit === undefined || unit === p.unit) continue;
    out.push({ message: `parameter "${p.name}" was in ${unit || "plain numbers"}; "${p.value}" is in ${p.unit || "plain numbers"}`, line: p.line });
  }
  return out;
}
