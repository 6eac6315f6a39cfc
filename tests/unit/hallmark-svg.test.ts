import { XMLParser, XMLValidator } from "fast-xml-parser";
import { describe, expect, it } from "vitest";
import { hallmarkSvg, type BadgeState } from "@/lib/badges/hallmark-svg";

const STATES: BadgeState[] = ["verified", "failing", "pending", "stale", "error", "unchecked"];
const parser = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: "" });

describe("the hallmark SVG", () => {
  it("is well-formed XML in the SVG namespace, with a title and an accessible label, for every state", () => {
    for (const badge of STATES) {
      const svg = hallmarkSvg({ badge, version: 12, approved: true });
      expect(XMLValidator.validate(svg)).toBe(true);
      const root = parser.parse(svg).svg;
      expect(root.xmlns).toBe("http://www.w3.org/2000/svg");
      expect(root["aria-label"]).toBe(`assay ${badge}, version 12, approved`);
      expect(root.title).toBe(`assay ${badge}, version 12, approved`);
    }
  });

  it("holds no script, event handler or external reference", () => {
    for (const badge of STATES) {
      const svg = hallmarkSvg({ badge, version: 3, approved: true });
      expect(svg).not.toMatch(/<script|\son[a-z]+=|href=|<foreignObject|@import/i);
    }
  });

  it("gives each state its own shape or pattern, not only its own colour", () => {
    // Strip colours, then compare: what remains (paths, dashes, hatches, glyphs) must still tell the states apart.
    const shapes = STATES.map((badge) =>
      hallmarkSvg({ badge, version: 1 }).replace(/#[0-9a-f]{6}/gi, "C").replace(new RegExp(badge, "g"), "WORD"),
    );
    expect(new Set(shapes).size).toBe(STATES.length);
  });

  it("adds the seal only when approved and shows the version", () => {
    expect(hallmarkSvg({ badge: "verified", version: 7 })).not.toContain('class="seal"');
    const approved = hallmarkSvg({ badge: "verified", version: 7, approved: true });
    expect(approved).toContain('class="seal"');
    expect(approved).toContain(">v7<");
    const w = (s: string) => Number(parser.parse(s).svg.width);
    expect(w(approved)).toBeGreaterThan(w(hallmarkSvg({ badge: "verified", version: 7 })));
  });

  it("has one width for every state and for one- to three-digit versions, so a column of marks aligns", () => {
    const w = (s: string) => Number(parser.parse(s).svg.width);
    const widths = STATES.flatMap((badge) => [1, 42, 999, null].map((version) => w(hallmarkSvg({ badge, version }))));
    expect(new Set(widths).size).toBe(1);
  });

  it("strikes the seal as a cartouche, not a rayed or scalloped rosette with a tick", () => {
    const seal = hallmarkSvg({ badge: "verified", version: 7, approved: true }).match(/<g class="seal">.*?<\/g>/)![0];
    expect(seal).toMatch(/<rect /);
    expect(seal).not.toMatch(/<path/);
  });

  it("keeps pattern ids apart when several marks share a page", () => {
    expect(hallmarkSvg({ badge: "stale", version: 1, idPrefix: "a" })).toContain('id="a-hatch"');
    expect(hallmarkSvg({ badge: "stale", version: 1, idPrefix: "b" })).toContain("url(#b-hatch)");
  });
});
