import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser } from "playwright-core";
import { DESKTOP, PHONE, SignInPage, launchBrowser, newContext, saveScreenshot } from "./browser";

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe.each([
  ["desktop", DESKTOP],
  ["phone", PHONE],
])("sessions at %s width", (width, viewport) => {
  it("'Sign out on every device' ends the session of another browser too", async () => {
    const laptop = await (await newContext(browser, viewport)).newPage();
    const phone = await (await newContext(browser, viewport)).newPage();
    await new SignInPage(laptop).signInAs("technician");
    await new SignInPage(phone).signInAs("technician");
    await laptop.goto("/signout");
    await laptop.getByRole("button", { name: "Sign out on every device" }).click();
    await laptop.waitForURL((url) => url.pathname === "/signin");
    await phone.goto("/structures/MILL-FB");
    await phone.waitForURL((url) => url.pathname === "/signin");
    await saveScreenshot(phone, `signed-out-everywhere-${width}`);
    await laptop.context().close();
    await phone.context().close();
  });

  it("says sign-in is paused after repeated wrong passwords", async () => {
    const page = await (await newContext(browser, viewport)).newPage();
    const signIn = new SignInPage(page);
    await signIn.open();
    // An address without an account is paused like one with an account, so the pause reveals nothing.
    for (let attempt = 0; attempt < 6; attempt++) {
      await signIn.signIn(`nobody-${width}@hookeline.example`, `guess-${attempt}`);
      await signIn.error().waitFor();
      await page.getByRole("button", { name: "Sign in" }).waitFor();
    }
    await expect(signIn.error().textContent()).resolves.toMatch(/paused for a quarter hour/);
    await saveScreenshot(page, `sign-in-paused-${width}`);
    await page.context().close();
  });
});
