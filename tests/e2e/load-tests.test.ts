import { createClient } from "@libsql/client";
import { parse } from "csv-parse/sync";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { storeReadings } from "../fixtures/readings";
import { PHONE, SignInPage, launchBrowser, newContext, saveScreenshot } from "./browser";

const TAG = "LC-M1";
const MINUTE = 60_000;
// 10 March 2026: London keeps GMT until the end of March, so the form's wall clock is UTC.
const START = Date.UTC(2026, 2, 10, 9, 0);
const END = START + 30 * MINUTE;
const BASELINE = 50;
const AMPLITUDE = 90;
const E_STEEL = 210_000;

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
  await plantTest();
});
afterAll(async () => {
  await browser?.close();
});

/**
 * A load planted on the footbridge's gauge, made here: at rest at 50 µε (with a 0.2 µε ripple on
 * alternate minutes that is 0 at the baseline and at the crest), a half sine of 90 µε across the
 * window peaking on the 09:15 reading. Measured peak 90 µε; against 100 µε predicted, ratio 0.90.
 */
async function plantTest() {
  const client = createClient({ url: inject("databaseUrl") });
  const found = await client.execute({
    sql: "SELECT g.id FROM gauges g JOIN structures s ON s.id = g.structure_id WHERE s.code = 'MILL-FB' AND g.tag = ?",
    args: [TAG],
  });
  const rows = [];
  for (let time = START - 60 * MINUTE; time < END + 60 * MINUTE; time += MINUTE) {
    const load = time >= START && time < END ? AMPLITUDE * Math.sin((Math.PI * (time - START)) / (END - START)) : 0;
    const ripple = ((time - START) / MINUTE) % 2 === 0 ? 0.2 : 0;
    const strain = BASELINE + load + ripple;
    rows.push({ time, strain, stress: (strain * E_STEEL) / 1e6, temperature: 6 });
  }
  await storeReadings(client, Number(found.rows[0]!.id), rows);
  client.close();
}

/** Page object of a load test's results page. */
class LoadTestPage {
  constructor(private readonly page: Page) {}
  row(tag: string) {
    return this.page.getByTestId("load-test-table").locator(`tr[data-gauge="${tag}"]`);
  }
  chart(tag: string) {
    return this.page.getByRole("figure", { name: `Strain of ${tag} around the test` });
  }
  async waitForChart(tag: string) {
    await expect.poll(() => this.chart(tag).locator("[data-window]").count(), { timeout: 30_000 }).toBe(1);
  }
}

const wall = (ms: number) => new Date(ms).toISOString().slice(0, 16);

describe("load tests", () => {
  let resultsPath = "";
  const title = `Static test ${Date.now()}`;

  it("lets the engineer record a test at 1280x800, fill it from a CSV file, and read the table and a chart", async () => {
    const page = await (await newContext(browser, { width: 1280, height: 800 })).newPage();
    await new SignInPage(page).signInAs("engineer");
    await page.goto("/structures/MILL-FB");
    await page.getByRole("link", { name: "Load tests", exact: true }).click();
    await page.getByRole("heading", { name: "Load tests: Millrace Footbridge" }).waitFor();
    const form = page.getByRole("form", { name: "Record a load test" });

    // A file naming a gauge the structure does not have is refused in the browser, naming the tag.
    const file = form.getByLabel(/fill the table from a CSV file/);
    await file.setInputFiles({ name: "model.csv", mimeType: "text/csv", buffer: Buffer.from(`gauge,predicted (µε)\n${TAG},100\nNO-SUCH-9,40\n`) });
    await expect.poll(() => form.getByRole("alert", { name: "Problems in the file" }).textContent()).toContain("NO-SUCH-9");
    await file.setInputFiles({ name: "model.csv", mimeType: "text/csv", buffer: Buffer.from(`gauge,predicted (µε)\n${TAG},100\n`) });
    await expect.poll(() => form.getByLabel(`Predicted strain of ${TAG}, µε`).inputValue()).toBe("100");

    await form.getByLabel("Title").fill(title);
    await form.getByLabel("Load").fill("One 3.5 t maintenance vehicle parked at midspan");
    // A window that ends before it starts is refused on its field, and nothing is recorded.
    await form.getByLabel(/Window start/).fill(wall(END));
    await form.getByLabel(/Window end/).fill(wall(START));
    await form.getByRole("button", { name: "Record load test" }).click();
    await form.getByText("The end of the window must be after its start.").waitFor();

    await form.getByLabel(/Window start/).fill(wall(START));
    await form.getByLabel(/Window end/).fill(wall(END));
    await form.getByRole("button", { name: "Record load test" }).click();
    await page.waitForURL(/\/structures\/MILL-FB\/load-tests\/\d+$/);
    resultsPath = new URL(page.url()).pathname;
    await page.getByRole("heading", { name: title }).waitFor();

    const results = new LoadTestPage(page);
    await expect(results.row(TAG).getByTestId("measured").textContent()).resolves.toBe(`${AMPLITUDE.toFixed(1)} µε`);
    await expect(results.row(TAG).getByTestId("ratio").textContent()).resolves.toBe("0.90");
    await expect(results.row(TAG).textContent()).resolves.toContain(`${BASELINE.toFixed(1)} µε`);
    await page.getByText(/licensed engineer under local codes/).first().waitFor();
    await results.waitForChart(TAG);
    const shaded = JSON.parse((await results.chart(TAG).locator("[data-window]").getAttribute("data-window"))!) as { left: number; right: number };
    expect(shaded.right).toBeGreaterThan(shaded.left);
    await saveScreenshot(page, "load-test-desktop");

    const csv = await page.request.get((await page.getByRole("link", { name: "Download CSV" }).getAttribute("href"))!);
    const [row] = parse(await csv.text(), { columns: true }) as Record<string, string>[];
    expect(row).toMatchObject({ gauge: TAG, "measured peak (µε)": "90.0", "ratio (measured/predicted)": "0.90", "predicted (µε)": "100.0" });
  });

  it("shows the owner the test and the month's report on a phone at 390x844 without sideways scrolling", async () => {
    const page = await (await newContext(browser, PHONE)).newPage();
    await new SignInPage(page).signInAs("owner");
    await page.goto("/structures/MILL-FB/load-tests");
    await page.getByRole("link", { name: title }).click();
    await page.getByRole("heading", { name: title }).waitFor();
    // Owners read; only engineers and admins record.
    await page.goto("/structures/MILL-FB/load-tests");
    await expect(page.getByRole("form", { name: "Record a load test" }).count()).resolves.toBe(0);
    await page.goto(resultsPath);
    const results = new LoadTestPage(page);
    await expect(results.row(TAG).getByTestId("ratio").textContent()).resolves.toBe("0.90");
    await results.waitForChart(TAG);
    await expect(page.evaluate(() => document.documentElement.scrollWidth)).resolves.toBeLessThanOrEqual(PHONE.width);
    await saveScreenshot(page, "load-test-phone");

    // The report of the month holds the test with its table.
    await page.goto("/structures/MILL-FB/report?month=2026-03");
    const inReport = page.getByTestId("report-load-test").filter({ hasText: title });
    await inReport.waitFor();
    await expect(inReport.locator(`tr[data-gauge="${TAG}"]`).getByTestId("ratio").textContent()).resolves.toBe("0.90");
  });
});
