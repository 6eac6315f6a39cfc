import { afterAll, describe, expect, it } from "vitest";
import { loadCaller } from "@/lib/auth/load-caller";
import { changePassword } from "@/lib/auth/profile";
import { authorizePassword, requestSignInLink } from "@/lib/auth/sign-in";
import { closeOrm, getEm } from "@/lib/db/orm";
import { PASSWORD, mailsTo, makeTeam } from "./auth-fixtures";
import { contextFor } from "@/lib/context";

afterAll(closeOrm);

// Growing delays per account and per client instead of a lock-out shared by everybody (common practice:
// OWASP Authentication Cheat Sheet, "Login Throttling"; NIST SP 800-63B §5.2.2 rate limiting, from memory).
describe("sign-in limits", () => {
  it("lets the owner in after 100 wrong passwords on random addresses from unnamed clients", async () => {
    const { people } = await makeTeam(["admin"]);
    for (let i = 0; i < 100; i++) {
      const guess = authorizePassword(await contextFor(), { email: `spray-${i}-${Date.now()}@fenwick.test`, password: "guess" }, null);
      await expect(guess).rejects.toMatchObject({ code: "unauthenticated" });
    }
    await expect(authorizePassword(await contextFor(), { email: people[0].email, password: PASSWORD }, null)).resolves.toMatchObject({ email: people[0].email });
  }, 180_000);

  it("makes one address wait after five wrong passwords, from any network, and says how long", async () => {
    const { people } = await makeTeam(["viewer"]);
    const email = people[0].email;
    for (let i = 0; i < 5; i++) {
      await expect(authorizePassword(await contextFor(), { email, password: `guess ${i}` }, `10.3.0.${i}`)).rejects.toMatchObject({ code: "unauthenticated" });
    }
    await expect(authorizePassword(await contextFor(), { email, password: PASSWORD }, "10.3.0.99"))
      .rejects.toThrow(/^Too many sign-in attempts for this address\. Try again in a second\.$/);
    await new Promise((r) => setTimeout(r, 1100));
    await expect(authorizePassword(await contextFor(), { email, password: PASSWORD }, "10.3.0.98")).resolves.toMatchObject({ email });
  });

  it("slows one client trying many addresses, and only that client", async () => {
    const ip = "10.3.1.1";
    const { people } = await makeTeam(["viewer"]);
    for (let i = 0; i < 20; i++) {
      await expect(authorizePassword(await contextFor(), { email: `spray-${i}-${Date.now()}@fenwick.test`, password: "x" }, ip)).rejects.toMatchObject({ code: "unauthenticated" });
    }
    // The twentieth failure started a five-second wait for this client, whichever address it names next.
    await expect(authorizePassword(await contextFor(), { email: people[0].email, password: PASSWORD }, ip)).rejects.toThrow(/from this network/);
    await expect(authorizePassword(await contextFor(), { email: people[0].email, password: PASSWORD }, "10.3.1.2")).resolves.toMatchObject({ email: people[0].email });
  });

  it("limits guesses at the current password on the password-change form", async () => {
    const { people } = await makeTeam(["author"]);
    const caller = await loadCaller(await getEm(), people[0].id);
    for (let i = 0; i < 5; i++) {
      await expect(changePassword(await contextFor(caller), { current: `guess ${i}`, next: "a new passphrase, long" })).rejects.toMatchObject({ code: "validation" });
    }
    await expect(changePassword(await contextFor(caller), { current: PASSWORD, next: "a new passphrase, long" })).rejects.toMatchObject({ code: "rate_limited" });
  });

  it("sends at most three sign-in links to one address per quarter hour", async () => {
    const { people } = await makeTeam(["viewer"]);
    const email = people[0].email;
    for (let i = 0; i < 3; i++) await requestSignInLink(await contextFor(), { email }, `10.3.2.${i}`);
    await expect(requestSignInLink(await contextFor(), { email }, "10.3.2.9")).rejects.toMatchObject({ code: "rate_limited" });
    expect(mailsTo(email)).toHaveLength(3);
  });

  it("keeps no link bucket shared by everybody: requests for other addresses do not hold up yours", async () => {
    for (let i = 0; i < 60; i++) await requestSignInLink(await contextFor(), { email: `nobody-${i}-${Date.now()}@fenwick.test` }, null);
    const { people } = await makeTeam(["viewer"]);
    await requestSignInLink(await contextFor(), { email: people[0].email }, null);
    expect(mailsTo(people[0].email)).toHaveLength(1);
  });
});
