import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { SignInPage, launchBrowser, newContext, saveScreenshot } from "./browser";

let browser: Browser;
let engineer: Page;

beforeAll(async () => {
  browser = await launchBrowser();
  engineer = await (await newContext(browser)).newPage();
  await new SignInPage(engineer).signInAs("engineer");
});
afterAll(async () => {
  await browser?.close();
});

// The demo seed (db/demo-gauges.ts) leaves DG-3's drifting strain at watch, still open, and a
// warning on LC-Q1 that cleared when the parked vehicle left.
describe("alerts in the app", () => {
  it("an engineer acknowledges the open alert with a comment, and it is recorded", async () => {
    await engineer.goto("/alerts");
    const row = engineer.getByTestId("alert-row").filter({ hasText: "DG-3" });
    await row.getByRole("link").click();
    await engineer.getByRole("heading", { name: "Alert on DG-3" }).waitFor();
    const form = engineer.getByRole("form", { name: "Acknowledge" });
    await form.getByLabel("Acknowledge with a comment").fill("Gauge suspected of debonding; technician to check on Friday.");
    await form.getByRole("button", { name: "Acknowledge" }).click();
    // The page redraws with the acknowledgement in the history and the form gone.
    await engineer.getByTestId("alert-event").filter({ hasText: "Gauge suspected of debonding" }).waitFor();
    await engineer.reload();
    await expect(engineer.getByRole("form", { name: "Acknowledge" }).count()).resolves.toBe(0);
    await saveScreenshot(engineer, "alert-acknowledged");
    await engineer.goto("/alerts?state=acknowledged");
    await expect(engineer.getByTestId("alert-row").filter({ hasText: "DG-3" }).count()).resolves.toBe(1);
  });

  it("an owner reads alerts but cannot acknowledge them", async () => {
    const owner = await (await newContext(browser)).newPage();
    await new SignInPage(owner).signInAs("owner");
    await owner.goto("/alerts?state=all");
    await owner.getByTestId("alert-row").filter({ hasText: "LC-Q1" }).getByRole("link").click();
    await owner.getByRole("heading", { name: "Alert on LC-Q1" }).waitFor();
    await expect(owner.getByRole("form", { name: "Acknowledge" }).count()).resolves.toBe(0);
    await expect(owner.getByRole("form", { name: "Clear by hand" }).count()).resolves.toBe(0);
  });

  it("the limits editor refuses a bound in the wrong order and backtests the stored data", async () => {
    await engineer.goto("/structures/MILL-FB/gauges/LC-Q1/limits");
    const rows = engineer.getByTestId("limit-row");
    await expect(rows.count()).resolves.toBe(3);
    await engineer.getByLabel("Lower bound, limit 1").fill("300");
    await engineer.getByRole("button", { name: "Save limits" }).click();
    await engineer.getByText(/lower bound|below the upper/i).first().waitFor();
    await engineer.getByLabel("Lower bound, limit 1").fill("");
    await engineer.getByLabel("Over the last").selectOption("90");
    await engineer.getByRole("button", { name: "Check against stored data" }).click();
    const result = engineer.getByTestId("backtest-result");
    await result.getByText(/alert episode/).waitFor();
    await expect(result.textContent()).resolves.toMatch(/warning on stress/);
    await saveScreenshot(engineer, "limits-editor");
  });

  it("alert e-mails reached the local mail server and an admin can read them", async () => {
    const admin = await (await newContext(browser)).newPage();
    await new SignInPage(admin).signInAs("admin");
    // The server's outbox job sends every few seconds; the seed queued the demo's alert e-mails.
    for (let attempt = 0; attempt < 20; attempt++) {
      await admin.goto("/admin/mail");
      if ((await admin.getByText(/WARNING: MILL-FB LC-Q1/).count()) > 0) break;
      await admin.waitForTimeout(1000);
    }
    await admin.getByText(/WARNING: MILL-FB LC-Q1/).first().waitFor();
    await saveScreenshot(admin, "admin-mail");
  });
});
