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

// Synthetic physics made here: a restrained member whose stress-producing strain follows its own
// temperature, three hours behind the air's: ε = a + b·T(t − 3 h), with a small deterministic noise.
const MINUTE = 60_000;
const DAY = 24 * 60 * MINUTE;
const INTERVAL = 10 * MINUTE;
const A = 30; // µε
const B = -9.6; // µε/°C
const LAG_MINUTES = 180;
const air = (time: number) => 16 + 6 * Math.sin((2 * Math.PI * time) / DAY) + 2 * Math.sin((2 * Math.PI * time) / (5.3 * DAY));

function readings(tag: string, end: number) {
  let state = 4242;
  const out = [];
  for (let time = end - 14 * DAY; time <= end; time += INTERVAL) {
    state = (state * 1103515245 + 12345) % 2147483648;
    const value = A + B * air(time - LAG_MINUTES * MINUTE) + (state / 2147483648 - 0.5);
    out.push({ gauge: tag, time: new Date(time).toISOString(), value: Number(value.toFixed(3)), temperature: Number(air(time).toFixed(2)) });
  }
  return out;
}

/** A microstrain gauge on MILL-FB with two weeks of readings, made through the API as the signed-in engineer. */
async function gaugeWithReadings(page: Page, tag: string) {
  const created = await page.request.post("/api/v1/structures/MILL-FB/gauges", {
    data: { tag, label: "Tie beam, restrained at both ends", kind: "foil", input: "microstrain", gaugeFactor: 2.1, material: { E: 200000, nu: 0.3, alpha: 12, yield: 355 }, zero: { value: 0, temperature: 16, time: new Date(Date.now() - 20 * DAY).toISOString() } },
  });
  expect(created.status()).toBe(201);
  const sent = await page.request.post("/api/v1/structures/MILL-FB/readings", { data: { readings: readings(tag, Math.floor(Date.now() / INTERVAL) * INTERVAL - INTERVAL) } });
  expect(sent.status()).toBe(200);
  expect(((await sent.json()) as { accepted: number }).accepted).toBeGreaterThan(2000);
}

/** Page object of a gauge's thermal-model editor. */
class ThermalPage {
  constructor(private readonly page: Page) {}
  async open(tag: string) {
    await this.page.goto(`/structures/MILL-FB/gauges/${tag}`);
    await this.page.getByRole("link", { name: "Thermal model" }).click();
    await this.page.getByRole("heading", { name: `Thermal model of ${tag}` }).waitFor();
  }
  fit() {
    return this.page.getByRole("button", { name: "Fit", exact: true }).click();
  }
  figure(label: string) {
    return this.page.getByTestId(`fit-${label}`).innerText();
  }
  /** What the scatter drew: the fitted line's coefficients and its point count, from the chart's data attribute. */
  async fittedLine() {
    const chart = this.page.locator("[data-testid=thermal-scatter-fit] .uplot");
    await chart.waitFor();
    return JSON.parse((await chart.getAttribute("data-fitted-line")) ?? "null") as { slope: number; intercept: number; points: number };
  }
}

describe("the thermal-model editor", () => {
  it("fits on a desktop: best-fit lag, coefficient with units, scatter with the fitted line; saved, the gauge page charts the residual with its ±2σ band", async () => {
    const page = await (await newContext(browser, DESKTOP)).newPage();
    await new SignInPage(page).signInAs("engineer");
    await gaugeWithReadings(page, "E2E-TH1");
    const editor = new ThermalPage(page);
    await editor.open("E2E-TH1");
    await expect(page.getByText("A thermal model is a statistical fit").isVisible()).resolves.toBe(true);
    await expect(page.getByText("engineering judgement").first().isVisible()).resolves.toBe(true);
    await editor.fit();
    await page.getByTestId("thermal-fit").waitFor();
    const lag = await editor.figure("Lag");
    const slope = await editor.figure("Thermal coefficient b");
    console.info(`thermal editor (desktop): lag ${lag}, coefficient ${slope}, R² ${await editor.figure("R²")}, σ ${await editor.figure("Residual σ")}`);
    expect(lag).toBe(`3.00 h (${LAG_MINUTES} min)`);
    expect(Number.parseFloat(slope)).toBeCloseTo(B, 1);
    expect(slope).toMatch(/µε\/°C$/);
    const line = await editor.fittedLine();
    expect(line.slope).toBeCloseTo(B, 1);
    expect(line.points).toBeGreaterThan(1000);
    await saveScreenshot(page, "thermal-editor-desktop");

    await page.getByRole("button", { name: "Save as the gauge's model" }).click();
    await page.getByText("Saved. The residual of every stored reading was recomputed").waitFor();
    await page.getByRole("heading", { name: /Model in force, saved by/ }).waitFor();

    await page.goto("/structures/MILL-FB/gauges/E2E-TH1");
    const residualChart = page.getByRole("region", { name: "Thermal residual chart" });
    await residualChart.locator(".uplot").waitFor();
    const band = JSON.parse((await residualChart.locator(".uplot").getAttribute("data-band")) ?? "null") as { low: number; high: number; drawn: boolean };
    expect(band.drawn).toBe(true);
    // σ of uniform ±0.5 µε noise is 1/√12 = 0.29 µε: the band is ±2σ ≈ ±0.58 µε.
    expect(band.high).toBeGreaterThan(0.45);
    expect(band.high).toBeLessThan(0.7);
    expect(band.low).toBeCloseTo(-band.high, 6);
    await saveScreenshot(page, "thermal-residual-desktop");
  });

  it("on a phone says what to fix for a lag longer than the period, then fits", async () => {
    const page = await (await newContext(browser, PHONE)).newPage();
    await new SignInPage(page).signInAs("engineer");
    await gaugeWithReadings(page, "E2E-TH2");
    const editor = new ThermalPage(page);
    await editor.open("E2E-TH2");
    await page.getByText("No thermal model yet").waitFor();
    // One day of period and a two-day lag: refused, saying both lengths.
    const lastDay = await page.getByLabel("Last day (included)").inputValue();
    const firstDay = await page.getByLabel("First day").inputValue();
    await page.getByLabel("First day").fill(lastDay);
    await page.getByLabel("fixed").check();
    await page.getByLabel("Lag (h)").fill("48");
    await editor.fit();
    const problem = await page.getByTestId("thermal-problem").innerText();
    expect(problem).toMatch(/A lag of 2880 min is longer than the reference period \(1439 min\); choose a shorter lag or a longer period/);
    await page.getByLabel("First day").fill(firstDay);
    await page.getByLabel("Lag (h)").fill("3");
    await editor.fit();
    await page.getByTestId("thermal-fit").waitFor();
    expect(await editor.figure("Lag")).toBe("3.00 h (180 min)");
    expect((await editor.fittedLine()).points).toBeGreaterThan(1000);
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await saveScreenshot(page, "thermal-editor-phone");
  });
});
