import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { bearer, makeWorld, rcBlockText, type ApiWorld } from "./api-fixtures";

// What a CI job has and asks (DESIGN.md, REST API): an edited file of a block, a pinned version, a file not in the
// library yet; each answered with a report whose simulated quantities are marked. The corner frequency is checked
// against the first-order RC closed form f = 1/(2 pi R C) (Horowitz & Hill, The Art of Electronics, 3rd ed., §1.7,
// from memory) on the demo values R = 4.7 kohm, C = 10 nF and on an edited R = 4.53 kohm (E96; its corners keep the block's 3.0-3.8 kHz band and 1.5 dB loss at 2 kHz).
let w: ApiWorld;
let slug: string;
const fc = (r: number, c: number) => 1 / (2 * Math.PI * r * c);
const withF3 = (text: string) => text.replace('res = ac(10 Hz, 1 MHz, 50)\n', 'res = ac(10 Hz, 1 MHz, 50)\nf3 = f3db(res, "out")\n');
type Report = { status: string; quantities: Record<string, { value: number; unit: string; simulated?: boolean }> };

const post = async (path: string, token: string, body: string, type: string) => {
  const res = await fetch(`${w.app.url}${path}`, { method: "POST", headers: { ...bearer(token), "Content-Type": type }, body });
  return { status: res.status, body: (await res.json()) as Report };
};

beforeAll(async () => {
  w = await makeWorld();
  slug = `rc-ci-${w.tag}`;
  const created = await fetch(`${w.app.url}/api/v1/blocks`, {
    method: "POST", headers: { ...bearer(w.people.author.write), "Content-Type": "text/markdown" }, body: withF3(rcBlockText(slug)),
  });
  expect(created.status).toBe(201); // no ?team=: the token's own team
  const v2 = await fetch(`${w.app.url}/api/v1/blocks/${slug}/versions`, {
    method: "POST", headers: { ...bearer(w.people.author.write), "Content-Type": "application/json" },
    body: JSON.stringify({ params: { R: "5.6 kohm" }, baseVersion: 1 }),
  });
  expect(v2.status).toBe(201);
}, 900_000);
afterAll(async () => w?.stop(), 60_000);

describe("the CI path", () => {
  it("evaluates an edited block file of an existing block, simulations included", async () => {
    const edited = withF3(rcBlockText(slug)).replace("value: 4.7 kohm", "value: 4.53 kohm");
    const { status, body } = await post(`/api/v1/blocks/${slug}/evaluate`, w.people.viewer.read, edited, "text/markdown");
    expect(status).toBe(200);
    expect(body.quantities.f3).toMatchObject({ unit: "Hz", simulated: true });
    expect(Math.abs(body.quantities.f3.value / fc(4530, 10e-9) - 1)).toBeLessThan(0.01); // 3.51 kHz, within 1 %
    expect(body.status).toBe("verified");
  }, 120_000);

  it("evaluates a pinned version, not the head", async () => {
    const { status, body } = await post(`/api/v1/blocks/${slug}/evaluate`, w.people.viewer.read, JSON.stringify({ version: 1, simulate: true }), "application/json");
    expect(status).toBe(200);
    expect(body.quantities.f3.simulated).toBe(true);
    expect(Math.abs(body.quantities.f3.value / fc(4700, 10e-9) - 1)).toBeLessThan(0.01);
  }, 120_000);

  it("evaluates a file not in the library yet through POST /api/v1/evaluate, storing nothing", async () => {
    const fresh = `rc-new-${w.tag}`;
    const { status, body } = await post("/api/v1/evaluate", w.people.viewer.read, withF3(rcBlockText(fresh)), "text/markdown");
    expect(status).toBe(200);
    expect(body.quantities.f3.simulated).toBe(true);
    expect(Math.abs(body.quantities.f3.value / fc(4700, 10e-9) - 1)).toBeLessThan(0.01);
    expect((await fetch(`${w.app.url}/api/v1/blocks/${fresh}`, { headers: bearer(w.people.admin.read) })).status).toBe(404);
  }, 120_000);

  it("refuses an edited file that names another block", async () => {
    const { status } = await post(`/api/v1/blocks/${slug}/evaluate`, w.people.viewer.read, rcBlockText("some-other-block"), "text/markdown");
    expect(status).toBe(422);
  });
});
