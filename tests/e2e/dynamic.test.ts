import { createClient } from "@libsql/client";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
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
  async overlays(): Promise<{ unit: string; trigger: { value: number; y: number }; peak: { value: number; x: number; y: number } }> {
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

/** A limit alert of the demo's DK-V1 opened by a sample inside a captured event, and that event. */
async function alertInsideEvent(): Promise<{ alertId: number; eventId: number }> {
  const client = createClient({ url: inject("databaseUrl") });
  const found = await client.execute(
    `SELECT a.id AS alert_id, e.id AS event_id FROM alerts a
       JOIN gauges g ON g.id = a.gauge_id JOIN structures s ON s.id = g.structure_id
       JOIN dynamic_events e ON e.gauge_id = g.id AND e.start < a.opened_at + 1 AND e."end" >= a.opened_at
     WHERE s.code = 'MILL-FB' AND g.tag = 'DK-V1' AND a.kind = 'limit' ORDER BY a.opened_at DESC, e.start DESC LIMIT 1`,
  );
  client.close();
  expect(found.rows, "the demo's DK-V1 peaks beyond its ±15 MPa watch limit inside events").toHaveLength(1);
  return { alertId: Number(found.rows[0]!.alert_id), eventId: Number(found.rows[0]!.event_id) };
}

describe("an alert raised by a burst", () => {
  for (const [name, viewport] of [
    ["desktop", DESKTOP],
    ["phone", PHONE],
  ] as const) {
    it(`links to the waveform that opened it, and the waveform links back (${name})`, async () => {
      const { alertId, eventId } = await alertInsideEvent();
      const page = await (await newContext(browser, viewport)).newPage();
      await new SignInPage(page).signInAs("owner");
      await page.goto(`/alerts/${alertId}`);
      const toWaveform = page.getByTestId("alert-waveforms").getByRole("link", { name: `Waveform of event ${eventId}` });
      await toWaveform.click();
      await page.waitForURL((url) => url.pathname === "/structures/MILL-FB/gauges/DK-V1" && url.searchParams.get("event") === String(eventId));
      const viewer = new DynamicGaugePage(page).viewer();
      await viewer.getByRole("heading", { name: `Event ${eventId} on DK-V1` }).waitFor();
      await saveScreenshot(page, `alert-waveform-${name}`);
      const back = viewer.getByTestId("event-alerts").getByRole("link", { name: new RegExp(`alert ${alertId}$`) });
      await back.click();
      await page.waitForURL((url) => url.pathname === `/alerts/${alertId}`);
      await page.getByTestId("alert-waveforms").waitFor();
      await page.context().close();
    });
  }
});

describe("a dynamic gauge in US units", () => {
  it("draws and writes the summaries and the waveform in ksi, converting the API's MPa", async () => {
    // The technician switches units here, so no other browser test reading MPa as this person is disturbed.
    const page = await (await newContext(browser, DESKTOP)).newPage();
    await new SignInPage(page).signInAs("technician");
    const gauge = new DynamicGaugePage(page);
    await gauge.open();
    try {
      await page.getByLabel("Units", { exact: true }).selectOption("us");
      await page.getByRole("heading", { name: /^Stress per interval \(ksi/ }).waitFor();
      const facts = gauge.viewer().getByTestId("event-facts");
      // The demo's trigger of 14 MPa is 14 / 6.894757 = 2.03 ksi (NIST SP 811, Appendix B: 1 ksi = 6.894757 MPa).
      await expect.poll(() => facts.textContent()).toMatch(/trigger (above 2\.03|below -2\.03) ksi/);
      expect(await facts.textContent()).toMatch(/peak -?\d+\.\d{2} ksi at/);
      expect(await gauge.eventRows().first().textContent()).toMatch(/-?\d+\.\d{2} ksi \((above 2\.03|below -2\.03) ksi\)/);
      const drawn = await expect.poll(async () => (await gauge.overlays()).unit).toBe("ksi").then(() => gauge.overlays());
      expect(Math.abs(drawn.trigger.value)).toBeCloseTo(14 / 6.894757, 6);
      await saveScreenshot(page, "dynamic-gauge-us");
    } finally {
      await page.getByLabel("Units", { exact: true }).selectOption("si");
      await page.getByRole("heading", { name: /^Stress per interval \(MPa/ }).waitFor();
      await page.context().close();
    }
  });
});
