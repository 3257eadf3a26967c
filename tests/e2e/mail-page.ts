import type { Page } from "playwright-core";

/** Page object of Admin → Mail: waits for a message to reach the local catcher and reads it. */
export class AdminMailPage {
  constructor(private readonly page: Page) {}

  async open() {
    await this.page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Mail", exact: true }).click();
    await this.page.waitForURL((url) => url.pathname === "/admin/mail");
  }

  /** The outbox sender runs every 5 s: reload until the message shows, then open it. */
  async openMessage(to: string, subject: string, timeoutMs = 30_000) {
    const entry = this.page.getByTestId("caught-mail").filter({ hasText: `to ${to}` }).filter({ hasText: subject });
    const deadline = Date.now() + timeoutMs;
    while ((await entry.count()) === 0) {
      if (Date.now() > deadline) throw new Error(`No mail "${subject}" to ${to} within ${timeoutMs} ms`);
      await this.page.waitForTimeout(1_000);
      await this.page.reload();
    }
    await entry.first().click();
    await this.page.getByRole("article", { name: "Message" }).getByRole("heading", { name: subject }).waitFor();
  }

  /** The first link to `path` in the open message's plain text. */
  async linkTo(path: string): Promise<string> {
    const text = (await this.page.getByTestId("mail-text").textContent()) ?? "";
    const link = new RegExp(`https?://\\S+${path.replace(/[/?]/g, "\\$&")}\\?token=\\S+`).exec(text)?.[0];
    if (!link) throw new Error(`No ${path} link in:\n${text}`);
    return link;
  }

  htmlFrame() {
    return this.page.getByTitle("HTML part");
  }
}
