import fs from "node:fs";
import { createClient } from "@libsql/client";
import { parse } from "csv-parse/sync";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Browser, Locator, Page, Response } from "playwright-core";
import { dayOf, formatInTimeZone } from "@/lib/time-format";
import { MPA_PER_KSI } from "@/lib/units";
import { SignInPage, dragAcrossChart, launchBrowser, newContext, saveScreenshot } from "./browser";
import { foilGaugeBody } from "../fixtures/gauges";

const MINUTE = 60_000;
const HOUR = 60 * MINUTE;
const DAY = 24 * HOUR;

let browser: Browser;
let admin: Page;
let engineer: Page;

beforeAll(async () => {
  browser = await launchBrowser();
  admin = await (await newContext(browser)).newPage();
  await new SignInPage(admin).signInAs("admin");
  engineer = await (await newContext(browser)).newPage();
  await new SignInPage(engineer).signInAs("engineer");
});
afterAll(async () => {
  await browser?.close();
});

type SeriesAnswer = { quantity: string; bucketWidth: number; t: number[]; min: number[]; max: number[]; mean: number[] };
type Reading = { time: string; value: number; temperature: number | null; strain: number; stress: number; flags: string[] };

/** A series answer of `quantity` whose requested span passes `span` (ms), so a late answer for another range is not taken. */
const isSeries = (quantity: string, span: (ms: number) => boolean) => (response: Response) => {
  if (!response.url().includes("/series?") || !response.ok()) return false;
  const query = new URL(response.url()).searchParams;
  return query.get("quantity") === quantity && span(Date.parse(query.get("to")!) - Date.parse(query.get("from")!));
};

/** Page object of the overview of all structures. */
class OverviewPage {
  constructor(private readonly page: Page) {}
  async open() {
    await this.page.goto("/");
    await this.page.getByRole("list", { name: "Structures" }).waitFor();
  }
  card(code: string): Locator {
    return this.page.getByTestId("structure-card").filter({ hasText: code });
  }
  staleMark(code: string) {
    return this.card(code).getByTestId("stale-mark");
  }
  state(code: string) {
    return this.card(code).locator("[data-state]").getAttribute("data-state");
  }
}

/** Page object of a gauge page's charts. */
class GaugeChartsPage {
  constructor(private readonly page: Page) {}
  async open(code: string, tag: string) {
    await this.page.goto(`/structures/${code}/gauges/${tag}`);
    await this.page.getByTestId("gauge-charts").waitFor();
  }
  chart(title: string): Locator {
    return this.page.getByRole("region", { name: `${title} chart` });
  }
  canvas(title: string): Locator {
    return this.chart(title).locator("canvas");
  }
  range() {
    return this.page.getByTestId("chart-range").textContent();
  }
  /** Clicks a range preset and answers the series the charts fetched for it. */
  async preset(label: string, days: number, quantity: string): Promise<SeriesAnswer> {
    const fetched = this.page.waitForResponse(isSeries(quantity, (ms) => ms === days * DAY));
    await this.page.getByRole("button", { name: label, exact: true }).click();
    return (await fetched).json();
  }
  limitLines(title: string) {
    return drawnLimitLines(this.chart(title));
  }
  dragZoom(title: string) {
    return dragAcrossChart(this.page, this.chart(title));
  }
  /** Points from outside a chart to the middle of its plot, as a person reads a value, and answers its legend's time and mean. */
  async hoverLegend(title: string): Promise<{ time: string; mean: string }> {
    const box = (await this.chart(title).locator(".u-over").boundingBox())!;
    await this.page.mouse.move(box.x - 20, box.y + box.height / 2);
    await this.page.mouse.move(box.x + box.width / 2, box.y + box.height / 2, { steps: 3 });
    const value = (label: string) => this.chart(title).locator(".u-legend .u-series").filter({ hasText: label }).locator(".u-value").textContent();
    return { time: (await value("Time"))!, mean: (await value("mean"))! };
  }
}

/** The limit lines a chart drew on its canvas, as the draw hook lists them. */
async function drawnLimitLines(chart: Locator): Promise<{ level: string; value: number; y: number }[]> {
  const attribute = chart.locator("[data-limit-lines]");
  return JSON.parse((await attribute.getAttribute("data-limit-lines")) ?? "[]");
}

/** The text uPlot draws on each canvas of the page, kept on the canvas element as `drawnText`: axis labels have no DOM of their own. */
function recordCanvasText() {
  const fillText = CanvasRenderingContext2D.prototype.fillText;
  CanvasRenderingContext2D.prototype.fillText = function (this: CanvasRenderingContext2D, ...args: Parameters<typeof fillText>) {
    const canvas = this.canvas as HTMLCanvasElement & { drawnText?: string[] };
    (canvas.drawnText ??= []).push(String(args[0]));
    fillText.apply(this, args);
  };
}

/** Pixels of a canvas: how many differ from the background, and how many of a row match a colour. */
function canvasPixels(canvas: Locator, row: number | null, rgb: [number, number, number] | null) {
  return canvas.evaluate(
    (element, [row, rgb]) => {
      const canvas = element as HTMLCanvasElement;
      const context = canvas.getContext("2d")!;
      const { data } = context.getImageData(0, 0, canvas.width, canvas.height);
      let inked = 0;
      for (let i = 3; i < data.length; i += 4) if (data[i]! > 0) inked++;
      let matching = 0;
      if (row !== null && rgb !== null) {
        for (let x = 0; x < canvas.width; x++) {
          const at = (row * canvas.width + x) * 4;
          const close = [0, 1, 2].every((c) => Math.abs(data[at + c]! - rgb[c]!) < 40) && data[at + 3]! > 128;
          if (close) matching++;
        }
      }
      return { inked, matching, width: canvas.width };
    },
    [row, rgb] as const,
  );
}

const hex = (colour: string): [number, number, number] => [1, 3, 5].map((i) => parseInt(colour.slice(i, i + 2), 16)) as [number, number, number];
/** The colours the chart strokes limit levels with (components/charts/envelope-chart.tsx). */
const LEVEL_RGB: Record<string, [number, number, number]> = { watch: hex("#8a6d00"), warning: hex("#b45309"), critical: hex("#b42318") };

/** Every reading of a range through the JSON listing, page by page. */
async function readingsOf(page: Page, path: string, from: string, to: string): Promise<Reading[]> {
  const all: Reading[] = [];
  let cursor: string | undefined;
  do {
    const query = new URLSearchParams({ from, to, limit: "10000", ...(cursor ? { cursor } : {}) });
    const response = await page.request.get(`${path}/readings?${query}`);
    expect(response.status()).toBe(200);
    const body = (await response.json()) as { readings: Reading[]; nextCursor?: string };
    all.push(...body.readings);
    cursor = body.nextCursor;
  } while (cursor);
  return all;
}

/** Creates a structure with one gauge through the API, and sends it hourly readings ending at `lastAt`. */
async function structureWithReadings(page: Page, code: string, lastAt: number) {
  const created = await page.request.post("/api/v1/structures", { data: { code, name: `Dashboard test ${code}`, timezone: "UTC" } });
  expect(created.status()).toBe(201);
  const gauge = await page.request.post(`/api/v1/structures/${code}/gauges`, { data: { ...foilGaugeBody("G1"), expectedInterval: 600 } });
  expect(gauge.status()).toBe(201);
  const readings = Array.from({ length: 12 }, (_, i) => ({
    gauge: "G1",
    time: new Date(lastAt - (11 - i) * 10 * MINUTE).toISOString(),
    value: 0.0121 + i * 0.00001,
    temperature: 14,
  }));
  const sent = await page.request.post(`/api/v1/structures/${code}/readings`, { data: { readings } });
  expect(sent.status()).toBe(200);
  expect((await sent.json()).accepted).toBe(12);
}

describe("the overview", () => {
  it("marks a structure whose data stopped three hours ago as stale, and one with fresh data not", async () => {
    const now = Date.now();
    // Stale after three missed 10-minute intervals (common practice, lib/alerting/gauge-state.ts): 3 h is well past that, 2 min well inside.
    await structureWithReadings(admin, "E2E-STALE", now - 3 * HOUR);
    await structureWithReadings(admin, "E2E-FRESH", now - 2 * MINUTE);
    const overview = new OverviewPage(admin);
    await overview.open();

    await expect(overview.staleMark("E2E-STALE").textContent()).resolves.toMatch(/not an all clear/);
    await expect(overview.state("E2E-STALE")).resolves.toBe("no-data");
    await expect(overview.card("E2E-STALE").textContent()).resolves.not.toMatch(/Within limits/);

    await expect(overview.staleMark("E2E-FRESH").count()).resolves.toBe(0);
    // Fresh readings, but the gauge has no limits to judge them by: it says so rather than "within limits".
    await expect(overview.state("E2E-FRESH")).resolves.toBe("no-limits");
    await expect(overview.card("E2E-FRESH").textContent()).resolves.not.toMatch(/Within limits/);
    await saveScreenshot(admin, "overview-admin");
  });
});

describe("the gauge page", () => {
  it("draws the fetched spike, the limit lines, and fetches finer intervals when zoomed", async () => {
    // The spike planted on LC-M1 (db/demo-gauges.ts, +420 µε for one reading), found in the e2e database itself.
    const db = createClient({ url: inject("databaseUrl") });
    const [spike] = (
      await db.execute(
        "SELECT r.t, r.strain FROM readings r JOIN gauges g ON g.id = r.gauge_id JOIN structures s ON s.id = g.structure_id " +
          "WHERE s.code = 'MILL-FB' AND g.tag = 'LC-M1' ORDER BY r.strain DESC LIMIT 1",
      )
    ).rows as unknown as { t: number; strain: number }[];
    const neighbours = await db.execute({
      sql: "SELECT strain FROM readings WHERE gauge_id = (SELECT id FROM gauges WHERE tag = 'LC-M1') AND t IN (?, ?)",
      args: [spike!.t - 10 * MINUTE, spike!.t + 10 * MINUTE],
    });
    db.close();
    for (const row of neighbours.rows) expect(spike!.strain - (row.strain as number)).toBeGreaterThan(300);

    const gaugePage = new GaugeChartsPage(engineer);
    await gaugePage.open("MILL-FB", "LC-M1");
    const strain = await gaugePage.preset("90 days", 90, "strain");
    // The series keeps each bucket's exact maximum (as the series endpoint documents), so the spike is the fetched maximum, in its bucket.
    const peak = strain.max.indexOf(Math.max(...strain.max));
    expect(strain.max[peak]).toBe(spike!.strain);
    expect(strain.t[peak]).toBeLessThanOrEqual(spike!.t);
    expect(strain.t[peak]! + strain.bucketWidth).toBeGreaterThan(spike!.t);

    const canvas = gaugePage.canvas("Stress");
    await canvas.waitFor();
    const drawn = await canvasPixels(canvas, null, null);
    // A drawn chart inks far more than a blank canvas: axes, band, mean line. A tenth of a row's width is a floor, not a guess at the figure.
    expect(drawn.inked).toBeGreaterThan(drawn.width / 10);

    // Expected lines from the API: stress limits as set, utilisation limits at bound × yield (|σ| / yield, common practice).
    const limits = (await (await engineer.request.get("/api/v1/structures/MILL-FB/gauges/LC-M1/limits")).json()).limits as { quantity: string; level: string; upper?: number; lower?: number }[];
    const gauge = await (await engineer.request.get("/api/v1/structures/MILL-FB/gauges/LC-M1")).json();
    const expected = limits.flatMap((limit) =>
      [limit.upper, limit.lower]
        .filter((bound): bound is number => bound !== undefined && (limit.quantity === "stress" || limit.quantity === "utilisation"))
        .map((bound) => ({ level: limit.level, value: limit.quantity === "utilisation" ? bound * gauge.material.yield : bound })),
    );
    expect(expected.length).toBeGreaterThanOrEqual(3);
    // The axis fits the data by default; with every limit asked for, each bound is drawn in view.
    await engineer.getByLabel(/^Show all limits/).check();
    await engineer.waitForFunction(() => document.querySelector("[aria-label='Stress chart'] [data-off-scale-lines]")?.getAttribute("data-off-scale-lines") === "[]");
    const lines = await gaugePage.limitLines("Stress");
    for (const want of expected) {
      const line = lines.find((l) => l.level === want.level && Math.abs(l.value - want.value) < 1e-9);
      expect(line, `${want.level} line at ${want.value} MPa`).toBeDefined();
      // The dashed line (6 on, 4 off) covers about 60 % of the plot's row in its level's colour.
      const rows = await Promise.all([line!.y - 1, line!.y, line!.y + 1].map((row) => canvasPixels(canvas, row, LEVEL_RGB[want.level]!)));
      expect(Math.max(...rows.map((r) => r.matching))).toBeGreaterThan(drawn.width / 4);
    }
    await saveScreenshot(engineer, "gauge-page-90-days");

    const before = await gaugePage.range();
    const finer = engineer.waitForResponse(isSeries("stress", (ms) => ms < 90 * DAY));
    await gaugePage.dragZoom("Stress");
    const zoomed = (await (await finer).json()) as SeriesAnswer;
    expect(zoomed.bucketWidth).toBeLessThan(strain.bucketWidth);
    await expect(gaugePage.range()).resolves.not.toBe(before);
    await canvas.waitFor();
    expect((await canvasPixels(gaugePage.canvas("Stress"), null, null)).inked).toBeGreaterThan(drawn.width / 10);
  });

  it("shows legend values rounded with their unit in the person's units, and day-first time labels", async () => {
    const page = await engineer.context().newPage();
    await page.addInitScript(recordCanvasText);
    const gaugePage = new GaugeChartsPage(page);
    const fetched = page.waitForResponse(isSeries("stress", (ms) => ms === 7 * DAY));
    await gaugePage.open("MILL-FB", "LC-M1");
    const stressResponse = await fetched;
    const stress = (await stressResponse.json()) as SeriesAnswer;
    const range = new URL(stressResponse.url()).searchParams;
    const { timezone } = await (await page.request.get("/api/v1/structures/MILL-FB")).json();
    await gaugePage.canvas("Stress").waitFor();

    /** The bucket mean the legend's time names, found by writing every bucket's time the way the app's other times read. */
    const meanAt = async (legendTime: string) => {
      const times = stress.t.map((ms) => formatInTimeZone(ms, timezone));
      const index = times.indexOf(legendTime);
      expect(index, `a bucket at ${legendTime}`).toBeGreaterThanOrEqual(0);
      return stress.mean[index]!;
    };

    /** The legend once it shows `unit`: a chart rebuilt for new units shows dashes until the pointer moves over it again. */
    const legendIn = async (unit: string) => {
      let legend = { time: "", mean: "" };
      await expect.poll(async () => (legend = await gaugePage.hoverLegend("Stress")).mean).toMatch(new RegExp(` ${unit}$`));
      return legend;
    };

    try {
      const si = await legendIn("MPa");
      // The app's one format with the structure's zone named, as "2026-03-01 14:30 GMT"; uPlot's own default would read "2026-03-01 2:30pm".
      expect(si.time).toMatch(/^\d{4}-\d{2}-\d{2} \d{2}:\d{2} (GMT|BST)$/);
      expect(si.mean).toBe(`${(await meanAt(si.time)).toFixed(1)} MPa`);

      // Date labels on the time axis ("2026-03-01", or "03-01" for day ticks), for days of the range on the structure's clock.
      const drawn = await gaugePage.canvas("Stress").evaluate((canvas) => (canvas as HTMLCanvasElement & { drawnText?: string[] }).drawnText ?? []);
      const days: string[] = [];
      for (let t = Date.parse(range.get("from")!); t <= Date.parse(range.get("to")!); t += 3_600_000) days.push(dayOf(t, timezone), dayOf(t, timezone).slice(5));
      const dateLabels = drawn.filter((text) => /^(\d{4}-)?\d{2}-\d{2}$/.test(text));
      expect(dateLabels.length, `date labels among ${JSON.stringify(drawn)}`).toBeGreaterThan(0);
      for (const label of dateLabels) expect(days).toContain(label);
      // Nothing month-first ("Mar 1", "3/1") or on a 12-hour clock ("2pm"), as uPlot's defaults draw.
      expect(drawn.filter((text) => /^[A-Z][a-z]{2} \d{1,2}$|^\d{1,2}\/\d{1,2}|\d(am|pm)$/.test(text))).toEqual([]);

      await page.getByLabel("Units", { exact: true }).selectOption("us");
      await page.getByRole("heading", { name: /^Stress \(ksi/ }).waitFor();
      const us = await legendIn("ksi");
      // 1 ksi = 6.894757 MPa (NIST SP 811, Appendix B).
      expect(us.mean).toBe(`${((await meanAt(us.time)) / 6.894757).toFixed(2)} ksi`);
      await saveScreenshot(page, "gauge-page-legend-us");
    } finally {
      await page.getByLabel("Units", { exact: true }).selectOption("si");
      await page.getByRole("heading", { name: /^Stress \(MPa/ }).waitFor();
      await page.close();
    }
  });

  it("exports a CSV with units in its header, equal to the readings the API lists for the same range to the written decimals", async () => {
    const gaugePage = new GaugeChartsPage(engineer);
    await gaugePage.open("MILL-FB", "LC-Q1");
    const request = engineer.waitForRequest((r) => r.url().includes("/readings?"));
    const download = engineer.waitForEvent("download");
    await engineer.getByRole("button", { name: "Export CSV" }).click();
    const url = new URL((await request).url());
    const file = await (await download).path();
    const rows = parse(fs.readFileSync(file), { columns: true, bom: true }) as Record<string, string>[];
    expect(Object.keys(rows[0]!)).toEqual(["time (UTC)", "local time (Europe/London)", expect.stringMatching(/^value \(.+\)$/), "temperature (°C)", "strain (µε)", "stress (MPa)", "flags"]);

    const api = await readingsOf(engineer, "/api/v1/structures/MILL-FB/gauges/LC-Q1", url.searchParams.get("from")!, url.searchParams.get("to")!);
    // The default week of 10-minute readings: a thousand or so rows, not an empty file that would match an empty listing.
    expect(api.length).toBeGreaterThan(500);
    expect(rows).toHaveLength(api.length);
    const decimals = (text: string) => text.split(".")[1]?.length ?? 0;
    rows.forEach((row, i) => {
      const reading = api[i]!;
      const [value, temperature, strain, stress, flags] = Object.values(row).slice(2);
      // The local column is the same instant on the footbridge's clock (GMT, or BST in summer).
      expect(row["local time (Europe/London)"]).toBe(formatInTimeZone(Date.parse(reading.time), "Europe/London", { precision: "millisecond" }));
      expect({ time: row["time (UTC)"], value: Number(value), temperature: temperature === "" ? null : Number(temperature), flags: flags ? flags.split(" ") : [] }).toEqual({
        time: reading.time,
        value: reading.value,
        temperature: reading.temperature,
        flags: reading.flags,
      });
      // Rounded, so within half a unit of the last decimal written; and never 16 digits.
      expect(Math.abs(Number(strain) - reading.strain)).toBeLessThanOrEqual(0.5 * 10 ** -decimals(strain!) + 1e-9);
      expect(Math.abs(Number(stress) - reading.stress)).toBeLessThanOrEqual(0.5 * 10 ** -decimals(stress!) + 1e-9);
      expect(decimals(stress!)).toBeLessThan(8);
    });
  });

  it("exports the stress chart as a PNG with a title band above the chart", async () => {
    const gaugePage = new GaugeChartsPage(engineer);
    await gaugePage.open("MILL-FB", "LC-Q1");
    const canvas = gaugePage.canvas("Stress");
    await canvas.waitFor();
    const drawn = await canvas.evaluate((node: HTMLCanvasElement) => ({ width: node.width, height: node.height, scale: node.width / node.clientWidth }));
    const download = engineer.waitForEvent("download");
    await engineer.getByRole("button", { name: "Stress chart as PNG" }).click();
    const saved = await download;
    expect(saved.suggestedFilename()).toMatch(/^MILL-FB-LC-Q1-stress-\d{4}-\d{2}-\d{2}-to-\d{4}-\d{2}-\d{2}\.png$/);
    const png = fs.readFileSync(await saved.path());
    fs.mkdirSync("test-results/screenshots", { recursive: true });
    fs.writeFileSync("test-results/screenshots/gauge-stress-export.png", png);
    // PNG signature, then the IHDR chunk's width and height (ISO/IEC 15948, section 11.2.2).
    expect([...png.subarray(1, 4)].map((byte) => String.fromCharCode(byte)).join("")).toBe("PNG");
    const size = { width: png.readUInt32BE(16), height: png.readUInt32BE(20) };
    const band = Math.round(52 * drawn.scale);
    expect(size).toEqual({ width: drawn.width, height: drawn.height + band });
    const inkInBand = await engineer.evaluate(
      async ({ source, band }) => {
        const image = new Image();
        image.src = source;
        await image.decode();
        const board = document.createElement("canvas");
        board.width = image.width;
        board.height = band;
        const context = board.getContext("2d")!;
        context.drawImage(image, 0, 0);
        const { data } = context.getImageData(0, 0, image.width, band);
        let dark = 0;
        for (let i = 0; i < data.length; i += 4) if (data[i]! < 120 && data[i + 1]! < 120 && data[i + 2]! < 140) dark++;
        return dark;
      },
      { source: `data:image/png;base64,${png.toString("base64")}`, band },
    );
    // Two lines of title text ink a few hundred pixels or more; an empty band inks none.
    expect(inkInBand).toBeGreaterThan(200);
  });
});

/** Page object of a structure page's gauge table and the header's units switch. */
class StructureTablePage {
  constructor(private readonly page: Page) {}
  async open(code: string) {
    await this.page.goto(`/structures/${code}`);
    await this.table().waitFor();
  }
  table() {
    return this.page.getByRole("table", { name: "Gauges" });
  }
  async chooseUnits(value: "si" | "us") {
    await this.page.getByLabel("Units", { exact: true }).selectOption(value);
  }
  /** The text of a gauge's cell under the header that starts with `header`. */
  async cell(tag: string, header: string) {
    const headers = await this.table().locator("thead th").allTextContents();
    const column = headers.findIndex((text) => text.startsWith(header));
    expect(column, `column ${header} in ${headers.join(" | ")}`).toBeGreaterThanOrEqual(0);
    const row = this.table().getByTestId("gauge-row").filter({ has: this.page.getByRole("link", { name: tag, exact: true }) });
    return (await row.locator("td").nth(column).textContent())!;
  }
}

describe("units preference", () => {
  it("shows ksi and °F in the table after switching, converting the API's MPa, and back", async () => {
    const structurePage = new StructureTablePage(engineer);
    await structurePage.open("MILL-FB");
    const api = await readingsOf(engineer, "/api/v1/structures/MILL-FB/gauges/LC-M1", new Date(Date.now() - 2 * DAY).toISOString(), new Date(Date.now() + MINUTE).toISOString());
    const latest = api[api.length - 1]!;

    await structurePage.chooseUnits("us");
    await structurePage.table().getByRole("button", { name: /^Stress \(ksi\)/ }).waitFor();
    await structurePage.table().getByRole("button", { name: /^Temp\. \(°F\)/ }).waitFor();
    // 1 ksi = 6.894757 MPa (NIST SP 811, Appendix B); the table shows ksi to two decimals.
    await expect(structurePage.cell("LC-M1", "Stress")).resolves.toBe((latest.stress / 6.894757).toFixed(2));
    expect(Math.abs(MPA_PER_KSI - 6.894757)).toBeLessThan(1e-6);
    // °F = °C × 9/5 + 32 (NIST SP 811, Appendix B, temperature).
    await expect(structurePage.cell("LC-M1", "Temp.")).resolves.toBe(((latest.temperature! * 9) / 5 + 32).toFixed(1));
    await saveScreenshot(engineer, "structure-page-us-units");

    await structurePage.chooseUnits("si");
    await structurePage.table().getByRole("button", { name: /^Stress \(MPa\)/ }).waitFor();
    await expect(structurePage.cell("LC-M1", "Stress")).resolves.toBe(latest.stress.toFixed(1));
    await expect(structurePage.cell("LC-M1", "Temp.")).resolves.toBe(latest.temperature!.toFixed(1));
  });
});

describe("the rosette page's limits editor", () => {
  it("backtests a proposed von Mises bound against the stored instants and draws it on the rosette's last 30 days", async () => {
    await engineer.goto("/structures/MILL-FB/rosettes/R1");
    await engineer.getByRole("button", { name: "Add a limit" }).click();
    await engineer.getByLabel("Upper bound, limit 1").fill("1");
    await engineer.getByLabel("Over the last").selectOption("90");
    await engineer.getByRole("button", { name: "Check against stored data" }).click();
    const result = engineer.getByTestId("backtest-result");
    await result.getByText(/alert episode/).waitFor();
    // Any stress state but zero has a von Mises stress above 1 MPa, so the demo's instants raise an episode.
    await expect(result.textContent()).resolves.toMatch(/over [\d,]+ instants with a reading of all three gauges/);
    await expect(result.textContent()).resolves.toMatch(/watch on vonMises/);
    // A bound this tight raises thousands of episodes: they are counted, and only the first 50 listed.
    await expect(result.textContent()).resolves.toMatch(/By level: watch [\d,]+\. The first 50 are listed; [\d,]+ more follow\./);
    await expect(result.getByRole("listitem").count()).resolves.toBe(50);

    // The bound is charted on the quantity it bounds, in MPa (the engineer reads SI units here).
    const proposed = engineer.getByRole("region", { name: "The last 30 days with these bounds" });
    const vonMises = proposed.getByRole("region", { name: "von Mises stress chart" });
    const canvas = vonMises.locator("canvas");
    await canvas.waitFor();
    await expect.poll(() => drawnLimitLines(vonMises)).toEqual([expect.objectContaining({ level: "watch", value: 1 })]);
    const [line] = await drawnLimitLines(vonMises);
    const drawn = await canvasPixels(canvas, null, null);
    // The dashed line (6 on, 4 off) covers about 60 % of the plot's row in its level's colour.
    const rows = await Promise.all([line!.y - 1, line!.y, line!.y + 1].map((row) => canvasPixels(canvas, row, LEVEL_RGB.watch!)));
    expect(Math.max(...rows.map((r) => r.matching))).toBeGreaterThan(drawn.width / 4);

    // Another quantity charted carries none of the von Mises bound.
    await proposed.getByRole("button", { name: "Principal stress σ1" }).click();
    const sigma1 = proposed.getByRole("region", { name: "Principal stress σ1 chart" });
    await sigma1.locator("canvas").waitFor();
    await expect(drawnLimitLines(sigma1)).resolves.toEqual([]);
  });

  it("draws the rosette's saved limits on the chart of the quantity they bound", async () => {
    const saved = await engineer.request.put("/api/v1/structures/MILL-FB/rosettes/R1/limits", {
      data: { limits: [{ quantity: "vonMises", level: "warning", upper: 250 }] },
    });
    expect(saved.status()).toBe(200);
    try {
      await engineer.goto("/structures/MILL-FB/rosettes/R1");
      // The page's own charts come before the editor's.
      const vonMises = engineer.getByRole("region", { name: "von Mises stress chart" }).first();
      await vonMises.locator("canvas").waitFor();
      // The demo rosette's stresses stay far below 250 MPa: the axis fits the data and the bound is marked at its top edge.
      const offScale = async () => JSON.parse((await vonMises.locator("[data-off-scale-lines]").getAttribute("data-off-scale-lines")) ?? "[]");
      await expect.poll(offScale, { timeout: 10_000 }).toEqual([expect.objectContaining({ level: "warning", value: 250, side: "above" })]);
      // As on a gauge's charts, the switch stretches the scale to every bound: the line is drawn in view, no arrow left.
      await engineer.getByLabel(/^Show all limits/).first().check();
      await expect.poll(offScale, { timeout: 10_000 }).toEqual([]);
      await expect.poll(() => drawnLimitLines(vonMises), { timeout: 10_000 }).toEqual([expect.objectContaining({ level: "warning", value: 250 })]);
      await engineer.getByLabel(/^Show all limits/).first().uncheck();
      await expect.poll(offScale, { timeout: 10_000 }).toEqual([expect.objectContaining({ level: "warning", value: 250, side: "above" })]);
      const sigma1 = engineer.getByRole("region", { name: "Principal stress σ1 chart" }).first();
      await sigma1.locator("canvas").waitFor();
      await expect(drawnLimitLines(sigma1)).resolves.toEqual([]);
    } finally {
      // Leave the demo rosette without limits for the other tests.
      expect((await engineer.request.put("/api/v1/structures/MILL-FB/rosettes/R1/limits", { data: { limits: [] } })).status()).toBe(200);
    }
  });

  it("says so plainly when the rosette's gauges never read at the same instant in the 30 days", async () => {
    const created = await admin.request.post("/api/v1/structures", { data: { code: "E2E-ROS", name: "Dashboard test E2E-ROS", timezone: "UTC" } });
    expect(created.status()).toBe(201);
    for (const tag of ["RA", "RB", "RC"]) {
      const gauge = await admin.request.post("/api/v1/structures/E2E-ROS/gauges", { data: { ...foilGaugeBody(tag), expectedInterval: 600 } });
      expect(gauge.status()).toBe(201);
    }
    const rosette = await admin.request.post("/api/v1/structures/E2E-ROS/rosettes", { data: { tag: "RX", layout: "rectangular", gauges: ["RA", "RB", "RC"] } });
    expect(rosette.status()).toBe(201);
    // Gauges a and b read together and c never does: a plane strain state needs all three at one instant.
    const time = new Date(Date.now() - HOUR).toISOString();
    const readings = ["RA", "RB"].map((gauge) => ({ gauge, time, value: 0.0121, temperature: 14 }));
    const sent = await admin.request.post("/api/v1/structures/E2E-ROS/readings", { data: { readings } });
    expect(sent.status()).toBe(200);

    await admin.goto("/structures/E2E-ROS/rosettes/RX");
    const proposed = admin.getByRole("region", { name: "The last 30 days with these bounds" });
    await proposed.getByText("No instants with a reading of all three gauges in this period.").waitFor();
    await expect(proposed.locator("canvas").count()).resolves.toBe(0);
  });
});

describe("screenshots of the main pages", () => {
  it("saves the overview, structure, gauge, alerts, compare and rosette pages", async () => {
    const pages: [string, string, string][] = [
      ["overview", "/", "structure-card"],
      ["structure-page", "/structures/MILL-FB", "gauge-row"],
      ["gauge-page", "/structures/MILL-FB/gauges/LC-Q1", "chart"],
      ["alerts-list", "/alerts", ""],
      ["compare", "/structures/MILL-FB/compare?gauges=LC-M1,LC-Q1,DG-3", "chart"],
      ["rosette", "/structures/MILL-FB/rosettes/R1", "chart"],
    ];
    for (const [name, path, ready] of pages) {
      const response = await engineer.goto(path);
      expect(response?.status(), path).toBe(200);
      if (ready) await engineer.getByTestId(ready).first().waitFor();
      if (ready === "chart") await engineer.getByTestId(ready).first().locator("canvas").waitFor();
      await saveScreenshot(engineer, `dashboard-${name}`);
    }
  });
});
