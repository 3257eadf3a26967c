import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { DESKTOP, PHONE, SignInPage, launchBrowser, newContext } from "./browser";

// The pages run under the Content-Security-Policy that proxy.ts sends (W3C CSP Level 3: a
// blocked script or style is reported as a console error naming the policy).
const MAIN_PAGES = [
  "/",
  "/alerts",
  "/structures/MILL-FB",
  "/structures/MILL-FB/gauges/LC-M1",
  "/structures/MILL-FB/gauges/LC-M1/limits",
  "/structures/MILL-FB/gauges/LC-M1/fatigue",
  "/structures/MILL-FB/rosettes/R1",
  "/structures/MILL-FB/compare",
  "/structures/MILL-FB/report",
  "/admin/users",
  "/admin/tokens",
];

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

/** Every console message that says the policy blocked something, while `visit` runs. */
async function violationsDuring(page: Page, visit: () => Promise<void>): Promise<string[]> {
  const violations: string[] = [];
  page.on("console", (message) => {
    if (/Content[- ]Security[- ]Policy|Refused to (load|execute|apply)/i.test(message.text())) violations.push(message.text());
  });
  page.on("pageerror", (error) => violations.push(`page error: ${error.message}`));
  await visit();
  return violations;
}

describe.each([
  ["desktop", DESKTOP],
  ["phone", PHONE],
])("content security policy at %s width", (_, viewport) => {
  it("the sign-in page and the main pages load with no violation and draw their charts", async () => {
    const page = await (await newContext(browser, viewport)).newPage();
    const violations = await violationsDuring(page, async () => {
      await new SignInPage(page).signInAs("admin");
      for (const path of MAIN_PAGES) {
        const response = await page.goto(path);
        expect(response!.status(), path).toBe(200);
        expect(response!.headers()["content-security-policy"], path).toMatch(/script-src 'self' 'nonce-[^']+' 'strict-dynamic'/);
        await page.waitForLoadState("networkidle");
      }
      await page.goto("/structures/MILL-FB/gauges/LC-M1");
      await page.locator(".u-over").first().waitFor();
      expect(await page.locator("canvas").count()).toBeGreaterThan(0);
    });
    expect(violations).toEqual([]);
    await page.context().close();
  });
});

describe("framing", () => {
  it("a page of another origin cannot show the app in a frame", async () => {
    const page = await (await newContext(browser)).newPage();
    const target = (await page.goto("/signin"))!.url();
    // about:blank is another origin than the app; the frame-ancestors directive refuses it.
    await page.goto("about:blank");
    const navigated = page.waitForEvent("framenavigated", { predicate: (f) => f !== page.mainFrame() });
    await page.setContent(`<iframe src="${target}" width="600" height="400"></iframe>`);
    const frame = await navigated;
    // Chromium replaces a refused frame by its own error page, where no sign-in form is.
    expect(frame.url()).toMatch(/^chrome-error:/);
    expect(await frame.locator("input[type=password]").count()).toBe(0);
    await page.context().close();
  });
});
