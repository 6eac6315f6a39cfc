import type { Report, Waveform } from "@/checks";
import { eng } from "../eng";
import { engApart, type Compared } from "../limit-margin";

type Check = Report["checks"][number];
export type Verdict = "pass" | "fail" | "error" | "skipped";

/** A dashed line across the plot at a value the check compared with: a hand value, a band edge, a limit. */
export type Guide = { axis: "x" | "y"; value: number; role: "target" | "band" | "limit"; text: string; check: string; status: Verdict };
/** Where the checked value was measured: over a window (x0..x1) at height y, or at one frequency. */
export type Measured = { x0: number; x1: number; y: number | null; text: string; check: string; status: Verdict };

const near = (a: number, b: number) => Math.abs(a - b) <= 1e-9 * Math.max(Math.abs(a), Math.abs(b), 1e-30);

/** Guides for one compared value drawn on an axis in the value's own unit; `sign` flips a negated measure. */
function guidesOf(c: Compared, check: Check, axis: "x" | "y", sign: number): Guide[] {
  const out: Guide[] = [];
  const status = check.status;
  if (c.target !== undefined) {
    out.push({ axis, value: sign * c.target, role: "target", text: `target ${eng(sign * c.target, c.unit)}`, check: check.label, status });
    const pct = c.target !== 0 ? Math.abs((c.limits[1] - c.target) / c.target) * 100 : null;
    c.limits.forEach((l, i) => {
      const edge = pct !== null ? `${i === 0 ? "−" : "+"}${Number(pct.toPrecision(2))} % ` : "";
      out.push({ axis, value: sign * l, role: "band", text: `${edge}${engApart(sign * l, sign * c.value, c.unit)}`, check: check.label, status });
    });
  } else {
    c.limits.forEach((l, i) => {
      const rel = sign < 0 ? ({ ">": "<", "<": ">", "≥": "≤", "≤": "≥" }[c.relations[i]] ?? c.relations[i]) : c.relations[i];
      out.push({ axis, value: sign * l, role: "limit", text: `${rel ?? ""} ${engApart(sign * l, sign * c.value, c.unit)}`.trim(), check: check.label, status });
    });
  }
  return out;
}

const mark = (s: Verdict) => (s === "pass" ? "✓" : s === "fail" ? "✗" : "");

/**
 * What the checks compared, placed on one plot: a check whose value was measured over a window of this transient
 * (or at a marked frequency of this sweep) gets its hand value, band or limits as guides and its value as a mark.
 * `yUnit` is the unit of the plot's y axis; a check in another unit (a frequency measured on a transient) is
 * shaded and named in the legend only.
 */
export function verdictOn(wave: Waveform, checks: Check[], yUnit: string, xUnit: string): { guides: Guide[]; measured: Measured[] } {
  const guides: Guide[] = [];
  const measured: Measured[] = [];
  for (const check of checks) {
    const c = check.compared;
    if (!c) continue;
    for (const w of wave.windows) {
      if (w.value === undefined || c.unit !== yUnit) continue;
      const sign = near(w.value, c.value) ? 1 : near(-w.value, c.value) ? -1 : 0;
      if (!sign) continue;
      guides.push(...guidesOf(c, check, "y", sign));
      measured.push({ x0: w.from, x1: w.to, y: w.value, text: `${w.measure} ${engApart(w.value, sign * (c.limits[0] ?? c.value), c.unit)} ${mark(check.status)}`.trim(), check: check.label, status: check.status });
      break;
    }
    for (const m of wave.marks) {
      if (m.value !== undefined && c.unit === yUnit) {
        const sign = near(m.value, c.value) ? 1 : near(-m.value, c.value) ? -1 : 0;
        if (!sign) continue;
        guides.push(...guidesOf(c, check, "y", sign));
        measured.push({ x0: m.x, x1: m.x, y: m.value, text: `${m.label} ${eng(m.value, c.unit, 4)} ${mark(check.status)}`.trim(), check: check.label, status: check.status });
        break;
      }
      // Only a mark whose x is itself the measured value (a −3 dB point, a start-up time), not a frequency a gain was read at.
      if (m.value === undefined && c.unit === xUnit && near(m.x, c.value)) {
        guides.push(...guidesOf(c, check, "x", 1));
        measured.push({ x0: m.x, x1: m.x, y: null, text: `${m.label} ${engApart(m.x, c.limits[0] ?? m.x, c.unit)} ${mark(check.status)}`.trim(), check: check.label, status: check.status });
        break;
      }
    }
  }
  return { guides, measured };
}

/** Labels along the top, left to right in rows: each starts after the one before it in its row, else opens a new row. */
export function rowLabels(xs: number[], widths: number[], span: number, gap = 8): { x: number; row: number }[] {
  const order = xs.map((x, i) => ({ x, i })).sort((a, b) => a.x - b.x);
  const ends: number[] = [];
  const out: { x: number; row: number }[] = new Array(xs.length);
  for (const { x, i } of order) {
    const w = widths[i];
    const want = Math.min(Math.max(0, x - w / 2), Math.max(0, span - w));
    let row = ends.findIndex((end) => end + gap <= want);
    if (row < 0) row = ends.length;
    const at = want;
    ends[row] = at + w;
    out[i] = { x: at, row };
  }
  return out;
}

/** Pushes labels apart so none overlaps the next: positions in px, sorted, at least `gap` apart, inside [lo, hi]. */
export function spreadLabels(ys: number[], gap: number, lo: number, hi: number): number[] {
  const order = ys.map((y, i) => ({ y, i })).sort((a, b) => a.y - b.y);
  const out = new Array<number>(ys.length);
  let prev = -Infinity;
  for (const o of order) {
    const y = Math.max(o.y, prev + gap, lo);
    out[o.i] = y;
    prev = y;
  }
  // Pushed past the bottom: shift the tail back up.
  let next = Infinity;
  for (let k = order.length - 1; k >= 0; k--) {
    const i = order[k].i;
    out[i] = Math.min(out[i], next - gap, hi);
    next = out[i];
  }
  return out;
}
