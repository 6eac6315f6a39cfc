import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { parseBlock } from "@/checks";

// What makes each file invalid is YAML 1.2 (yaml.org/spec/1.2.2): section numbers beside each case. Line numbers
// count from 1 in the whole block file, the "---" that opens the front matter being line 1 (common practice).
const good = readFileSync(path.join(__dirname, "fixtures/rc-lowpass.md"), "utf8");
const PARAMS = "  - { name: R, value: 3.3 kohm, tol: 1%, note: series resistor }\n";

/** The one error a broken file yields. */
function onlyError(text: string) {
  const { block, errors } = parseBlock(text);
  expect(block).toBeNull();
  expect(errors).toHaveLength(1);
  return errors[0];
}

describe("a block file whose front matter is not YAML", () => {
  it("names the parameter field indented deeper than the line above (§8.2.2 block mappings)", () => {
    const text = good.replace(PARAMS, "  - name: R\n     value: 3.3 kohm\n");
    expect(onlyError(text)).toEqual({ line: 9, message: `the parameter's "value" is indented differently from the line above` });
  });

  it("names the parameter field indented less than the line above (§8.2.1 block sequences)", () => {
    const text = good.replace(PARAMS, "  - name: R\n    value: 3.3 kohm\n   tol: 1%\n");
    expect(onlyError(text)).toEqual({ line: 10, message: `the parameter's "tol" is indented differently from the line above` });
  });

  it("puts an unclosed quote on the line where it opened, not at the end of the front matter (§7.3.1)", () => {
    const text = good.replace("title: First-order RC low-pass", 'title: "First-order RC low-pass');
    expect(onlyError(text)).toEqual({ line: 3, message: "the double quote opened on this line is never closed" });
    const single = good.replace("summary: One-pole", "summary: 'One-pole");
    expect(onlyError(single)).toEqual({ line: 6, message: "the single quote opened on this line is never closed" });
    // An apostrophe on a later line, and an escaped quote inside, do not move the line named.
    const apostrophe = good.replace("title: First-order RC low-pass", "title: 'First-order RC low-pass").replace("One-pole passive", "One-pole filter's");
    expect(onlyError(apostrophe)).toMatchObject({ line: 3 });
    expect(onlyError(good.replace("title: First-order RC low-pass", 'title: "First-order \\" RC'))).toMatchObject({ line: 3 });
    expect(onlyError(good.replace("title: First-order RC low-pass", "title: 'First-order '' RC"))).toMatchObject({ line: 3 });
  });

  it("refuses a tab used to indent (§6.1: tabs are not indentation)", () => {
    const text = good.replace("  - { name: C,", "\t- { name: C,");
    expect(onlyError(text)).toEqual({ line: 9, message: "a tab indents this line; indent with spaces only" });
  });

  it("names a key given twice, on its second line (§3.2.1.1: mapping keys are unique)", () => {
    const text = good.replace("params:\n", "title: Again\nparams:\n");
    expect(onlyError(text)).toEqual({ line: 7, message: `"title" is given a second time; each key may appear once` });
  });

  it("puts an unclosed list on the line that opened it (§7.4.1 flow sequences)", () => {
    const text = good.replace("tags: [anti-alias, passive]", "tags: [anti-alias, passive");
    expect(onlyError(text)).toEqual({ line: 5, message: `the "[" opened on this line is never closed with "]"` });
  });

  it("says a key needs its colon, and a value holding \": \" needs quotes (§7.3.3 plain scalars)", () => {
    expect(onlyError(good.replace("summary: One-pole", "summary One-pole"))).toEqual({ line: 6, message: `this line needs a ":" between the key and its value` });
    expect(onlyError(good.replace("title: First-order RC low-pass", "title: Low-pass: first order"))).toEqual({
      line: 3, message: `this value holds ": " a second time; put the whole value in quotes`,
    });
  });
});
