import { describe, expect, it } from "vitest";
import { MAX_BLOCK_FILE_BYTES, readBlockFile, readJson } from "@/lib/api/body";
import { conditional, matchesIfNoneMatch, strongEtag } from "@/lib/api/etag";
import { AppError } from "@/lib/errors";

const post = (body: BodyInit, type?: string, headers: Record<string, string> = {}) =>
  new Request("http://x.test/api/v1/blocks?team=fenwick", { method: "POST", body, headers: { ...(type ? { "content-type": type } : {}), ...headers } });

async function codeOf(p: Promise<unknown>): Promise<string> {
  try {
    await p;
    return "ok";
  } catch (e) {
    return e instanceof AppError ? e.code : String(e);
  }
}

describe("reading block files", () => {
  it("takes text/markdown and the file part of multipart/form-data", async () => {
    expect(await readBlockFile(post("---\nslug: a\n---\n", "text/markdown; charset=utf-8"))).toBe("---\nslug: a\n---\n");
    const form = new FormData();
    form.set("file", new Blob(["hello"], { type: "text/markdown" }), "a.md");
    expect(await readBlockFile(new Request("http://x.test/", { method: "POST", body: form }))).toBe("hello");
  });

  it("refuses other media types with 415", async () => {
    expect(await codeOf(readBlockFile(post("{}", "application/json")))).toBe("unsupported_media_type");
    expect(await codeOf(readBlockFile(post("x")))).toBe("unsupported_media_type");
  });

  it("refuses bodies over the limit with 413, declared or streamed", async () => {
    const big = "x".repeat(MAX_BLOCK_FILE_BYTES + 1);
    expect(await codeOf(readBlockFile(post(big, "text/markdown")))).toBe("payload_too_large");
    const stream = new ReadableStream({
      start(c) {
        for (let i = 0; i < 5; i++) c.enqueue(new TextEncoder().encode("y".repeat(64 * 1024)));
        c.close();
      },
    });
    const req = new Request("http://x.test/", { method: "POST", body: stream, headers: { "content-type": "text/markdown" }, duplex: "half" } as RequestInit);
    expect(await codeOf(readBlockFile(req))).toBe("payload_too_large");
  });

  it("refuses a multipart form without a file part, and bytes that are not UTF-8, with 422", async () => {
    const form = new FormData();
    form.set("other", "x");
    expect(await codeOf(readBlockFile(new Request("http://x.test/", { method: "POST", body: form })))).toBe("validation");
    expect(await codeOf(readBlockFile(post(new Uint8Array([0xff, 0xfe, 0x00]), "text/markdown")))).toBe("validation");
  });

  it("reads JSON only as application/json and calls malformed JSON a validation problem", async () => {
    expect(await readJson(post('{"a":1}', "application/json"))).toEqual({ a: 1 });
    expect(await codeOf(readJson(post('{"a":', "application/json")))).toBe("validation");
    expect(await codeOf(readJson(post('{"a":1}', "text/plain")))).toBe("unsupported_media_type");
  });
});

// RFC 9110 §8.8.3 (ETag), §13.1.2 (If-None-Match, weak comparison), §15.4.5 (304 repeats ETag and Cache-Control).
describe("conditional GET", () => {
  const get = (inm?: string) => new Request("http://x.test/", { headers: inm ? { "if-none-match": inm } : {} });

  it("gives a strong ETag that changes with the body", () => {
    expect(strongEtag("a")).toMatch(/^"[A-Za-z0-9_-]+"$/);
    expect(strongEtag("a")).not.toBe(strongEtag("b"));
  });

  it("matches lists, weak forms and *", () => {
    const e = strongEtag("body");
    expect(matchesIfNoneMatch(get(`"other", ${e}`), e)).toBe(true);
    expect(matchesIfNoneMatch(get(`W/${e}`), e)).toBe(true);
    expect(matchesIfNoneMatch(get("*"), e)).toBe(true);
    expect(matchesIfNoneMatch(get('"other"'), e)).toBe(false);
    expect(matchesIfNoneMatch(get(), e)).toBe(false);
  });

  it("answers 304 without a body but with the validator and cache headers", async () => {
    const first = conditional(get(), "body", { "Content-Type": "application/json", "Cache-Control": "public, no-cache" });
    expect(first.status).toBe(200);
    const again = conditional(get(first.headers.get("etag")!), "body", { "Content-Type": "application/json", "Cache-Control": "public, no-cache" });
    expect(again.status).toBe(304);
    expect(await again.text()).toBe("");
    expect(again.headers.get("etag")).toBe(first.headers.get("etag"));
    expect(again.headers.get("cache-control")).toBe("public, no-cache");
  });
});
