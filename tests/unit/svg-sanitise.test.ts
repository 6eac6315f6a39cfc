import { JSDOM } from "jsdom";
import { describe, expect, it } from "vitest";
import { sanitiseSvg } from "@/lib/attachments/svg-sanitise";

// What a browser would run is judged by parsing the output as the browser does for a direct load
// (image/svg+xml, an XML document; W3C SVG 1.1 §1.2 / XML 1.0 §2.7 CDATA sections).
function scriptsIn(svg: string): number {
  const { window } = new JSDOM(svg, { contentType: "image/svg+xml" });
  const doc = window.document;
  const handlers = [...doc.querySelectorAll("*")].flatMap((el) => [...el.attributes].filter((a) => /^on/i.test(a.name)));
  return doc.getElementsByTagName("script").length + handlers.length;
}

describe("uploaded SVG", () => {
  it("does not let a CDATA section smuggle a script element into the stored file", () => {
    const attack = `<svg xmlns="http://www.w3.org/2000/svg"><text x="1" y="9"><![CDATA[<script>alert(document.domain)</script>]]></text></svg>`;
    const out = sanitiseSvg(attack);
    expect(out).not.toMatch(/<script/i);
    expect(scriptsIn(out)).toBe(0);
  });

  it("keeps drawing, drops script, handlers, foreign content and outside references", () => {
    const out = sanitiseSvg(`<?xml version="1.0"?>
<svg xmlns="http://www.w3.org/2000/svg" xmlns:xlink="http://www.w3.org/1999/xlink" viewBox="0 0 10 10" onload="alert(1)">
  <script><![CDATA[alert(2)]]></script><path d="M0 5 H10" stroke="black"/>
  <defs><linearGradient id="g"><stop offset="0" stop-color="red"/></linearGradient></defs><rect fill="url(#g)" width="2" height="2"/>
  <image href="https://example.test/x.png"/><rect style="fill:url('https://example.test/f')" width="1" height="1"/>
  <foreignObject><div xmlns="http://www.w3.org/1999/xhtml"><img src="x" onerror="alert(3)"/></div></foreignObject>
</svg>`);
    expect(out).toContain('d="M0 5 H10"');
    expect(out).toContain('fill="url(#g)"');
    expect(out).toContain("<linearGradient");
    expect(scriptsIn(out)).toBe(0);
    for (const bad of ["alert", "example.test", "foreignObject", "onerror"]) expect(out).not.toContain(bad);
  });

  it("answers with an XML document that parses on its own, entities escaped", () => {
    const out = sanitiseSvg(`<svg xmlns="http://www.w3.org/2000/svg"><text>R1 &amp; C1 &#160;10k</text></svg>`);
    const { window } = new JSDOM(out, { contentType: "image/svg+xml" });
    expect(window.document.documentElement.localName).toBe("svg");
    expect(window.document.querySelector("text")?.textContent).toBe("R1 & C1 \u00a010k");
  });

  it("refuses what is not an SVG document, and DTDs", () => {
    expect(() => sanitiseSvg("<html><body></body></html>")).toThrow(/root element/);
    expect(() => sanitiseSvg('<!DOCTYPE svg [<!ENTITY a "b">]><svg/>')).toThrow(/DOCTYPE/);
  });
});
