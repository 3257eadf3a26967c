import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { DESKTOP, PHONE, SignInPage, launchBrowser, newContext, saveScreenshot } from "./browser";

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

/** Page object of a dynamic gauge's page: the demo's footbridge deck stringer DK-V1, fed by bursts. */
class DynamicGaugePage {
  constructor(private readonly page: Page) {}
  open() {
    return this.page.goto("/structures/MILL-FB/gauges/DK-V1");
  }
  viewer() {
    return this.page.getByTestId("waveform-viewer");
  }
  eventRows() {
    return this.page.getByTestId("event-row");
  }
  /** What the waveform chart drew over the samples: trigger line and peak marker, from its data attribute. */
  async overlays(): Promise<{ trigger: { value: number; y: number }; peak: { value: number; x: number; y: number } }> {
    const root = this.viewer().locator(".uplot");
    await expect.poll(() => root.getAttribute("data-overlays")).not.toBeNull();
    return JSON.parse((await root.getAttribute("data-overlays"))!);
  }
}

describe("a dynamic gauge's page", () => {
  for (const [name, viewport] of [
    ["desktop", DESKTOP],
    ["phone", PHONE],
  ] as const) {
    it(`shows the summaries, the events and the chosen event's waveform with trigger and peak (${name})`, async () => {
      const page = await (await newContext(browser, viewport)).newPage();
      await new SignInPage(page).signInAs("owner");
      const gauge = new DynamicGaugePage(page);
      await gauge.open();
      await expect.poll(() => page.getByLabel("Summary envelope chart").locator("canvas").count()).toBeGreaterThan(0);
      await expect.poll(() => gauge.eventRows().count()).toBeGreaterThan(0);
      const facts = gauge.viewer().getByTestId("event-facts");
      await expect.poll(() => facts.textContent()).toMatch(/peak -?\d+\.\d MPa at \d{4}-\d{2}-\d{2} \d{2}:\d{2}:\d{2}\.\d{3} (GMT|BST)/);
      expect(await facts.textContent()).toMatch(/at 100 Hz · .* trigger (above 14\.0|below -14\.0) MPa/);
      const drawn = await gauge.overlays();
      // The demo's trigger is ±14 MPa; the peak lies beyond it, on the same side, and is drawn beyond the line.
      expect(Math.abs(drawn.trigger.value)).toBe(14);
      expect(Math.abs(drawn.peak.value)).toBeGreaterThan(14);
      expect(Math.sign(drawn.peak.value)).toBe(Math.sign(drawn.trigger.value));
      expect(drawn.trigger.value > 0 ? drawn.peak.y < drawn.trigger.y : drawn.peak.y > drawn.trigger.y).toBe(true);
      // An owner reads the label but may not change it.
      await expect.poll(() => gauge.viewer().getByText(/^Label:/).count()).toBe(1);
      expect(await gauge.viewer().getByLabel("What was it?").count()).toBe(0);
      await saveScreenshot(page, `dynamic-gauge-${name}`);
      await page.context().close();
    });
  }

  it("lets an engineer choose another event and label it, and says so in the list", async () => {
    const page = await (await newContext(browser, DESKTOP)).newPage();
    await new SignInPage(page).signInAs("engineer");
    const gauge = new DynamicGaugePage(page);
    await gauge.open();
    await expect.poll(() => gauge.eventRows().count()).toBeGreaterThan(1);
    const second = gauge.eventRows().nth(1);
    await second.getByRole("button").click();
    await expect.poll(() => second.getByRole("button").getAttribute("aria-pressed")).toBe("true");
    await gauge.viewer().getByLabel("What was it?").fill("group crossing in step");
    await gauge.viewer().getByRole("button", { name: "Save label" }).click();
    await expect.poll(() => second.textContent()).toContain("group crossing in step");
    await page.context().close();
  });

  it("shows fatigue from the bursts with the equivalent range beside the category and damage per day", async () => {
    const page = await (await newContext(browser, PHONE)).newPage();
    await new SignInPage(page).signInAs("engineer");
    await page.goto("/structures/MILL-FB/gauges/DK-V1/fatigue");
    await expect.poll(() => page.getByTestId("fatigue-source").textContent()).toMatch(/dynamic channel/);
    expect(await page.getByTestId("fatigue-figures").textContent()).toMatch(/Equivalent range Δσ_E\d+(\.\d)? MPa.*Δσ_C = 71 MPa/);
    await expect.poll(() => page.getByTestId("damage-per-day").locator("rect").count()).toBeGreaterThanOrEqual(3);
    await page.context().close();
  });
});
