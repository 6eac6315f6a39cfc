import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { BlockVersionSchema } from "@/entities";
import { sha256 } from "@/lib/blocks/common";
import { createBlock } from "@/lib/blocks/create";
import { spiceDeckText } from "@/lib/blocks/deck";
import { closeOrm, getEm } from "@/lib/db/orm";
import { contentBlock, makeTeam, type TestTeam } from "./blocks-helpers";
import { contextFor } from "@/lib/context";

// A netlist that asks ngspice to run commands (.control blocks, `shell`; ngspice manual, "Interactive Interpreter")
// is refused when it is stored, with the engine sanitiser's own message at the block file's line, and a version
// stored before that refusal existed is never handed out as a runnable deck.
let team: TestTeam;
beforeAll(async () => { team = await makeTeam(); });
afterAll(closeOrm);

const withControl = (slug: string) =>
  contentBlock("rc-lowpass-antialias.md", slug).replace("C1 out 0 {C}\n", "C1 out 0 {C}\n.control\nshell touch /tmp/owned\n.endc\n");
const lineOf = (text: string, needle: string) => text.split("\n").findIndex((l) => l.startsWith(needle)) + 1;

async function failure(p: Promise<unknown>) {
  try { await p; } catch (e) { return e as { code: string; message: string; extra: { errors: { message: string; line?: number }[] } }; }
  throw new Error("expected a refusal");
}

describe("a netlist the sanitiser refuses", () => {
  it("is refused at store with 422 and the line of .control", async () => {
    const text = withControl(`ctl-${team.tag}`);
    const e = await failure(createBlock(await contextFor(team.author), { team: team.slug, text }));
    expect(e.code).toBe("validation");
    expect(e.extra.errors[0]).toEqual({ message: expect.stringMatching(/control blocks \(\.control\/\.endc\) are not allowed/), line: lineOf(text, ".control") });
  });

  it("is refused at store for a lone shell line too", async () => {
    const text = contentBlock("rc-lowpass-antialias.md", `sh-${team.tag}`).replace("C1 out 0 {C}\n", "C1 out 0 {C}\nshell rm -rf /\n");
    const e = await failure(createBlock(await contextFor(team.author), { team: team.slug, text }));
    expect(e.extra.errors[0]).toEqual({ message: expect.stringMatching(/`shell` is not allowed/), line: lineOf(text, "shell") });
  });

  it("stored before the refusal existed, is not served as a deck", async () => {
    const slug = `old-${team.tag}`;
    await createBlock(await contextFor(team.author), { team: team.slug, text: contentBlock("rc-lowpass-antialias.md", slug) });
    expect(await spiceDeckText(await contextFor(team.viewer), { slug })).toMatch(/^R1 in out \{R\}$/m);
    const text = withControl(slug);
    await (await getEm()).nativeUpdate(BlockVersionSchema, { block: { slug }, number: 1 }, { text, contentHash: sha256(text) });
    const e = await failure(spiceDeckText(await contextFor(team.viewer), { slug }));
    expect(e.code).toBe("validation");
    expect(e.extra.errors[0].line).toBe(lineOf(text, ".control"));
  });

  it("leaves an include of a model file to the run (the file is checked where it is stored)", async () => {
    const text = contentBlock("rc-lowpass-antialias.md", `inc-${team.tag}`).replace("C1 out 0 {C}\n", "C1 out 0 {C}\n.include not-uploaded-yet.lib\n");
    await expect(createBlock(await contextFor(team.author), { team: team.slug, text })).resolves.toMatchObject({ version: 1 });
  });
});
