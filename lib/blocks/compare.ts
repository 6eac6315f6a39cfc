import { diffLines, type ChangeObject } from "diff";
import { parseBlock } from "@/checks";
import type { Ctx } from "@/lib/context";
import type { CompareInput } from "@/lib/validation/blocks";
import type { BlockVersion } from "@/entities";
import { latestRuns, type LatestRun } from "@/lib/runs/badge";
import { loadBlock, loadVersion } from "./common";

export type DiffPart = { value: string; added?: boolean; removed?: boolean };

export interface Comparison {
  from: number;
  to: number;
  params: { name: string; from: string | null; to: string | null }[];
  note: DiffPart[];
  netlist: DiffPart[];
  script: DiffPart[];
  /** Checks whose outcome differs between the two versions' latest runs (null: absent or not run). */
  checks: { label: string; from: string | null; to: string | null }[];
  /** Every quantity of either version's latest run, side by side (value in its unit, null where absent). */
  quantities: { name: string; unit: string; from: number | null; to: number | null; simulated: boolean }[];
}

const parts = (a: string, b: string): DiffPart[] =>
  diffLines(a, b).map((c: ChangeObject<string>) => ({ value: c.value, ...(c.added ? { added: true } : {}), ...(c.removed ? { removed: true } : {}) }));

/** What changed from version a to version b of one block: values, note, circuit, script and check outcomes. */
export async function compareVersions({ em, caller }: Ctx, input: CompareInput): Promise<Comparison> {
  const block = await loadBlock(em, caller, input.slug);
  const va = await loadVersion(em, block, input.a);
  const vb = await loadVersion(em, block, input.b);
  const runs = await latestRuns(em, [va.id, vb.id]);
  return { from: va.number, to: vb.number, ...changesBetween(va, vb, runs) };
}

export type Changes = Omit<Comparison, "from" | "to">;
type Side = Pick<BlockVersion, "id" | "text" | "params">;

/**
 * What changed from `va` to `vb`, for versions already loaded with their latest runs. `va` null: against nothing,
 * so every parameter, line and check of `vb` reads as new.
 */
export function changesBetween(va: Side | null, vb: Side, runs: Map<number, LatestRun>): Changes {
  const pa = va ? parseBlock(va.text).block : null;
  const pb = parseBlock(vb.text).block;

  const valueOf = (ps: Side["params"]) => new Map(ps.map((p) => [p.name, p.tol ? `${p.value} ± ${p.tol}` : p.value]));
  const ma = valueOf(va?.params ?? []);
  const mb = valueOf(vb.params);
  const names = [...new Set([...ma.keys(), ...mb.keys()])];
  const params = names
    .filter((n) => ma.get(n) !== mb.get(n))
    .map((n) => ({ name: n, from: ma.get(n) ?? null, to: mb.get(n) ?? null }));

  const reportOf = (id: number | undefined) => (id === undefined ? null : (runs.get(id)?.report ?? null)) as
    { checks?: { label: string; status: string }[]; quantities?: Record<string, Q> } | null;
  const outcomes = (id: number | undefined) => new Map((reportOf(id)?.checks ?? []).map((c) => [c.label, c.status]));
  const ca = outcomes(va?.id);
  const cb = outcomes(vb.id);
  const labels = [...new Set([...ca.keys(), ...cb.keys()])];
  const checks = labels
    .filter((l) => ca.get(l) !== cb.get(l))
    .map((l) => ({ label: l, from: ca.get(l) ?? null, to: cb.get(l) ?? null }));

  type Q = { value: number; unit: string; simulated?: boolean };
  const quantitiesOf = (id: number | undefined) => new Map(Object.entries(reportOf(id)?.quantities ?? {}));
  const qa = quantitiesOf(va?.id);
  const qb = quantitiesOf(vb.id);
  const quantities = [...new Set([...qa.keys(), ...qb.keys()])].map((name) => {
    const [x, y] = [qa.get(name), qb.get(name)];
    return { name, unit: (y ?? x)!.unit, from: x?.value ?? null, to: y?.value ?? null, simulated: Boolean((y ?? x)!.simulated) };
  });

  return {
    quantities,
    params,
    note: parts(pa?.note ?? "", pb?.note ?? ""),
    netlist: parts(pa?.netlist ?? "", pb?.netlist ?? ""),
    script: parts(pa?.script ?? "", pb?.script ?? ""),
    checks,
  };
}
