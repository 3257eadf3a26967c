import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { auditLog, caughtMail, mailOutbox } from "@/db/schema";
import { runOutboxSender } from "@/jobs/outbox-sender";
import { verifyCredentials } from "@/lib/auth/sign-in";
import type { LocalSmtpServer } from "@/lib/mail/local-smtp-server";
import { checkAccountLink, inviteUser, LINK_UNUSABLE, requestPasswordReset, setPasswordWithLink } from "@/lib/services/accounts";
import { makeUser } from "./helpers";
import { clearMail, startCatcher } from "./mail-helpers";

process.env.NEXTAUTH_SECRET = "integration-test-secret";
process.env.NEXTAUTH_URL = "http://hookeline.test:3000";

let catcher: LocalSmtpServer;
beforeAll(async () => {
  catcher = await startCatcher();
});
afterAll(() => catcher.close());
beforeEach(clearMail);

const tokenIn = (text: string, page: string) => {
  const match = new RegExp(`http://hookeline\\.test:3000${page}\\?token=(\\S+)`).exec(text);
  if (!match) throw new Error(`no ${page} link in:\n${text}`);
  return decodeURIComponent(match[1]!);
};

async function queuedText(to: string) {
  const rows = await getDb().select().from(mailOutbox).where(eq(mailOutbox.toAddress, to));
  return rows.map((row) => row.text);
}

describe("invitations", () => {
  it("mails a link through SMTP that sets the password once; then the person signs in", async () => {
    const admin = await makeUser("admin", "inviter@test.example");
    await inviteUser(admin, { email: "newcomer@test.example", name: "Nia Newcomer", role: "owner" });
    expect(await verifyCredentials("newcomer@test.example", "", null)).toEqual({ refused: "credentials" });

    await runOutboxSender({ holder: "test" });
    const [mail] = await getDb().select().from(caughtMail);
    expect(mail!.envelopeTo).toEqual(["newcomer@test.example"]);
    expect(mail!.subject).toBe("You are invited to Hookeline");
    const token = tokenIn(mail!.text!, "/welcome");

    expect(await checkAccountLink(token, "invitation")).toEqual({ name: "Nia Newcomer", email: "newcomer@test.example" });
    await setPasswordWithLink(token, "invitation", "chosen-password");
    expect(await verifyCredentials("newcomer@test.example", "chosen-password", null)).toMatchObject({ actor: { role: "owner", name: "Nia Newcomer" } });

    expect(await checkAccountLink(token, "invitation")).toBeNull();
    await expect(setPasswordWithLink(token, "invitation", "another-password")).rejects.toThrow(LINK_UNUSABLE);
    const audit = await getDb().select({ action: auditLog.action, actor: auditLog.actorLabel }).from(auditLog).where(eq(auditLog.entityKey, "newcomer@test.example"));
    expect(audit).toEqual([
      { action: "user.invite", actor: "inviter@test.example" },
      { action: "user.accept-invitation", actor: "newcomer@test.example" },
    ]);
  });

  it("is for administrators only, and refuses an address that already has an account", async () => {
    const engineer = await makeUser("engineer", "eng@test.example");
    await expect(inviteUser(engineer, { email: "x@test.example", name: "X", role: "owner" })).rejects.toMatchObject({ code: "forbidden" });
    const admin = await makeUser("admin", "admin2@test.example");
    await expect(inviteUser(admin, { email: "eng@test.example", name: "Again", role: "owner" })).rejects.toMatchObject({ code: "conflict" });
    expect(await getDb().select().from(mailOutbox)).toEqual([]);
  });
});

describe("password reset", () => {
  it("mails a link that works once, and only for resetting", async () => {
    await makeUser("technician", "forgetful@test.example");
    await requestPasswordReset("Forgetful@test.example");
    const [text] = await queuedText("forgetful@test.example");
    const token = tokenIn(text!, "/reset/confirm");
    await expect(setPasswordWithLink(token, "invitation", "wrong-purpose")).rejects.toThrow(LINK_UNUSABLE);
    await setPasswordWithLink(token, "password-reset", "remembered-now");
    expect(await verifyCredentials("forgetful@test.example", "remembered-now", null)).toHaveProperty("actor");
    await expect(setPasswordWithLink(token, "password-reset", "once-more-please")).rejects.toThrow(LINK_UNUSABLE);
    expect(await verifyCredentials("forgetful@test.example", "remembered-now", null)).toHaveProperty("actor");
  });

  it("expires 60 minutes after it was sent", async () => {
    await makeUser("owner", "late@test.example");
    const sent = new Date("2026-07-01T12:00:00Z");
    await requestPasswordReset("late@test.example", sent);
    const token = tokenIn((await queuedText("late@test.example"))[0]!, "/reset/confirm");
    expect(await checkAccountLink(token, "password-reset", new Date("2026-07-01T12:59:00Z"))).not.toBeNull();
    await expect(setPasswordWithLink(token, "password-reset", "too-late-now", new Date("2026-07-01T13:00:00Z"))).rejects.toThrow(LINK_UNUSABLE);
  });

  it("queues nothing for an unknown address, and one e-mail for repeated requests", async () => {
    await makeUser("engineer", "eager@test.example");
    await requestPasswordReset("nobody@test.example");
    const now = new Date("2026-07-01T12:01:00Z");
    await requestPasswordReset("eager@test.example", now);
    await requestPasswordReset("eager@test.example", new Date(now.getTime() + 60_000));
    const rows = await getDb().select({ to: mailOutbox.toAddress, kind: mailOutbox.kind }).from(mailOutbox);
    expect(rows).toEqual([{ to: "eager@test.example", kind: "password-reset" }]);
  });
});
