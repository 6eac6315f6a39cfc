import { eng } from "./eng";

export type Compared = { quantity: string; unit: string; value: number; limits: number[]; relations: string[]; target?: number };

/** `eng` with as many digits (3 to 9) as it takes for `value` and `other` to read differently, when they differ. */
export function engApart(value: number, other: number, unit: string): string {
  if (value === other || eng(value, unit, 3) !== eng(other, unit, 3)) return eng(value, unit, 3);
  for (let d = 4; d <= 9; d++) {
    const a = eng(value, unit, d, true);
    if (a !== eng(other, unit, d, true)) return a;
  }
  return eng(value, unit, 9, true);
}

export type Margin = { limit: number; relation: string; by: number; percent: number | null; pass: boolean };

/**
 * The binding limit: of all the limits the value is compared with, the one it clears by least (or misses by most),
 * with that distance in the check's unit and in percent of the limit.
 */
export function bindingMargin(c: Compared): Margin | null {
  let best: Margin | null = null;
  c.limits.forEach((limit, i) => {
    const rel = c.relations[i] ?? "";
    const dir = rel === ">" || rel === "≥" ? 1 : rel === "<" || rel === "≤" ? -1 : 0;
    if (dir === 0) return;
    const by = dir * (c.value - limit);
    const pass = rel === ">" ? by > 0 : rel === "<" ? by > 0 : by >= 0;
    const m = { limit, relation: rel, by, percent: limit !== 0 ? (100 * Math.abs(c.value - limit)) / Math.abs(limit) : null, pass };
    if (!best || by < best.by) best = m;
  });
  return best;
}

const SIDE: Record<string, string> = { ">": "lower limit", "≥": "lower limit", "<": "upper limit", "≤": "upper limit" };

/** "clears the upper limit 2.575 V by 4.90 mV (0.19 %)" or "misses the lower limit 1.5 kHz by 12.0 Hz (0.80 %)". */
export function marginSentence(c: Compared): string | null {
  const m = bindingMargin(c);
  if (!m) return null;
  const dist = eng(Math.abs(m.by), c.unit, 3);
  const pct = m.percent === null ? "" : ` (${m.percent < 0.1 ? m.percent.toPrecision(2) : m.percent.toFixed(m.percent < 1 ? 2 : 1)} %)`;
  const at = `${c.quantity} = ${engApart(c.value, m.limit, c.unit)}`;
  const limit = engApart(m.limit, c.value, c.unit);
  return m.by === 0 && m.pass
    ? `${at} sits exactly on the ${SIDE[m.relation]} ${limit}`
    : `${at} ${m.pass ? "clears" : "misses"} the ${SIDE[m.relation]} ${limit} by ${dist}${pct}`;
}
