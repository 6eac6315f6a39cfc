import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { failure } from "@/lib/actions/form-state";
import { parseOrThrow } from "@/lib/blocks/common";

// A refused save tells the form once: the error, in plain words, goes to the block file's field with its line;
// the message under the form only says where to look (tabs are not YAML indentation: YAML 1.2 §6.1).
const good = readFileSync(path.join(__dirname, "fixtures/rc-lowpass.md"), "utf8");

const refusal = (text: string) => {
  try {
    parseOrThrow(text);
  } catch (e) {
    return failure(e);
  }
  throw new Error("the file was accepted");
};

describe("a block file refused for its front matter, as a form shows it", () => {
  it("lists the error once at its line, and the message does not repeat it", () => {
    const state = refusal(good.replace("  - { name: C,", "\t- { name: C,"));
    expect(state.lines).toEqual([{ message: "a tab indents this line; indent with spaces only", line: 9 }]);
    expect(state.message).toBe("Nothing was saved: the block file needs a fix at line 9; the rest is kept as you typed it.");
    expect(state.ok).toBe(false);
  });
});
