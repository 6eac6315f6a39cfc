import type { CheckOutcome } from "../script/evaluate";
import { formatQuantity, toQuantity } from "../units";
import type { Corner } from "../corners";
import type { CheckReport, Report } from "./types";

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

const siOf = (x: unknown) => toQuantity(x)?.si ?? NaN;

/** Fold a check's outcomes at every tolerance corner into its nominal result. */
export function withCorners(
  nominal: CheckOutcome,
  atCorners: CheckOutcome[],
  corners: Corner[],
  detailAt: (corner: number) => string,
): CheckReport {
  const out: CheckReport = { label: nominal.label, status: nominal.status, detail: nominal.detail, line: nominal.line, simulated: nominal.simulated };
  const compared = comparedOf(nominal.primary);
  if (compared) out.compared = compared;
  if (nominal.simulated || nominal.status === "skipped" || corners.length === 0) return out;
  let worst = -1;
  atCorners.forEach((c, k) => {
    if (worst < 0 || c.margin < atCorners[worst].margin) worst = k;
  });
  const failing = atCorners.filter((c) => c.status === "fail").length;
  const broken = atCorners.findIndex((c) => c.status === "error");
  if (nominal.status !== "error" && broken >= 0) {
    out.status = "error";
    out.detail = `${nominal.detail}; at corner ${describe(corners[broken].label)}: ${atCorners[broken].detail}`;
  } else if (nominal.status === "pass" && failing > 0) {
    out.status = "fail";
    out.detail = `${nominal.detail}; fails at ${failing} of ${corners.length} tolerance corners`;
  } else if (nominal.status === "fail" && failing < corners.length) {
    out.detail = `${nominal.detail}; fails at nominal and at ${failing} of ${corners.length} tolerance corners`;
  }
  if (worst >= 0) out.worst = { corner: corners[worst].label, detail: atCorners[worst].detail || detailAt(worst) };
  const p = nominal.primary;
  if (p && atCorners.every((c) => c.primary?.label === p.label)) {
    const unit = toQuantity(p.value)?.unit ?? "";
    out.corners = {
      quantity: p.label,
      unit,
      values: atCorners.map((c) => siOf(c.primary!.value)),
      nominal: siOf(p.value),
      limits: p.limits.map(siOf),
    };
  }
  return out;
}

/** The nominal comparison in SI numbers; none when the value is not one finite number (a family, a boolean). */
function comparedOf(p: CheckOutcome["primary"]): CheckReport["compared"] | undefined {
  if (!p) return undefined;
  const value = siOf(p.value);
  const limits = p.limits.map(siOf);
  if (!Number.isFinite(value) || !limits.every(Number.isFinite)) return undefined;
  const target = p.target === undefined ? undefined : siOf(p.target);
  return { quantity: p.label, unit: toQuantity(p.value)?.unit ?? "", value, limits, relations: p.relations ?? [], ...(target !== undefined ? { target } : {}) };
}

const describe = (label: Record<string, string>) => Object.entries(label).map(([k, v]) => `${k} ${v}`).join(", ");
