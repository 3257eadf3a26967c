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

async function technicianAt(viewport: typeof DESKTOP) {
  const page = await (await newContext(browser, viewport)).newPage();
  await new SignInPage(page).signInAs("technician");
  return page;
}

/**
 * The demo's LC-M1: a 350 Ω quarter bridge with 0.9 Ω of lead in the gauge's arm and its output leads
 * swapped. Its output with 174 650 Ω across the gauge, from the Wheatstone circuit
 * Vout/Vex = R1/(R1+R2) − R4/(R3+R4) (Dally & Riley, Experimental Stress Analysis, bridge chapter),
 * arms R1 = (350 ‖ 174 650) + 0.9 Ω and R2 = R3 = R4 = 350.9 Ω, sign reversed by the swapped leads.
 */
const SHUNT = 174_650;
const arm = (350 * SHUNT) / (350 + SHUNT) + 0.9;
const EXPECTED = -1000 * (arm / (arm + 350.9) - 0.5);

/** Page object of the gauge page's shunt-check section. */
class ShuntSection {
  constructor(private readonly page: Page) {}
  form() {
    return this.page.getByRole("form", { name: "Record a shunt check" });
  }
  async type(shunt: string, measured: string) {
    await this.form().getByLabel("Shunt resistance (Ω)").fill(shunt);
    await this.form().getByLabel("Measured output change (mV/V)").fill(measured);
  }
  rows() {
    return this.page.getByTestId("shunt-row");
  }
}

describe("shunt checks on the gauge page", () => {
  it("shows a technician at a desk the expected output, the difference and Passed, then lists the check", async () => {
    const page = await technicianAt(DESKTOP);
    await page.goto("/structures/MILL-FB/gauges/LC-M1");
    const shunt = new ShuntSection(page);
    const before = await shunt.rows().count();
    // 1 % is the default tolerance (common practice).
    await expect(shunt.form().getByLabel("Tolerance (%)").inputValue()).resolves.toBe("1");
    await shunt.type("174650", (EXPECTED * 1.004).toFixed(5));
    await expect(page.getByTestId("shunt-expected").textContent()).resolves.toContain(`${EXPECTED.toFixed(4)} mV/V`);
    await expect(page.getByTestId("shunt-difference").textContent()).resolves.toContain("+0.4 %");
    await expect(shunt.form().getByTestId("shunt-verdict").textContent()).resolves.toContain("Passed");
    await shunt.form().getByRole("button", { name: "Record shunt check" }).click();
    await shunt.form().getByText(/Shunt check recorded: passed/).waitFor();
    await expect.poll(() => shunt.rows().count()).toBe(before + 1);
    const newest = await shunt.rows().first().textContent();
    expect(newest).toContain("✓ Passed");
    expect(newest).toContain("174,650 Ω");
    expect(newest).toContain(`${EXPECTED.toFixed(4)} mV/V`);
    await saveScreenshot(page, "shunt-check-desktop");
  });

  it("on a phone, fails a reading 5 % short in words, shape and colour, and the page fits the screen", async () => {
    const page = await technicianAt(PHONE);
    await page.goto("/structures/MILL-FB/gauges/LC-M1");
    const shunt = new ShuntSection(page);
    await shunt.type("174650", (EXPECTED * 0.95).toFixed(5));
    const verdict = shunt.form().getByTestId("shunt-verdict");
    await expect(verdict.textContent()).resolves.toBe("✕ Failed");
    // Failed is drawn in the critical colour with a border, Passed in green: colour is not the only cue.
    const colours = await verdict.evaluate((element) => getComputedStyle(element).borderTopWidth);
    expect(colours).not.toBe("0px");
    await expect(page.getByTestId("shunt-difference").textContent()).resolves.toContain("-5.0 %");
    await shunt.form().getByRole("button", { name: "Record shunt check" }).click();
    await shunt.form().getByText(/Shunt check recorded: FAILED/).waitFor();
    await expect.poll(async () => shunt.rows().first().textContent()).toContain("✕ Failed");
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await saveScreenshot(page, "shunt-check-phone");
  });

  it("says what to fix for a missing shunt resistance, and stores nothing", async () => {
    const page = await technicianAt(PHONE);
    await page.goto("/structures/MILL-FB/gauges/LC-M1");
    const shunt = new ShuntSection(page);
    const before = await shunt.rows().count();
    await shunt.form().getByLabel("Measured output change (mV/V)").fill("0.5");
    await shunt.form().getByRole("button", { name: "Record shunt check" }).click();
    await shunt.form().getByText("Enter a number.").waitFor();
    await page.reload();
    await expect(shunt.rows().count()).resolves.toBe(before);
  });

  it("offers no check on a gauge without a bridge, and says why", async () => {
    const page = await technicianAt(DESKTOP);
    // TC-M1's logger reports microstrain and no bridge arrangement is recorded for it.
    await page.goto("/structures/MILL-FB/gauges/TC-M1");
    await page.getByTestId("shunt-not-applicable").getByText(/no bridge to shunt/).waitFor();
    await expect(page.getByRole("form", { name: "Record a shunt check" }).count()).resolves.toBe(0);
  });
});
