import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { pngImage, SVG_DRAWING } from "../fixtures/images";
import { DESKTOP, PHONE, SignInPage, demoUser, launchBrowser, newContext, saveScreenshot } from "./browser";

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

/** Page object of the structure's site-visit page. */
class SiteVisitsPage {
  constructor(private readonly page: Page) {}
  form() {
    return this.page.getByRole("form", { name: "Record a site visit" });
  }
  async record(work: string, photo: { name: string; mimeType: string; buffer: Buffer }) {
    const form = this.form();
    await form.getByLabel("What was done").fill(work);
    await form.getByRole("checkbox", { name: /LC-M1/ }).check();
    await form.getByLabel("Photos (optional)").setInputFiles(photo);
    await form.getByRole("button", { name: "Record visit" }).click();
  }
  visit(work: string) {
    return this.page.getByTestId("site-visit").filter({ hasText: work });
  }
}

const png = { name: "junction-box.png", mimeType: "image/png", buffer: Buffer.from(pngImage(64, 48)) };

describe("site visits", () => {
  it("lets a technician record a visit at desktop width, a script disguised as a photo refused, and links it from the gauge it names", async () => {
    const page = await (await newContext(browser, DESKTOP)).newPage();
    await new SignInPage(page).signInAs("technician");
    await page.goto("/structures/MILL-FB");
    await page.getByRole("link", { name: "Site visits", exact: true }).click();
    await page.getByText("No site visits recorded yet").waitFor();
    const visits = new SiteVisitsPage(page);
    expect(await visits.form().getByLabel("Who").inputValue()).toBe(demoUser("technician").name);
    expect(await visits.form().getByLabel("When (Europe/London)").inputValue()).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}$/);

    await visits.record("Resealed the junction box", { name: "sketch.svg", mimeType: "image/svg+xml", buffer: Buffer.from(SVG_DRAWING) });
    await expect.poll(() => visits.form().getByRole("alert").textContent()).toContain("SVG files are not accepted");
    expect(await page.getByTestId("site-visit").count()).toBe(0);

    await visits.record("Resealed the junction box", png);
    const visit = visits.visit("Resealed the junction box");
    await visit.waitFor({ timeout: 15_000 });
    expect(await visit.textContent()).toContain(demoUser("technician").name);
    expect(await visit.getByRole("img").getAttribute("width")).toBe("64");
    await saveScreenshot(page, "site-visits-desktop");

    await visit.getByRole("link", { name: "LC-M1" }).click();
    const onGauge = page.getByRole("region", { name: "Site visits that name this gauge" });
    await expect.poll(() => onGauge.getByTestId("site-visit").textContent(), { timeout: 15_000 }).toContain("Resealed the junction box");
  });

  it("works at phone width: an engineer records a visit and reads the list without sideways scrolling", async () => {
    const page = await (await newContext(browser, PHONE)).newPage();
    await new SignInPage(page).signInAs("engineer");
    await page.goto("/structures/MILL-FB/site-visits");
    const visits = new SiteVisitsPage(page);
    await visits.record("Checked the cable glands", png);
    await visits.visit("Checked the cable glands").waitFor({ timeout: 15_000 });
    // Newest first: the visit just recorded comes before the technician's earlier one.
    const order = await page.getByTestId("site-visit").allTextContents();
    expect(order[0]).toContain("Checked the cable glands");
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(PHONE.width);
    await saveScreenshot(page, "site-visits-phone");
  });
});
