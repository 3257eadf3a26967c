import fs from "node:fs";
import path from "node:path";
import { chromium, type Browser, type BrowserContext, type Locator, type Page } from "playwright-core";
import { inject } from "vitest";
import { DEMO_USERS } from "@/db/seed";
import type { Role } from "@/db/schema";

export const baseUrl = () => inject("baseUrl");

/** Debian's Chromium, started the way this machine's closed network wants it. */
export function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    headless: true,
    args: [
      "--no-sandbox",
      "--disable-gpu",
      "--disable-quic",
      "--disable-background-networking",
      "--disable-component-update",
      "--disable-sync",
      "--no-first-run",
    ],
  });
}

export const PHONE = { width: 390, height: 844 };
export const DESKTOP = { width: 1280, height: 860 };

export function newContext(browser: Browser, viewport = DESKTOP): Promise<BrowserContext> {
  return browser.newContext({ baseURL: baseUrl(), viewport });
}

export function demoUser(role: Role) {
  const user = DEMO_USERS.find((u) => u.role === role);
  if (!user) throw new Error(`no demo ${role}`);
  return user;
}

/** Page object of the sign-in page. */
export class SignInPage {
  constructor(private readonly page: Page) {}

  async open() {
    await this.page.goto("/signin");
  }

  async signIn(email: string, password: string) {
    await this.page.getByLabel("E-mail").fill(email);
    await this.page.getByLabel("Password").fill(password);
    await this.page.getByRole("button", { name: "Sign in" }).click();
  }

  async signInAs(role: Role) {
    const user = demoUser(role);
    await this.open();
    await this.signIn(user.email, user.password);
    await this.page.waitForURL((url) => url.pathname === "/");
  }

  error() {
    return this.page.locator("form [role=alert]");
  }
}

export async function signOut(page: Page) {
  await page.getByRole("link", { name: "Sign out" }).click();
  await page.getByRole("button", { name: "Sign out", exact: true }).click();
  await page.waitForURL((url) => url.pathname === "/signin");
}

/** Saves a screenshot as a test artefact under test-results/. */
export async function saveScreenshot(page: Page, name: string) {
  const folder = path.join("test-results", "screenshots");
  fs.mkdirSync(folder, { recursive: true });
  await page.screenshot({ path: path.join(folder, `${name}.png`), fullPage: true });
}

/** Drags across the middle fifth of a uPlot chart (its `.u-over` layer), as a person zooms in. */
export async function dragAcrossChart(page: Page, chart: Locator) {
  const box = (await chart.locator(".u-over").boundingBox())!;
  const y = box.y + box.height / 2;
  await page.mouse.move(box.x + box.width * 0.4, y);
  await page.mouse.down();
  await page.mouse.move(box.x + box.width * 0.6, y, { steps: 5 });
  await page.mouse.up();
}
