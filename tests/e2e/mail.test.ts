import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { SignInPage, launchBrowser, newContext, saveScreenshot } from "./browser";
import { AdminMailPage } from "./mail-page";

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

/** Opens an e-mailed link signed out, chooses a password there, and follows the page to sign in. */
async function choosePassword(link: string, heading: string, password: string): Promise<Page> {
  const page = await (await newContext(browser)).newPage();
  await page.goto(link);
  await page.getByRole("heading", { name: heading }).waitFor();
  const form = page.getByRole("form", { name: "Choose a password" });
  await form.getByLabel("New password").fill(password);
  await form.getByRole("button", { name: "Save password" }).click();
  await form.getByText("Your password is saved.").waitFor();
  await page.getByRole("link", { name: "Go to sign in" }).click();
  await page.waitForURL((url) => url.pathname === "/signin");
  return page;
}

describe("mail", () => {
  it("invites a person, whose invitation the admin reads on the Mail page; the link sets a password once", async () => {
    await admin.goto("/admin/users");
    await admin.getByRole("link", { name: "Invite by e-mail" }).click();
    const form = admin.getByRole("form", { name: "Invite by e-mail" });
    await form.getByLabel("Name").fill("Ada Quill");
    await form.getByLabel("E-mail").fill("ada@hookeline.example");
    await form.getByLabel("Role").selectOption("engineer");
    await form.getByRole("button", { name: "Send invitation" }).click();
    await form.getByText("Invitation to ada@hookeline.example queued").waitFor();

    const mail = new AdminMailPage(admin);
    await mail.open();
    await admin.getByTestId("mail-route").getByText("local catcher").waitFor();
    await mail.openMessage("ada@hookeline.example", "You are invited to Hookeline");
    await expect(mail.htmlFrame().getAttribute("sandbox")).resolves.toBe("");
    await admin.getByTestId("outbox-row").filter({ hasText: "ada@hookeline.example" }).getByText("sent", { exact: true }).waitFor();
    await saveScreenshot(admin, "admin-mail");
    const link = await mail.linkTo("/welcome");

    const ada = await choosePassword(link, "Welcome to Hookeline", "ada-chosen-pw");
    await new SignInPage(ada).signIn("ada@hookeline.example", "ada-chosen-pw");
    await ada.waitForURL((url) => url.pathname === "/");
    await expect(ada.getByTestId("signed-in-name").textContent()).resolves.toBe("Ada Quill");

    await ada.goto(link);
    await ada.getByText("This link has expired or has already been used.").waitFor();
  });

  it("resets a forgotten password from the sign-in page, answering alike for unknown addresses", async () => {
    await admin.goto("/admin/users");
    const add = admin.getByRole("form", { name: "Add a user" });
    await add.getByLabel("Name").fill("Bram Oduya");
    await add.getByLabel("E-mail").fill("bram@hookeline.example");
    await add.getByLabel("First password").fill("bram-first-pw");
    await add.getByRole("button", { name: "Add user" }).click();
    await add.getByText("Bram Oduya can now sign in").waitFor();

    const visitor = await (await newContext(browser)).newPage();
    const answerFor = async (email: string) => {
      await visitor.goto("/signin");
      await visitor.getByRole("link", { name: "Forgot your password?" }).click();
      const form = visitor.getByRole("form", { name: "Ask for a new password" });
      await form.getByLabel("E-mail").fill(email);
      await form.getByRole("button", { name: "Send me a link" }).click();
      return form.getByRole("status").textContent();
    };
    const known = await answerFor("bram@hookeline.example");
    expect(known).toMatch(/^If an active account uses that address/);
    await expect(answerFor("nobody@hookeline.example")).resolves.toBe(known);

    const mail = new AdminMailPage(admin);
    await mail.open();
    await mail.openMessage("bram@hookeline.example", "Choose a new Hookeline password");
    const bram = await choosePassword(await mail.linkTo("/reset/confirm"), "Choose a new password", "bram-second-pw");
    const signIn = new SignInPage(bram);
    await signIn.signIn("bram@hookeline.example", "bram-first-pw");
    await signIn.error().waitFor();
    await signIn.signIn("bram@hookeline.example", "bram-second-pw");
    await bram.waitForURL((url) => url.pathname === "/");
  });
});
