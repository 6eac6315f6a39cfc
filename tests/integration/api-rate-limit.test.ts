import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { problemTypes } from "@/lib/api/problem";
import { bearer, makeWorld, rcBlockText, type ApiWorld } from "./api-fixtures";

// Engine calls (evaluate, retune) are budgeted per caller and, signed out, per block and overall.
// 429 and Retry-After: RFC 6585 §4 and RFC 9110 §10.2.3; problem documents: RFC 9457.
// Small budgets for this app only: 4 points per caller, 3 per block and 5 overall for signed-out callers.

let w: ApiWorld;
let pub: string;
let pub2: string;

const evaluate = (slug: string, headers: Record<string, string>, body: object = { params: {} }) =>
  fetch(`${w.app.url}/api/v1/blocks/${slug}/evaluate`, {
    method: "POST", headers: { ...headers, "Content-Type": "application/json" }, body: JSON.stringify(body),
  });

async function create(slug: string) {
  const res = await fetch(`${w.app.url}/api/v1/blocks?team=${w.teamA.slug}&visibility=public`, {
    // Public from the start is a maintainer's decision (DESIGN.md, Roles).
    method: "POST", headers: { ...bearer(w.people.maintainer.write), "Content-Type": "text/markdown" }, body: rcBlockText(slug),
  });
  expect(res.status).toBe(201);
}

async function expect429(res: Response) {
  expect(res.status).toBe(429);
  expect(res.headers.get("content-type")).toBe("application/problem+json");
  const retry = Number(res.headers.get("retry-after"));
  expect(Number.isInteger(retry) && retry >= 1 && retry <= 60).toBe(true);
  const doc = await res.json();
  expect(doc).toMatchObject({ type: problemTypes.rate_limited, status: 429, retryAfter: retry });
}

beforeAll(async () => {
  w = await makeWorld({ env: { ASSAY_ENGINE_POINTS: "4", ASSAY_ENGINE_ANON_BLOCK_POINTS: "3", ASSAY_ENGINE_ANON_POINTS: "5" } });
  pub = `rl-a-${w.tag}`;
  pub2 = `rl-b-${w.tag}`;
  await create(pub);
  await create(pub2);
}, 900_000);
afterAll(async () => w?.stop(), 60_000);

describe("engine rate limits", () => {
  it("gives each token its own budget; a simulation costs more than a plain evaluation", async () => {
    const viewer = bearer(w.people.viewer.read);
    for (let i = 0; i < 4; i++) expect((await evaluate(pub, viewer)).status).toBe(200);
    await expect429(await evaluate(pub, viewer));
    await expect429(await fetch(`${w.app.url}/api/v1/blocks/${pub}/retune`, {
      method: "POST", headers: { ...viewer, "Content-Type": "application/json" },
      body: JSON.stringify({ param: "R", target: { quantity: "fc", value: "2 kHz" }, series: "E24" }),
    }));
    // Another token is untouched by the viewer's calls; then a simulation (6 points, capped at the budget of 4) needs more than the 3 left.
    const maintainer = bearer(w.people.maintainer.read);
    expect((await evaluate(pub, maintainer)).status).toBe(200);
    await expect429(await evaluate(pub, maintainer, { params: {}, simulate: true }));
  });

  it("budgets signed-out callers per block and overall", async () => {
    for (let i = 0; i < 3; i++) expect((await evaluate(pub, {})).status).toBe(200);
    await expect429(await evaluate(pub, {}));
    // The other block has its own per-block budget, until the overall one (5) runs out.
    expect((await evaluate(pub2, {})).status).toBe(200);
    expect((await evaluate(pub2, {})).status).toBe(200);
    await expect429(await evaluate(pub2, {}));
  });

  it("does not count requests that fail validation", async () => {
    const res = await evaluate(pub, bearer(w.people.author.read), { params: "not an object" });
    expect(res.status).toBe(422);
    for (let i = 0; i < 4; i++) expect((await evaluate(pub, bearer(w.people.author.read))).status).toBe(200);
  });
});
