import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { bearer, makeWorld, rcBlockText, type ApiWorld } from "./api-fixtures";
import { servedRoutes } from "./api-routes";

// Who may call what: every route handler under app/api/v1 with every kind of caller, against a team block of
// team A written by its author. The matrix must name every exported method of every route.ts, so a new route
// cannot land without deciding its rights here (DESIGN.md, "Roles"; lib/auth/permissions.ts).

type Who = "anonymous" | "viewer" | "author" | "maintainer" | "admin" | "authorCookie" | "otherTeam" | "readToken";
const WHO: Who[] = ["anonymous", "viewer", "author", "maintainer", "admin", "authorCookie", "otherTeam", "readToken"];

interface Call {
  path: string;
  method: string;
  body?: string;
  type?: string;
}
interface Entry {
  call: (who: Who) => Promise<Call>;
  expect: Record<Who, number>;
}

let w: ApiWorld;
let slug: string;
let runId: string;
let n = 0;
const unique = () => `${w.tag}-${++n}`;

const all = (status: number): Record<Who, number> => Object.fromEntries(WHO.map((k) => [k, status])) as Record<Who, number>;
/** Reading a team block: members (any role, any scope) yes; outsiders and the signed-out see nothing (404). */
const readTeamBlock = { ...all(200), anonymous: 404, otherTeam: 404 };
/** Writing to team A: authors and up; viewers and read tokens 403; the signed-out 401. */
const writeTeam = (outsider: number) => ({ ...all(201), anonymous: 401, viewer: 403, readToken: 403, otherTeam: outsider });

async function headOf(): Promise<number> {
  const res = await fetch(`${w.app.url}/api/v1/blocks/${slug}`, { headers: bearer(w.people.admin.read) });
  return ((await res.json()) as { version: number }).version;
}
let draftId: Promise<string> | undefined;
/** One draft run started by the author (their write token), shared by the GET and DELETE rows. */
const authorDraft = () => (draftId ??= fetch(`${w.app.url}/api/v1/blocks/${slug}/draft-runs`, {
  method: "POST", headers: { ...bearer(w.people.author.write), "Content-Type": "application/json" }, body: JSON.stringify({ params: { R: "3.6 kohm" } }),
}).then(async (res) => {
  expect(res.status).toBe(202);
  return ((await res.json()) as { id: string }).id;
}));
const ownDraft = { ...all(404), anonymous: 401, author: 200, authorCookie: 200, readToken: 200 };
const json = (path: string, body: unknown): Call => ({ path, method: "POST", body: JSON.stringify(body), type: "application/json" });

const MATRIX: Record<string, Entry> = {
  "GET /api/v1/health": { call: async () => ({ path: "/api/v1/health", method: "GET" }), expect: all(200) },
  "GET /api/v1/openapi.json": { call: async () => ({ path: "/api/v1/openapi.json", method: "GET" }), expect: all(200) },
  "GET /api/v1/blocks": { call: async () => ({ path: `/api/v1/blocks?team=${w.teamA.slug}`, method: "GET" }), expect: all(200) },
  "POST /api/v1/blocks": {
    call: async () => ({ path: `/api/v1/blocks?team=${w.teamA.slug}`, method: "POST", body: rcBlockText(`rc-new-${unique()}`), type: "text/markdown" }),
    expect: writeTeam(403),
  },
  "GET /api/v1/blocks/[slug]": { call: async () => ({ path: `/api/v1/blocks/${slug}`, method: "GET" }), expect: readTeamBlock },
  "GET /api/v1/blocks/[slug]/versions": { call: async () => ({ path: `/api/v1/blocks/${slug}/versions`, method: "GET" }), expect: readTeamBlock },
  "POST /api/v1/blocks/[slug]/versions": {
    call: async () => json(`/api/v1/blocks/${slug}/versions`, { params: { R: `${4700 + n++} ohm` }, baseVersion: await headOf() }),
    expect: writeTeam(404),
  },
  "GET /api/v1/blocks/[slug]/versions/[n]": { call: async () => ({ path: `/api/v1/blocks/${slug}/versions/1`, method: "GET" }), expect: readTeamBlock },
  "POST /api/v1/blocks/[slug]/forks": {
    call: async () => json(`/api/v1/blocks/${slug}/forks`, { slug: `rc-forked-${unique()}` }),
    expect: writeTeam(404),
  },
  "POST /api/v1/blocks/[slug]/evaluate": {
    call: async () => json(`/api/v1/blocks/${slug}/evaluate`, { params: { R: "3.3 kohm" } }),
    expect: { ...readTeamBlock },
  },
  "POST /api/v1/blocks/[slug]/retune": {
    call: async () => json(`/api/v1/blocks/${slug}/retune`, { param: "R", target: { quantity: "fc", value: "3.4 kHz" }, series: "E24" }),
    expect: { ...readTeamBlock },
  },
  "POST /api/v1/evaluate": {
    // A file not in the library, for any member of the named team (a read token too); outsiders do not see the team.
    call: async () => ({ path: `/api/v1/evaluate?team=${w.teamA.slug}&simulate=false`, method: "POST", body: rcBlockText(`rc-ci-${unique()}`), type: "text/markdown" }),
    expect: { ...all(200), anonymous: 401, otherTeam: 404 },
  },
  "POST /api/v1/blocks/[slug]/draft-runs": {
    // A draft run belongs to a person: readers of the block who are signed in (a read token too); signed out 401.
    call: async () => json(`/api/v1/blocks/${slug}/draft-runs`, { params: { R: "3.3 kohm" } }),
    expect: { ...all(202), anonymous: 401, otherTeam: 404 },
  },
  // The author's own draft run: only its starter sees or cancels it; any other person is told there is no such run.
  "GET /api/v1/draft-runs/[id]": { call: async () => ({ path: `/api/v1/draft-runs/${await authorDraft()}`, method: "GET" }), expect: ownDraft },
  "DELETE /api/v1/draft-runs/[id]": { call: async () => ({ path: `/api/v1/draft-runs/${await authorDraft()}`, method: "DELETE" }), expect: ownDraft },
  "GET /api/v1/blocks/[slug]/badge.svg": { call: async () => ({ path: `/api/v1/blocks/${slug}/badge.svg`, method: "GET" }), expect: readTeamBlock },
  "GET /api/v1/runs/[id]": { call: async () => ({ path: `/api/v1/runs/${runId}`, method: "GET" }), expect: readTeamBlock },
  // The shared model library is everyone's; a team's files are its members' alone (404 outside, as for team blocks).
  "GET /api/v1/models": { call: async () => ({ path: "/api/v1/models", method: "GET" }), expect: all(200) },
  "GET /api/v1/models/[team]/[name]": {
    call: async () => ({ path: `/api/v1/models/${w.teamA.slug}/authz-diode.lib`, method: "GET" }), expect: readTeamBlock,
  },
  "POST /api/v1/models/[team]": {
    call: async () => ({ path: `/api/v1/models/${w.teamA.slug}?name=authz-diode.lib`, method: "POST", body: modelText(), type: "text/plain" }),
    expect: writeTeam(404),
  },
};

const modelText = () => `* authz fixture ${unique()}\n.model DAUTHZ D(IS=2n N=1.8)\n`;

async function headersOf(who: Who): Promise<Record<string, string>> {
  switch (who) {
    case "anonymous":
      return {};
    case "authorCookie":
      return { Cookie: await w.cookieFor(w.people.author.id) };
    case "otherTeam":
      return bearer(w.outsider.write);
    case "readToken":
      return bearer(w.people.author.read);
    default:
      return bearer(w.people[who].write);
  }
}

beforeAll(async () => {
  w = await makeWorld();
  slug = `rc-authz-${w.tag}`;
  const res = await fetch(`${w.app.url}/api/v1/blocks?team=${w.teamA.slug}`, {
    method: "POST",
    headers: { ...bearer(w.people.author.write), "Content-Type": "text/markdown" },
    body: rcBlockText(slug),
  });
  expect(res.status).toBe(201);
  runId = ((await res.json()) as { run: { id: string } }).run.id;
  const model = await fetch(`${w.app.url}/api/v1/models/${w.teamA.slug}?name=authz-diode.lib`, {
    method: "POST", headers: { ...bearer(w.people.author.write), "Content-Type": "text/plain" }, body: modelText(),
  });
  expect(model.status).toBe(201);
}, 900_000);
afterAll(async () => w?.stop(), 60_000);

describe("authorization matrix", () => {
  it("has an entry for every route handler method under app/api/v1", () => {
    expect(Object.keys(MATRIX).sort()).toEqual(servedRoutes());
  });

  for (const [route, entry] of Object.entries(MATRIX)) {
    it(route, async () => {
      const seen: Record<string, number> = {};
      for (const who of WHO) {
        const call = await entry.call(who);
        const headers = { ...(await headersOf(who)), ...(call.type ? { "Content-Type": call.type } : {}) };
        const res = await fetch(`${w.app.url}${call.path}`, { method: call.method, headers, body: call.body });
        await res.arrayBuffer();
        seen[who] = res.status;
      }
      expect(seen).toEqual(entry.expect);
    });
  }

  // DESIGN.md, REST API: the caller is resolved before the request is validated, so a signed-out or bad-token
  // call is a 401 whatever is wrong with its body, query or type, and learns nothing about what would validate.
  it("answers 401 to every malformed request from a signed-out or bad-token caller", async () => {
    const big = "x".repeat(300 * 1024);
    const malformed: [string, string, RequestInit][] = [];
    // No caller and no input (health, the document), or no input beyond an id in the path (a run).
    const open = new Set(["GET /api/v1/health", "GET /api/v1/openapi.json", "GET /api/v1/runs/[id]"]);
    for (const r of servedRoutes().filter((x) => !open.has(x))) {
      const [method, template] = r.split(" ");
      const path = template.replace("[slug]", slug).replace("[n]", "1").replace("[id]", runId).replace("[team]", w.teamA.slug).replace("[name]", "opa-generic.lib");
      if (method === "GET") {
        malformed.push([r, `${path}?limit=-3&cursor=%00&version=x&format=nope`, { method }]);
        continue;
      }
      malformed.push(
        [r, path, { method, headers: { "Content-Type": "application/json" }, body: "{not json" }],
        [r, path, { method, headers: { "Content-Type": "application/json" }, body: JSON.stringify({ params: 7, baseVersion: "x", slug: "NO SLUG" }) }],
        [r, path, { method, headers: { "Content-Type": "image/png" }, body: "\x89PNG" }],
        [r, path, { method, headers: { "Content-Type": "text/markdown" }, body: big }],
        [r, `${path}?team=Not+A+Slug&baseVersion=-1`, { method, headers: { "Content-Type": "text/markdown" }, body: "---\nslug: [\n" }],
      );
    }
    const wrong: string[] = [];
    for (const [r, path, init] of malformed) {
      for (const auth of [{}, bearer("asy_" + "B".repeat(43))]) {
        const res = await fetch(`${w.app.url}${path}`, { ...init, headers: { ...(init.headers as Record<string, string>), ...auth } });
        await res.arrayBuffer();
        // A read that ignores a query it does not take may answer as to any signed-out reader; never as a validator.
        const ok = "Authorization" in auth || init.method !== "GET" ? res.status === 401 : ![413, 415, 422].includes(res.status);
        if (!ok) wrong.push(`${r} ${init.method} ${path.slice(0, 60)} ${"Authorization" in auth ? "bad token" : "signed out"} → ${res.status}`);
      }
    }
    expect(wrong).toEqual([]);
  }, 300_000);

  it("refuses a cookie-carried write from a foreign origin, and lets the same write from our own origin through", async () => {
    const cookie = await w.cookieFor(w.people.author.id);
    const send = (origin: string) =>
      fetch(`${w.app.url}/api/v1/blocks/${slug}/forks`, {
        method: "POST",
        headers: { Cookie: cookie, Origin: origin, "Content-Type": "application/json" },
        body: JSON.stringify({ slug: `rc-origin-${unique()}` }),
      });
    expect((await send("https://elsewhere.test")).status).toBe(403);
    expect((await send(w.app.url)).status).toBe(201);
  });
});
