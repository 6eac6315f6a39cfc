import type { CheckOutcome } from "../script/evaluate";
import { formatQuantity, toQuantity } from "../units";
import type { CheckReport, Report } from "./types";

const siOf = (x: unknown) => toQuantity(x)?.si ?? NaN;

export { reportStatus } from "./status";

export function quantitiesOf(scope: Map<string, unknown>, assigned: { name: string; simulated: boolean }[]): Report["quantities"] {
  const out: Report["quantities"] = {};
  // Simulated measures are reported too, so the hand value and the simulation sit side by side.
  for (const { name, simulated } of assigned) {
    const q = toQuantity(scope.get(name));
    if (!q || !Number.isFinite(q.si)) continue;
    out[name] = { value: q.si, unit: q.unit, text: formatQuantity(q.si, q.unit), ...(simulated ? { simulated: true as const } : {}) };
  }
  return out;
}

/** The nominal comparison in SI numbers; none when the value is not one finite number (a family, a boolean). */
export function comparedOf(p: CheckOutcome["primary"]): CheckReport["compared"] | undefined {
  if (!p) return undefined;
  const value = siOf(p.value);
  const limits = p.limits.map(siOf);
  if (!Number.isFinite(value) || !limits.every(Number.isFinite)) return undefined;
  const target = p.target === undefined ? undefined : siOf(p.target);
  return { quantity: p.label, unit: toQuantity(p.value)?.unit ?? "", value, limits, relations: p.relations ?? [], ...(target !== undefined ? { target } : {}) };
}

