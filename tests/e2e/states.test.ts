import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page, Request, Route } from "playwright-core";
import { DESKTOP, PHONE, SignInPage, launchBrowser, newContext } from "./browser";
import { foilGaugeBody } from "../fixtures/gauges";

/** Loading, empty and error screens at both widths, each asked for on purpose instead of hoped for. */
const SIZES = { desktop: DESKTOP, phone: PHONE } as const;
type Size = keyof typeof SIZES;
const EMPTY_STRUCTURE = "E2E-STATES";

let browser: Browser;
const pages = {} as Record<Size, Page>;

beforeAll(async () => {
  browser = await launchBrowser();
  for (const size of Object.keys(SIZES) as Size[]) {
    pages[size] = await (await newContext(browser, SIZES[size])).newPage();
    await new SignInPage(pages[size]).signInAs("admin");
  }
  const admin = pages.desktop;
  const created = await admin.request.post("/api/v1/structures", { data: { code: EMPTY_STRUCTURE, name: "States test structure", timezone: "UTC" } });
  expect(created.status()).toBe(201);
  const gauge = await admin.request.post(`/api/v1/structures/${EMPTY_STRUCTURE}/gauges`, { data: { ...foilGaugeBody("QUIET"), expectedInterval: 600 } });
  expect(gauge.status()).toBe(201);
});
afterAll(async () => {
  await browser?.close();
});

/** Requests matching `matches` wait at the network until `release()`, so a screen can be read while it waits for them. */
async function holdRequests(page: Page, matches: (url: URL, request: Request) => boolean) {
  const held: Route[] = [];
  let holding = true;
  const handler = async (route: Route) => {
    const request = route.request();
    if (holding && matches(new URL(request.url()), request)) held.push(route);
    else await route.continue();
  };
  await page.route("**/*", handler);
  return {
    heldCount: () => held.length,
    async release() {
      holding = false;
      await Promise.all(held.splice(0).map((route) => route.continue()));
      await page.unroute("**/*", handler);
    },
  };
}

const documentOverflow = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);

describe("loading screens", () => {
  for (const size of Object.keys(SIZES) as Size[]) {
    it(`says each chart is loading until its series arrives (${size})`, async () => {
      const page = pages[size];
      const gate = await holdRequests(page, (url) => url.pathname.endsWith("/gauges/LC-M1/series"));
      try {
        await page.goto("/structures/MILL-FB/gauges/LC-M1");
        const chart = page.getByRole("region", { name: "Stress chart" });
        await chart.getByRole("status").filter({ hasText: "Loading the stress…" }).waitFor();
        await expect.poll(() => gate.heldCount(), { timeout: 15_000 }).toBeGreaterThan(0);
      } finally {
        await gate.release();
      }
      await page.getByRole("region", { name: "Stress chart" }).locator("canvas").first().waitFor();
    });
  }

  for (const size of Object.keys(SIZES) as Size[]) {
    it(`shows the structure's loading screen while the page is read after a click (${size})`, async () => {
      const page = pages[size];
      const isStructurePage = (url: URL) => url.pathname === "/structures/MILL-FB";
      // The link's prefetch brings the loading screen ahead of the click; only the page itself is held.
      const gate = await holdRequests(page, (url, request) => isStructurePage(url) && request.headers()["rsc"] === "1" && !request.headers()["next-router-prefetch"]);
      try {
        await page.goto("/");
        const card = page.getByTestId("structure-card").filter({ hasText: "MILL-FB" });
        await card.hover();
        await page.waitForLoadState("networkidle");
        await card.click();
        await page.getByRole("status").filter({ hasText: "Loading the structure…" }).waitFor();
        await expect.poll(() => gate.heldCount(), { timeout: 15_000 }).toBeGreaterThan(0);
        expect(await documentOverflow(page)).toBeLessThanOrEqual(0);
      } finally {
        await gate.release();
      }
      await page.getByRole("heading", { level: 2, name: "Gauges" }).waitFor();
    });
  }
});

describe("error and empty screens", () => {
  for (const size of Object.keys(SIZES) as Size[]) {
    it(`says in words that a structure code does not exist (${size})`, async () => {
      const page = pages[size];
      const response = await page.goto("/structures/NO-SUCH-CODE");
      expect(response?.status()).toBe(404);
      await page.getByRole("heading", { level: 1, name: "Not found" }).waitFor();
      await expect(page.getByText(/does not exist, or it belongs to a structure you are not a member of/).isVisible()).resolves.toBe(true);
      expect(await documentOverflow(page)).toBeLessThanOrEqual(0);
    });

    it(`says a chart could not be loaded, with the server's reason, when its series fails (${size})`, async () => {
      const page = pages[size];
      const failing = async (route: Route) =>
        route.fulfill({ status: 503, contentType: "application/json", body: JSON.stringify({ error: { code: "unavailable", message: "The database is busy." } }) });
      await page.route("**/gauges/LC-M1/series?quantity=stress*", failing);
      try {
        await page.goto("/structures/MILL-FB/gauges/LC-M1");
        const alert = page.getByRole("region", { name: "Stress chart" }).getByRole("alert");
        await alert.waitFor();
        await expect(alert.textContent()).resolves.toBe("The stress could not be loaded: The database is busy. Try again, or choose a shorter period.");
        expect(await documentOverflow(page)).toBeLessThanOrEqual(0);
      } finally {
        await page.unroute("**/gauges/LC-M1/series?quantity=stress*", failing);
      }
    });

    it(`says a gauge that never sent a reading has none yet, in words (${size})`, async () => {
      const page = pages[size];
      await page.goto(`/structures/${EMPTY_STRUCTURE}/gauges/QUIET`);
      await page.getByText("No readings yet", { exact: true }).waitFor();
      await expect(page.getByText("Charts appear once the logger sends data or a logger file is uploaded.").isVisible()).resolves.toBe(true);
      await expect(page.getByRole("region", { name: "Stress chart" }).count()).resolves.toBe(0);
      expect(await documentOverflow(page)).toBeLessThanOrEqual(0);
    });
  }
});
