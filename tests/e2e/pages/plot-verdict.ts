import type { Page } from "playwright-core";

/** The checks drawn over a block page's transient: the dashed guides and the measured marks, read from the SVG layer. */
export class PlotVerdict {
  constructor(private readonly page: Page) {}

  private layer() {
    return this.page.getByTestId("transient-plot").first().getByTestId("verdict-layer");
  }

  async waitFor(): Promise<void> {
    await this.layer().locator('[data-role="measured"]').first().waitFor({ timeout: 30_000 });
  }

  /** Screen y (px, down is larger) of each guide line of one check, by role. */
  async guides(check: string, role: "band" | "target" | "limit"): Promise<number[]> {
    return this.layer().locator(`line[data-role="${role}"][data-check="${check}"]`).evaluateAll((ls) => ls.map((l) => Number(l.getAttribute("y1"))));
  }

  /** The measured mark of one check: its screen y, its verdict and the colour it is drawn in. */
  async measured(check: string): Promise<{ y: number; status: string; colour: string }> {
    const mark = this.layer().locator(`g[data-role="measured"][data-check="${check}"]`);
    return mark.evaluate((g) => ({
      y: Number(g.getAttribute("data-y")),
      status: g.getAttribute("data-status") ?? "",
      colour: g.querySelector("line")?.getAttribute("stroke") ?? "",
    }));
  }

  legendText(): Promise<string> {
    return this.page.getByTestId("transient-plot").first().getByTestId("plot-legend").innerText();
  }
}
