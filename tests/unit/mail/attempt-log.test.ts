import { describe, expect, it } from "vitest";
import { KEPT_ATTEMPTS, attemptLines, withAttempt } from "@/lib/mail/attempt-log";

describe("an outbox message's attempts", () => {
  // RFC 5321 §4.2.1: 4yz is transient (try later), 5yz permanent (refused).
  it("reads each attempt in order, an old failure before a later send", () => {
    let log = withAttempt(null, { at: "2026-12-01T10:00:00.000Z", outcome: "relay", answer: "connect ECONNREFUSED 127.0.0.1:25" });
    log = withAttempt(log, { at: "2026-12-01T10:05:00.000Z", outcome: "later", answer: "452 4.2.2 Mailbox full" });
    log = withAttempt(log, { at: "2026-12-01T10:20:00.000Z", outcome: "sent" });
    expect(attemptLines(log, (iso) => iso.slice(11, 16))).toEqual([
      "10:00: relay not reached — connect ECONNREFUSED 127.0.0.1:25",
      "10:05: relay asked to try later — 452 4.2.2 Mailbox full",
      "10:20: sent",
    ]);
  });

  it("keeps the latest attempts of a message retried for long, and says when an old time was not kept", () => {
    let log = withAttempt(null, { at: null, outcome: "failed", answer: "timeout" });
    for (let i = 0; i < KEPT_ATTEMPTS + 5; i++) log = withAttempt(log, { at: `2026-12-01T10:${String(i).padStart(2, "0")}:00.000Z`, outcome: "relay" });
    expect(log).toHaveLength(KEPT_ATTEMPTS);
    expect(log.at(-1)!.at).toBe("2026-12-01T10:24:00.000Z");
    expect(attemptLines([{ at: null, outcome: "failed", answer: "timeout" }], String)).toEqual(["earlier (time not kept): failed — timeout"]);
  });
});
