import { describe, expect, it } from "vitest";
import { createHash } from "node:crypto";
import { displayPrefix, isWellFormedToken, newTokenString, tokenHash } from "@/lib/tokens/format";
import { parseCookies } from "@/lib/auth/request-caller";

describe("API token format", () => {
  it("is asy_ and 32 random bytes in base64url, different every time", () => {
    const a = newTokenString();
    const b = newTokenString();
    expect(a).toMatch(/^asy_[A-Za-z0-9_-]{43}$/);
    expect(Buffer.from(a.slice(4), "base64url")).toHaveLength(32);
    expect(a).not.toBe(b);
    expect(isWellFormedToken(a)).toBe(true);
    for (const bad of ["", "asy_", `asy_${"A".repeat(42)}`, `asy_${"A".repeat(44)}`, `xyz_${"A".repeat(43)}`, `asy_${"A".repeat(42)}=`]) {
      expect(isWellFormedToken(bad)).toBe(false);
    }
  });
  it("is stored as its sha256 (FIPS 180-4) and shown by a prefix too short to guess from", () => {
    // The SHA-256 of "abc" is the FIPS 180-4 appendix example digest.
    expect(tokenHash("abc")).toBe("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
    const t = newTokenString();
    expect(tokenHash(t)).toBe(createHash("sha256").update(t).digest("hex"));
    expect(displayPrefix(t)).toBe(t.slice(0, 12));
  });
});

describe("cookie header parsing", () => {
  it("splits name=value pairs and keeps values as sent", () => {
    expect(parseCookies("a=1; next-auth.session-token=eyJ.x-y_z; empty=; =bad; b=c=d")).toEqual({
      a: "1", "next-auth.session-token": "eyJ.x-y_z", empty: "", b: "c=d",
    });
    expect(parseCookies(null)).toEqual({});
  });
});

describe("client address for per-IP limits", () => {
  it("believes x-forwarded-for only behind a trusted proxy, and then the hop that proxy appended", async () => {
    const { clientIp } = await import("@/lib/auth/rate-limit");
    const before = process.env.ASSAY_TRUSTED_PROXY;
    try {
      delete process.env.ASSAY_TRUSTED_PROXY;
      // Served directly, a client writes its own x-forwarded-for (Next only fills it when absent): no address.
      expect(clientIp({ "x-forwarded-for": "203.0.113.9" })).toBeNull();
      expect(clientIp({ "x-real-ip": "192.0.2.1" })).toBeNull();
      process.env.ASSAY_TRUSTED_PROXY = "1";
      expect(clientIp({ "x-forwarded-for": "203.0.113.9, 10.0.0.5" })).toBe("10.0.0.5");
      expect(clientIp(new Headers({ "x-forwarded-for": "127.0.0.1" }))).toBe("127.0.0.1");
      expect(clientIp({ "x-real-ip": "192.0.2.1" })).toBeNull();
      expect(clientIp(undefined)).toBeNull();
    } finally {
      if (before === undefined) delete process.env.ASSAY_TRUSTED_PROXY;
      else process.env.ASSAY_TRUSTED_PROXY = before;
    }
  });
});
