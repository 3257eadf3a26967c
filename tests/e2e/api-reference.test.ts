import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser } from "playwright-core";
import { DESKTOP, PHONE, SignInPage, baseUrl, launchBrowser, newContext, saveScreenshot } from "./browser";

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe("the API reference", () => {
  for (const [name, viewport] of [
    ["desktop", DESKTOP],
    ["phone", PHONE],
  ] as const) {
    it(`draws the served document's paths from the app alone (${name})`, async () => {
      const context = await newContext(browser, viewport);
      const page = await context.newPage();
      const elsewhere: string[] = [];
      page.on("request", (request) => {
        if (!request.url().startsWith(baseUrl()) && !request.url().startsWith("data:")) elsewhere.push(request.url());
      });
      const troubles: string[] = [];
      page.on("console", (message) => message.type() === "error" && troubles.push(`console: ${message.text()}`));
      page.on("pageerror", (error) => troubles.push(`page error: ${error.message}`));
      page.on("requestfailed", (request) => troubles.push(`request failed: ${request.url()} ${request.failure()?.errorText}`));
      await new SignInPage(page).signInAs("engineer");
      await page.goto("/api-reference");
      const reference = page.getByTestId("api-reference");
      // Swagger UI's bundle is large: on a busy CI machine parsing it has taken more than 20 s.
      const drawn = page.locator("[data-state='ready'], [data-state='failed']");
      await drawn.waitFor({ timeout: 50_000 }).catch(async (error: Error) => {
        const state = await page.locator("[data-state]").first().getAttribute("data-state").catch(() => "none");
        throw new Error(`${error.message}\nat ${page.url()}, state ${state}\n${troubles.join("\n")}`);
      });
      expect(await drawn.getAttribute("data-state"), "the reference says it could not be drawn").toBe("ready");
      await expect.poll(() => reference.locator(".opblock-tag").count(), { timeout: 10_000 }).toBeGreaterThan(5);
      const served = await (await page.request.get("/api/v1/openapi.json")).json();
      const shown = await reference.locator(".opblock-summary-path").evaluateAll((nodes) => nodes.map((node) => node.getAttribute("data-path")));
      expect(new Set(shown)).toEqual(new Set(Object.keys(served.paths)));
      expect(await reference.locator(".opblock-tag", { hasText: "gauges" }).first().isVisible()).toBe(true);
      await saveScreenshot(page, `api-reference-${name}`);
      expect(elsewhere).toEqual([]);
      await context.close();
    }, 90_000);
  }
});
