import type { EntityManager } from "@mikro-orm/postgresql";
import { parseBlock, sharedModelFile, spiceDeck, SpiceError, type InlineModel } from "@/checks";
import type { RunModel } from "@/entities";
import type { Ctx } from "@/lib/context";
import type { BlockVersionInput } from "@/lib/validation/blocks";
import { AppError } from "@/lib/errors";
import { resolveModels } from "@/lib/models/resolve";
import { readCore, versionFile } from "./read-core";

/**
 * A deck a bare `ngspice -b` runs unchanged (DESIGN.md `?format=spice`): title, .param lines, the circuit with every
 * included model file inlined — the exact versions the latest run simulated with, else the team's files as they are
 * now — the analysis cards that run asked for at nominal values, `.end`.
 */
export async function spiceDeckText({ em, caller }: Ctx, input: BlockVersionInput): Promise<string> {
  const core = await readCore(em, caller, input.slug, input.version, { forks: false });
  const { text } = await versionFile(em, core.version.id, core.version.contentHash);
  const simulations = ((core.run?.report as { simulations?: { card?: string; corner?: unknown }[] } | null)?.simulations ?? []);
  const analyses = simulations.filter((s) => s.card && !s.corner).map((s) => s.card!);
  const models = await modelTexts(em, core.block.teamId, text, core.run?.models ?? null);
  try {
    return spiceDeck(text, undefined, { models, analyses });
  } catch (e) {
    if (!(e instanceof SpiceError)) throw e;
    const where = e.line ? ` (line ${e.line})` : "";
    throw new AppError("validation", `this version cannot be served as a SPICE deck: ${e.message}${where}`, {
      errors: [{ message: e.message, ...(e.line ? { line: e.line } : {}) }],
    });
  }
}

async function modelTexts(em: EntityManager, teamId: number, text: string, used: RunModel[] | null): Promise<Record<string, InlineModel>> {
  const pinned = used ? await pinnedTexts(em, teamId, used) : null;
  if (pinned) return pinned;
  const current = await resolveModels(em, teamId, parseBlock(text).block?.netlist ?? "");
  return Object.fromEntries(current.used.map((m) => [m.name, { text: m.text, sha256: m.sha256 }]));
}

// The run's own versions, found by sha256; null when one of them can no longer be found (a shared file edited since).
async function pinnedTexts(em: EntityManager, teamId: number, used: RunModel[]): Promise<Record<string, InlineModel> | null> {
  const team = used.filter((m) => m.source === "team");
  const rows = team.length
    ? await em.getConnection().execute<{ name: string; sha256: string; text: string }[]>(
        `select m.name, v.sha256, v.text from model_versions v join models m on m.id = v.model_id
          where m.team_id = ? and v.sha256 in (${team.map(() => "?").join(",")})`,
        [teamId, ...team.map((m) => m.sha256)], "all", em.getTransactionContext())
    : [];
  const out: Record<string, InlineModel> = {};
  for (const m of used) {
    const text = m.source === "team" ? rows.find((r) => r.name === m.name && r.sha256 === m.sha256)?.text : sharedModelFile(m.name);
    if (text === undefined || text === null) return null;
    out[m.name] = { text, sha256: m.sha256 };
  }
  return out;
}
