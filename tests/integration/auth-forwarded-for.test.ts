import { afterAll, describe, expect, it } from "vitest";
import { closeOrm } from "@/lib/db/orm";
import { startApp, type AppServer } from "../support/app-server";
import { PASSWORD, makeTeam } from "./auth-fixtures";

// Per-network sign-in limits against the built app, with x-forwarded-for written by the client itself.
// Each case starts its own app so it starts with empty (in-memory) limits.
const apps: AppServer[] = [];
afterAll(async () => {
  await Promise.all(apps.map((a) => a.stop()));
  await closeOrm();
});

async function signInVia(app: AppServer, forwardedFor: string) {
  const csrf = await fetch(`${app.url}/api/auth/csrf`);
  const cookie = csrf.headers.getSetCookie().map((c) => c.split(";")[0]).join("; ");
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  return async (email: string, password: string): Promise<{ status: number; error: string | null }> => {
    const res = await fetch(`${app.url}/api/auth/callback/password`, {
      method: "POST",
      redirect: "manual",
      headers: {
        cookie,
        "content-type": "application/x-www-form-urlencoded",
        "x-auth-return-redirect": "1",
        "x-forwarded-for": forwardedFor,
      },
      body: new URLSearchParams({ email, password, csrfToken, json: "true" }),
    });
    const { url } = (await res.json()) as { url: string };
    return { status: res.status, error: new URL(url).searchParams.get("error") };
  };
}

describe("a forged x-forwarded-for", () => {
  it("buys nothing when the app is reached directly, and 100 guesses elsewhere do not lock the owner out", async () => {
    const app = await startApp();
    apps.push(app);
    const { people } = await makeTeam(["viewer"]);
    // 100 wrong passwords at 100 addresses, each claiming another client address: none of them is believed, and
    // with no bucket shared by everybody the owner of a real account signs in from another client at once.
    for (let i = 0; i < 100; i++) {
      const attempt = await signInVia(app, `198.51.${Math.floor(i / 250)}.${i % 250}`);
      expect((await attempt(`spray-${i}@fenwick.test`, "guess")).error).toBe("That e-mail and password do not match.");
    }
    const owner = await (await signInVia(app, "203.0.113.77"))(people[0].email, PASSWORD);
    expect(owner).toEqual({ status: 200, error: null });
  }, 300_000);

  it("counts per client behind a trusted proxy (ASSAY_TRUSTED_PROXY=1), by the hop the proxy appended", async () => {
    const app = await startApp({ env: { ASSAY_TRUSTED_PROXY: "1" } });
    apps.push(app);
    const { people } = await makeTeam(["viewer"]);
    // The proxy appends 203.0.113.7 to whatever the client sent; the client varies its own part.
    for (let i = 0; i < 20; i++) {
      const attempt = await signInVia(app, `10.0.0.${i}, 203.0.113.7`);
      expect((await attempt(`spray-${i}@fenwick.test`, "guess")).status).toBe(401);
    }
    const same = await (await signInVia(app, "192.0.2.200, 203.0.113.7"))(people[0].email, PASSWORD);
    expect(same.error).toMatch(/^Too many sign-in attempts from this network\./);
    const other = await (await signInVia(app, "203.0.113.7, 203.0.113.8"))(people[0].email, PASSWORD);
    expect(other).toEqual({ status: 200, error: null });
  }, 180_000);
});
