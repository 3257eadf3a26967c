import { spawn } from "node:child_process";
import { afterEach, beforeEach, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { caughtMail, jobLeases, mailOutbox } from "@/db/schema";
import { runOutboxSender } from "@/jobs/outbox-sender";
import { withLease } from "@/jobs/lease";
import type { LocalSmtpServer } from "@/lib/mail/local-smtp-server";
import { startLocalSmtpServer } from "@/lib/mail/local-smtp-server";
import { clearMail, freePort, outboxRow, queue, receivedCounts, startCatcher } from "./mail-helpers";

let catcher: LocalSmtpServer | undefined;
beforeEach(clearMail);
afterEach(async () => {
  await catcher?.close();
  catcher = undefined;
});

const send = (holder = "sender-a", now?: Date) => runOutboxSender({ holder, now });

describe("outbox sender against a real SMTP server", () => {
  it("delivers each queued message once, with its subject and both parts, and marks it sent", async () => {
    catcher = await startCatcher();
    for (const to of ["ada@hookeline.example", "ben@hookeline.example", "cy@hookeline.example"]) await queue({ to });
    expect(await send()).toEqual({ sent: 3, retried: 0, failed: 0 });
    expect(await send()).toEqual({ sent: 0, retried: 0, failed: 0 });
    expect(await receivedCounts()).toEqual({ "ada@hookeline.example": 1, "ben@hookeline.example": 1, "cy@hookeline.example": 1 });
    const [caught] = await getDb().select().from(caughtMail).where(eq(caughtMail.subject, "Test for ada@hookeline.example"));
    expect(caught!.text?.trim()).toBe("plain text");
    expect(caught!.html).toContain("<p>html</p>");
    expect(caught!.envelopeFrom).toBe("alerts@hookeline.example");
    const row = await outboxRow("ada@hookeline.example");
    expect(row).toMatchObject({ state: "sent", attempts: 1, claimedBy: null });
    expect(row.sentAt).toBeInstanceOf(Date);
  });

  it("queues a message once per dedupe key", async () => {
    catcher = await startCatcher();
    expect(await queue({ to: "ada@hookeline.example", dedupeKey: "alert:7:opened:3" })).toBe(true);
    expect(await queue({ to: "ada@hookeline.example", dedupeKey: "alert:7:opened:3", subject: "again" })).toBe(false);
    await send();
    expect(await receivedCounts()).toEqual({ "ada@hookeline.example": 1 });
  });

  it("keeps mail queued while the relay is down and delivers it once when it is back", async () => {
    const port = await freePort();
    process.env.LOCAL_SMTP_PORT = String(port);
    await queue({ to: "ada@hookeline.example" });
    await queue({ to: "ben@hookeline.example" });
    const start = new Date();
    expect(await send("sender-a", start)).toEqual({ sent: 0, retried: 2, failed: 0 });
    const waiting = await outboxRow("ada@hookeline.example");
    expect(waiting).toMatchObject({ state: "queued", attempts: 1, claimedBy: null });
    expect(waiting.lastError).toMatch(/ECONNREFUSED/);
    // First retry 30 s after the first failure (retryDelayMs).
    expect(waiting.nextAttemptAt.getTime()).toBe(start.getTime() + 30_000);

    catcher = await startLocalSmtpServer({ port });
    expect(await send("sender-a", new Date(start.getTime() + 10_000))).toEqual({ sent: 0, retried: 0, failed: 0 });
    expect(await send("sender-a", new Date(start.getTime() + 31_000))).toEqual({ sent: 2, retried: 0, failed: 0 });
    expect(await send("sender-a", new Date(start.getTime() + 3_600_000))).toEqual({ sent: 0, retried: 0, failed: 0 });
    expect(await receivedCounts()).toEqual({ "ada@hookeline.example": 1, "ben@hookeline.example": 1 });
    const delivered = await outboxRow("ada@hookeline.example");
    expect(delivered).toMatchObject({ state: "sent", attempts: 2 });
    // The history keeps the refused connection before the send, so "sent" never reads beside an old error alone.
    expect(delivered.attemptLog!.map((attempt) => attempt.outcome)).toEqual(["relay", "sent"]);
    expect(delivered.attemptLog![0]!.answer).toMatch(/ECONNREFUSED/);
  });

  it("fails a refused address with the server's answer and delivers the others", async () => {
    catcher = await startCatcher({ refuseRecipient: (address) => (address.startsWith("gone@") ? "5.1.1 No mailbox by that name" : null) });
    await queue({ to: "ada@hookeline.example" });
    await queue({ to: "gone@hookeline.example" });
    await queue({ to: "ben@hookeline.example" });
    expect(await send()).toEqual({ sent: 2, retried: 0, failed: 1 });
    const refused = await outboxRow("gone@hookeline.example");
    expect(refused).toMatchObject({ state: "failed", attempts: 1 });
    expect(refused.lastError).toMatch(/^550 .*No mailbox by that name/);
    expect(await receivedCounts()).toEqual({ "ada@hookeline.example": 1, "ben@hookeline.example": 1 });
  });

  it("never sends a message twice when two senders run at once", async () => {
    catcher = await startCatcher();
    const addresses = Array.from({ length: 12 }, (_, i) => `person${i}@hookeline.example`);
    for (const to of addresses) await queue({ to });
    const [a, b] = await Promise.all([send("sender-a"), send("sender-b")]);
    expect(a.sent + b.sent).toBe(12);
    expect(await receivedCounts()).toEqual(Object.fromEntries(addresses.map((to) => [to, 1])));
  });

  it("takes over a message whose sender stopped mid-way once its lease has run out", async () => {
    catcher = await startCatcher();
    await queue({ to: "ada@hookeline.example" });
    const now = new Date();
    await getDb()
      .update(mailOutbox)
      .set({ state: "sending", claimedBy: "crashed", claimedUntil: new Date(now.getTime() + 60_000) });
    expect((await send("sender-b", now)).sent).toBe(0);
    expect((await send("sender-b", new Date(now.getTime() + 61_000))).sent).toBe(1);
    expect(await receivedCounts()).toEqual({ "ada@hookeline.example": 1 });
  });

  it("never sends a message twice when two job processes run at once", async () => {
    catcher = await startCatcher();
    const addresses = Array.from({ length: 8 }, (_, i) => `proc${i}@hookeline.example`);
    for (const to of addresses) await queue({ to });
    const runOnce = () =>
      new Promise<string>((resolve, reject) => {
        const child = spawn("node_modules/.bin/tsx", ["--conditions=react-server", "scripts/jobs.ts", "--once", "mail-outbox"], { env: { ...process.env } });
        let output = "";
        child.stdout.on("data", (chunk) => (output += chunk));
        child.stderr.on("data", (chunk) => (output += chunk));
        child.on("error", reject);
        child.on("exit", (code) => (code === 0 ? resolve(output) : reject(new Error(output))));
      });
    const outputs = await Promise.all([runOnce(), runOnce()]);
    expect(outputs.join("\n")).toMatch(/mail-outbox: 8 sent/);
    expect(await receivedCounts()).toEqual(Object.fromEntries(addresses.map((to) => [to, 1])));
    const [lease] = await getDb().select().from(jobLeases).where(eq(jobLeases.name, "mail-outbox"));
    expect(lease!.lastOutcome).toMatch(/^ok: /);
  }, 60_000);
});

describe("job lease", () => {
  const slow = (ms: number) => () => new Promise<string>((resolve) => setTimeout(() => resolve("done"), ms));

  it("lets one of two holders run a job at a time, and either after it is released", async () => {
    const [a, b] = await Promise.all([withLease("test-job", 10_000, slow(50), "holder-a"), withLease("test-job", 10_000, slow(50), "holder-b")]);
    expect([a, b].filter((r) => r === "done")).toHaveLength(1);
    expect([a, b].filter((r) => r === null)).toHaveLength(1);
    expect(await withLease("test-job", 10_000, slow(0), "holder-b")).toBe("done");
  });

  it("lets another holder take over a lease that ran out, and records an error as the outcome", async () => {
    await getDb()
      .insert(jobLeases)
      .values({ name: "stale-job", holder: "gone", leaseUntil: new Date(Date.now() - 1) });
    await expect(withLease("stale-job", 10_000, async () => Promise.reject(new Error("boom")), "holder-a")).rejects.toThrow("boom");
    const [row] = await getDb().select().from(jobLeases).where(eq(jobLeases.name, "stale-job"));
    expect(row).toMatchObject({ holder: "holder-a", lastOutcome: "error: boom" });
    expect(row!.leaseUntil.getTime()).toBeLessThanOrEqual(Date.now());
  });

  it("refuses a lease that another holder still has", async () => {
    await getDb()
      .insert(jobLeases)
      .values({ name: "busy-job", holder: "other", leaseUntil: new Date(Date.now() + 60_000) });
    expect(await withLease("busy-job", 10_000, slow(0), "holder-a")).toBeNull();
  });
});

