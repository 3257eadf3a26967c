import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { SignInPage, baseUrl, launchBrowser, newContext, saveScreenshot } from "./browser";

let browser: Browser;
let admin: Page;
beforeAll(async () => {
  browser = await launchBrowser();
  admin = await (await newContext(browser)).newPage();
  await new SignInPage(admin).signInAs("admin");
});
afterAll(async () => {
  await browser?.close();
});

describe("administration", () => {
  it("adds a user who can sign in, and deactivating them ends their session at once", async () => {
    await admin.goto("/admin/users");
    const form = admin.getByRole("form", { name: "Add a user" });
    await form.getByLabel("Name").fill("Lena Park");
    await form.getByLabel("E-mail").fill("lena@hookeline.example");
    await form.getByLabel("Role").selectOption("owner");
    await form.getByLabel("First password").fill("short");
    await form.getByRole("button", { name: "Add user" }).click();
    await form.getByText("Use at least 8 characters.").waitFor();
    await expect(form.getByLabel("Name").inputValue()).resolves.toBe("Lena Park");
    await form.getByLabel("First password").fill("lena-password");
    await form.getByRole("button", { name: "Add user" }).click();
    await form.getByText("Lena Park can now sign in").waitFor();

    const lena = await (await newContext(browser)).newPage();
    const signIn = new SignInPage(lena);
    await signIn.open();
    await signIn.signIn("lena@hookeline.example", "lena-password");
    await lena.waitForURL((url) => url.pathname === "/");
    await lena.getByText("You are not a member of any structure").waitFor();

    await admin.reload();
    const row = admin.getByTestId("user-row").filter({ hasText: "lena@hookeline.example" });
    await row.getByRole("button", { name: "Deactivate" }).click();
    await row.getByRole("button", { name: "Yes, deactivate" }).click();
    await row.getByText("deactivated", { exact: true }).waitFor();
    await saveScreenshot(admin, "admin-users");

    await lena.goto("/");
    expect(new URL(lena.url()).pathname).toBe("/signin");
  });

  it("adds a membership that the member then sees", async () => {
    await admin.goto("/admin/members");
    const form = admin.getByRole("form", { name: "Add a member" });
    await form.getByLabel("Person").selectOption("technician@hookeline.example");
    await form.getByLabel("Structure").selectOption("ORCH-PD");
    await form.getByRole("button", { name: "Add member" }).click();
    await form.getByText("technician@hookeline.example added to ORCH-PD").waitFor();
    await admin.reload();
    const row = admin.getByTestId("membership-row").filter({ hasText: "ORCH-PD" }).filter({ hasText: "technician@" });
    await expect(row.count()).resolves.toBe(1);
    await row.getByRole("button", { name: "Remove" }).click();
    await row.waitFor({ state: "detached" });
  });

  it("creates a logger token shown once that works on the API, and revokes it", async () => {
    await admin.goto("/admin/tokens");
    const form = admin.getByRole("form", { name: "Create a token" });
    await form.getByLabel("Logger (one structure)").check();
    await form.getByLabel("Sends readings to").selectOption("MILL-FB");
    await form.getByLabel("Token name").fill("logger at pier 2");
    await form.getByRole("button", { name: "Create token" }).click();
    const token = (await form.getByTestId("new-secret").textContent())!.trim();
    expect(token).toMatch(/^hkl_/);

    const call = () =>
      fetch(`${baseUrl()}/api/v1/structures/MILL-FB/readings`, {
        method: "POST",
        headers: { authorization: `Bearer ${token}`, "content-type": "application/json" },
        body: JSON.stringify({ readings: [] }),
      });
    const answer = await call();
    expect(answer.status).toBe(200);
    expect(await answer.json()).toMatchObject({ accepted: 0, rejected: [] });
    // It sends readings and nothing else: not even its structure's name.
    expect((await fetch(`${baseUrl()}/api/v1/structures`, { headers: { authorization: `Bearer ${token}` } })).status).toBe(403);

    await admin.reload();
    await expect(admin.getByText(token).count()).resolves.toBe(0);
    const row = admin.getByTestId("token-row").filter({ hasText: "logger at pier 2" });
    await expect(row.getByText("less than a minute ago").count()).resolves.toBe(1);
    await row.getByRole("button", { name: "Revoke" }).click();
    await row.getByRole("button", { name: "Yes, revoke" }).click();
    await row.getByText(/revoked/).waitFor();
    expect((await call()).status).toBe(401);
    await saveScreenshot(admin, "admin-tokens");
  });

  it("creates a structure from the form and explains a bad code", async () => {
    await admin.goto("/");
    await admin.getByRole("link", { name: "New structure" }).click();
    const form = admin.getByRole("form", { name: "New structure" });
    await form.getByLabel("Code").fill("bad code!");
    await form.getByLabel("Name", { exact: true }).fill("Quarry conveyor gantry");
    await form.getByRole("button", { name: "Create structure" }).click();
    await form.getByText("Use 2 to 32 letters").waitFor();
    await form.getByLabel("Code").fill("QG-7");
    await form.getByRole("button", { name: "Create structure" }).click();
    await admin.waitForURL((url) => url.pathname === "/structures/QG-7");
    await admin.getByRole("heading", { name: "Quarry conveyor gantry" }).waitFor();
  });
});
