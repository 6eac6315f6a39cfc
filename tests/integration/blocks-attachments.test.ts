import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";

await vi.hoisted(async () => { await (await import("./blocks-db")).usePrivateDatabase(); });
import { addAttachment, getAttachment, listAttachments } from "@/lib/attachments/attachments";
import { createBlock } from "@/lib/blocks/create";
import { closeOrm } from "@/lib/db/orm";
import type { AppError } from "@/lib/errors";
import { dividerBlock, drain, makeTeam, type TestTeam } from "./blocks-helpers";
import { contextFor } from "@/lib/context";

let team: TestTeam;
const slug = () => `att-${team.tag}`;
beforeAll(async () => {
  team = await makeTeam();
  await createBlock(await contextFor(team.author), { team: team.slug, text: dividerBlock(slug()) });
});
afterAll(async () => { await drain(team); await closeOrm(); });
const code = (p: Promise<unknown>) => p.then(() => "ok", (e: AppError) => e.code);

// The 8-byte PNG signature (W3C PNG specification, 2nd ed., section 5.2) followed by an IHDR chunk start.
const png = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52]);

describe("attachments", () => {
  it("stores a PNG and refuses what is not one, or too big, or of another type", async () => {
    const info = await addAttachment(await contextFor(team.author), { slug: slug(), name: "Schematic.png", contentType: "image/png", bytes: png });
    expect(info).toMatchObject({ name: "schematic.png", contentType: "image/png", size: png.length });
    expect((await getAttachment(await contextFor(team.viewer), { slug: slug(), name: "schematic.png" })).bytes.equals(png)).toBe(true);
    expect(await code(addAttachment(await contextFor(team.author), { slug: slug(), name: "x.png", contentType: "image/png", bytes: Buffer.from("GIF89a") }))).toBe("validation");
    expect(await code(addAttachment(await contextFor(team.author), { slug: slug(), name: "x.gif", contentType: "image/gif", bytes: Buffer.from("GIF89a") }))).toBe("validation");
    expect(await code(addAttachment(await contextFor(team.author), { slug: slug(), name: "x.png", contentType: "image/gif", bytes: png }))).toBe("unsupported_media_type");
    const big = Buffer.concat([png, Buffer.alloc(1024 * 1024)]);
    expect(await code(addAttachment(await contextFor(team.author), { slug: slug(), name: "big.png", contentType: "image/png", bytes: big }))).toBe("payload_too_large");
    expect(await code(addAttachment(await contextFor(team.viewer), { slug: slug(), name: "v.png", contentType: "image/png", bytes: png }))).toBe("forbidden");
    expect(await code(getAttachment(await contextFor(team.outsider), { slug: slug(), name: "schematic.png" }))).toBe("not_found");
  });

  it("reduces an SVG to drawing elements: no script, event handlers, foreign content or outside links", async () => {
    const svg = `<?xml version="1.0"?>
<svg xmlns="http://www.w3.org/2000/svg" xmlns:xlink="http://www.w3.org/1999/xlink" viewBox="0 0 100 40" onload="alert(1)">
  <script>alert(2)</script>
  <g stroke="black"><path d="M0 20 H100"/><rect x="40" y="10" width="20" height="20" fill="none"/></g>
  <text x="50" y="8" text-anchor="middle">R1 10k</text>
  <a href="https://example.test/"><circle cx="5" cy="5" r="2"/></a>
  <defs><linearGradient id="r"><stop offset="0" stop-color="red"/></linearGradient></defs><rect fill="url(#r)" width="2" height="2"/>
  <use href="javascript:alert(3)"/><text><![CDATA[<script>alert(4)</script>]]></text>
  <foreignObject><div>html</div></foreignObject>
  <rect style="fill: url(https://example.test/x)" width="1" height="1"/>
</svg>`;
    await addAttachment(await contextFor(team.author), { slug: slug(), name: "divider.svg", contentType: "image/svg+xml", bytes: Buffer.from(svg) });
    const out = (await getAttachment(await contextFor(team.viewer), { slug: slug(), name: "divider.svg" })).bytes.toString("utf8");
    expect(out).toContain('<path d="M0 20 H100"');
    expect(out).toContain("R1 10k");
    expect(out).toContain('fill="url(#r)"');
    for (const bad of ["<script", "alert(2)", "alert(3)", "onload", "foreignObject", "example.test", "<a", "javascript"]) expect(out).not.toContain(bad);
    expect(await code(addAttachment(await contextFor(team.author), { slug: slug(), name: "x.svg", contentType: "image/svg+xml", bytes: Buffer.from("<html><body/></html>") }))).toBe("validation");
    expect(await code(addAttachment(await contextFor(team.author), { slug: slug(), name: "e.svg", contentType: "image/svg+xml", bytes: Buffer.from('<!DOCTYPE svg [<!ENTITY a "b">]><svg/>') }))).toBe("validation");
    expect((await listAttachments(await contextFor(team.viewer), { slug: slug() })).map((a) => a.name)).toEqual(["divider.svg", "schematic.png"]);
  });
});
