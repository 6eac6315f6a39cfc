import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Page } from "playwright-core";
import { BlockPage } from "./pages/block-page";
import { EditPage } from "./pages/edit-page";
import { ImportPage } from "./pages/import-page";
import { LibraryPage } from "./pages/library-page";
import { RetunePage } from "./pages/retune-page";
import { ReviewsPage } from "./pages/reviews-page";
import { SignInPage } from "./pages/sign-in-page";
import { assertNoFrameworkError, launch, shot, watchErrors } from "./support/browser";

// One story through the library, in order: each step builds on the block the one before made.
const FORK = "opamp-soft-limiter-e2e";
const COLLEAGUE_FORK = "sallen-key-lowpass-unity-tomas";
// A 1 x 1 PNG, the smallest schematic there is.
const PNG_1PX = Buffer.from("iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==", "base64");
let close: () => Promise<void>;
let page: Page;
let errors: string[];

async function settle(p: Page, name: string, errs: string[]) {
  await p.waitForLoadState("networkidle").catch(() => undefined);
  await assertNoFrameworkError(p);
  await shot(p, name);
  expect(errs, `console errors on ${name}`).toEqual([]);
}

beforeAll(async () => {
  ({ page, close } = await launch(inject("appUrl")));
  errors = watchErrors(page);
});

afterAll(async () => {
  await close?.();
});

describe("the library in a browser", () => {
  it("signs in as an author", async () => {
    await new SignInPage(page).signIn("nadia.okafor@fenwick.test");
    await settle(page, "01-library-signed-in", errors);
  });

  it("asks the server once per settled keystroke: the API search, never the page again", async () => {
    const library = new LibraryPage(page);
    await library.open();
    await page.waitForLoadState("networkidle").catch(() => undefined);
    const seen: string[] = [];
    const count = (r: { url: () => string }) => {
      const path = new URL(r.url()).pathname;
      if (path === "/api/v1/blocks") seen.push("search");
      else if (path === "/") seen.push("page");
    };
    page.on("request", count);
    const box = page.getByLabel("Search blocks");
    // Each key waits past the 200 ms debounce, so every key is a search of its own.
    for (const key of "wien") {
      await box.press(key);
      await page.waitForTimeout(500);
    }
    await library.resultLink(/Wien/).first().waitFor({ timeout: 30_000 });
    await page.waitForLoadState("networkidle").catch(() => undefined);
    page.off("request", count);
    expect(seen).toEqual(["search", "search", "search", "search"]);
    expect(new URL(page.url()).search).toBe("?q=wien");
  });

  it("finds the limiter despite a typo and opens the verified block", async () => {
    const library = new LibraryPage(page);
    await library.open();
    await library.search("limitr");
    const link = library.resultLink(/Soft limiter/);
    await link.waitFor({ timeout: 30_000 });
    await settle(page, "02-library-search-typo", errors);
    // Matched words are highlighted in the results.
    await library.search("limiter");
    await page.getByRole("table", { name: "Search results" }).locator("mark", { hasText: /limiter/i }).first().waitFor({ timeout: 15_000 });
    await link.click();
    await page.waitForURL("**/blocks/opamp-soft-limiter");
    const block = new BlockPage(page);
    await block.waitForBadge("verified");
    // KaTeX rendered the note's math; the checks read as sentences; uPlot drew the stored waveforms.
    expect(await page.getByTestId("note").locator(".katex").count()).toBeGreaterThan(2);
    expect(await block.checks().count()).toBe(6);
    await expect(block.checks().first().textContent()).resolves.toMatch(/passes/);
    await page.getByTestId("plot").first().locator("canvas").waitFor({ timeout: 15_000 });
    await settle(page, "03-block-verified", errors);
  });

  it("forks with a higher gain: the live preview shows the failing check before saving, the badge turns failing", async () => {
    const block = new BlockPage(page);
    await block.open("opamp-soft-limiter");
    await block.fork();
    const retune = new RetunePage(page);
    await retune.setParam("Rf", "150 kohm");
    await retune.waitForPreviewCheck("fail", "small-signal gain 10 +/- 3% at every corner");
    // Values are typeset with SI prefixes and the ohm sign, never the engine's "Mohm"/"kohm" (common practice).
    const quantities = page.getByTestId("live-preview").getByTestId("quantity-list");
    await expect(quantities.locator("[data-quantity=r_pair]").textContent()).resolves.toMatch(/^\s*7\.755 MΩ$/);
    await expect(quantities.textContent()).resolves.not.toMatch(/ohm/);
    await settle(page, "04-fork-preview-failing", errors);
    await retune.saveAsFork(FORK);
    expect(["pending", "failing"]).toContain(await block.badge());
    await settle(page, "05-fork-pending", errors);
    await block.waitForBadge("failing");
    await settle(page, "06-fork-failing", errors);
  });

  it("retunes with the assistant back to passing", async () => {
    const block = new BlockPage(page);
    await block.open(FORK);
    await block.fork();
    const retune = new RetunePage(page);
    // G_ss = -Rf/Ri with Ri = 10 kohm: the gain of -10 asks for Rf = 100 kohm, an E24 value.
    const used = await retune.retune("Rf", "G_ss", "-10", "E24");
    expect(used).toMatch(/100 kohm|100 kΩ|100000/);
    await retune.waitForPreviewCheck("pass", "small-signal gain 10 +/- 3% at every corner");
    await settle(page, "07-retune-assistant", errors);
    await retune.saveAsVersion(FORK, "gain back to 10 with the retune assistant");
    await block.waitForBadge("verified");
    await page.getByRole("button", { name: "Request sign-off" }).click();
    await page.getByText("Sign-off requested from the team's maintainers.").waitFor();
    await settle(page, "08-fork-retuned-verified", errors);
  });

  it("approves the retuned version as a maintainer", async () => {
    const { page: reviewer, close: closeReviewer } = await launch(inject("appUrl"));
    const reviewerErrors = watchErrors(reviewer);
    await new SignInPage(reviewer).signIn("tomas.reyes@fenwick.test");
    const reviews = new ReviewsPage(reviewer);
    await reviews.open();
    // The entry shows v2's checks and, since the fork was never approved, every parameter as new.
    const entry = reviews.entry(FORK, 2);
    await expect(entry.getByTestId("check-list").locator("li").count()).resolves.toBe(6);
    await expect(entry.getByTestId("check-list").textContent()).resolves.toMatch(/small-signal gain 10 \+\/- 3% at every corner\s*passes/);
    await expect(entry.getByTestId("review-changes").locator("h3").textContent()).resolves.toMatch(/No approved version yet/);
    await expect(entry.locator("tr[data-param=Rf] td").last().textContent()).resolves.toMatch(/^(100 kΩ|100000\b)/);
    // Six passing checks fold behind their tally.
    await expect(entry.locator("summary").first().textContent()).resolves.toBe("6 checks: 6 pass");
    await settle(reviewer, "09-review-queue", reviewerErrors);
    await reviewer.setViewportSize({ width: 390, height: 844 });
    await settle(reviewer, "09a-review-queue-narrow", reviewerErrors);
    await reviewer.setViewportSize({ width: 1366, height: 900 });
    await reviews.approve(FORK, 2, "Gain and limiting agree with the hand analysis.");
    await new BlockPage(reviewer).open(FORK);
    await expect(reviewer.getByTestId("block-badge").locator("svg").getAttribute("aria-label")).resolves.toMatch(/approved/);
    await settle(reviewer, "10-block-approved", reviewerErrors);
    await closeReviewer();
  });

  it("offers an author Revise (edit) on a block they wrote, not on a colleague's", async () => {
    // Tomas (maintainer) forks a block; Nadia (author) may fork his fork but not edit it (lib/auth/permissions.ts).
    const { page: colleague, close: closeColleague } = await launch(inject("appUrl"));
    await new SignInPage(colleague).signIn("tomas.reyes@fenwick.test");
    const theirs = new BlockPage(colleague);
    await theirs.open("sallen-key-lowpass-unity");
    await theirs.fork();
    await new RetunePage(colleague).saveAsFork(COLLEAGUE_FORK);
    await closeColleague();
    const block = new BlockPage(page);
    await block.open(COLLEAGUE_FORK);
    await page.getByRole("link", { name: "Derive a variant" }).waitFor();
    expect(await page.getByRole("link", { name: "Revise" }).count()).toBe(0);
    await settle(page, "10b-colleague-block-no-edit", errors);
    await block.open("opamp-soft-limiter");
    await page.getByRole("link", { name: "Revise" }).waitFor();
  });

  it("compares the two versions and lists the runs", async () => {
    await page.goto(`/blocks/${FORK}/compare?a=1&b=2`);
    await page.getByRole("cell", { name: "Rf" }).or(page.getByRole("rowheader", { name: "Rf" })).first().waitFor();
    await settle(page, "11-compare", errors);
    await page.goto(`/blocks/${FORK}/runs`);
    expect(await page.getByTestId("run-history").getByTestId("run-entry").count()).toBeGreaterThanOrEqual(2);
    await settle(page, "12-runs", errors);
  });

  it("edits the block file with the engine's errors shown at their lines before saving", async () => {
    await page.goto(`/blocks/${FORK}/edit`);
    const editor = page.getByLabel("Block file");
    const text = await editor.inputValue();
    await editor.fill(text.replace(/^category: .*$/m, "category: teapot"));
    const shown = page.getByTestId("editor-errors");
    await shown.waitFor({ timeout: 30_000 });
    await expect(shown.textContent()).resolves.toMatch(/Line 4/);
    await settle(page, "13-edit-line-errors", errors);
    // Front matter that is not YAML: one plain sentence at the line where the quote opened, listed once at the file,
    // and still once after a refused save, which keeps the message typed (YAML 1.2 §7.3.1 double-quoted scalars).
    const titleLine = text.split("\n").findIndex((l) => l.startsWith("title:")) + 1;
    await editor.fill(text.replace(/^title: (.*)$/m, 'title: "$1'));
    await shown.getByText(`Line ${titleLine}: the double quote opened on this line is never closed`).waitFor({ timeout: 30_000 });
    await expect(shown.locator("li").count()).resolves.toBe(1);
    await page.getByLabel("Message").fill("quote the title");
    await page.getByRole("button", { name: /^Save as v\d+$/ }).click();
    const status = page.locator("#editor-status");
    await status.getByRole("alert").waitFor({ timeout: 30_000 });
    await expect(status.textContent()).resolves.toBe(`Nothing was saved: the block file needs a fix at line ${titleLine}; the rest is kept as you typed it.`);
    await expect(shown.locator("li").count()).resolves.toBe(1);
    await expect(page.getByLabel("Message").inputValue()).resolves.toBe("quote the title");
    await settle(page, "13b-edit-yaml-error", errors);
  });

  it("attaches a schematic from the block page, refusing a file over 1 MiB first", async () => {
    await new BlockPage(page).open(FORK);
    await page.waitForLoadState("networkidle");
    const form = page.getByTestId("attachment-form");
    const file = form.getByLabel(/Schematic image/);
    await file.setInputFiles({ name: "big.png", mimeType: "image/png", buffer: Buffer.concat([PNG_1PX, Buffer.alloc(1024 * 1024)]) });
    await form.getByText("the limit is 1 MiB").waitFor();
    await expect(form.getByRole("button", { name: "Attach" }).isDisabled()).resolves.toBe(true);
    await file.setInputFiles({ name: "Limiter Schematic.PNG", mimeType: "image/png", buffer: PNG_1PX });
    await form.getByRole("button", { name: "Attach" }).click();
    await form.getByText("Attached limiter-schematic.png").waitFor({ timeout: 30_000 });
    await expect(page.getByTestId("attachment-list").textContent()).resolves.toContain("![schematic](limiter-schematic.png)");
    const served = await page.request.get(`/blocks/${FORK}/attachments/limiter-schematic.png`);
    expect(served.status()).toBe(200);
    expect(served.headers()["content-type"]).toBe("image/png");
    await settle(page, "13a-attachment", errors);
  });

  it("refuses the second of two edits from the same base and links to the newer version", async () => {
    const first = new EditPage(page);
    await first.open(FORK);
    const base = Number((await page.getByRole("button", { name: /^Save as v\d+$/ }).textContent())!.replace(/\D/g, "")) - 1;
    const otherTab = await page.context().newPage();
    const otherErrors = watchErrors(otherTab);
    const second = new EditPage(otherTab);
    await second.open(FORK);
    await first.changeSummary("A soft limiter, summary edited in the first tab.");
    await second.changeSummary("A soft limiter, summary edited in the second tab.");
    await first.save();
    await page.waitForURL(`**/blocks/${FORK}`);
    await second.save();
    const status = second.status();
    await status.getByRole("alert").waitFor({ timeout: 30_000 });
    await expect(status.textContent()).resolves.toContain(`saved v${base + 1} while you were editing v${base}`);
    const newer = status.getByRole("link", { name: `Read v${base + 1}` });
    await expect(newer.getAttribute("href")).resolves.toBe(`/blocks/${FORK}/versions/${base + 1}`);
    // The refused text stays in the editor, nothing lost.
    await expect(otherTab.getByLabel("Block file").inputValue()).resolves.toContain("edited in the second tab");
    await settle(otherTab, "13b-edit-stale-base", otherErrors);
    await newer.click();
    await otherTab.waitForURL(`**/blocks/${FORK}/versions/${base + 1}`);
    await otherTab.getByText("summary edited in the first tab", { exact: false }).first().waitFor({ timeout: 30_000 });
    await otherTab.close();
  });

  it("searches and opens a block with the keyboard alone", async () => {
    await new BlockPage(page).open("mains-bias-rail-5v1");
    await page.locator("body").focus();
    const box = page.locator("#header-q");
    for (let i = 0; i < 20 && !(await box.evaluate((el) => el === document.activeElement)); i++) await page.keyboard.press("Tab");
    await expect(box.evaluate((el) => el === document.activeElement)).resolves.toBe(true);
    await page.keyboard.type("wien");
    await page.keyboard.press("Enter");
    await page.waitForURL("**/?q=wien");
    const library = page.locator("#library-q");
    for (let i = 0; i < 20 && !(await library.evaluate((el) => el === document.activeElement)); i++) await page.keyboard.press("Tab");
    await expect(library.inputValue()).resolves.toBe("wien");
    const result = new LibraryPage(page).resultLink(/Wien/).first();
    await result.waitFor({ timeout: 30_000 });
    await page.keyboard.press("ArrowDown");
    await expect(result.evaluate((el) => el === document.activeElement)).resolves.toBe(true);
    const href = await result.getAttribute("href");
    await settle(page, "13c-keyboard-search", errors);
    await page.keyboard.press("Enter");
    await page.waitForURL(`**${href}`);
    await page.getByRole("heading", { level: 1, name: /Wien/ }).waitFor();
  });

  it("imports a SPICE netlist, listing the dropped lines", async () => {
    const imp = new ImportPage(page);
    await imp.open();
    const netlist = "* RC divider from the bench\n.param R1v=4.7k\n.param C1v=10n\nV1 in 0 AC 1\nR1 in out {R1v}\nC1 out 0 {C1v}\n.ac dec 10 10 1meg\n.control\nrun\n.endc\n.end\n";
    await imp.read({ name: "rc-divider-e2e.cir", mimeType: "text/plain", buffer: Buffer.from(netlist) });
    await expect(imp.droppedLines().textContent()).resolves.toContain(".control");
    await settle(page, "14-import-netlist", errors);
    // A title with an unclosed quote is refused once, at the block file with its line, and the text is kept
    // (YAML 1.2 §7.3.1 double-quoted scalars).
    const converted = await imp.blockText();
    const titleLine = converted.split("\n").findIndex((l) => l.startsWith("title:")) + 1;
    const broken = converted.replace(/^title: (.*)$/m, 'title: "$1');
    await page.locator("#import-text").fill(broken);
    await page.getByRole("button", { name: "Create the block" }).click();
    await page.locator("#create-status [role=alert]").waitFor({ timeout: 30_000 });
    const refusal = page.locator("#import-text-errors li");
    await expect(refusal.allTextContents()).resolves.toEqual([`Line ${titleLine}: the double quote opened on this line is never closed`]);
    await expect(imp.blockText()).resolves.toBe(broken);
    await settle(page, "14a-import-yaml-error", errors);
    await page.locator("#import-text").fill(converted);
    // The refusal's alert stays up until this create answers, so wait for the block page itself.
    await page.getByRole("button", { name: "Create the block" }).click();
    await page.waitForURL("**/blocks/rc-divider-e2e", { timeout: 60_000 });
    await expect(page.getByTestId("param-table").textContent()).resolves.toContain("R1v");
    await settle(page, "15-imported-block", errors);
  });

  it("renders neither a script tag nor a javascript: link from a note", async () => {
    const imp = new ImportPage(page);
    await imp.open();
    const file = [
      "---", "slug: note-injection-e2e", "title: A note that tries to run script", "category: other", "tags: [test]",
      "summary: Checks that notes are sanitised.", "params:", "  - { name: R, value: 1 kohm, tol: 1% }", "---",
      "Plain words and $R = 1\\,\\mathrm{k\\Omega}$.", "", "<script>window.__noteScriptRan = true</script>", "",
      "A [dangerous link](javascript:window.__noteLinkRan=true) and <img src=x onerror=\"window.__noteImgRan=true\">.", "",
      "![the test resistor](schematic.png)", "",
      "```spice", "R1 a 0 {R}", "V1 a 0 1", "```", "", "```check", "I = 1 V / R", "check(\"current is 1 mA\", near(I, 1 mA, 2%))", "```", "",
    ].join("\n");
    await imp.read({ name: "note-injection-e2e.md", mimeType: "text/markdown", buffer: Buffer.from(file) });
    await page.getByLabel(/Schematic images/).setInputFiles({ name: "schematic.png", mimeType: "image/png", buffer: PNG_1PX });
    await imp.create("note-injection-e2e");
    const note = page.getByTestId("note");
    await note.locator(".katex").first().waitFor();
    expect(await note.locator("script").count()).toBe(0);
    expect(await note.locator('a[href^="javascript:"]').count()).toBe(0);
    expect(await note.locator("[onerror]").count()).toBe(0);
    expect(await note.getByText("dangerous link").count()).toBe(1);
    const ran = await page.evaluate(() => {
      const w = window as unknown as Record<string, unknown>;
      return [w.__noteScriptRan, w.__noteLinkRan, w.__noteImgRan];
    });
    expect(ran).toEqual([undefined, undefined, undefined]);
    // The one image the note may show is its own attachment, served by the app.
    const img = note.locator("img");
    expect(await img.count()).toBe(1);
    await expect(img.getAttribute("src")).resolves.toBe("/blocks/note-injection-e2e/attachments/schematic.png");
    await page.waitForFunction(() => (document.querySelector("[data-testid=note] img") as HTMLImageElement | null)?.naturalWidth === 1);
    await settle(page, "16-note-sanitised", errors);
  });

  it("shows cautions on a block that works from the mains", async () => {
    await new BlockPage(page).open("mains-bias-rail-5v1");
    const caution = page.getByTestId("hazard");
    await expect(caution.textContent()).resolves.toMatch(/local electrical codes/);
    await settle(page, "17-hazard-cautions", errors);
  });

  it("holds up on a narrow screen", async () => {
    const { page: phone, close: closePhone } = await launch(inject("appUrl"), 390);
    const phoneErrors = watchErrors(phone);
    await phone.goto("/blocks/opamp-soft-limiter");
    const overflow = await phone.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
    expect(overflow).toBeLessThanOrEqual(1);
    await settle(phone, "18-block-narrow", phoneErrors);
    await closePhone();
  });
});
