import { createClient } from "@libsql/client";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Browser } from "playwright-core";
import { DEMO_USERS } from "@/db/seed";
import type { Role } from "@/db/schema";
import { DESKTOP, PHONE, SignInPage, launchBrowser, newContext, saveScreenshot, signOut } from "./browser";

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

// What each demo role must see, from the demo memberships in db/seed.ts. Administrators see every
// structure in the database, including those other browser tests create.
// The seeded memberships, plus any structure another browser test file's engineer created (its creator becomes a member).
const VISIBLE: Record<Role, () => Promise<string[]>> = {
  admin: allStructureCodes,
  engineer: async () => ["MILL-FB", "ORCH-PD", ...(await structuresCreatedInTests("engineer"))],
  technician: async () => ["MILL-FB"],
  owner: async () => ["MILL-FB", "ORCH-PD"],
};

/** Structures outside the seeded demo that the demo user of `role` is a member of. */
async function structuresCreatedInTests(role: Role): Promise<string[]> {
  const email = DEMO_USERS.find((user) => user.role === role)!.email;
  const client = createClient({ url: inject("databaseUrl") });
  const result = await client.execute({
    sql: `SELECT s.code FROM structures s JOIN structure_members m ON m.structure_id = s.id JOIN users u ON u.id = m.user_id
          WHERE u.email = ? AND s.code NOT IN ('MILL-FB', 'ORCH-PD')`,
    args: [email],
  });
  client.close();
  return result.rows.map((row) => String(row.code));
}

async function allStructureCodes(): Promise<string[]> {
  const client = createClient({ url: inject("databaseUrl") });
  const result = await client.execute("SELECT code FROM structures ORDER BY code");
  client.close();
  return result.rows.map((row) => String(row.code));
}

describe("signing in and out", () => {
  for (const role of Object.keys(VISIBLE) as Role[]) {
    it(`${role}: sees exactly their structures, then signs out`, async () => {
      const context = await newContext(browser, role === "technician" ? PHONE : DESKTOP);
      const page = await context.newPage();
      await new SignInPage(page).signInAs(role);
      const cards = page.getByTestId("structure-card");
      await cards.first().waitFor();
      const codes = (await cards.locator("p.font-mono").allTextContents()).sort();
      expect(codes).toEqual((await VISIBLE[role]()).sort());
      await saveScreenshot(page, `structures-${role}`);
      await signOut(page);
      await page.goto("/");
      expect(new URL(page.url()).pathname).toBe("/signin");
      await context.close();
    });
  }

  it("redirects a signed-out visitor to the sign-in page", async () => {
    const context = await newContext(browser);
    const page = await context.newPage();
    await page.goto("/admin/users");
    expect(new URL(page.url()).pathname).toBe("/signin");
    await context.close();
  });

  it("answers a wrong password with a plain message that does not say whether the e-mail exists", async () => {
    const context = await newContext(browser);
    const page = await context.newPage();
    const signIn = new SignInPage(page);
    await signIn.open();
    await signIn.signIn("engineer@hookeline.example", "not-the-password");
    const known = await signIn.error().textContent();
    await signIn.signIn("nobody@hookeline.example", "not-the-password");
    await page.getByRole("button", { name: "Sign in" }).waitFor();
    const unknown = await signIn.error().textContent();
    expect(known).toMatch(/do not match/);
    expect(unknown).toBe(known);
    expect(new URL(page.url()).pathname).toBe("/signin");
    await context.close();
  });

  it("keeps a technician out of the admin pages and of structures they are not a member of", async () => {
    const context = await newContext(browser, PHONE);
    const page = await context.newPage();
    await new SignInPage(page).signInAs("technician");
    await page.goto("/admin/users");
    await page.getByRole("heading", { name: "Not allowed" }).waitFor();
    await page.goto("/structures/ORCH-PD");
    await page.getByRole("heading", { name: "Not found" }).waitFor();
    await page.goto("/structures/MILL-FB");
    await page.getByRole("heading", { name: "Millrace Footbridge" }).waitFor();
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await saveScreenshot(page, "structure-phone");
    await context.close();
  });
});
