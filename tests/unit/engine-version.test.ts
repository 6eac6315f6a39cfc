import { createHash } from "node:crypto";
import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { ENGINE_VERSION, modelLibraryHash, spiceDeck } from "@/checks";

describe("engine stamps", () => {
  it("hashes the model library over sorted .lib names and bytes (sha256, FIPS 180-4)", () => {
    const dir = mkdtempSync(path.join(os.tmpdir(), "assay-models-"));
    writeFileSync(path.join(dir, "b.lib"), ".model D2 D(is=1e-14)\n");
    writeFileSync(path.join(dir, "a.lib"), ".model D1 D(is=2e-14)\n");
    writeFileSync(path.join(dir, "README.md"), "not a model");
    const expected = createHash("sha256")
      .update("a.lib\0").update(".model D1 D(is=2e-14)\n").update("\0")
      .update("b.lib\0").update(".model D2 D(is=1e-14)\n").update("\0")
      .digest("hex");
    expect(modelLibraryHash(dir)).toBe(expected);
    writeFileSync(path.join(dir, "README.md"), "edited");
    expect(modelLibraryHash(dir)).toBe(expected);
    writeFileSync(path.join(dir, "b.lib"), ".model D2 D(is=3e-14)\n");
    expect(modelLibraryHash(dir)).not.toBe(expected);
    expect(ENGINE_VERSION).toMatch(/^\d+\.\d+\.\d+$/);
  });

  it("writes the SPICE deck as title, .param lines in SI, circuit, .end", () => {
    // Deck layout per DESIGN.md "Block file format"; the first line of a SPICE deck is its title (ngspice manual §2.1).
    const text = readFileSync(path.join(__dirname, "fixtures/rc-lowpass.md"), "utf8");
    const deck = spiceDeck(text, { R: "4.7 kohm" }).split("\n");
    expect(deck.slice(0, 4)).toEqual(["First-order RC low-pass", ".param R=4700", ".param C=2.2e-8", ".param Vs=5"]);
    expect(deck).toContain("R1 in out {R}");
    expect(deck.slice(-2)).toEqual([".end", ""]);
    expect(deck.some((l) => /^\.(ac|tran|op)\b/.test(l))).toBe(false);
  });
});
