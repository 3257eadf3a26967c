import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { PHONE, SignInPage, launchBrowser, newContext, saveScreenshot } from "./browser";

let browser: Browser;
let technician: Page;

beforeAll(async () => {
  browser = await launchBrowser();
  technician = await (await newContext(browser, PHONE)).newPage();
  await new SignInPage(technician).signInAs("technician");
});
afterAll(async () => {
  await browser?.close();
});

/** Page object of the gauge form. */
class GaugeFormPage {
  constructor(private readonly page: Page) {}
  field(label: string | RegExp) {
    return this.page.getByLabel(label, { exact: typeof label === "string" });
  }
  async fill(values: [string | RegExp, string][]) {
    for (const [label, value] of values) await this.field(label).fill(value);
  }
  preview() {
    return this.page.getByTestId("conversion-preview");
  }
}

describe("a technician on site with a phone", () => {
  it("registers a quarter-bridge gauge, sees its conversion preview and opens its page", async () => {
    await technician.goto("/structures/MILL-FB");
    await technician.getByRole("link", { name: "Register a gauge" }).click();
    const form = new GaugeFormPage(technician);
    await form.fill([
      ["Tag", "E2E-Q1"],
      ["Location", "Cross girder 4, bottom flange"],
      [/^Gauge factor/, "2.00"],
    ]);
    await form.field("Bridge arrangement").selectOption("quarter");
    await technician.getByLabel("Start from").selectOption("structural-steel-us");
    await form.fill([
      [/^Raw value at zero/, "0"],
      [/^Temperature at zero/, "12"],
      [/^Sample/, "1"],
    ]);
    // Quarter bridge of the Dally & Riley circuit (bridge chapter), gauge in R1: Vr = 1 mV/V =
    // 0.001 V/V, GF 2.00: ε = 4Vr / (GF(1 − 2Vr)) = 0.004 / (2 × 0.998) = 2004.0 µε;
    // σ = 200 000 MPa × 2004.0e-6 = 400.8 MPa.
    await expect(technician.getByTestId("preview-strain").textContent()).resolves.toBe("2,004.0 µε");
    await expect(technician.getByTestId("preview-stress").textContent()).resolves.toBe("400.80 MPa");
    // Beyond the 345 MPa yield of A992 steel the preview must say the linear conversion no longer holds.
    await form.preview().getByText("outside-linear-range").waitFor();
    // Leads swapped: the output reverses before the relation, Vr = −0.001: −0.004 / (2 × 1.002) = −1996.0 µε.
    await form.field("Polarity").selectOption("-1");
    await expect(technician.getByTestId("preview-strain").textContent()).resolves.toBe("-1,996.0 µε");
    await saveScreenshot(technician, "gauge-form-phone");
    await form.field("Quarter-bridge wiring").selectOption("3-wire");
    await form.fill([
      [/^Resistance of one lead/, "1.8"],
      [/^Gauge resistance/, "120"],
      [/^Bridge excitation/, "2.5"],
    ]);

    await technician.getByRole("button", { name: "Register gauge" }).click();
    await technician.waitForURL(/\/structures\/MILL-FB\/gauges\/E2E-Q1$/);
    await technician.getByRole("heading", { name: "Gauge E2E-Q1" }).waitFor();
    await technician.getByText("3-wire", { exact: true }).waitFor();
    await technician.getByText("2.5 V", { exact: true }).waitFor();
    await expect(technician.getByTestId("zero-row").count()).resolves.toBe(1);
    const overflow = await technician.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
  });

  it("shows what to fix when a field is wrong, keeping what was typed", async () => {
    await technician.goto("/structures/MILL-FB/gauges/new");
    const form = new GaugeFormPage(technician);
    await form.fill([
      ["Tag", "E2E-BAD"],
      [/^Gauge factor/, "-2"],
      [/^Raw value at zero/, "0"],
      [/^Bridge excitation/, "2500"],
    ]);
    await technician.getByRole("button", { name: "Register gauge" }).click();
    await technician.getByText("Must be greater than zero.").waitFor();
    await technician.getByText("The bridge excitation in V lies between 0.1 and 25.").waitFor();
    await expect(form.field("Tag").inputValue()).resolves.toBe("E2E-BAD");
  });

  it("records a new zero and keeps the old one in the history", async () => {
    await technician.goto("/structures/MILL-FB/gauges/E2E-Q1");
    const zero = technician.getByRole("form", { name: "Record a new zero" });
    await zero.getByLabel("Raw value (mV/V)").fill("0.015");
    await zero.getByLabel("Temperature (°C)").fill("8.5");
    await zero.getByLabel("Why").fill("after deck resurfacing");
    await zero.getByRole("button", { name: "Record zero" }).click();
    await zero.getByText("New zero recorded").waitFor();
    await technician.reload();
    const rows = technician.getByTestId("zero-row");
    await expect(rows.count()).resolves.toBe(2);
    await expect(rows.first().textContent()).resolves.toContain("after deck resurfacing");
  });

  it("replaces the gauge with a linked one and the old one reads as retired", async () => {
    await technician.goto("/structures/MILL-FB/gauges/E2E-Q1");
    await technician.getByRole("link", { name: "Replace" }).click();
    const form = new GaugeFormPage(technician);
    await form.fill([
      ["Tag", "E2E-Q1b"],
      [/^Raw value at zero/, "0.002"],
      [/^Temperature at zero/, "9"],
      ["Reason", "gauge debonded"],
    ]);
    await technician.getByRole("button", { name: "Replace gauge" }).click();
    await technician.waitForURL(/\/gauges\/E2E-Q1b$/);
    await technician.getByTestId("gauge-status").getByText("Replaced gauge").waitFor();
    await technician.getByRole("link", { name: "E2E-Q1", exact: true }).click();
    await technician.getByTestId("gauge-status").getByText(/^Retired \d{4}-/).waitFor();
    await technician.getByTestId("gauge-status").getByText("Replaced by").waitFor();
    await saveScreenshot(technician, "gauge-page-phone");
  });
});

describe("an engineer", () => {
  it("sees the audit trail of the location, old → new", async () => {
    const engineer = await (await newContext(browser)).newPage();
    await new SignInPage(engineer).signInAs("engineer");
    await engineer.goto("/structures/MILL-FB/gauges/E2E-Q1b");
    const actions = await engineer.getByTestId("audit-row").allTextContents();
    expect(actions.join("\n")).toMatch(/replaced/);
    expect(actions.join("\n")).toMatch(/new zero/);
    expect(actions.join("\n")).toMatch(/technician@hookeline\.example/);
    await saveScreenshot(engineer, "gauge-page-engineer");
  });

  it("is refused the limits of a technician: technicians do not see the audit trail or token controls", async () => {
    await technician.goto("/structures/MILL-FB");
    await expect(technician.getByRole("heading", { name: "Logger tokens" }).count()).resolves.toBe(0);
    await technician.goto("/structures/MILL-FB/gauges/LC-M1");
    await expect(technician.getByTestId("audit-row").count()).resolves.toBe(0);
  });
});
