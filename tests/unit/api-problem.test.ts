import { describe, expect, it, vi } from "vitest";
import { z } from "zod";
import { problem, problemDocument, PROBLEM_BASE, STALE_BASE_TYPE } from "@/lib/api/problem";
import { route } from "@/lib/api/handler";
import { AppError } from "@/lib/errors";

// RFC 9457 (Problem Details for HTTP APIs), §3: type, title, status, detail; extension members allowed.
describe("problem documents", () => {
  it("maps every AppError code to its status and a type under one base", async () => {
    const cases: [ConstructorParameters<typeof AppError>[0], number][] = [
      ["unauthenticated", 401], ["forbidden", 403], ["not_found", 404], ["conflict", 409],
      ["payload_too_large", 413], ["unsupported_media_type", 415], ["validation", 422],
    ];
    for (const [code, status] of cases) {
      const res = problem(new AppError(code, "why"));
      expect(res.status).toBe(status);
      expect(res.headers.get("content-type")).toBe("application/problem+json");
      const body = await res.json();
      expect(body.type.startsWith(PROBLEM_BASE)).toBe(true);
      expect(body).toMatchObject({ status, detail: "why" });
      expect(typeof body.title).toBe("string");
    }
  });

  it("names a conflict with a head a stale base and carries the head", () => {
    const doc = problemDocument(new AppError("conflict", "moved on", { head: 4 }));
    expect(doc).toMatchObject({ type: STALE_BASE_TYPE, status: 409, head: 4 });
    expect(problemDocument(new AppError("conflict", "slug taken", { slug: "x" })).type).toBe(PROBLEM_BASE + "conflict");
  });

  it("lists zod issues with their paths on 422", () => {
    const r = z.object({ baseVersion: z.number().int() }).safeParse({ baseVersion: "two" });
    const doc = problemDocument(r.error);
    expect(doc.status).toBe(422);
    expect(doc.errors).toEqual([expect.objectContaining({ path: "baseVersion" })]);
  });

  it("keeps extra members but never lets them overwrite type, title, status or detail", () => {
    const doc = problemDocument(new AppError("validation", "bad file", { errors: [{ message: "x", line: 3 }], status: 200, type: "https://evil.test/", detail: "other" }));
    expect(doc).toMatchObject({ status: 422, type: PROBLEM_BASE + "validation", detail: "bad file", errors: [{ message: "x", line: 3 }] });
  });

  it("answers 401 with a Bearer challenge (RFC 6750 §3)", () => {
    expect(problem(new AppError("unauthenticated", "sign in")).headers.get("www-authenticate")).toMatch(/^Bearer /);
  });

  it("hides the cause of an unexpected error and logs it on the server", async () => {
    const log = vi.spyOn(console, "error").mockImplementation(() => {});
    const handler = route(async () => {
      throw new Error('relation "blocks" does not exist at 10.0.0.5:5432');
    });
    const res = await handler(new Request("http://x.test/api/v1/blocks"), { params: Promise.resolve({}) });
    expect(res.status).toBe(500);
    const text = await res.text();
    expect(text).not.toMatch(/relation|5432/);
    expect(log).toHaveBeenCalled();
    expect(String(log.mock.calls[0][0])).toContain("/api/v1/blocks");
    log.mockRestore();
  });
});

describe("cookie-carried writes from another site", () => {
  const handler = route(async () => new Response("ok"));
  const call = (headers: Record<string, string>, method = "POST") =>
    handler(new Request("http://localhost:3000/api/v1/blocks/x/forks", { method, headers }), { params: Promise.resolve({}) });

  it("are refused when the Origin is neither the Host nor APP_URL", async () => {
    expect((await call({ cookie: "next-auth.session-token=x", origin: "https://elsewhere.test", host: "127.0.0.1:3000" })).status).toBe(403);
  });
  it("pass from the same host, for token callers, without a cookie, and for reads", async () => {
    expect((await call({ cookie: "s=x", origin: "http://127.0.0.1:3000", host: "127.0.0.1:3000" })).status).toBe(200);
    // Not refused for its origin: a token caller is judged by its token (this one is not valid: 401, not 403).
    expect((await call({ cookie: "s=x", authorization: "Bearer t", origin: "https://elsewhere.test" })).status).toBe(401);
    expect((await call({ origin: "https://elsewhere.test" })).status).toBe(200);
    expect((await call({ cookie: "s=x", origin: "https://elsewhere.test" }, "GET")).status).toBe(200);
  });
});

describe("finer problem types named by a service", () => {
  it("stay under our base and are not mistaken for a stale base", () => {
    const doc = problemDocument(new AppError("conflict", "the block is archived", { type: "archived", head: 3 }));
    expect(doc).toMatchObject({ type: PROBLEM_BASE + "archived", status: 409, head: 3 });
  });
  it("cannot point outside our base", () => {
    expect(problemDocument(new AppError("conflict", "x", { type: "https://evil.test/x" })).type).toBe(PROBLEM_BASE + "conflict");
  });
});
