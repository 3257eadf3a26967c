import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { CONCRETE_CAUTION } from "@/lib/mechanics";
import { DESKTOP, PHONE, SignInPage, launchBrowser, newContext } from "./browser";

let browser: Browser;

beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

async function ownerAt(viewport: typeof DESKTOP): Promise<Page> {
  const page = await (await newContext(browser, viewport)).newPage();
  await new SignInPage(page).signInAs("owner");
  return page;
}

// The demo parking deck's vibrating-wire gauges are embedded in concrete of f'c = 40 MPa: utilisation
// is compressive stress ÷ f_ck, and concrete in tension is not rated (it cracks), in words, not a number.
const CONCRETE_RATING = /^(\d+ % of f_ck in compression|not rated: concrete in tension cracks)$/;

describe("concrete utilisation", () => {
  for (const [name, viewport] of [["desktop", DESKTOP], ["phone", PHONE]] as const) {
    it(`rates the deck's concrete gauges in the table and on the gauge page, with the caution (${name})`, async () => {
      const page = await ownerAt(viewport);
      await page.goto("/structures/ORCH-PD");
      const row = page.getByRole("table", { name: "Gauges" }).getByRole("row").filter({ hasText: "L2-S1" });
      await row.waitFor();
      const cells = await row.getByRole("cell").allTextContents();
      expect(cells.some((cell) => CONCRETE_RATING.test(cell.trim())), cells.join(" | ")).toBe(true);
      await page.getByTestId("concrete-caution").getByText(CONCRETE_CAUTION).waitFor();

      await page.goto("/structures/ORCH-PD/gauges/L2-S1");
      const shown = (await page.getByTestId("gauge-utilisation").textContent())!.replace("Utilisation at the latest reading: ", "");
      expect(shown).toMatch(CONCRETE_RATING);
      await page.getByText("Compressive strength f_ck").waitFor();
      await page.getByTestId("concrete-caution").waitFor();
    });
  }

  it("rates a steel gauge against its yield and shows no concrete caution there", async () => {
    const page = await ownerAt(DESKTOP);
    await page.goto("/structures/MILL-FB/gauges/LC-M1");
    await expect(page.getByTestId("gauge-utilisation").textContent()).resolves.toMatch(/\d+ % of yield$/);
    await expect(page.getByTestId("concrete-caution").count()).resolves.toBe(0);
  });

  it("carries the caution on the deck's report", async () => {
    const page = await ownerAt(PHONE);
    await page.goto("/structures/ORCH-PD/report");
    await page.getByTestId("concrete-caution").waitFor();
  });
});
