import { withParams } from "../block/with-params";
import { eseries, seriesValues } from "../eseries";
import { runScript } from "../script/evaluate";
import { formatQuantity, readQuantity, toQuantity } from "../units";
import { evaluateBlock } from "./evaluate-block";
import { nominalValues, noSimulation, prepare, scopeFor } from "./prepare";
import type { Report } from "./types";

export type RetuneRequest = { param: string; target: { quantity: string; value: string }; series: string; models?: Record<string, string> };

/**
 * Solve quantity(param) = target with a bracketed root finder (bisection on a log scale,
 * so it works across decades), then snap the answer to the nearest preferred value.
 */
export function retuneBlock(text: string, req: RetuneRequest): { value: string; snapped: string; report: Report } {
  seriesValues(req.series);
  const { block, statements, errors } = prepare(text);
  if (!block || errors.length) throw new Error(`the block has errors: ${errors[0]?.message}`);
  const spec = block.params.find((p) => p.name === req.param);
  if (!spec) throw new Error(`unknown parameter "${req.param}"`);
  if (spec.si === 0) throw new Error(`cannot retune "${spec.name}" from zero`);
  const target = readQuantity(req.target.value);
  const plain = statements.filter((s) => !s.simulated);
  if (!plain.some((s) => s.kind === "assign" && s.name === req.target.quantity))
    throw new Error(`"${req.target.quantity}" is not a quantity the script computes without a simulation`);

  const base = nominalValues(block);
  const quantityAt = (x: number): number => {
    const run = runScript(plain, scopeFor(block, { ...base, [spec.name]: x }, noSimulation), false);
    const q = toQuantity(run.scope.get(req.target.quantity));
    if (!q) throw new Error(`"${req.target.quantity}" is not a number or a quantity`);
    if (q.unit !== target.unit) throw new Error(`"${req.target.quantity}" is in ${q.unit || "plain numbers"}, the target in ${target.unit || "plain numbers"}`);
    return q.si - target.si;
  };

  // Bracket: widen around the present value by factors of 2, up to 1000x each way.
  const sign = Math.sign(spec.si);
  const at = (logx: number) => quantityAt(sign * Math.exp(logx));
  const l0 = Math.log(Math.abs(spec.si));
  const f0 = at(l0);
  let lo = l0, hi = l0, flo = f0;
  if (f0 !== 0) {
    const last = { 1: [l0, f0], [-1]: [l0, f0] } as Record<number, [number, number]>;
    let found = false;
    for (let k = 1; k <= 10 && !found; k++)
      for (const dir of [1, -1]) {
        const l = l0 + dir * k * Math.LN2;
        const f = at(l);
        const [lp, fp] = last[dir];
        last[dir] = [l, f];
        if (Number.isFinite(f) && Number.isFinite(fp) && Math.sign(f) !== Math.sign(fp)) {
          [lo, flo, hi] = dir > 0 ? [lp, fp, l] : [l, f, lp];
          found = true;
          break;
        }
      }
    if (!found)
      throw new Error(`no value of ${spec.name} within 1/1000..1000 times ${spec.value} brings ${req.target.quantity} to ${req.target.value}`);
    for (let n = 0; n < 100 && hi - lo > 1e-12; n++) {
      const mid = (lo + hi) / 2;
      const fm = at(mid);
      if (fm === 0) [lo, hi] = [mid, mid];
      else if (Math.sign(fm) === Math.sign(flo)) [lo, flo] = [mid, fm];
      else hi = mid;
    }
  }
  const solved = sign * Math.exp((lo + hi) / 2);
  const snappedSi = eseries(solved, req.series);
  const value = formatQuantity(solved, spec.unit);
  const snapped = formatQuantity(snappedSi, spec.unit, 3);
  const report = evaluateBlock(withParams(text, { [spec.name]: snapped }), { models: req.models }).report;
  return { value, snapped, report };
}
