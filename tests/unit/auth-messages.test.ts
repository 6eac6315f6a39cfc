import { afterEach, describe, expect, it } from "vitest";
import { useSecureCookies, sessionCookieName } from "@/lib/auth/config";
import { invitationMessage, nowFailingMessage, signInLinkMessage } from "@/lib/mail/messages";

const saved = process.env.APP_URL;
afterEach(() => {
  process.env.APP_URL = saved;
});

describe("mail messages", () => {
  it("put the same link, built on APP_URL, in the text and the HTML part", () => {
    process.env.APP_URL = "https://assay.fenwick.test/";
    const m = signInLinkMessage("tok_en-123", 15);
    expect(m.text).toContain("https://assay.fenwick.test/sign-in/link?token=tok_en-123");
    expect(m.html).toContain('href="https://assay.fenwick.test/sign-in/link?token=tok_en-123"');
    expect(m.text).toContain("15 minutes");
  });
  it("escape names in the HTML part", () => {
    const m = invitationMessage({ token: "t", teamName: "R&D <Bench>", role: "viewer", invitedBy: "Iris", days: 7 });
    expect(m.html).toContain("R&amp;D &lt;Bench&gt;");
    expect(m.html).not.toContain("<Bench>");
    expect(m.text).toContain("R&D <Bench>");
    expect(nowFailingMessage({ slug: "a-b", version: 3, title: "T" }, "failing").subject).toBe("Now failing: T v3");
  });
});

describe("session cookie naming", () => {
  it("is Secure-prefixed exactly when the app is served over https", () => {
    process.env.APP_URL = "https://assay.fenwick.test";
    expect(useSecureCookies()).toBe(true);
    expect(sessionCookieName()).toBe("__Secure-next-auth.session-token");
    process.env.APP_URL = "http://127.0.0.1:3000";
    expect(useSecureCookies()).toBe(false);
    expect(sessionCookieName()).toBe("next-auth.session-token");
  });
});
