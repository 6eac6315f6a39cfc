import type { EntityManager } from "@mikro-orm/postgresql";
import { createHash } from "node:crypto";
import { includedNames, parseBlock, sharedModelFile, type InlineModel, type ModelTexts } from "@/checks";
import type { RunModel } from "@/entities";
import { AppError } from "@/lib/errors";

export interface ResolvedModels {
  /** What the engine gets: every file reachable through `.include`, by name. */
  texts: ModelTexts;
  /** What the run records and the deck inlines: name, sha256, source and team version. */
  used: (RunModel & InlineModel)[];
  /** Names no library of the team has; the engine refuses them on their line. */
  missing: string[];
}

const sha256 = (text: string) => createHash("sha256").update(text, "utf8").digest("hex");

/** The heads of a team's model files by name, in one query. */
async function teamHeads(em: EntityManager, teamId: number, names: string[]): Promise<Map<string, { text: string; sha256: string; number: number }>> {
  if (names.length === 0) return new Map();
  const rows = await em.getConnection().execute<{ name: string; text: string; sha256: string; number: number }[]>(
    `select m.name, v.text, v.sha256, v.number from models m join model_versions v on v.id = m.head_id
      where m.team_id = ? and m.name in (${names.map(() => "?").join(",")})`,
    [teamId, ...names], "all", em.getTransactionContext());
  return new Map(rows.map((r) => [r.name, { text: r.text, sha256: r.sha256, number: Number(r.number) }]));
}

/**
 * `.include NAME` resolved for a block of `teamId` (DESIGN.md "Block file format"): the team's own file of that
 * name, else the shared library's; followed through the files' own includes. Only this team is ever looked at.
 */
export async function resolveModels(em: EntityManager, teamId: number, netlist: string): Promise<ResolvedModels> {
  const out: ResolvedModels = { texts: {}, used: [], missing: [] };
  let wanted = includedNames(netlist);
  while (wanted.length) {
    const fresh = wanted.filter((n) => !(n in out.texts) && !out.missing.includes(n));
    const team = await teamHeads(em, teamId, fresh);
    const next: string[] = [];
    for (const name of fresh) {
      const own = team.get(name);
      const text = own?.text ?? sharedModelFile(name);
      if (text === null || text === undefined) {
        out.missing.push(name);
        continue;
      }
      out.texts[name] = text;
      out.used.push(own
        ? { name, sha256: own.sha256, source: "team", version: own.number, text }
        : { name, sha256: sha256(text), source: "shared", version: null, text });
      next.push(...includedNames(text));
    }
    wanted = next;
  }
  return out;
}

/** A run's model list without the texts. */
export const runModels = (r: ResolvedModels): RunModel[] => r.used.map(({ name, sha256, source, version }) => ({ name, sha256, source, version }));

/** For a stored version: its block's team, and the models its circuit includes as that team resolves them now. */
export async function resolveForVersion(em: EntityManager, versionId: number, text: string): Promise<ResolvedModels> {
  const [row] = await em.getConnection().execute<{ team_id: number }[]>(
    `select b.team_id from block_versions v join blocks b on b.id = v.block_id where v.id = ?`, [versionId], "all", em.getTransactionContext());
  const netlist = parseBlock(text).block?.netlist ?? "";
  return resolveModels(em, Number(row.team_id), netlist);
}

/** Whether a model the run simulated with has been replaced meanwhile (an upload while the run was in progress). */
export async function modelsChangedSince(em: EntityManager, versionId: number, text: string, used: RunModel[]): Promise<boolean> {
  const now = runModels(await resolveForVersion(em, versionId, text));
  return JSON.stringify(now) !== JSON.stringify(used);
}

/**
 * Refuses a fork whose circuit includes a model file neither the target team nor the shared library has, naming
 * the file and its line in the block file. Says nothing of the source team's file.
 */
export async function assertModelsAvailable(em: EntityManager, teamId: number, teamSlug: string, block: { netlist: string; netlistLine: number }): Promise<void> {
  const { missing } = await resolveModels(em, teamId, block.netlist);
  if (missing.length === 0) return;
  const lines = block.netlist.split("\n");
  const errors = missing.map((name) => {
    const at = lines.findIndex((l) => includedNames(l).includes(name));
    const message = `.include ${name}: the ${teamSlug} model library and the shared library have no file of that name; upload it to ${teamSlug} first`;
    return { message, ...(at >= 0 ? { line: block.netlistLine + at } : {}) };
  });
  throw new AppError("validation", errors.map((e) => e.message).join("; "), { errors, missingModels: missing });
}
