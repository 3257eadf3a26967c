import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { dayOf } from "@/lib/time-format";
import { pdfDocument } from "../fixtures/documents";
import { DESKTOP, PHONE, SignInPage, launchBrowser, newContext, saveScreenshot } from "./browser";

const ZONE = "Europe/London"; // the demo footbridge's zone
const DAY = 86_400_000;
const day = (offset: number) => dayOf(Date.now() + offset * DAY, ZONE);

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

/** Page object of the structure's certificates page. */
class CertificatesPage {
  constructor(private readonly page: Page) {}
  form() {
    return this.page.getByRole("form", { name: "Record a calibration certificate" });
  }
  async fill(fields: { number: string; issuedOn: string; expiresOn: string }, file: { name: string; mimeType: string; buffer: Buffer }) {
    const form = this.form();
    await form.getByLabel("Gauge", { exact: true }).selectOption("LC-M1");
    await form.getByLabel("Certificate number").fill(fields.number);
    await form.getByLabel("Issued by").fill("Example calibration laboratory");
    await form.getByLabel("Issued on").fill(fields.issuedOn);
    await form.getByLabel("Expires on").fill(fields.expiresOn);
    await form.getByLabel("Certificate file").setInputFiles(file);
    await form.getByRole("button", { name: "Record certificate" }).click();
  }
  row(number: string) {
    return this.page.getByTestId("certificate-row").filter({ hasText: number });
  }
}

describe("calibration certificates", () => {
  it("lets a technician record one at desktop width: wrong dates and a file that is no PDF refused in words, then listed as expiring, also on the gauge page", async () => {
    const page = await (await newContext(browser, DESKTOP)).newPage();
    await new SignInPage(page).signInAs("technician");
    await page.goto("/structures/MILL-FB");
    await page.getByRole("link", { name: "Certificates", exact: true }).click();
    await page.getByText("No calibration certificates recorded yet").waitFor();
    const certificates = new CertificatesPage(page);
    const pdf = { name: "certificate.pdf", mimeType: "application/pdf", buffer: Buffer.from(await pdfDocument("Certificate CC-E2E")) };

    await certificates.fill({ number: "CC-E2E", issuedOn: day(-300), expiresOn: day(-301) }, pdf);
    await expect.poll(() => certificates.form().getByRole("alert").textContent()).toContain(`The expiry date must be after the issue date (${day(-300)})`);
    await certificates.fill({ number: "CC-E2E", issuedOn: day(-300), expiresOn: day(10) }, { ...pdf, buffer: Buffer.from("not a PDF at all") });
    await expect.poll(() => certificates.form().getByRole("alert").textContent()).toContain("Only PDF files and PNG, JPEG or WebP images are accepted");
    expect(await page.getByTestId("certificate-row").count()).toBe(0);

    await certificates.fill({ number: "CC-E2E", issuedOn: day(-300), expiresOn: day(10) }, pdf);
    await expect.poll(() => certificates.row("CC-E2E").textContent(), { timeout: 15_000 }).toContain(`Expiring`);
    expect(await certificates.row("CC-E2E").getByTestId("certificate-standing").textContent()).toBe(`Expires in 10 days, on ${day(10)}`);
    await saveScreenshot(page, "certificates-desktop");

    await certificates.row("CC-E2E").getByRole("link", { name: "LC-M1" }).click();
    const onGauge = page.getByRole("region", { name: "Calibration certificates" });
    await expect.poll(() => onGauge.getByTestId("certificate-standing").textContent(), { timeout: 15_000 }).toBe(`Expires in 10 days, on ${day(10)}`);
  });

  it("shows the owner the list at phone width, stacked, without the form", async () => {
    const page = await (await newContext(browser, PHONE)).newPage();
    await new SignInPage(page).signInAs("owner");
    await page.goto("/structures/MILL-FB/certificates");
    await page.getByTestId("certificate-row").first().waitFor();
    expect(await page.getByTestId("certificate-standing").first().textContent()).toMatch(/^Expires in 10 days, on \d{4}-\d{2}-\d{2}$/);
    expect(await page.getByRole("form", { name: "Record a calibration certificate" }).count()).toBe(0);
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(PHONE.width);
    await saveScreenshot(page, "certificates-phone");
  });
});
