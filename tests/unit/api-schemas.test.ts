import { describe, expect, it } from "vitest";
import { parseBlock } from "@/checks";
import { slugParamsSchema, slugSchema, versionParamsSchema } from "@/lib/validation/api";
import { evaluateBodySchema, forkBodySchema, newVersionJsonSchema, retuneBodySchema, searchQuerySchema } from "@/lib/validation/blocks";

describe("request schemas", () => {
  it("takes new parameter values keyed by identifiers against a base version", () => {
    expect(newVersionJsonSchema.parse({ params: { R: "3.9 kohm" }, baseVersion: 2 })).toEqual({ params: { R: "3.9 kohm" }, baseVersion: 2 });
    expect(newVersionJsonSchema.safeParse({ params: { "R1-x": "1" }, baseVersion: 2 }).success).toBe(false);
    expect(newVersionJsonSchema.safeParse({ params: { R: "" }, baseVersion: 2 }).success).toBe(false);
    expect(newVersionJsonSchema.safeParse({ params: {}, baseVersion: 0 }).success).toBe(false);
    expect(newVersionJsonSchema.safeParse({ params: {}, baseVersion: 1, extra: true }).success).toBe(false);
  });

  it("accepts only the IEC 60063 series E3…E192 for retuning", () => {
    // IEC 60063:2015, Preferred number series for resistors and capacitors: E3, E6, E12, E24, E48, E96, E192.
    const ok = (series: string) => retuneBodySchema.safeParse({ param: "R", target: { quantity: "fc", value: "1 kHz" }, series }).success;
    for (const s of ["E3", "E6", "E12", "E24", "E48", "E96", "E192"]) expect(ok(s)).toBe(true);
    expect(ok("E25")).toBe(false);
    expect(ok("e24")).toBe(false);
  });

  it("reads a slug as the block file does: a path, a form and the file agree on every case", () => {
    // DESIGN.md "Block file format": slug is lowercase letters, digits and `-` (single hyphens between words: common practice).
    const cases = ["rc-lowpass-2k", "a", "e24", "Bad", "rc--lowpass", "-rc", "rc-", "rc_lowpass", "rc lowpass", "ré-lowpass"];
    const fileTakes = (slug: string) => !parseBlock(`---\nslug: ${slug}\n---\n`).errors.some((e) => /^slug /.test(e.message));
    for (const slug of cases) expect([slug, slugSchema.safeParse(slug).success]).toEqual([slug, fileTakes(slug)]);
    expect(cases.filter((c) => slugSchema.safeParse(c).success)).toEqual(["rc-lowpass-2k", "a", "e24"]);
  });

  it("lets a fork body be empty or name a new slug, and refuses a bad slug", () => {
    expect(forkBodySchema.parse({})).toEqual({});
    expect(forkBodySchema.safeParse({ slug: "Bad Slug" }).success).toBe(false);
    expect(forkBodySchema.safeParse({ slug: "rc-lowpass-2k", params: { C: "10 nF" }, team: "larkspur" }).success).toBe(true);
  });

  it("defaults evaluate params to the file's and keeps simulate optional", () => {
    expect(evaluateBodySchema.parse({})).toEqual({ params: {} });
    expect(evaluateBodySchema.safeParse({ params: {}, simulate: "yes" }).success).toBe(false);
  });

  it("reads search queries: limit coerced and bounded, approved as a boolean, unknown badge refused", () => {
    expect(searchQuerySchema.parse({ limit: "5", approved: "true" })).toMatchObject({ limit: 5, approved: true });
    expect(searchQuerySchema.parse({})).toMatchObject({ limit: 20 });
    expect(searchQuerySchema.safeParse({ limit: "500" }).success).toBe(false);
    expect(searchQuerySchema.safeParse({ badge: "green" }).success).toBe(false);
  });

  it("reads path segments: slugs lowercase-hyphenated, version numbers positive integers", () => {
    expect(slugParamsSchema.safeParse({ slug: "wien-bridge-sine-1k" }).success).toBe(true);
    expect(slugParamsSchema.safeParse({ slug: "-x" }).success).toBe(false);
    expect(versionParamsSchema.parse({ slug: "a", n: "3" })).toEqual({ slug: "a", n: 3 });
    expect(versionParamsSchema.safeParse({ slug: "a", n: "1.5" }).success).toBe(false);
    expect(versionParamsSchema.safeParse({ slug: "a", n: "0" }).success).toBe(false);
  });
});
