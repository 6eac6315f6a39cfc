import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { loadCaller } from "@/lib/auth/load-caller";
import { requestSignInLink } from "@/lib/auth/sign-in";
import { createBlock } from "@/lib/blocks/create";
import { contextFor } from "@/lib/context";
import { closeOrm, getEm } from "@/lib/db/orm";
import { startApp, type AppServer } from "../support/app-server";
import { CookieJar } from "../support/cookie-jar";
import { PASSWORD, linkIn, mailsTo, makeTeam } from "./auth-fixtures";

// The built app over HTTP: next-auth's own endpoints, our providers, the cookie they set, and pages reading it.
let app: AppServer;
beforeAll(async () => {
  app = await startApp();
}, 900_000);
afterAll(async () => {
  await app?.stop();
  await closeOrm();
});

async function post(jar: CookieJar, path: string, fields: Record<string, string>): Promise<Response> {
  const csrf = await fetch(`${app.url}/api/auth/csrf`, { headers: { cookie: jar.header() } });
  jar.take(csrf);
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const res = await fetch(`${app.url}${path}`, {
    method: "POST",
    redirect: "manual",
    headers: { cookie: jar.header(), "content-type": "application/x-www-form-urlencoded", "x-auth-return-redirect": "1" },
    body: new URLSearchParams({ ...fields, csrfToken, json: "true" }),
  });
  jar.take(res);
  return res;
}

const session = async (jar: CookieJar) =>
  (await (await fetch(`${app.url}/api/auth/session`, { headers: { cookie: jar.header() } })).json()) as { user?: { email: string } };

describe("sign-in over HTTP", () => {
  it("signs in with a password: an HttpOnly session cookie that pages and the API accept, then signs out", async () => {
    const { people, slug: team, tag } = await makeTeam(["author"]);
    const text = readFileSync("content/blocks/rc-lowpass-antialias.md", "utf8").replace(/^slug: .*$/m, `slug: http-${tag}`);
    const { slug } = await createBlock(await contextFor(await loadCaller(await getEm(), people[0].id)), { team, text });
    const jar = new CookieJar();
    const res = await post(jar, "/api/auth/callback/password", { email: people[0].email, password: PASSWORD });
    expect(res.status).toBe(200);
    const setCookie = res.headers.getSetCookie().find((c) => c.startsWith("next-auth.session-token="));
    expect(setCookie).toMatch(/HttpOnly/i);
    expect(setCookie).toMatch(/SameSite=Lax/i);
    expect(setCookie).not.toMatch(/Secure/i); // APP_URL is http here
    expect((await session(jar)).user?.email).toBe(people[0].email);

    const settings = await fetch(`${app.url}/settings`, { headers: { cookie: jar.header() }, redirect: "manual" });
    expect(settings.status).toBe(200);
    expect(await settings.text()).toContain(people[0].email);

    // The same cookie is a caller of the REST API: a team block answers 200 to its member, 404 to nobody.
    expect((await fetch(`${app.url}/api/v1/blocks/${slug}`, { headers: { cookie: jar.header() } })).status).toBe(200);
    expect((await fetch(`${app.url}/api/v1/blocks/${slug}`)).status).toBe(404);

    await post(jar, "/api/auth/signout", {});
    expect((await session(jar)).user).toBeUndefined();
    const after = await fetch(`${app.url}/settings`, { headers: { cookie: jar.header() }, redirect: "manual" });
    // Behind the settings page's loading boundary Next streams, so the redirect may come inside a 200 page.
    const body = await after.text();
    const target = after.headers.get("location") ?? body;
    expect(target).toContain("/sign-in?callbackUrl=%2Fsettings");
    expect(body).not.toContain(people[0].email);
  });

  it("ends the session on the server at sign-out: a kept copy of the old cookie is nobody", async () => {
    const { people, slug: team, tag } = await makeTeam(["author"]);
    const text = readFileSync("content/blocks/rc-lowpass-antialias.md", "utf8").replace(/^slug: .*$/m, `slug: out-${tag}`);
    const { slug } = await createBlock(await contextFor(await loadCaller(await getEm(), people[0].id)), { team, text });
    const jar = new CookieJar();
    await post(jar, "/api/auth/callback/password", { email: people[0].email, password: PASSWORD });
    const kept = jar.header(); // what someone who copied the cookie before sign-out would replay
    const other = new CookieJar(); // the same person in a second browser stays signed in
    await post(other, "/api/auth/callback/password", { email: people[0].email, password: PASSWORD });
    expect((await fetch(`${app.url}/api/v1/blocks/${slug}`, { headers: { cookie: kept } })).status).toBe(200);

    await post(jar, "/api/auth/signout", {});
    expect((await fetch(`${app.url}/api/v1/blocks/${slug}`, { headers: { cookie: kept } })).status).toBe(404);
    const write = await fetch(`${app.url}/api/v1/blocks?team=${team}`, {
      method: "POST", headers: { cookie: kept, "content-type": "text/markdown", origin: app.url }, body: text.replace(/^slug: .*$/m, `slug: out2-${tag}`),
    });
    expect(write.status).toBe(401);
    const page = await fetch(`${app.url}/settings`, { headers: { cookie: kept }, redirect: "manual" });
    expect(page.headers.get("location") ?? (await page.text())).toContain("/sign-in?callbackUrl=%2Fsettings");
    const replayed = await fetch(`${app.url}/api/auth/session`, { headers: { cookie: kept } });
    expect(((await replayed.json()) as { user?: unknown }).user).toBeUndefined();
    expect((await session(other)).user?.email).toBe(people[0].email);
  });

  it("refuses a wrong password with our message", async () => {
    const { people } = await makeTeam(["viewer"]);
    const jar = new CookieJar();
    const res = await post(jar, "/api/auth/callback/password", { email: people[0].email, password: "wrong wrong" });
    expect(res.status).toBe(401);
    const { url } = (await res.json()) as { url: string };
    expect(new URL(url).searchParams.get("error")).toBe("That e-mail and password do not match.");
    expect((await session(jar)).user).toBeUndefined();
  });

  it("redeems a mailed sign-in link once", async () => {
    const { people } = await makeTeam(["viewer"]);
    await requestSignInLink(await contextFor(), { email: people[0].email }, "10.9.0.1");
    const token = linkIn(mailsTo(people[0].email)[0]).searchParams.get("token")!;
    const page = await fetch(`${app.url}/sign-in/link?token=${token}`);
    expect(page.status).toBe(200); // opening the page does not use the link up
    const jar = new CookieJar();
    expect((await post(jar, "/api/auth/callback/link", { token })).status).toBe(200);
    expect((await session(jar)).user?.email).toBe(people[0].email);
    const again = new CookieJar();
    expect((await post(again, "/api/auth/callback/link", { token })).status).toBe(401);
    expect((await session(again)).user).toBeUndefined();
  });
});
