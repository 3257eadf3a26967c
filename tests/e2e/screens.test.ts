import fs from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { DESKTOP, PHONE, SignInPage, dragAcrossChart, launchBrowser, newContext, saveScreenshot } from "./browser";

/** Screenshots of this suite are named by stage ("before" on the earlier build, "after" otherwise). */
const STAGE = process.env.SCREENSHOT_STAGE ?? "after";
const SIZES = { desktop: DESKTOP, phone: PHONE } as const;
type Size = keyof typeof SIZES;

/** The main pages a person works in, each checked for sideways overflow and accessibility. */
const MAIN_PAGES = {
  structure: "/structures/MILL-FB",
  gauge: "/structures/MILL-FB/gauges/LC-M1",
  limits: "/structures/MILL-FB/gauges/LC-Q1/limits",
  alerts: "/alerts?state=all",
  upload: "/structures/MILL-FB/upload",
};

let browser: Browser;
const pages = {} as Record<Size, Page>;

beforeAll(async () => {
  browser = await launchBrowser();
  for (const size of Object.keys(SIZES) as Size[]) {
    pages[size] = await (await newContext(browser, { ...SIZES[size], height: size === "desktop" ? 800 : PHONE.height })).newPage();
    await new SignInPage(pages[size]).signInAs("engineer");
  }
});
afterAll(async () => {
  await browser?.close();
});

/** Sideways overflow of the document itself: a table may scroll inside its own frame instead. */
function documentOverflow(page: Page) {
  return page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
}

describe("every main page fits the screen at 1280 × 800 and 390 × 844", () => {
  for (const size of Object.keys(SIZES) as Size[]) {
    for (const [name, url] of Object.entries(MAIN_PAGES)) {
      it(`${name} page on ${size}`, async () => {
        const page = pages[size];
        await page.goto(url);
        await page.getByRole("heading", { level: 1 }).waitFor();
        await page.waitForLoadState("networkidle");
        expect(await documentOverflow(page)).toBeLessThanOrEqual(0);
      });
    }
  }

  it("shows the whole gauge table at 1280 px: temperature, last reading and open alerts in view", async () => {
    const page = pages.desktop;
    await page.goto(MAIN_PAGES.structure);
    const frame = page.getByRole("region", { name: /^Gauges table/ });
    await frame.getByTestId("gauge-row").first().waitFor();
    const { scroll, client } = await frame.evaluate((element) => ({ scroll: element.scrollWidth, client: element.clientWidth }));
    expect(scroll).toBeLessThanOrEqual(client);
    for (const header of [/^Temp\./, /^Last reading/, /^Open alerts/]) await expect(frame.getByRole("button", { name: header }).isVisible()).resolves.toBe(true);
  });

  it("scrolls the gauge table inside its own frame on a phone, the tag column fixed", async () => {
    const page = pages.phone;
    await page.goto(MAIN_PAGES.structure);
    const frame = page.getByRole("region", { name: /^Gauges table/ });
    await frame.getByTestId("gauge-row").first().waitFor();
    const layout = await frame.evaluate((element) => {
      const firstCell = element.querySelector("tbody td")!;
      const before = firstCell.getBoundingClientRect().left;
      element.scrollLeft = 400;
      return { scroll: element.scrollWidth, client: element.clientWidth, position: getComputedStyle(firstCell).position, moved: firstCell.getBoundingClientRect().left - before };
    });
    expect(layout.scroll).toBeGreaterThan(layout.client);
    expect(layout.position).toBe("sticky");
    expect(layout.moved).toBe(0);
    await saveScreenshot(page, `gauge-table-phone-${STAGE}`);
  });
});

describe("limits editor", () => {
  it("takes bounds in ksi when the person reads US units, and in MPa again after", async () => {
    const page = pages.desktop;
    await page.goto(MAIN_PAGES.limits);
    await page.getByLabel("Units", { exact: true }).selectOption("us");
    await page.getByText("Upper bound (ksi)").first().waitFor();
    // LC-Q1's watch bound of 120 MPa: 120 / 6.894 757 = 17.405 ksi (NIST SP 811, 1 psi = 6 894.757 Pa).
    await expect(page.getByLabel("Upper bound, limit 1").inputValue()).resolves.toBe("17.405");
    await saveScreenshot(page, `limits-editor-desktop-us-${STAGE}`);
    await page.getByLabel("Units", { exact: true }).selectOption("si");
    await page.getByText("Upper bound (MPa)").first().waitFor();
    await expect(page.getByLabel("Upper bound, limit 1").inputValue()).resolves.toBe("120");
  });

  it("gives each field a readable width on a phone and shows the whole level name on a desktop", async () => {
    for (const size of Object.keys(SIZES) as Size[]) {
      const page = pages[size];
      await page.goto(MAIN_PAGES.limits);
      const upper = page.getByLabel("Upper bound, limit 1");
      await upper.waitFor();
      // A box narrower than about eight characters of the 16 px phone font cannot show "-17.405".
      expect((await upper.boundingBox())!.width).toBeGreaterThan(100);
      const level = page.getByLabel("Level, limit 2");
      const fits = await level.evaluate((select: HTMLSelectElement) => select.scrollWidth <= select.clientWidth);
      expect(fits).toBe(true);
      await saveScreenshot(page, `limits-editor-${size}-${STAGE}`);
    }
  });
});

describe("charts", () => {
  it("explains the shading of alert episodes with a legend", async () => {
    const page = pages.desktop;
    await page.goto("/structures/MILL-FB/gauges/DG-3");
    const legend = page.getByTestId("episode-legend").first();
    await legend.waitFor();
    await expect(legend.textContent()).resolves.toMatch(/alert episode.*watch/);
  });

  it("zooms in by dragging and back out by double-clicking", async () => {
    const page = pages.desktop;
    await page.goto(MAIN_PAGES.gauge);
    const chart = page.getByRole("region", { name: "Stress chart" });
    await chart.locator(".u-over").waitFor();
    const range = page.getByTestId("chart-range");
    const first = await range.textContent();
    await dragAcrossChart(page, chart);
    await expect.poll(() => range.textContent(), { timeout: 10_000 }).not.toBe(first);
    await chart.locator(".u-over").waitFor();
    await chart.locator(".u-over").dblclick();
    await expect.poll(() => range.textContent(), { timeout: 10_000 }).toBe(first);
  });
});

describe("audit trail", () => {
  it("reads each changed field as name, old → new, with units", async () => {
    const page = pages.desktop;
    await page.goto("/structures/MILL-FB/gauges/DG-3/edit");
    await page.getByLabel(/^Gauge factor/).fill("2.09");
    await page.getByLabel(/^Location/).fill("Diagonal D3, mid-length, west face");
    await page.getByRole("button", { name: "Save changes" }).click();
    await page.waitForURL(/\/gauges\/DG-3$/);
    // The audit trail streams in after the page shell; read it once the new entry shows.
    await expect.poll(() => page.getByTestId("audit-change").allTextContents(), { timeout: 15_000 }).toContain("Gauge factor: 2.08 → 2.09");
    const changes = await page.getByTestId("audit-change").allTextContents();
    expect(changes).toContain("Gauge factor: 2.08 → 2.09");
    expect(changes).toContain("Location: Diagonal D3, mid-length → Diagonal D3, mid-length, west face");
    expect(changes.join("\n")).toMatch(/Limits: .*strain watch: above 110 µε, below -110 µε/);
    expect(changes.join("\n")).not.toMatch(/[{}]/);
    for (const size of Object.keys(SIZES) as Size[]) {
      await pages[size].goto("/structures/MILL-FB/gauges/DG-3");
      await pages[size].getByTestId("audit-row").first().scrollIntoViewIfNeeded();
      await saveScreenshot(pages[size], `audit-trail-${size}-${STAGE}`);
    }
  });

  it("stacks the audit rows on a phone, so the page never scrolls sideways", async () => {
    const page = pages.phone;
    await page.goto("/structures/MILL-FB/gauges/DG-3");
    const row = page.getByTestId("audit-row").first();
    await row.waitFor();
    await page.waitForLoadState("networkidle");
    // Each field is a line headed by its column name, and neither the page nor the section overflows.
    await expect(row.locator("td").first().evaluate((cell) => getComputedStyle(cell).display)).resolves.toBe("block");
    const section = page.getByRole("region", { name: /^Changes to this location/ });
    const { scroll, client } = await section.evaluate((element) => ({ scroll: element.scrollWidth, client: element.clientWidth }));
    expect(scroll).toBeLessThanOrEqual(client);
    expect(await documentOverflow(page)).toBeLessThanOrEqual(0);
  });
});

describe("drawings", () => {
  it("keeps the tags of a rosette's close gauges apart on the drawing", async () => {
    for (const size of Object.keys(SIZES) as Size[]) {
      const page = pages[size];
      await page.goto(MAIN_PAGES.structure);
      const tags = page.getByTestId("gauge-marker").filter({ hasText: /^GP-R1/ }).locator("[data-label-slot]");
      await expect(tags.count()).resolves.toBe(3);
      // The drawings stream in behind a skeleton: measure once each tag is shown.
      for (const tag of await tags.all()) await tag.waitFor();
      const boxes = await Promise.all((await tags.all()).map((tag) => tag.boundingBox()));
      for (let i = 0; i < boxes.length; i++) {
        for (let j = i + 1; j < boxes.length; j++) {
          const [a, b] = [boxes[i]!, boxes[j]!];
          const overlap = a.x < b.x + b.width && b.x < a.x + a.width && a.y < b.y + b.height && b.y < a.y + a.height;
          expect(overlap, `tags ${i} and ${j} overlap`).toBe(false);
        }
      }
    }
  });
});

describe("upload page", () => {
  it("lists the structure's gauges with what their value column is in", async () => {
    const page = pages.phone;
    await page.goto(MAIN_PAGES.upload);
    const row = page.getByTestId("upload-gauge").filter({ hasText: "LC-M1" });
    await expect(row.textContent()).resolves.toMatch(/Bridge output, mV\/V/);
    await saveScreenshot(pages.desktop, `gauge-table-desktop-${STAGE}`);
  });
});

const AXE = fs.readFileSync(path.join(process.cwd(), "node_modules", "axe-core", "axe.min.js"), "utf8");

type AxeResult = { violations: { id: string; impact: string | null; help: string; nodes: { target: string[] }[] }[] };

describe("accessibility (axe-core 4.14.1, WCAG 2.1 A and AA rules)", () => {
  for (const [name, url] of Object.entries(MAIN_PAGES)) {
    it(`${name} page has no serious or critical violation`, async () => {
      const page = pages.desktop;
      await page.goto(url);
      await page.getByRole("heading", { level: 1 }).waitFor();
      await page.waitForLoadState("networkidle");
      // Evaluated through the browser's debugging protocol, so the page's own script policy does not apply.
      await page.evaluate(AXE);
      const result = (await page.evaluate(() =>
        (window as unknown as { axe: { run: (context: Document, options: object) => Promise<unknown> } }).axe.run(document, {
          runOnly: { type: "tag", values: ["wcag2a", "wcag2aa", "wcag21a", "wcag21aa"] },
        }),
      )) as AxeResult;
      const severe = result.violations
        .filter((violation) => violation.impact === "serious" || violation.impact === "critical")
        .map((violation) => `${violation.id} (${violation.impact}): ${violation.help} at ${violation.nodes.slice(0, 3).map((node) => node.target.join(" ")).join(", ")}`);
      expect(severe).toEqual([]);
    });
  }
});
