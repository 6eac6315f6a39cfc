import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { parseBlock, withParams } from "@/checks";

// Rules under test are DESIGN.md "Block file format"; line numbers count from 1 in the file,
// as editors and compilers report them (common practice).
const good = readFileSync(path.join(__dirname, "fixtures/rc-lowpass.md"), "utf8");

function errorsOf(text: string) {
  const { block, errors } = parseBlock(text);
  expect(block).toBeNull();
  return errors;
}
const lineOf = (text: string, needle: string) => text.split("\n").findIndex((l) => l.includes(needle)) + 1;

describe("parseBlock", () => {
  it("reads the example block of the design", () => {
    const { block, errors } = parseBlock(good);
    expect(errors).toEqual([]);
    expect(block!.slug).toBe("rc-lowpass-first-order");
    expect(block!.params.map((p) => [p.name, p.si, p.unit, p.line])).toEqual([
      ["R", 3300, "ohm", 8],
      ["C", 22e-9, "F", 9],
      ["Vs", 5, "V", 10],
    ].map(([n, si, u, l]) => [n, expect.closeTo(si as number, 20), u, l]));
    expect(block!.netlist).toContain("R1 in out {R}");
    expect(block!.script.split("\n")[0]).toBe("fc = 1 / (2 pi R C)");
    expect(block!.note).not.toContain("```");
    expect(block!.scriptLine).toBe(lineOf(good, "fc = 1 / (2 pi R C)"));
  });

  it("names a missing required field", () => {
    const text = good.replace("title: First-order RC low-pass\n", "");
    expect(errorsOf(text)).toContainEqual({ message: 'missing required field "title"', line: 2 });
  });

  it("refuses a value mathjs cannot read, on the value's line", () => {
    const text = good.replace("22 nF", "22 nQ");
    const e = errorsOf(text);
    expect(e).toHaveLength(1);
    expect(e[0].message).toMatch(/parameter "C".*22 nQ/);
    expect(e[0].line).toBe(lineOf(text, "22 nQ"));
  });

  it("refuses a parameter without a value", () => {
    const text = good.replace("{ name: C, value: 22 nF, tol: 5% }", "{ name: C, tol: 5% }");
    expect(errorsOf(text)).toEqual([{ message: 'parameter "C" has no value', line: 9 }]);
  });

  it("refuses duplicate names and names that differ only in case (SPICE ignores case)", () => {
    const dup = good.replace("name: Vs", "name: R");
    expect(errorsOf(dup)).toEqual([{ message: 'duplicate parameter name "R"', line: 10 }]);
    const folded = good.replace("name: Vs", "name: r");
    expect(errorsOf(folded)).toEqual([{ message: 'parameters "R" and "r" differ only in case (SPICE ignores case)', line: 10 }]);
  });

  it("refuses bad tolerances: wrong unit, signed, out of range", () => {
    for (const [tol, pattern] of [
      ["5 V", /is in V, the value in F/],
      ["-5%", /between 0% and 100%|without a sign/],
      ["150%", /between 0% and 100%/],
      ["lots", /not a quantity/],
    ] as const) {
      const text = good.replace("tol: 5%", `tol: ${tol}`);
      const e = errorsOf(text);
      expect(e).toHaveLength(1);
      expect(e[0].message).toMatch(pattern);
      expect(e[0].line).toBe(9);
    }
  });

  it("refuses an unknown category and lists the allowed ones", () => {
    const e = errorsOf(good.replace("category: filter", "category: filtre"));
    expect(e).toEqual([{ message: expect.stringMatching(/unknown category "filtre".*oscillator.*other/), line: 4 }]);
  });

  it("refuses an unknown key, a bad slug, an unknown hazard and a YAML syntax error", () => {
    expect(errorsOf(good.replace("tags:", "tagz:"))).toEqual([{ message: 'unknown frontmatter key "tagz"', line: 5 }]);
    expect(errorsOf(good.replace("slug: rc-lowpass-first-order", "slug: RC_lowpass"))[0]).toMatchObject({ line: 2 });
    expect(errorsOf(good.replace("tags: [anti-alias, passive]", "tags: [a]\nhazard: [lava]"))[0]).toMatchObject({
      message: expect.stringMatching(/unknown hazard "lava"/),
      line: 6,
    });
    const broken = errorsOf(good.replace("tags: [anti-alias, passive]", "tags: [anti-alias, passive"));
    expect(broken).toEqual([{ message: 'the "[" opened on this line is never closed with "]"', line: 5 }]);
  });

  it("needs the frontmatter fences and one script fence", () => {
    expect(errorsOf("no frontmatter")).toEqual([{ message: expect.stringMatching(/must start with a "---"/), line: 1 }]);
    expect(errorsOf("---\nslug: a\n")).toEqual([{ message: expect.stringMatching(/no closing/), line: 1 }]);
    const twice = good + "\n```check\nx = 1\n```\n";
    expect(errorsOf(twice)).toEqual([{ message: "more than one ```check fence", line: lineOf(twice, "x = 1") - 1 }]);
  });
});

describe("withParams", () => {
  it("changes only the values it is given, byte for byte", () => {
    const out = withParams(good, { R: "4.7 kohm" });
    expect(out).toBe(good.replace("value: 3.3 kohm", "value: 4.7 kohm"));
    expect(parseBlock(out).block!.params[0].si).toBe(4700);
  });

  it("quotes a title that YAML would misread and keeps the file parseable", () => {
    const out = withParams(good, {}, { title: "RC: low-pass, #2", slug: "rc-fork" });
    const { block } = parseBlock(out);
    expect(block!.title).toBe("RC: low-pass, #2");
    expect(block!.slug).toBe("rc-fork");
    expect(out.split("\n").slice(4).join("\n")).toBe(good.split("\n").slice(4).join("\n"));
  });

  it("throws for an unknown parameter, an unreadable value and a change of unit", () => {
    expect(() => withParams(good, { X: "1" })).toThrow(/unknown parameter "X"/);
    expect(() => withParams(good, { R: "10k" })).toThrow(/not a quantity mathjs can read/);
    expect(() => withParams(good, { R: "10 nF" })).toThrow(/in ohm/);
  });
});
