import { afterAll, describe, expect, it } from "vitest";
import { authorizePassword, requestSignInLink } from "@/lib/auth/sign-in";
import { closeOrm, getEm } from "@/lib/db/orm";
import { PASSWORD, mailsTo, makeTeam } from "./auth-fixtures";

afterAll(closeOrm);

describe("sign-in rate limits", () => {
  it("stops password guesses at one address after five, even from other networks, with a clear message", async () => {
    const { people } = await makeTeam(["viewer"]);
    const email = people[0].email;
    for (let i = 0; i < 5; i++) {
      await expect(authorizePassword(await getEm(), email, `guess ${i}`, `10.3.0.${i}`)).rejects.toMatchObject({ code: "unauthenticated" });
    }
    const blocked = authorizePassword(await getEm(), email, PASSWORD, "10.3.0.99");
    await expect(blocked).rejects.toMatchObject({ code: "rate_limited" });
    await expect(authorizePassword(await getEm(), email, PASSWORD, "10.3.0.98")).rejects.toThrow(/Too many sign-in attempts for this address\. Try again in \d+ minutes/);
  });

  it("stops one network trying many addresses", async () => {
    const ip = "10.3.1.1";
    for (let i = 0; i < 30; i++) {
      await expect(authorizePassword(await getEm(), `spray-${i}-${Date.now()}@fenwick.test`, "x", ip)).rejects.toMatchObject({ code: "unauthenticated" });
    }
    const { people } = await makeTeam(["viewer"]);
    await expect(authorizePassword(await getEm(), people[0].email, PASSWORD, ip)).rejects.toThrow(/from this network/);
    // Another network is not affected.
    await expect(authorizePassword(await getEm(), people[0].email, PASSWORD, "10.3.1.2")).resolves.toMatchObject({ email: people[0].email });
  });

  it("sends at most three sign-in links to one address per quarter hour", async () => {
    const { people } = await makeTeam(["viewer"]);
    const email = people[0].email;
    for (let i = 0; i < 3; i++) await requestSignInLink(await getEm(), email, `10.3.2.${i}`);
    await expect(requestSignInLink(await getEm(), email, "10.3.2.9")).rejects.toMatchObject({ code: "rate_limited" });
    expect(mailsTo(email)).toHaveLength(3);
  });

  it("counts link requests without a client IP to believe in one bucket for everybody", async () => {
    // clientIp gives null unless ASSAY_TRUSTED_PROXY=1: fifty requests a quarter hour, whichever addresses they name.
    for (let i = 0; i < 50; i++) await requestSignInLink(await getEm(), `nobody-${i}-${Date.now()}@fenwick.test`, null);
    const { people } = await makeTeam(["viewer"]);
    await expect(requestSignInLink(await getEm(), people[0].email, null)).rejects.toThrow(/Too many sign-in attempts just now/);
    expect(mailsTo(people[0].email)).toHaveLength(0);
    // A request from a known client IP is counted on its own.
    await requestSignInLink(await getEm(), people[0].email, "10.3.3.1");
    expect(mailsTo(people[0].email)).toHaveLength(1);
  });
});
