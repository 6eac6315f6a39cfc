import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { loadCaller } from "@/lib/auth/load-caller";
import { createBlock } from "@/lib/blocks/create";
import { closeOrm, getEm } from "@/lib/db/orm";
import { startApp, type AppServer } from "../support/app-server";
import { PASSWORD, makeTeam } from "./auth-fixtures";

// The built app over HTTP: two browsers signed in as one person; one changes the password on the settings page,
// submitting the form as a browser without JavaScript does (React renders the action's hidden fields into it).
let app: AppServer;
beforeAll(async () => {
  app = await startApp();
}, 900_000);
afterAll(async () => {
  await app?.stop();
  await closeOrm();
});

class Browser {
  cookies = new Map<string, string>();
  header = () => [...this.cookies].map(([k, v]) => `${k}=${v}`).join("; ");
  take(res: Response) {
    for (const line of res.headers.getSetCookie()) {
      const [pair] = line.split(";");
      const i = pair.indexOf("=");
      if (pair.slice(i + 1) === "" || /Max-Age=0/i.test(line) || /Expires=Thu, 01 Jan 1970/i.test(line)) this.cookies.delete(pair.slice(0, i));
      else this.cookies.set(pair.slice(0, i), pair.slice(i + 1));
    }
  }
  async get(path: string): Promise<Response> {
    const res = await fetch(`${app.url}${path}`, { headers: { cookie: this.header() }, redirect: "manual" });
    this.take(res);
    return res;
  }
  async signIn(email: string, password: string): Promise<Response> {
    const csrf = await this.get("/api/auth/csrf");
    const { csrfToken } = (await csrf.json()) as { csrfToken: string };
    const res = await fetch(`${app.url}/api/auth/callback/password`, {
      method: "POST",
      redirect: "manual",
      headers: { cookie: this.header(), "content-type": "application/x-www-form-urlencoded", "x-auth-return-redirect": "1" },
      body: new URLSearchParams({ email, password, csrfToken, json: "true" }),
    });
    this.take(res);
    return res;
  }
  async who(): Promise<string | undefined> {
    return ((await (await this.get("/api/auth/session")).json()) as { user?: { email: string } }).user?.email;
  }
}

const unescape = (s: string) =>
  s.replace(/&quot;/g, '"').replace(/&#x27;/g, "'").replace(/&lt;/g, "<").replace(/&gt;/g, ">").replace(/&amp;/g, "&");

/** Submits the settings page's password form with its hidden fields, as the browser would. */
async function changePasswordOnPage(b: Browser, current: string, next: string): Promise<Response> {
  const page = await (await b.get("/settings")).text();
  const form = (page.match(/<form[\s\S]*?<\/form>/g) ?? []).find((f) => f.includes('name="current"'));
  if (!form) throw new Error("no password form on /settings");
  const body = new FormData();
  for (const m of form.matchAll(/<input type="hidden" name="([^"]+)"(?: value="([^"]*)")?\/>/g)) body.append(unescape(m[1]), unescape(m[2] ?? ""));
  body.append("current", current);
  body.append("next", next);
  body.append("repeat", next);
  const res = await fetch(`${app.url}/settings`, { method: "POST", body, headers: { cookie: b.header() }, redirect: "manual" });
  b.take(res);
  return res;
}

describe("changing a password over HTTP", () => {
  it("signs out the other browser and keeps the one that made the change signed in", async () => {
    const { people, slug: team, tag } = await makeTeam(["author"]);
    const me = people[0];
    const text = readFileSync("content/blocks/rc-lowpass-antialias.md", "utf8").replace(/^slug: .*$/m, `slug: pw-${tag}`);
    const { slug } = await createBlock(await loadCaller(await getEm(), me.id), { teamSlug: team, text });

    const laptop = new Browser();
    const phone = new Browser();
    expect((await laptop.signIn(me.email, PASSWORD)).status).toBe(200);
    expect((await phone.signIn(me.email, PASSWORD)).status).toBe(200);
    expect(await phone.who()).toBe(me.email);
    const phoneCookie = phone.header();

    const res = await changePasswordOnPage(laptop, PASSWORD, "a new passphrase, long");
    expect(res.status).toBe(200);
    expect(await res.text()).toContain("Password changed. Other browsers and devices are signed out.");
    expect(res.headers.getSetCookie().some((c) => c.startsWith("next-auth.session-token=") && /HttpOnly/i.test(c))).toBe(true);

    // The laptop: still signed in, on pages, next-auth's session endpoint and the API.
    expect(await laptop.who()).toBe(me.email);
    const settings = await laptop.get("/settings");
    expect(settings.status).toBe(200);
    expect(await settings.text()).toContain(me.email);
    expect((await laptop.get(`/api/v1/blocks/${slug}`)).status).toBe(200);

    // The phone's cookie: nobody to the API and pages; next-auth's session endpoint clears it.
    expect((await fetch(`${app.url}/api/v1/blocks/${slug}`, { headers: { cookie: phoneCookie } })).status).toBe(404);
    const page = await fetch(`${app.url}/settings`, { headers: { cookie: phoneCookie }, redirect: "manual" });
    const body = await page.text();
    expect(page.headers.get("location") ?? body).toContain("/sign-in?callbackUrl=%2Fsettings");
    expect(body).not.toContain(me.email);
    expect(await phone.who()).toBeUndefined();
    expect(phone.cookies.has("next-auth.session-token")).toBe(false);

    // The old password is refused, the new one signs the phone in again.
    expect((await phone.signIn(me.email, PASSWORD)).status).toBe(401);
    expect((await phone.signIn(me.email, "a new passphrase, long")).status).toBe(200);
    expect(await phone.who()).toBe(me.email);
  });

  it("changes nothing when the current password is wrong", async () => {
    const { people } = await makeTeam(["viewer"]);
    const laptop = new Browser();
    const phone = new Browser();
    await laptop.signIn(people[0].email, PASSWORD);
    await phone.signIn(people[0].email, PASSWORD);
    const res = await changePasswordOnPage(laptop, "not the password", "a new passphrase, long");
    expect(await res.text()).toContain("The current password is not right.");
    expect(await phone.who()).toBe(people[0].email);
    expect(await laptop.who()).toBe(people[0].email);
  });
});
