import { describe, expect, it } from "vitest";
import { afterFailure, classifySendFailure, MAX_ATTEMPTS, RELAY_RETRY_MS, retryDelayMs } from "@/jobs/outbox-sender";
import { renewEveryMs } from "@/jobs/lease";

describe("retry schedule", () => {
  it("doubles from 30 s after each failed attempt and stops growing at one hour (by hand: 30 s × 2^(n−1))", () => {
    expect([1, 2, 3, 4, 5, 6, 7].map(retryDelayMs)).toEqual([30_000, 60_000, 120_000, 240_000, 480_000, 960_000, 1_920_000]);
    expect(retryDelayMs(8)).toBe(3_600_000);
    expect(retryDelayMs(30)).toBe(3_600_000);
  });
});

describe("what a failed send means", () => {
  // Error shapes as nodemailer 7 reports them (lib/smtp-connection: responseCode parsed from the answer).
  // RFC 5321 §4.2.1: a 5yz reply is a permanent negative completion, 4yz a transient one.
  it("reads a 5xx answer as refused, a 4xx answer as later, and no answer as a relay problem", () => {
    expect(classifySendFailure({ code: "EENVELOPE", responseCode: 550, response: "550 5.1.1 No mailbox" })).toEqual({ kind: "refused", answer: "550 5.1.1 No mailbox" });
    expect(classifySendFailure({ code: "EENVELOPE", responseCode: 452, response: "452 4.2.2 Mailbox full" }).kind).toBe("later");
    expect(classifySendFailure({ code: "ESOCKET", message: "connect ECONNREFUSED 127.0.0.1:2525" })).toEqual({ kind: "relay", answer: "connect ECONNREFUSED 127.0.0.1:2525" });
    expect(classifySendFailure({ code: "ETIMEDOUT", message: "Greeting never received" }).kind).toBe("relay");
  });

  it("blames the relay, not the message, for a refused login, and the message for an address nodemailer cannot use", () => {
    expect(classifySendFailure({ code: "EAUTH", responseCode: 535, response: "535 Authentication failed" }).kind).toBe("relay");
    expect(classifySendFailure({ code: "EENVELOPE", message: 'Invalid recipient "not an address"' }).kind).toBe("refused");
  });
});

describe("state after a failure", () => {
  const now = new Date("2026-07-01T12:00:00Z");

  it("fails a refused message at once with the server's answer", () => {
    expect(afterFailure({ kind: "refused", answer: "550 no" }, 0, now)).toEqual({ state: "failed", attempts: 1, lastError: "550 no" });
  });

  it("retries 'later' answers until the MAX_ATTEMPTS-th, then fails", () => {
    const later = { kind: "later" as const, answer: "451 try later" };
    expect(afterFailure(later, MAX_ATTEMPTS - 2, now)).toMatchObject({ state: "queued", attempts: MAX_ATTEMPTS - 1 });
    expect(afterFailure(later, MAX_ATTEMPTS - 1, now)).toMatchObject({ state: "failed", attempts: MAX_ATTEMPTS });
  });

  it("keeps retrying while the relay is unreachable without a growing back-off, so the queue resumes when it answers", () => {
    const next = afterFailure({ kind: "relay", answer: "ECONNREFUSED" }, 50, now);
    expect(next).toMatchObject({ state: "queued", attempts: 51 });
    expect(next.state === "queued" && next.nextAttemptAt.getTime() - now.getTime()).toBe(RELAY_RETRY_MS);
  });
});

describe("lease renewal", () => {
  it("renews three times per lease, never more often than once a second", () => {
    expect(renewEveryMs(60_000)).toBe(20_000);
    expect(renewEveryMs(1_500)).toBe(1_000);
  });
});
