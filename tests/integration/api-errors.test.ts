import net from "node:net";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { PROBLEM_BASE, STALE_BASE_TYPE } from "@/lib/api/problem";
import { problemSchema } from "@/lib/validation/api";
import { bearer, makeWorld, rcBlockText, type ApiWorld } from "./api-fixtures";

// Every error path of the API answers an RFC 9457 problem document (application/problem+json) with a stable type.

let w: ApiWorld;
let slug: string;

async function problemOf(res: Response, status: number, type: string) {
  expect(res.status).toBe(status);
  expect(res.headers.get("content-type")).toBe("application/problem+json");
  const body = problemSchema.parse(await res.json());
  expect(body).toMatchObject({ status, type });
  return body;
}

const send = (path: string, init: RequestInit & { token?: string } = {}) =>
  fetch(`${w.app.url}${path}`, { ...init, headers: { ...(init.token ? bearer(init.token) : {}), ...(init.headers as Record<string, string>) } });
const md = (token: string, body: string, path = `/api/v1/blocks?team=${w.teamA.slug}`) =>
  send(path, { method: "POST", token, headers: { "Content-Type": "text/markdown" }, body });
const json = (token: string | undefined, path: string, body: unknown) =>
  send(path, { method: "POST", token, headers: { "Content-Type": "application/json" }, body: JSON.stringify(body) });

beforeAll(async () => {
  w = await makeWorld();
  slug = `rc-err-${w.tag}`;
  expect((await md(w.people.author.write, rcBlockText(slug))).status).toBe(201);
}, 900_000);
afterAll(async () => w?.stop(), 60_000);

describe("401 unauthenticated", () => {
  it("for a write signed out", async () => {
    await problemOf(await md("", rcBlockText(`x-${w.tag}`)), 401, PROBLEM_BASE + "unauthenticated");
  });
  it("for a malformed, unknown or non-Bearer Authorization header, even on a public read", async () => {
    await problemOf(await send("/api/v1/blocks", { token: "not-a-token" }), 401, PROBLEM_BASE + "unauthenticated");
    await problemOf(await send("/api/v1/blocks", { token: "asy_" + "A".repeat(43) }), 401, PROBLEM_BASE + "unauthenticated");
    const basic = await send("/api/v1/blocks", { headers: { Authorization: "Basic dTpw" } });
    await problemOf(basic, 401, PROBLEM_BASE + "unauthenticated");
    expect(basic.headers.get("www-authenticate")).toMatch(/^Bearer/);
  });
});

describe("403 forbidden", () => {
  it("for a viewer creating a block, and for a read token on a write route", async () => {
    await problemOf(await md(w.people.viewer.write, rcBlockText(`v-${w.tag}`)), 403, PROBLEM_BASE + "forbidden");
    await problemOf(await md(w.people.admin.read, rcBlockText(`r-${w.tag}`)), 403, PROBLEM_BASE + "forbidden");
    await problemOf(await json(w.people.author.read, `/api/v1/blocks/${slug}/forks`, {}), 403, PROBLEM_BASE + "forbidden");
  });
});

describe("404 not found", () => {
  it("for an unknown block, version or run, and for a path segment that cannot name one", async () => {
    await problemOf(await send(`/api/v1/blocks/no-such-${w.tag}`), 404, PROBLEM_BASE + "not-found");
    await problemOf(await send(`/api/v1/blocks/${slug}/versions/9`, { token: w.people.viewer.read }), 404, PROBLEM_BASE + "not-found");
    await problemOf(await send(`/api/v1/blocks/${slug}/versions/zero`, { token: w.people.viewer.read }), 404, PROBLEM_BASE + "not-found");
    await problemOf(await send(`/api/v1/blocks/Not_A_Slug`), 404, PROBLEM_BASE + "not-found");
    await problemOf(await send(`/api/v1/runs/00000000-0000-4000-8000-000000000000`, { token: w.people.viewer.read }), 404, PROBLEM_BASE + "not-found");
    await problemOf(await send(`/api/v1/runs/not-a-uuid`), 404, PROBLEM_BASE + "not-found");
  });
  it("for a team block asked for from another team, whatever the route", async () => {
    await problemOf(await send(`/api/v1/blocks/${slug}`, { token: w.outsider.write }), 404, PROBLEM_BASE + "not-found");
    await problemOf(await json(w.outsider.write, `/api/v1/blocks/${slug}/evaluate`, { params: {} }), 404, PROBLEM_BASE + "not-found");
    await problemOf(await send(`/api/v1/blocks/${slug}/badge.svg`, { token: w.outsider.write }), 404, PROBLEM_BASE + "not-found");
  });
  it("for a team that does not exist", async () => {
    await problemOf(await md(w.people.author.write, rcBlockText(`t-${w.tag}`), `/api/v1/blocks?team=no-team-${w.tag}`), 404, PROBLEM_BASE + "not-found");
  });
});

describe("409 conflict", () => {
  it("for a slug that is taken, and for a stale base with the head", async () => {
    const taken = await problemOf(await md(w.people.author.write, rcBlockText(slug)), 409, PROBLEM_BASE + "conflict");
    expect(taken.detail).toContain(slug);
    const stale = await json(w.people.author.write, `/api/v1/blocks/${slug}/versions`, { params: { R: "4.3 kohm" }, baseVersion: 7 });
    expect((await problemOf(stale, 409, STALE_BASE_TYPE)).head).toBe(1);
  });
});

describe("a team-bound token", () => {
  it("creates in its own team without ?team= (DESIGN.md: a token's own team is the default)", async () => {
    const res = await md(w.people.author.write, rcBlockText(`n-${w.tag}`), "/api/v1/blocks");
    expect(res.status).toBe(201);
    const block = (await (await send(`/api/v1/blocks/n-${w.tag}`, { token: w.people.author.read })).json()) as { team: string };
    expect(block.team).toBe(w.teamA.slug);
  });
});

describe("413 and 415", () => {
  it("closes the connection after an early 413 on a chunked body, so the next request is not left waiting", async () => {
    const { hostname, port } = new URL(w.app.url);
    const socket = net.connect(Number(port), hostname);
    await new Promise((r) => socket.once("connect", r));
    let received = "";
    socket.on("data", (b) => (received += b.toString()));
    const closed = new Promise<number>((r) => socket.once("close", () => r(Date.now())));
    socket.write(`POST /api/v1/blocks?team=${w.teamA.slug} HTTP/1.1\r\nHost: ${hostname}\r\nAuthorization: Bearer ${w.people.author.write}\r\n` +
      "Content-Type: text/markdown\r\nTransfer-Encoding: chunked\r\n\r\n");
    const chunk = "x".repeat(64 * 1024);
    for (let i = 0; i < 5 && !received; i++) socket.write(`${chunk.length.toString(16)}\r\n${chunk}\r\n`); // 320 KiB, never ended
    const until = Date.now() + 10_000;
    while (!/\r\n\r\n/.test(received) && Date.now() < until) await new Promise((r) => setTimeout(r, 20));
    const answeredAt = Date.now();
    expect(received).toMatch(/^HTTP\/1\.1 413 /);
    expect(received).toMatch(/\r\nconnection: close\r\n/i);
    const closedAt = await Promise.race([closed, new Promise<number>((r) => setTimeout(() => r(Infinity), 5_000))]);
    expect(closedAt - answeredAt).toBeLessThan(2_000);
    socket.destroy();
  });


  it("refuse a block file over 256 KiB, and a JSON body over 64 KiB", async () => {
    const big = rcBlockText(`big-${w.tag}`) + "\n" + "x".repeat(260 * 1024);
    await problemOf(await md(w.people.author.write, big), 413, PROBLEM_BASE + "payload-too-large");
    const huge = await json(w.people.author.write, `/api/v1/blocks/${slug}/evaluate`, { params: {}, pad: "y".repeat(70 * 1024) });
    await problemOf(huge, 413, PROBLEM_BASE + "payload-too-large");
  });
  it("refuse a content type a route does not take", async () => {
    await problemOf(await send(`/api/v1/blocks?team=${w.teamA.slug}`, { method: "POST", token: w.people.author.write, headers: { "Content-Type": "application/json" }, body: "{}" }), 415, PROBLEM_BASE + "unsupported-media-type");
    await problemOf(await send(`/api/v1/blocks/${slug}/versions`, { method: "POST", token: w.people.author.write, headers: { "Content-Type": "text/plain" }, body: "R=1" }), 415, PROBLEM_BASE + "unsupported-media-type");
    await problemOf(await send(`/api/v1/blocks/${slug}/evaluate`, { method: "POST", token: w.people.author.write, headers: { "Content-Type": "text/plain" }, body: "x" }), 415, PROBLEM_BASE + "unsupported-media-type");
  });
});

describe("422 validation", () => {
  it("lists the issues of a bad query or body, with their paths", async () => {
    const limit = await problemOf(await send(`/api/v1/blocks?limit=500`, { token: w.people.viewer.read }), 422, PROBLEM_BASE + "validation");
    expect(limit.errors?.[0].path).toBe("limit");
    const noBase = await problemOf(await json(w.people.author.write, `/api/v1/blocks/${slug}/versions`, { params: { R: "1 kohm" } }), 422, PROBLEM_BASE + "validation");
    expect(noBase.errors?.map((e) => e.path)).toContain("baseVersion");
    const series = await problemOf(await json(w.people.viewer.read, `/api/v1/blocks/${slug}/retune`, { param: "R", target: { quantity: "fc", value: "1 kHz" }, series: "E25" }), 422, PROBLEM_BASE + "validation");
    expect(series.errors?.[0].path).toBe("series");
    await problemOf(await send(`/api/v1/blocks/${slug}?format=pdf`, { token: w.people.viewer.read }), 422, PROBLEM_BASE + "validation");
    await problemOf(await send(`/api/v1/blocks/${slug}/versions`, { method: "POST", token: w.people.author.write, headers: { "Content-Type": "application/json" }, body: "{nope" }), 422, PROBLEM_BASE + "validation");
  });
  it("points at the line of a broken block file, and refuses an unknown parameter", async () => {
    const broken = rcBlockText(`bad-${w.tag}`).replace("category: filter", "category: teleporter");
    const doc = await problemOf(await md(w.people.author.write, broken), 422, PROBLEM_BASE + "validation");
    expect(doc.errors?.length).toBeGreaterThan(0);
    expect(doc.errors?.some((e) => e.line === 4)).toBe(true);
    const unknown = await json(w.people.author.write, `/api/v1/blocks/${slug}/versions`, { params: { Rx: "1 kohm" }, baseVersion: 1 });
    expect((await problemOf(unknown, 422, PROBLEM_BASE + "validation")).detail).toMatch(/Rx/);
  });
  it("never leaks a database or engine cause", async () => {
    const res = await json(w.people.author.write, `/api/v1/blocks/${slug}/versions`, { params: { R: "12 parsecs" }, baseVersion: 1 });
    const body = await res.text();
    expect(res.status).toBe(422);
    expect(body).not.toMatch(/at \w+ \(|node_modules|postgres|select |stack/i);
  });
});
