import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { ApiTokenSchema, InvitationSchema, MembershipSchema } from "@/entities";
import { inviteMember } from "@/lib/auth/invitations";
import { loadCaller } from "@/lib/auth/load-caller";
import { createBlock } from "@/lib/blocks/create";
import { contextFor } from "@/lib/context";
import { createToken } from "@/lib/tokens/tokens";
import { closeOrm, getEm } from "@/lib/db/orm";
import { startApp, type AppServer } from "../support/app-server";
import { CookieJar } from "../support/cookie-jar";
import { PASSWORD, linkIn, mailsTo, makeTeam } from "./auth-fixtures";

// The built app over HTTP, with forms submitted as a browser without JavaScript does (React renders each server
// action's hidden fields into its form). Anyone can post those fields: the action itself must check who is asking.
let app: AppServer;
beforeAll(async () => {
  app = await startApp();
}, 900_000);
afterAll(async () => {
  await app?.stop();
  await closeOrm();
});

class Browser extends CookieJar {
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

/** The hidden fields of the first form on a page that contains `marker`, as a browser would submit them. */
async function formOn(b: Browser, path: string, marker: string): Promise<FormData> {
  const page = await (await b.get(path)).text();
  const form = (page.match(/<form[\s\S]*?<\/form>/g) ?? []).find((f) => f.includes(marker));
  if (!form) throw new Error(`no form with ${marker} on ${path}`);
  const body = new FormData();
  for (const m of form.matchAll(/<input type="hidden" name="([^"]+)"(?: value="([^"]*)")?\/>/g)) body.append(unescape(m[1]), unescape(m[2] ?? ""));
  return body;
}

async function submit(b: Browser, path: string, body: FormData): Promise<Response> {
  const res = await fetch(`${app.url}${path}`, { method: "POST", body, headers: { cookie: b.header() }, redirect: "manual" });
  b.take(res);
  return res;
}

/** Submits the settings page's password form, as the browser would. */
async function changePasswordOnPage(b: Browser, current: string, next: string): Promise<Response> {
  const body = await formOn(b, "/settings", 'name="current"');
  body.append("current", current);
  body.append("next", next);
  body.append("repeat", next);
  return submit(b, "/settings", body);
}

describe("changing a password over HTTP", () => {
  it("signs out the other browser and keeps the one that made the change signed in", async () => {
    const { people, slug: team, tag } = await makeTeam(["author"]);
    const me = people[0];
    const text = readFileSync("content/blocks/rc-lowpass-antialias.md", "utf8").replace(/^slug: .*$/m, `slug: pw-${tag}`);
    const { slug } = await createBlock(await contextFor(await loadCaller(await getEm(), me.id)), { team, text });

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

describe("team and settings actions check the caller on the server", () => {
  const roleOf = async (teamId: number, userId: number) =>
    (await (await getEm()).findOne(MembershipSchema, { team: teamId, user: userId }))?.role;

  it("refuses a role change, an invitation and a token revocation posted by someone without the right", async () => {
    const { people, teamId } = await makeTeam(["admin", "maintainer", "viewer"]);
    const [, maintainer, viewer] = people;
    const browsers = Object.fromEntries(await Promise.all(people.map(async (p) => {
      const b = new Browser();
      await b.signIn(p.email, PASSWORD);
      return [p.role, b] as const;
    })));
    const nobody = new Browser();

    // The admin's own role form for the viewer, replayed by others asking to make the viewer admin.
    const roleForm = await formOn(browsers.admin, "/team", `name="userId" value="${viewer.id}"`);
    for (const who of [browsers.viewer, browsers.maintainer, nobody]) {
      const body = new FormData();
      roleForm.forEach((v, k) => body.append(k, v));
      body.append("role", "admin");
      await submit(who, "/team", body);
      expect(await roleOf(teamId, viewer.id)).toBe("viewer");
    }
    const inviteForm = await formOn(browsers.admin, "/team", 'name="email"');
    const invite = (who: Browser) => {
      const body = new FormData();
      inviteForm.forEach((v, k) => body.append(k, v));
      body.append("email", `outsider-${teamId}@fenwick.test`);
      body.append("role", "admin");
      return submit(who, "/team", body);
    };
    for (const who of [browsers.viewer, browsers.maintainer, nobody]) await invite(who);
    expect(await (await getEm()).count(InvitationSchema, { team: teamId })).toBe(0);

    // The maintainer's token, which only its owner and the team's admins may revoke.
    const { record } = await createToken(await getEm(), { userId: maintainer.id, teamId, name: "bench", scope: "read", expiresAt: null });
    const mine = await createToken(await getEm(), { userId: viewer.id, teamId, name: "own", scope: "read", expiresAt: null });
    const revokeForm = await formOn(browsers.viewer, "/settings/tokens", `name="id" value="${mine.record.id}"`);
    revokeForm.set("id", String(record.id));
    await submit(browsers.viewer, "/settings/tokens", revokeForm);
    expect((await (await getEm()).findOneOrFail(ApiTokenSchema, { id: record.id })).revokedAt).toBeNull();

    // The same posts from the admin do take effect, so the refusals above were the role check, not a bad request.
    const body = new FormData();
    roleForm.forEach((v, k) => body.append(k, v));
    body.append("role", "author");
    expect(await (await submit(browsers.admin, "/team", body)).text()).toContain("Role set to author.");
    expect(await roleOf(teamId, viewer.id)).toBe("author");
    await invite(browsers.admin);
    expect(await (await getEm()).count(InvitationSchema, { team: teamId })).toBe(1);
    const again = new FormData();
    revokeForm.forEach((v, k) => again.append(k, v));
    await submit(browsers.admin, "/settings/tokens", again);
    expect((await (await getEm()).findOneOrFail(ApiTokenSchema, { id: record.id })).revokedAt).not.toBeNull();
  });
});

describe("the invitation page", () => {
  it("names the team, the role and the address of a live link to anyone, and turns a made-up or missing token away", async () => {
    const { slug, people } = await makeTeam(["admin"]);
    const invitee = `page-${slug}@larkspur.test`;
    await inviteMember(await contextFor(await loadCaller(await getEm(), people[0].id)), { teamSlug: slug, email: invitee, role: "maintainer" });
    const token = linkIn(mailsTo(invitee)[0]).searchParams.get("token")!;
    const stranger = new Browser();
    const live = await stranger.get(`/invitation?token=${token}`);
    expect(live.status).toBe(200);
    const page = await live.text();
    expect(page).toContain(`Join <!-- -->Team ${slug.slice(2)}`);
    expect(page).toContain(invitee);
    expect(page).toMatch(/<strong[^>]*>maintainer<\/strong>/);
    for (const path of [`/invitation?token=${"A".repeat(43)}`, "/invitation?token=short", "/invitation"]) {
      expect(await (await stranger.get(path)).text()).toContain("This invitation is not valid any more");
    }
  });
});

describe("the sign-in page's link form", () => {
  it("mails a one-time link when posted as a browser without JavaScript does, and answers the same for an unknown address", async () => {
    const { people } = await makeTeam(["viewer"]);
    const b = new Browser();
    const post = async (email: string) => {
      const body = await formOn(b, "/sign-in", 'aria-labelledby="link-heading"');
      body.append("email", email);
      return (await submit(b, "/sign-in", body)).text();
    };
    expect(await post(people[0].email)).toContain(`If ${people[0].email} has an account, a sign-in link is on its way.`);
    const [mail] = mailsTo(people[0].email);
    expect(linkIn(mail).pathname).toBe("/sign-in/link");
    const nobody = `nobody-${Date.now()}@fenwick.test`;
    expect(await post(nobody)).toContain(`If ${nobody} has an account, a sign-in link is on its way.`);
    expect(mailsTo(nobody)).toHaveLength(0);
  });
});
