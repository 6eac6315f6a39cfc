import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { loadCaller } from "@/lib/auth/load-caller";
import { createBlock } from "@/lib/blocks/create";
import { contextFor } from "@/lib/context";
import { closeOrm, getEm } from "@/lib/db/orm";
import { uploadModel } from "@/lib/models/upload";
import { startApp, type AppServer } from "../support/app-server";
import { makeTeam, sessionCookie } from "./auth-fixtures";

// The status line of the library's pages over HTTP, from the built app. A team block (or model file) outside the
// reader's teams and one that does not exist answer alike: 404, with the not-found page as the body, as the REST
// route for the same block does (RFC 9110 §15.5.5: 404 may stand for "not disclosed"). Before the page knows, no
// 200 may have been sent: behind a loading boundary Next streams the 200 first.
let app: AppServer;
let slug: string;
let team: string;
let member: string;
let outsider: string;
const MODEL = "dtest-status.lib";

beforeAll(async () => {
  app = await startApp();
  const owners = await makeTeam(["author"]);
  const others = await makeTeam(["author"]);
  team = owners.slug;
  slug = `status-${owners.tag}`;
  const text = readFileSync("content/blocks/rc-lowpass-antialias.md", "utf8").replace(/^slug: .*$/m, `slug: ${slug}`);
  const author = await loadCaller(await getEm(), owners.people[0].id);
  await createBlock(await contextFor(author), { team, text });
  // Our own diode values.
  await uploadModel({ em: await getEm(), caller: author }, { team, name: MODEL, text: "* status test diode\n.model DSTAT D(IS=2n N=1.8)\n", message: "first" });
  member = await sessionCookie(String(owners.people[0].id));
  outsider = await sessionCookie(String(others.people[0].id));
}, 900_000);
afterAll(async () => {
  await app?.stop();
  await closeOrm();
});

async function get(path: string, cookie?: string): Promise<{ status: number; body: string }> {
  const res = await fetch(`${app.url}${path}`, { headers: cookie ? { cookie } : {}, redirect: "manual" });
  return { status: res.status, body: await res.text() };
}

const BLOCK_PAGES = ["", "/fork", "/edit", "/runs", "/compare", "/versions/1"];

describe("page statuses for hidden and missing blocks", () => {
  it("answers 200 to a member of the block's team (the control)", async () => {
    for (const sub of BLOCK_PAGES) expect((await get(`/blocks/${slug}${sub}`, member)).status, sub || "/").toBe(200);
    expect((await get(`/models/${team}/${MODEL}`, member)).status).toBe(200);
  });

  it("answers 404 to a signed-in reader of another team on the block page and every subpage", async () => {
    for (const sub of BLOCK_PAGES) {
      const { status, body } = await get(`/blocks/${slug}${sub}`, outsider);
      expect(status, sub || "/").toBe(404);
      expect(body).toContain("Not in the library");
      expect(body).not.toContain("First-order RC anti-alias"); // the block's title never reaches an outsider
    }
  });

  it("answers 404 to a signed-out reader on the pages that need no sign-in", async () => {
    for (const sub of ["", "/runs", "/compare", "/versions/1"]) expect((await get(`/blocks/${slug}${sub}`)).status, sub || "/").toBe(404);
  });

  it("answers 404 for a slug nobody has and a version the block does not have", async () => {
    for (const sub of BLOCK_PAGES) expect((await get(`/blocks/no-such-${slug}${sub}`, member)).status, sub || "/").toBe(404);
    expect((await get(`/blocks/${slug}/versions/99`, member)).status).toBe(404);
  });

  it("answers 404 for a team's model file outside the reader's teams, and for a missing one", async () => {
    expect((await get(`/models/${team}/${MODEL}`, outsider)).status).toBe(404);
    expect((await get(`/models/${team}/${MODEL}`)).status).toBe(404);
    expect((await get(`/models/${team}/no-such.lib`, member)).status).toBe(404);
  });
});
