import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { PHONE, SignInPage, baseUrl, launchBrowser, newContext, saveScreenshot } from "./browser";

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

  // The seed gives L3-C2 a loose connector's step: a jump that holds the gauge in sensor fault.
  it("on a phone, a held jump says limits are not being checked and offers its two resolutions", async () => {
    const phone = await (await newContext(browser, PHONE)).newPage();
    await new SignInPage(phone).signInAs("engineer");
    await phone.goto("/alerts?state=open&kind=sensor");
    await phone.getByTestId("alert-row").filter({ hasText: "L3-C2" }).filter({ hasText: "jump" }).getByRole("link").first().click();
    await phone.getByRole("status").filter({ hasText: "Limits are not being checked on gauge L3-C2" }).waitFor();
    const form = phone.getByRole("form", { name: "Resolve the jump" });
    await form.getByLabel(/Accept the step as real/).waitFor();
    await form.getByLabel(/Record a new zero at the jump/).waitFor();
    await expect(phone.getByRole("form", { name: "Clear by hand" }).count()).resolves.toBe(0);
    // Nothing wider than the phone's screen.
    await expect(phone.evaluate(() => document.documentElement.scrollWidth)).resolves.toBeLessThanOrEqual(PHONE.width);
    await saveScreenshot(phone, "jump-resolution-phone");
  });

  it("an engineer accepts a jump as a real step, and the alert is cleared with what was checked", async () => {
    await engineer.goto("/alerts?state=open&kind=sensor");
    await engineer.getByTestId("alert-row").filter({ hasText: "L3-C2" }).filter({ hasText: "jump" }).getByRole("link").first().click();
    const form = engineer.getByRole("form", { name: "Resolve the jump" });
    await form.getByLabel(/Accept the step as real/).check();
    await form.getByLabel("What was checked").fill("Connector re-seated; the column did shorten under the new floor load.");
    await form.getByRole("button", { name: "Resolve" }).click();
    await engineer.getByTestId("alert-event").filter({ hasText: "Accepted as a real step" }).waitFor();
    await expect(engineer.getByRole("form", { name: "Resolve the jump" }).count()).resolves.toBe(0);
    await saveScreenshot(engineer, "jump-accepted");
  });

  it("an owner gets sensor faults in the digest unless they choose otherwise, and can choose", async () => {
    const owner = await (await newContext(browser)).newPage();
    await new SignInPage(owner).signInAs("owner");
    await owner.goto("/structures/MILL-FB");
    const form = owner.getByRole("form", { name: "My alert e-mails" });
    await expect(form.getByLabel("Sensor faults (a gauge, not the structure)").inputValue()).resolves.toBe("digest");
    await form.getByLabel("Sensor faults (a gauge, not the structure)").selectOption("immediate");
    await form.getByRole("button", { name: "Save" }).click();
    await form.getByText("and sensor faults as they happen too").waitFor();
    await owner.reload();
    await expect(owner.getByRole("form", { name: "My alert e-mails" }).getByLabel("Sensor faults (a gauge, not the structure)").inputValue()).resolves.toBe("immediate");
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

  it("an alert raised by readings arriving now is e-mailed through the local mail server, and an admin can read it", async () => {
    const admin = await (await newContext(browser)).newPage();
    await new SignInPage(admin).signInAs("admin");
    // The seed's 90 days are a backfill: their alert events wait for the digest. A logger sends two fresh readings.
    await admin.goto("/admin/tokens");
    const form = admin.getByRole("form", { name: "Create a token" });
    await form.getByLabel("Logger (one structure)").check();
    await form.getByLabel("Sends readings to").selectOption("MILL-FB");
    await form.getByLabel("Token name").fill("logger for the mail test");
    await form.getByRole("button", { name: "Create token" }).click();
    const token = (await form.getByTestId("new-secret").textContent())!.trim();
    // LC-Q1 is a full Poisson bridge: |Vr| = GF·ε·(1+ν)/2 (bridge textbook formula), so 1.009 mV/V from its -0.0041 zero is
    // about 757 µε with GF 2.05 and ν 0.3 (the demo wires it so that tension reads negative), σ = 210 000 MPa × 757 µε + 31 MPa
    // initial ≈ 190 MPa: beyond the 150 MPa warning, short of 240.
    // After the seed's last reading (the last whole ten minutes before seeding), so neither is a duplicate.
    const now = Date.now();
    const readings = [now - 60_000, now - 30_000].map((time) => ({ gauge: "LC-Q1", time: new Date(time).toISOString(), value: -1.013, temperature: 11.5 }));
    const response = await fetch(`${baseUrl()}/api/v1/structures/MILL-FB/readings`, {
      method: "POST",
      headers: { authorization: `Bearer ${token}`, "content-type": "application/json" },
      body: JSON.stringify({ readings }),
    });
    expect(response.status).toBe(200);
    await expect(response.json()).resolves.toMatchObject({ accepted: 2, alerts: { opened: 1 } });
    // The server's outbox job sends every few seconds.
    for (let attempt = 0; attempt < 20; attempt++) {
      await admin.goto("/admin/mail");
      if ((await admin.getByText(/WARNING: MILL-FB LC-Q1/).count()) > 0) break;
      await admin.waitForTimeout(1000);
    }
    await admin.getByText(/WARNING: MILL-FB LC-Q1/).first().waitFor();
    await saveScreenshot(admin, "admin-mail");
  });
});

describe("the gauge page's alert table", () => {
  type ApiAlert = { gauge: string; kind: string; quantity?: string; peak: number | null; bound: number | null };

  it("shows peaks and bounds in the person's units: ksi after switching, MPa again after switching back, on a desktop and a phone", async () => {
    const context = await newContext(browser);
    const page = await context.newPage();
    await new SignInPage(page).signInAs("technician");
    const response = await page.request.get("/api/v1/structures/MILL-FB/alerts?state=all");
    expect(response.status()).toBe(200);
    const stressAlerts = ((await response.json()) as { alerts: ApiAlert[] }).alerts.filter((a) => a.gauge === "LC-Q1" && a.kind === "limit" && a.quantity === "stress");
    expect(stressAlerts.length).toBeGreaterThan(0);
    const rows = () => page.getByRole("table", { name: "Alerts" }).getByTestId("alert-row");
    const units = page.getByLabel("Units", { exact: true });
    try {
      await page.goto("/structures/MILL-FB/gauges/LC-Q1");
      await rows().first().waitFor();
      const text = (value: number, unit: string, decimals: number) => `${value.toFixed(decimals)} ${unit}`;
      for (const alert of stressAlerts) await rows().filter({ hasText: `stress reached ${text(alert.peak!, "MPa", 1)} (bound ${text(alert.bound!, "MPa", 1)})` }).first().waitFor();

      await units.selectOption("us");
      // 1 ksi = 6.894757 MPa (NIST SP 811, Appendix B); stresses in ksi are written to two decimals.
      const ksi = (mpa: number) => text(mpa / 6.894757, "ksi", 2);
      for (const alert of stressAlerts) await rows().filter({ hasText: `stress reached ${ksi(alert.peak!)} (bound ${ksi(alert.bound!)})` }).first().waitFor();
      await expect(rows().filter({ hasText: "MPa" }).count()).resolves.toBe(0);
      await saveScreenshot(page, "gauge-alerts-us-units");

      const phone = await (await newContext(browser, PHONE)).newPage();
      await new SignInPage(phone).signInAs("technician");
      await phone.goto("/structures/MILL-FB/gauges/LC-Q1");
      const phoneRows = phone.getByRole("table", { name: "Alerts" }).getByTestId("alert-row");
      await phoneRows.filter({ hasText: `(bound ${ksi(stressAlerts[0]!.bound!)})` }).first().waitFor();
      await expect(phoneRows.filter({ hasText: "MPa" }).count()).resolves.toBe(0);
      await saveScreenshot(phone, "gauge-alerts-us-units-phone");

      await units.selectOption("si");
      await rows().filter({ hasText: `(bound ${text(stressAlerts[0]!.bound!, "MPa", 1)})` }).first().waitFor();
      await expect(rows().filter({ hasText: "ksi" }).count()).resolves.toBe(0);
    } finally {
      // Units are the person's preference, kept on the server: leave them as the seed had them.
      if ((await units.inputValue()) !== "si") await units.selectOption("si");
    }
  });
});
