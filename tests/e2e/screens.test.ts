import { afterAll, beforeAll, describe, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { DESKTOP, PHONE, SignInPage, launchBrowser, newContext, saveScreenshot } from "./browser";

/** Screenshots of this suite are named by stage ("before" on the earlier build, "after" otherwise). */
const STAGE = process.env.SCREENSHOT_STAGE ?? "after";

let browser: Browser;
const pages: Record<"desktop" | "phone", Page> = {} as never;

beforeAll(async () => {
  browser = await launchBrowser();
  for (const [name, viewport] of [["desktop", DESKTOP], ["phone", PHONE]] as const) {
    pages[name] = await (await newContext(browser, viewport)).newPage();
    await new SignInPage(pages[name]).signInAs("engineer");
  }
});
afterAll(async () => {
  await browser?.close();
});

describe("screenshots of the table, the limits editor and the audit trail", () => {
  it("records an edit so the audit trail has a change to show", async () => {
    const page = pages.desktop;
    await page.goto("/structures/MILL-FB/gauges/DG-3/edit");
    await page.getByLabel(/^Gauge factor/).fill("2.09");
    await page.getByLabel(/^Location/).fill("Diagonal D3, mid-length, west face");
    await page.getByRole("button", { name: "Save changes" }).click();
    await page.waitForURL(/\/gauges\/DG-3$/);
  });

  for (const size of ["desktop", "phone"] as const) {
    it(`takes the ${size} screenshots`, async () => {
      const page = pages[size];
      await page.goto("/structures/MILL-FB");
      await page.getByTestId("gauge-row").first().waitFor();
      await saveScreenshot(page, `gauge-table-${size}-${STAGE}`);
      await page.goto("/structures/MILL-FB/gauges/LC-M1/limits");
      await page.getByTestId("limit-row").first().waitFor();
      await saveScreenshot(page, `limits-editor-${size}-${STAGE}`);
      await page.goto("/structures/MILL-FB/gauges/DG-3");
      await page.getByTestId("audit-row").first().waitFor();
      await saveScreenshot(page, `audit-trail-${size}-${STAGE}`);
    });
  }
});
