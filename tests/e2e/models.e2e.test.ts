import { readFileSync } from "node:fs";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Page } from "playwright-core";
import { ModelPage } from "./pages/model-page";
import { SignInPage } from "./pages/sign-in-page";
import { assertNoFrameworkError, launch, shot, watchErrors } from "./support/browser";

// An author uploads a new version of the team's diode model: the page names the block it will verify again before
// the upload, says so after it, and shows the change between the two versions.
let close: () => Promise<void>;
let page: Page;
let errors: string[];

beforeAll(async () => {
  ({ page, close } = await launch(inject("appUrl")));
  errors = watchErrors(page);
});
afterAll(async () => { await close?.(); });

describe("team model files in a browser", () => {
  it("uploads a model, names the blocks it will reverify, and opens the version diff", async () => {
    await new SignInPage(page).signIn("nadia.okafor@fenwick.test");
    const model = new ModelPage(page);
    await model.open("fenwick", "fwk-d1s.lib");
    await assertNoFrameworkError(page);
    expect(await model.willReverify()).toBe("Uploading verifies again: diode-vf-fwk-d1s.");
    const v1 = readFileSync("content/team/fenwick/models/fwk-d1s.lib", "utf8");
    const v2 = v1.replace("RS=0.412", "RS=0.398");
    expect(await model.upload(v2, "RS from the lot 2311 sweep")).toMatch(/^Version 2 stored \(sha256 [0-9a-f]{12}…\)\. Reverifying: diode-vf-fwk-d1s\.$/);
    await model.open("fenwick", "fwk-d1s.lib");
    const diff = await model.openDiff(1, 2);
    expect(diff).toContain("removed: .MODEL DFWK1S D(IS=4.35N N=1.906 RS=0.412");
    expect(diff).toContain("added: .MODEL DFWK1S D(IS=4.35N N=1.906 RS=0.398");
    await shot(page, "models-diff");
    expect(errors).toEqual([]);
  });
});
