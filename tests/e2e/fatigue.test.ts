import { createClient } from "@libsql/client";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { fatigueSummary, formatScientific, rainflow } from "@/lib/fatigue";
import { DESKTOP, PHONE, SignInPage, launchBrowser, newContext, saveScreenshot } from "./browser";

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

const TAG = "E2E-FAT";
const INTERVAL_MS = 600_000;
// ASTM E1049 example sequence read as 10 MPa per unit about 40 MPa, repeated over 20 days of 10-minute readings.
const ASTM_EXAMPLE = [-2, 1, -3, 5, -1, 3, -4, 4, -2];
const history = Array.from({ length: 20 * 144 }, (_, i) => 40 + 10 * ASTM_EXAMPLE[i % ASTM_EXAMPLE.length]!);

/** Page object of a gauge's fatigue page. */
class FatiguePage {
  constructor(private readonly page: Page) {}
  damage() {
    return this.page.getByTestId("fatigue-damage");
  }
  /** Pixels of the histogram canvas in the bar colour (#1f6f78): axes and grid alone draw none. */
  barPixels() {
    return this.page.locator("[data-testid=rainflow-histogram] canvas").evaluate((canvas: HTMLCanvasElement) => {
      const { data } = canvas.getContext("2d")!.getImageData(0, 0, canvas.width, canvas.height);
      let bars = 0;
      for (let i = 0; i < data.length; i += 4) {
        if (Math.abs(data[i]! - 0x1f) < 8 && Math.abs(data[i + 1]! - 0x6f) < 8 && Math.abs(data[i + 2]! - 0x78) < 8) bars++;
      }
      return bars;
    });
  }
}

/** Writes readings straight into the browser tests' database: this branch has no ingestion endpoint yet. */
async function storeReadings(stresses: number[], end: number) {
  const client = createClient({ url: inject("databaseUrl") });
  const found = await client.execute({
    sql: "SELECT g.id FROM gauges g JOIN structures s ON s.id = g.structure_id WHERE s.code = 'MILL-FB' AND g.tag = ?",
    args: [TAG],
  });
  const gaugeId = Number(found.rows[0]!.id);
  const start = end - stresses.length * INTERVAL_MS;
  await client.execute({
    // The raw value follows the stress as a live channel's does: a constant one reads as a flat line, a sensor fault.
    sql: `INSERT INTO readings (gauge_id, t, value, strain, stress, flags) VALUES ${stresses.map(() => "(?, ?, ?, 0, ?, 0)").join(", ")}`,
    args: stresses.flatMap((stress, i) => [gaugeId, start + i * INTERVAL_MS, stress, stress]),
  });
  client.close();
}

describe("the fatigue view", () => {
  it("shows an engineer on a phone the damage, the histogram, the CSV and the caution", async () => {
    const page = await (await newContext(browser, PHONE)).newPage();
    await new SignInPage(page).signInAs("engineer");
    const created = await page.request.post("/api/v1/structures/MILL-FB/gauges", {
      data: {
        tag: TAG,
        label: "Cross girder 2, bottom flange at the weld toe",
        kind: "foil",
        input: "microstrain",
        gaugeFactor: 2.1,
        material: { name: "S355", E: 210000, nu: 0.3, alpha: 12, yield: 355 },
        zero: { value: 0 },
        detailCategory: 71,
      },
    });
    expect(created.status()).toBe(201);
    await storeReadings(history, Date.now() - INTERVAL_MS);

    await page.goto(`/structures/MILL-FB/gauges/${TAG}`);
    await page.getByRole("link", { name: "Fatigue damage and life" }).click();
    await page.getByRole("heading", { name: `Fatigue of gauge ${TAG}` }).waitFor();
    const fatigue = new FatiguePage(page);
    // The last 30 days hold the whole history; the expected figure comes from the tested fatigue core.
    await expect(fatigue.damage().textContent({ timeout: 20_000 })).resolves.toBe(formatScientific(fatigueSummary(rainflow(history), 71).damage));
    await expect(page.getByLabel("Detail category").inputValue()).resolves.toBe("71");
    await page.getByRole("img", { name: /cycles \(log scale\) against stress range Δσ in MPa/ }).waitFor();
    await expect.poll(() => fatigue.barPixels()).toBeGreaterThan(50);
    await page.getByText(/depends on the detail category the engineer chose/).waitFor();
    await page.getByText(/readings minutes apart, which see only daily and seasonal cycles/).waitFor();
    // 20 days of readings every 10 minutes with no outage: the rate divides by the 20 days they cover.
    await page.getByText(/over 20 days covered by readings$/).waitFor();
    await page.getByText(/nominal stress ranges at the detail/).waitFor();

    const csvLink = page.getByRole("link", { name: "Download the rainflow matrix (CSV)" });
    const csv = await page.request.get((await csvLink.getAttribute("href"))!);
    expect(csv.headers()["content-type"]).toBe("text/csv; charset=utf-8");
    expect((await csv.text()).split("\r\n")[0]).toMatch(/^range bin upper edge \(MPa\) \\ mean bin centre \(MPa\),/);

    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await saveScreenshot(page, "fatigue-phone");

    await page.getByLabel("Period", { exact: true }).selectOption("custom");
    await page.getByLabel("First day").fill("2024-01-01");
    await page.getByLabel("Last day").fill("2024-01-31");
    await page.getByText("No readings in this period").waitFor();
  });

  it("shows the basis of the rate and what counting from readings misses on a desktop", async () => {
    const page = await (await newContext(browser, DESKTOP)).newPage();
    await new SignInPage(page).signInAs("engineer");
    await page.goto(`/structures/MILL-FB/gauges/${TAG}/fatigue`);
    await page.getByTestId("fatigue-damage").waitFor({ timeout: 20_000 });
    await page.getByTestId("fatigue-source").getByText(/traffic, wind or machinery/).waitFor();
    await page.getByText(/days covered by readings/).waitFor();
    await saveScreenshot(page, "fatigue-desktop");
  });
});
