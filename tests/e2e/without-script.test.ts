import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, BrowserContext } from "playwright-core";
import { DESKTOP, PHONE, SignInPage, launchBrowser, newContext } from "./browser";

/**
 * Forms bound to server actions work before the page's JavaScript has loaded: with the page's
 * script bundles held back (the streamed HTML's own inline scripts still run, as on a slow line),
 * the browser posts the form itself and the page comes back with the action's outcome.
 */
const SIZES = { desktop: DESKTOP, phone: PHONE } as const;
type Size = keyof typeof SIZES;

let browser: Browser;
const contexts = {} as Record<Size, BrowserContext>;

beforeAll(async () => {
  browser = await launchBrowser();
  for (const size of Object.keys(SIZES) as Size[]) {
    const context = await newContext(browser, SIZES[size]);
    const signIn = await context.newPage();
    await new SignInPage(signIn).signInAs("engineer");
    await signIn.close();
    await context.route("**/_next/static/**/*.js", (route) => route.abort());
    contexts[size] = context;
  }
});
afterAll(async () => {
  await browser?.close();
});

describe("forms before the JavaScript has loaded", () => {
  for (const size of Object.keys(SIZES) as Size[]) {
    it(`creates a logger token and shows it once, and names the missing field (${size})`, async () => {
      const page = await contexts[size].newPage();
      const loggerName = `no-script logger ${size} ${Date.now().toString(36)}`;
      await page.goto("/structures/MILL-FB");
      const form = page.getByRole("form", { name: "Create a logger token" });

      await form.getByRole("button", { name: "Create logger token" }).click();
      await page.waitForLoadState("load");
      await expect(page.getByRole("form", { name: "Create a logger token" }).getByLabel("Logger name").getAttribute("aria-invalid")).resolves.toBe("true");
      await expect(page.getByTestId("new-secret").count()).resolves.toBe(0);

      await page.getByRole("form", { name: "Create a logger token" }).getByLabel("Logger name").fill(loggerName);
      await page.getByRole("form", { name: "Create a logger token" }).getByRole("button", { name: "Create logger token" }).click();
      await page.waitForLoadState("load");
      const secret = await page.getByTestId("new-secret").textContent();
      expect(secret?.trim().length).toBeGreaterThan(20);
      await page.getByRole("row").filter({ hasText: loggerName }).first().waitFor();
    });
  }
});
