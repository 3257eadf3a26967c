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

  it("keeps mail queued while the relay is down and resumes at the first run after it answers, each message delivered once", async () => {
    const port = await freePort();
    process.env.LOCAL_SMTP_PORT = String(port);
    for (const name of ["ada", "ben", "cy"]) await queue({ to: `${name}@hookeline.example` });
    const start = new Date();
    // An hour of outage, a run every five minutes: each finds the relay down.
    let now = start.getTime();
    for (; now < start.getTime() + 3_600_000; now += 300_000) await send("sender-a", new Date(now));
    const waiting = await outboxRow("ada@hookeline.example");
    expect(waiting).toMatchObject({ state: "queued", claimedBy: null });
    expect(waiting.lastError).toMatch(/ECONNREFUSED/);

    catcher = await startLocalSmtpServer({ port });
    const back = Date.now();
    // Today's back-off would hold each message up to an hour after the relay returned; the first run now delivers what is due.
    const first = await send("sender-a", new Date(now));
    const second = await send("sender-a", new Date(now + 10_000));
    const resumedMs = Date.now() - back;
    console.log(`outbox after an outage: ${first.sent} sent at the first run after the relay answered, all ${first.sent + second.sent} within 10 s of job time (${resumedMs} ms of wall time)`);
    expect(first.sent).toBeGreaterThanOrEqual(2);
    expect(first.sent + second.sent).toBe(3);
    expect(await receivedCounts()).toEqual({ "ada@hookeline.example": 1, "ben@hookeline.example": 1, "cy@hookeline.example": 1 });
    // The history keeps the refused connections before the send, so "sent" never reads beside an old error alone.
    const outcomes = (await outboxRow("ada@hookeline.example")).attemptLog!.map((attempt) => attempt.outcome);
    expect(outcomes.at(-1)).toBe("sent");
    expect(outcomes).toContain("relay");
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

  it("gives its leases back when the process is told to stop (SIGTERM), so another instance need not wait out ten minutes", async () => {
    const child = spawn(process.execPath, ["--conditions=react-server", "--import", "tsx", "tests/integration/lease-child.ts"], { env: { ...process.env } });
    let output = "";
    child.stderr.on("data", (chunk) => (output += chunk));
    await new Promise<void>((resolve, reject) => {
      child.stdout.on("data", (chunk) => {
        output += chunk;
        if (output.includes("holding")) resolve();
      });
      child.on("exit", () => reject(new Error(output)));
    });
    const [taken] = await getDb().select().from(jobLeases).where(eq(jobLeases.name, "long-job"));
    expect(taken!.leaseUntil.getTime()).toBeGreaterThan(Date.now() + 60_000);
    const stopped = new Promise<void>((resolve) => child.on("exit", () => resolve()));
    child.kill("SIGTERM");
    // The process still ends (its run stopped, or SIGTERM's default action) once the leases are back.
    await stopped;
    const [row] = await getDb().select().from(jobLeases).where(eq(jobLeases.name, "long-job"));
    expect(row!.lastOutcome, `the child said: ${output}`).toBe("stopped: SIGTERM");
    expect(row!.leaseUntil.getTime()).toBeLessThanOrEqual(Date.now());
    expect(await withLease("long-job", 10_000, slow(0), "holder-b")).toBe("done");
  }, 60_000);

  it("refuses a lease that another holder still has", async () => {
    await getDb()
      .insert(jobLeases)
      .values({ name: "busy-job", holder: "other", leaseUntil: new Date(Date.now() + 60_000) });
    expect(await withLease("busy-job", 10_000, slow(0), "holder-a")).toBeNull();
  });
});

