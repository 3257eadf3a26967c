import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { getClient } from "@/db/client";
import { faultDatabase } from "../faults/fault-database";
import { makeStructure, makeUser } from "../integration/helpers";
import { DESKTOP, PHONE, SignInPage, launchBrowser } from "./browser";

/**
 * The error screens of a page whose data cannot be read, on a database of this file's own (the
 * shared demo database must keep working for the other browser tests): a table the page reads is
 * renamed away under the running server, then put back before "Try again".
 */
const database = await faultDatabase("error-screens");
const engineer = await makeUser("engineer");
await makeStructure("BROKEN", [engineer]);

let browser: Browser;
let baseUrl: string;
beforeAll(async () => {
  baseUrl = (await database.startServer({ jobs: false })).baseUrl;
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

async function signedInPage(viewport: { width: number; height: number }): Promise<Page> {
  const page = await (await browser.newContext({ baseURL: baseUrl, viewport })).newPage();
  const signIn = new SignInPage(page);
  await signIn.open();
  await signIn.signIn(engineer.email, "correct-horse");
  await page.waitForURL((url) => url.pathname === "/");
  return page;
}

/** Runs `look` while `table` is missing from the database, and puts it back whatever happens. */
async function withTableMissing(table: string, look: () => Promise<void>) {
  await getClient().execute(`ALTER TABLE ${table} RENAME TO ${table}_away`);
  try {
    await look();
  } finally {
    await getClient().execute(`ALTER TABLE ${table}_away RENAME TO ${table}`);
  }
}

describe("a page whose data cannot be read", () => {
  for (const [name, viewport] of [
    ["desktop", DESKTOP],
    ["phone", PHONE],
  ] as const) {
    it(`says so in words, keeps the navigation, and shows the page again after "Try again" (${name})`, async () => {
      const page = await signedInPage(viewport);
      await withTableMissing("alerts", async () => {
        await page.goto("/alerts");
        const screen = page.getByRole("alert").filter({ hasText: "Could not show the alerts" });
        await screen.waitFor({ timeout: 30_000 });
        expect(await screen.textContent()).toContain("Stored readings, limits and alerts are not affected");
        // The server's message (it names the missing table) stays in the server's log.
        expect(await page.content()).not.toContain("no such table");
        // The segment failed, not the app: the main navigation around it is still there.
        expect(await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Structures" }).isVisible()).toBe(true);
      });
      await page.getByRole("button", { name: "Try again" }).click();
      await page.getByRole("heading", { name: "Alerts", exact: true }).waitFor({ timeout: 30_000 });
      expect(await page.getByText("Could not show the alerts").count()).toBe(0);

      await withTableMissing("gauges", async () => {
        await page.goto("/structures/BROKEN");
        await page.getByRole("alert").filter({ hasText: "Could not show this structure" }).waitFor({ timeout: 30_000 });
      });
      await page.getByRole("button", { name: "Try again" }).click();
      await page.getByRole("heading", { name: "Structure BROKEN", exact: true }).waitFor({ timeout: 30_000 });
      expect(await page.getByText("Could not show this structure").count()).toBe(0);
      await page.context().close();
    }, 120_000);
  }
});
