import fs from "node:fs";
import { createClient } from "@libsql/client";
import { PDFParse } from "pdf-parse";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { monthName, previousMonthPeriod } from "@/lib/report/period";
import { monthOf } from "@/lib/time-format";
import { storeReadings } from "../fixtures/readings";
import { PHONE, SignInPage, launchBrowser, newContext, saveScreenshot } from "./browser";

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

const TAG = "LC-M1";
const PEAK_MPA = 123.4;
const TEN_MINUTES = 600_000;

/** Ten-minute readings over the whole of the demo footbridge's previous month, one of them the peak. */
async function storePreviousMonth() {
  const { from, to } = previousMonthPeriod(new Date(), "Europe/London");
  const client = createClient({ url: inject("databaseUrl") });
  const found = await client.execute({
    sql: "SELECT g.id FROM gauges g JOIN structures s ON s.id = g.structure_id WHERE s.code = 'MILL-FB' AND g.tag = ?",
    args: [TAG],
  });
  const rows = [];
  for (let time = from.getTime(), i = 0; time < to.getTime(); time += TEN_MINUTES, i++) {
    const stress = i === 1000 ? PEAK_MPA : 40 + 10 * Math.sin(i / 20);
    rows.push({ time, stress, strain: (stress / 210_000) * 1e6, temperature: 8 });
  }
  await storeReadings(client, Number(found.rows[0]!.id), rows);
  client.close();
}

/** Page object of a structure's report page. */
class ReportPage {
  constructor(private readonly page: Page) {}
  gaugeRow(tag: string) {
    return this.page.getByTestId("report-gauge-row").filter({ has: this.page.getByRole("rowheader", { name: new RegExp(`^${tag}`) }) });
  }
  downloadLink() {
    return this.page.getByRole("link", { name: "Download PDF" });
  }
  stressChart(tag: string) {
    return this.page.getByTestId("report-chart").and(this.page.locator(`[data-gauge="${tag}"]`));
  }
  drawings() {
    return this.page.getByRole("region", { name: "Where the gauges are" });
  }
}

/** The name of the demo's previous month at the footbridge, as the report titles it. */
const previousMonthName = () => monthName(monthOf(previousMonthPeriod(new Date(), "Europe/London").from, "Europe/London"));

/** That the chart draws the envelope and its mean, and the drawing's image has loaded with markers on it. */
async function expectChartAndDrawing(report: ReportPage, page: Page) {
  const chart = report.stressChart(TAG);
  await chart.getByRole("img", { name: `Stress of ${TAG} over ${previousMonthName()}` }).waitFor();
  // A band and a mean per run of readings, and the axis's ticks labelled in MPa.
  await expect(chart.locator("path[fill-opacity]").count()).resolves.toBeGreaterThan(0);
  await expect(chart.locator("svg text").allTextContents()).resolves.toContain("Stress (MPa)");
  const image = report.drawings().locator("img").first();
  await expect(image.evaluate((img: HTMLImageElement) => img.decode().then(() => img.naturalWidth))).resolves.toBeGreaterThan(0);
  await expect(report.drawings().getByTestId("gauge-marker").filter({ hasText: TAG }).count()).resolves.toBe(1);
  const box = (await chart.locator("svg").boundingBox())!;
  const viewport = page.viewportSize()!;
  expect(box.width).toBeGreaterThan(200);
  expect(box.x + box.width).toBeLessThanOrEqual(viewport.width);
}

describe("the structure report page", () => {
  it("shows the demo owner last month's report of the footbridge and hands over its PDF", async () => {
    await storePreviousMonth();
    const page = await (await newContext(browser)).newPage();
    await new SignInPage(page).signInAs("owner");
    await page.goto("/structures/MILL-FB");
    await page.getByRole("link", { name: "Report", exact: true }).click();
    await page.getByRole("heading", { name: "Report: Millrace Footbridge" }).waitFor();
    for (const heading of ["Summary", "Where the gauges are", "Gauges", "Alerts and how they were handled"]) await page.getByRole("heading", { name: heading, exact: true }).waitFor();

    const report = new ReportPage(page);
    await expect(report.gaugeRow(TAG).textContent()).resolves.toContain(`${PEAK_MPA.toFixed(1)} MPa`);
    // The demo's own alerts may fall in last month: the page must say what the report's data say.
    const json = await (await page.request.get("/api/v1/structures/MILL-FB/report")).json();
    await expect(page.getByTestId("report-level").textContent()).resolves.toContain(json.summary.headline);
    await page.getByText("Monitoring supplements inspection; it never replaces it.").waitFor();
    await page.getByText(/depends on the detail category chosen by the engineer/).waitFor();
    await expectChartAndDrawing(report, page);
    await saveScreenshot(page, "report-desktop");

    const [download] = await Promise.all([page.waitForEvent("download"), report.downloadLink().click()]);
    expect(download.suggestedFilename()).toMatch(/^MILL-FB-report-\d{4}-\d{2}\.pdf$/);
    const bytes = fs.readFileSync((await download.path())!);
    expect(bytes.subarray(0, 4).toString("latin1")).toBe("%PDF");
    const response = await page.request.get((await report.downloadLink().getAttribute("href"))!);
    expect(response.headers()["content-type"]).toBe("application/pdf");

    // On paper only the report: no navigation, period picker or buttons.
    await page.emulateMedia({ media: "print" });
    await expect(report.downloadLink().isVisible()).resolves.toBe(false);
    await expect(page.getByRole("navigation", { name: "Main" }).isVisible()).resolves.toBe(false);
    await expect(page.getByRole("region", { name: "Report period" }).isVisible()).resolves.toBe(false);
    await expect(report.gaugeRow(TAG).isVisible()).resolves.toBe(true);
    // The chart and the drawing are on paper too.
    await expect(report.stressChart(TAG).isVisible()).resolves.toBe(true);
    await expect(report.drawings().locator("img").first().isVisible()).resolves.toBe(true);
    await saveScreenshot(page, "report-print");

    // The PDF of the demo data read back.
    const parsed = await new PDFParse({ data: new Uint8Array(bytes) }).getText();
    const text = parsed.text.replace(/\s+/g, " ");
    expect(parsed.total).toBeGreaterThanOrEqual(1);
    expect(text).toContain("Millrace Footbridge (MILL-FB)");
    expect(text).toContain(`Gauge ${TAG}`);
    expect(text).toContain(`${PEAK_MPA.toFixed(1)} MPa`);
    expect(text).toContain("Monitoring supplements inspection and never replaces it.");
    expect(text).toContain(`Stress, MPa: band from min to max`);
    // The footbridge's drawing is in the PDF as an image.
    const images = await new PDFParse({ data: new Uint8Array(bytes) }).getImage({ imageBuffer: false, imageDataUrl: false });
    expect(images.pages.flatMap((pdfPage) => pdfPage.images).length).toBeGreaterThanOrEqual(1);
  });

  it("fits the chart and the drawing to a phone's width", async () => {
    const page = await (await newContext(browser, PHONE)).newPage();
    await new SignInPage(page).signInAs("owner");
    await page.goto("/structures/MILL-FB/report");
    await page.getByRole("heading", { name: "Report: Millrace Footbridge" }).waitFor();
    await expectChartAndDrawing(new ReportPage(page), page);
    await saveScreenshot(page, "report-phone");
  });

  it("says so when a period has no readings, instead of an all clear", async () => {
    const page = await (await newContext(browser)).newPage();
    await new SignInPage(page).signInAs("owner");
    await page.goto("/structures/MILL-FB/report?from=2024-01-01&to=2024-01-31");
    await page.getByRole("heading", { name: "Report: Millrace Footbridge" }).waitFor();
    await expect(page.getByTestId("report-level").textContent()).resolves.toMatch(/No readings were received/);
    await page.getByText("No gauges in this period").waitFor();
    await page.goto("/structures/MILL-FB/report?month=2026-13");
    await page.getByRole("alert").filter({ hasText: "month is YYYY-MM" }).waitFor();
  });
});
