import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { formatInTimeZone, zoneName } from "@/lib/time-format";
import { SignInPage, launchBrowser, newContext, saveScreenshot } from "./browser";

/** Page object of the logger-file upload page. */
class UploadPage {
  constructor(private readonly page: Page) {}

  async openFromStructure(code: string) {
    await this.page.goto(`/structures/${code}`);
    await this.page.getByRole("link", { name: "Upload logger file" }).click();
    await this.page.getByRole("heading", { name: "Upload a logger file" }).waitFor();
  }

  async choose(file: string) {
    await this.page.getByLabel("Logger file (CSV)").setInputFiles(file);
  }

  preview() {
    return this.page.getByRole("table", { name: "First rows of the file" });
  }

  timezone() {
    return this.page.getByLabel("Time zone of times without an offset");
  }

  async upload() {
    await this.page.getByRole("button", { name: "Upload", exact: true }).click();
  }

  progress() {
    return this.page.getByRole("progressbar", { name: "Import progress" });
  }

  rejectedRows() {
    return this.page.getByTestId("rejected-row");
  }
}

let browser: Browser;
let folder: string;
beforeAll(async () => {
  browser = await launchBrowser();
  folder = fs.mkdtempSync(path.join(os.tmpdir(), "hookeline-upload-"));
});
afterAll(async () => {
  await browser?.close();
  fs.rmSync(folder, { recursive: true, force: true });
});

/**
 * A logger file of LC-M1 (quarter bridge, mV/V) every minute for two days from ten days ago, local
 * times, with three bad rows. The demo gauges were zeroed 91 days ago, so the file comes after
 * their zero; at half a minute past, no row repeats a seeded 10-minute reading.
 */
/** The wall-clock time of the file's first row, written as if it were UTC. */
const fileStart = () => Math.floor((Date.now() - 10 * 86_400_000) / 86_400_000) * 86_400_000 + 8 * 3_600_000 + 30_000;

function loggerFile(): string {
  const start = fileStart();
  const timeOf = (i: number) => new Date(start + i * 60_000).toISOString().slice(0, 19).replace("T", " ");
  const rows = ["gauge,time,value,temperature"];
  for (let i = 0; i < 3000; i++) {
    rows.push(`LC-M1,${timeOf(i)},${(0.0123 + 0.0004 * Math.sin(i / 30)).toFixed(6)},${(4 + i / 1000).toFixed(2)}`);
  }
  rows[11] = `LC-M1,${timeOf(10)},not-read,4.01`; // line 12
  rows[501] = `LC-X9,${timeOf(500)},0.0123,4.5`; // line 502
  rows[2001] = "LC-M1,06/01/2025 17:20,0.0123,5.0"; // line 2002
  const file = path.join(folder, "footbridge-january.csv");
  fs.writeFileSync(file, `${rows.join("\n")}\n`);
  return file;
}

describe("logger-file upload", () => {
  it("the technician previews a file, uploads it with a progress bar and gets the report of bad rows", async () => {
    const context = await newContext(browser);
    const page = await context.newPage();
    await new SignInPage(page).signInAs("technician");
    const upload = new UploadPage(page);
    await upload.openFromStructure("MILL-FB");
    await expect(upload.timezone().inputValue()).resolves.toBe("Europe/London");

    await upload.choose(loggerFile());
    await upload.preview().getByText("LC-M1").first().waitFor();
    await expect(upload.preview().locator("th").allTextContents()).resolves.toEqual(["gauge", "time", "value", "temperature"]);

    await upload.upload();
    await page.getByText("Import finished").waitFor({ timeout: 30_000 });
    await expect(upload.progress().getAttribute("aria-valuenow")).resolves.toBe("100");
    // By hand: 3000 rows, three of them bad.
    await page.getByText("2,997 stored").waitFor();
    await expect(upload.rejectedRows().count()).resolves.toBe(3);
    // Per gauge: LC-M1's 2 997 readings span the file's first and last rows (i = 0 and 2 999; the bad
    // rows lie inside), shown on the structure's clock, the clock the file was written in.
    // The file's wall clock, named as London names it at that time (GMT or BST).
    const wallClock = (i: number) => `${formatInTimeZone(fileStart() + i * 60_000, "UTC").replace(/ UTC$/, "")} ${zoneName(fileStart() + i * 60_000, "Europe/London")}`;
    await expect(page.getByTestId("arrival-row").allTextContents()).resolves.toEqual([`LC-M12,997${wallClock(0)}${wallClock(2999)}`]);
    const rows = await upload.rejectedRows().allTextContents();
    expect(rows[0]).toMatch(/^12not-finite.*not a finite number/);
    expect(rows[1]).toMatch(/^502unknown-gauge.*LC-X9/);
    expect(rows[2]).toMatch(/^2002invalid-time.*ISO-8601/);
    await saveScreenshot(page, "upload-report");

    const [download] = await Promise.all([page.waitForEvent("download"), page.getByRole("button", { name: "Download report (CSV)" }).click()]);
    const report = fs.readFileSync((await download.path())!, "utf8").split("\n");
    expect(report[0]).toMatch(/3000 rows, 2997 stored, 0 duplicates, 3 rejected/);
    expect(report[1]).toBe("line,code,message");
    expect(report[2]).toMatch(/^12,not-finite,/);
    await context.close();
  });
});
